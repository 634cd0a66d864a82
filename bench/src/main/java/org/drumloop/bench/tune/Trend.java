package org.drumloop.bench.tune;

import java.util.EnumMap;
import java.util.Map;

/**
 * A recorded trend in SI: strictly increasing time from zero and the signals that were asked for.
 * Immutable once built; arrays are shared, not copied, so callers must not write into them.
 *
 * @param file   the file as the user named it (for messages and report headers)
 * @param sha256 hex SHA-256 of the file's bytes (empty when not read from a file)
 */
public record Trend(String file, String sha256, double[] tS, Map<TrendSignal, double[]> signals,
                    Map<TrendSignal, String> headers) {

    /** A trend made in memory (synthetic data, simulated bump tests). */
    public static Trend of(String name, double[] tS, Map<TrendSignal, double[]> signals) {
        Map<TrendSignal, String> h = new EnumMap<>(TrendSignal.class);
        for (TrendSignal s : signals.keySet()) {
            h.put(s, s.tag());
        }
        return new Trend(name, "", tS, new EnumMap<>(signals), h);
    }

    public boolean has(TrendSignal s) { return signals.containsKey(s); }

    /** Values of a signal in its SI unit; throws when the trend does not carry it. */
    public double[] get(TrendSignal s) {
        double[] v = signals.get(s);
        if (v == null) {
            throw new IllegalArgumentException(file + ": no " + s.tag() + " column");
        }
        return v;
    }

    public int size() { return tS.length; }

    public double durationS() { return tS[tS.length - 1] - tS[0]; }

    /** The column header a signal was read from (for reports). */
    public String header(TrendSignal s) { return headers.getOrDefault(s, s.tag()); }
}
