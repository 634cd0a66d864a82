package org.drumloop.bench.expect;

/**
 * A signal comes within a band of a value within a time after an instant and stays there to the end
 * of the run: {@code expect drum_level settles to 0 mm +- 15 mm within 300 s after 60 s}.
 * The settling time is measured as the last sample outside the band, minus the instant.
 */
public final class SettleExpectation extends Expectation {
    private final Channel channel;
    private final double targetSi;
    private final double bandSi;
    private final double withinS;
    private final double afterS;

    private double lastOutS;
    private boolean seen;
    private double lastValue;

    public SettleExpectation(String file, int line, String text, Channel channel, double targetSi, double bandSi,
                             double withinS, double afterS) {
        super(file, line, text);
        this.channel = channel;
        this.targetSi = targetSi;
        this.bandSi = bandSi;
        this.withinS = withinS;
        this.afterS = afterS;
    }

    @Override
    public void start() {
        lastOutS = Double.NaN;
        seen = false;
        lastValue = Double.NaN;
    }

    @Override
    public void observe(Frame f) {
        if (f.tS < afterS - TIME_EPS_S) {
            return;
        }
        seen = true;
        double x = f.get(channel);
        lastValue = x;
        if (!(Math.abs(x - targetSi) <= bandSi)) {
            lastOutS = f.tS;
        }
    }

    @Override
    public Outcome finish(double endS) {
        if (!seen || endS < afterS + withinS - TIME_EPS_S) {
            return outcome(false, "run ended at " + seconds(endS) + ", before the settling time was over");
        }
        if (Double.isNaN(lastOutS)) {
            return outcome(true, "inside the band throughout (settling time 0.0 s)");
        }
        if (lastOutS >= endS - TIME_EPS_S) {
            return outcome(false, "still outside the band at the end (" + eng(channel, lastValue) + ")");
        }
        double settleS = lastOutS - afterS;
        return outcome(settleS <= withinS + TIME_EPS_S, "settling time " + seconds(settleS)
                + ", final " + eng(channel, lastValue));
    }
}
