package org.drumloop.bench.tune;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.drumloop.plant.PlantKey;

/**
 * Writes fitted values into a plant file by editing each key's own line: the value is written in the
 * unit the line already has, the line says it was fitted and what it was; comments, order and every
 * other line stay as they were. A header comment names the trend and the fit errors.
 */
public final class PlantFileWriter {
    /** Significant digits of a fitted value. */
    static final int DIGITS = 6;

    private PlantFileWriter() {
    }

    /**
     * @param lines  the start file's lines
     * @param keys   fitted keys
     * @param values fitted values, SI
     * @param header header comment lines (without '#'), placed first
     * @throws IllegalArgumentException a key has no line or its unit cannot be read
     */
    public static List<String> write(List<String> lines, List<PlantKey> keys, double[] values, List<String> header) {
        Map<String, String> changes = new LinkedHashMap<>();
        Map<String, String> comments = new LinkedHashMap<>();
        for (String line : lines) {
            String code = KeyLines.stripComment(line).strip();
            if (code.isEmpty()) {
                continue;
            }
            String[] f = code.split("\\s+");
            PlantKey k = PlantKey.of(f[0]);
            int j = keys.indexOf(k);
            if (j < 0) {
                continue;
            }
            if (f.length != 3) {
                throw new IllegalArgumentException(k.key() + ": expected 'value unit' on its line");
            }
            String unit = f[2];
            double zero = k.toSi(0, unit);
            double factor = k.toSi(1, unit) - zero;
            if (Double.isNaN(zero) || factor == 0) {
                throw new IllegalArgumentException(k.key() + ": unit '" + unit + "' not known");
            }
            changes.put(k.key(), KeyLines.number((values[j] - zero) / factor, DIGITS) + " " + unit);
            comments.put(k.key(), "fitted (start: " + f[1] + " " + unit + ")");
        }
        for (PlantKey k : keys) {
            if (!changes.containsKey(k.key())) {
                throw new IllegalArgumentException(k.key() + ": not in the start file");
            }
        }
        List<String> out = new ArrayList<>();
        for (String h : header) {
            out.add(h.isEmpty() ? "#" : "# " + h);
        }
        out.addAll(KeyLines.replace(lines, changes, comments));
        return out;
    }

    /** The header comment of a fitted file. */
    public static List<String> header(String trend, String sha256, PlantFit.Result r) {
        List<String> h = new ArrayList<>();
        h.add(String.format(Locale.ROOT, "Fitted by drumloop fit-plant to %s (SHA-256 %s).", trend, sha256));
        h.add(String.format(Locale.ROOT, "RMS error: level %.3g mm, pressure %.3g kPa (start file: %.3g mm, %.3g kPa).",
                r.rmsLevelM() * 1e3, r.rmsPressurePa() / 1e3, r.rmsLevelBeforeM() * 1e3, r.rmsPressureBeforePa() / 1e3));
        for (int j = 0; j < r.keys().size(); j++) {
            h.add(String.format(Locale.ROOT, "  %s: %.6g -> %.6g +- %.2g (SI)", r.keys().get(j).key(), r.start()[j],
                    r.values()[j], r.stdErr()[j]));
        }
        h.add("A fitted model reproduces the record it was fitted to; check it against another record before relying on it.");
        h.add("");
        return h;
    }
}
