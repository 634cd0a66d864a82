package org.drumloop.bench.expect;

/**
 * The integral of the absolute error of a signal against its reference (the setpoint for levels, or
 * a fixed value) over a window stays below a bound:
 * {@code expect iae drum_level below 3000 mm*s during 60..900 s}.
 * Rectangle rule over the recorded samples: each sample's error times the time since the previous one.
 */
public final class IaeExpectation extends Expectation {
    private final Channel channel;
    private final Channel reference;
    private final double referenceSi;
    private final double boundSiS;
    private final double fromS;
    private final double toS;

    private double iae;
    private double prevS;

    /** @param reference channel to compare against, or null to use {@code referenceSi} */
    public IaeExpectation(String file, int line, String text, Channel channel, Channel reference, double referenceSi,
                          double boundSiS, double fromS, double toS) {
        super(file, line, text);
        this.channel = channel;
        this.reference = reference;
        this.referenceSi = referenceSi;
        this.boundSiS = boundSiS;
        this.fromS = fromS;
        this.toS = toS;
    }

    @Override
    public void start() {
        iae = 0.0;
        prevS = Double.NaN;
    }

    @Override
    public void observe(Frame f) {
        if (f.tS < fromS - TIME_EPS_S || f.tS > toS + TIME_EPS_S) {
            return;
        }
        if (!Double.isNaN(prevS)) {
            double ref = reference == null ? referenceSi : f.get(reference);
            double e = Math.abs(f.get(channel) - ref);
            iae += Double.isNaN(e) ? Double.POSITIVE_INFINITY : e * (f.tS - prevS);
        }
        prevS = f.tS;
    }

    @Override
    public Outcome finish(double endS) {
        if (endS < toS - TIME_EPS_S) {
            return outcome(false, "run ended at " + seconds(endS) + ", before the window closed");
        }
        String m = "IAE " + engDelta(channel, iae) + "*s";
        return outcome(iae <= boundSiS, m);
    }

    public double iaeSiS() { return iae; }
}
