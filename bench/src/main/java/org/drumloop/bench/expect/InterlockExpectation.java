package org.drumloop.bench.expect;

import org.drumloop.core.config.ConfigException;

/**
 * An alarm or trip is raised (active) within a time after an instant, or never in a window:
 * {@code expect alarm LAL within 30 s after 600 s}, {@code expect trip LALL never}.
 */
public final class InterlockExpectation extends Expectation {
    private final boolean trip;
    private final String tag;
    private final boolean never;
    private final double fromS;
    private final double toS;
    private final double afterS;
    private int index = -1;
    private double firstActiveS;

    /**
     * @param never  true for "never" (window fromS..toS); false for "within (toS - fromS) after fromS"
     */
    public InterlockExpectation(String file, int line, String text, boolean trip, String tag, boolean never,
                                double fromS, double toS) {
        super(file, line, text);
        this.trip = trip;
        this.tag = tag;
        this.never = never;
        this.fromS = fromS;
        this.toS = toS;
        this.afterS = fromS;
    }

    @Override
    public void bind(Binder binder) throws ConfigException {
        index = binder.interlockIndex(tag);
        if (index < 0) {
            throw error(tag, "no such alarm or trip in the interlocks (known: " + binder.interlockTags() + ")");
        }
        if (binder.interlockIsTrip(index) != trip) {
            throw error(tag, trip ? "is an alarm, not a trip: write 'alarm " + tag + "'"
                    : "is a trip, not an alarm: write 'trip " + tag + "'");
        }
    }

    /** For tests on synthetic traces without a firmware. */
    public void bindIndex(int i) {
        index = i;
    }

    @Override
    public void start() {
        firstActiveS = Double.NaN;
    }

    @Override
    public void observe(Frame f) {
        if (index < 0 || !Double.isNaN(firstActiveS)) {
            return;
        }
        if (f.tS < fromS - TIME_EPS_S || f.tS > toS + TIME_EPS_S) {
            return;
        }
        if (f.interlockActive[index]) {
            firstActiveS = f.tS;
        }
    }

    @Override
    public Outcome finish(double endS) {
        String what = (trip ? "trip " : "alarm ") + tag;
        if (never) {
            if (Double.isNaN(firstActiveS)) {
                return outcome(true, what + " not raised");
            }
            return outcome(false, what + " raised at " + seconds(firstActiveS));
        }
        if (Double.isNaN(firstActiveS)) {
            if (endS < toS - TIME_EPS_S) {
                return outcome(false, "run ended at " + seconds(endS) + ", before the time was over; " + what
                        + " not raised");
            }
            return outcome(false, what + " not raised within the time");
        }
        return outcome(true, what + " raised " + seconds(firstActiveS - afterS) + " after " + seconds(afterS));
    }
}
