package org.drumloop.bench.expect;

/**
 * The controller is in a mode at an instant, or reaches it within a time after an instant:
 * {@code expect mode three-element at 450 s}, {@code expect mode single-element within 2 s after 400 s}.
 */
public final class ModeExpectation extends Expectation {
    private final String label;
    private final boolean at;
    private final double fromS;
    private final double toS;

    private double reachedS;
    private String seenAt;

    /** {@code at}: judged at the first sample at or after fromS; otherwise reached within fromS..toS. */
    public ModeExpectation(String file, int line, String text, String label, boolean at, double fromS, double toS) {
        super(file, line, text);
        this.label = label;
        this.at = at;
        this.fromS = fromS;
        this.toS = toS;
    }

    @Override
    public void start() {
        reachedS = Double.NaN;
        seenAt = null;
    }

    @Override
    public void observe(Frame f) {
        if (at) {
            if (seenAt == null && f.tS >= fromS - TIME_EPS_S) {
                seenAt = f.modeLabel;
                if (label.equals(f.modeLabel)) {
                    reachedS = f.tS;
                }
            }
            return;
        }
        if (!Double.isNaN(reachedS) || f.tS < fromS - TIME_EPS_S || f.tS > toS + TIME_EPS_S) {
            return;
        }
        if (label.equals(f.modeLabel)) {
            reachedS = f.tS;
        }
    }

    @Override
    public Outcome finish(double endS) {
        if (at) {
            if (seenAt == null) {
                return outcome(false, "run ended at " + seconds(endS) + " before " + seconds(fromS));
            }
            return outcome(!Double.isNaN(reachedS), "mode " + seenAt + " at " + seconds(fromS));
        }
        if (Double.isNaN(reachedS)) {
            return outcome(false, "mode " + label + " not reached within the time");
        }
        return outcome(true, "mode " + label + " " + seconds(reachedS - fromS) + " after " + seconds(fromS));
    }
}
