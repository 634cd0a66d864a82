package org.drumloop.bench.expect;

/**
 * A signal stays inside a band (either side may be open) over a time window:
 * {@code expect drum_level between -80 and 80 mm during 0..900 s}.
 */
public final class BandExpectation extends Expectation {
    private final Channel channel;
    private final double loSi;
    private final double hiSi;
    private final double fromS;
    private final double toS;

    private double min;
    private double max;
    private double firstOutS;
    private int samples;

    public BandExpectation(String file, int line, String text, Channel channel, double loSi, double hiSi,
                           double fromS, double toS) {
        super(file, line, text);
        this.channel = channel;
        this.loSi = loSi;
        this.hiSi = hiSi;
        this.fromS = fromS;
        this.toS = toS;
    }

    @Override
    public void start() {
        min = Double.POSITIVE_INFINITY;
        max = Double.NEGATIVE_INFINITY;
        firstOutS = Double.NaN;
        samples = 0;
    }

    @Override
    public void observe(Frame f) {
        if (f.tS < fromS - TIME_EPS_S || f.tS > toS + TIME_EPS_S) {
            return;
        }
        double x = f.get(channel);
        samples++;
        if (x < min) {
            min = x;
        }
        if (x > max) {
            max = x;
        }
        boolean inside = x >= loSi && x <= hiSi; // NaN is outside
        if (!inside && Double.isNaN(firstOutS)) {
            firstOutS = f.tS;
        }
    }

    @Override
    public Outcome finish(double endS) {
        if (samples == 0) {
            return outcome(false, "no samples in the window (run ended at " + seconds(endS) + ")");
        }
        if (endS < toS - TIME_EPS_S) {
            return outcome(false, "run ended at " + seconds(endS) + ", before the window closed");
        }
        String m = "min " + eng(channel, min) + ", max " + eng(channel, max);
        if (!Double.isNaN(firstOutS)) {
            return outcome(false, m + "; first outside at " + seconds(firstOutS));
        }
        return outcome(true, m);
    }

    public double minSi() { return min; }

    public double maxSi() { return max; }
}
