package org.drumloop.bench.record;

import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Frame;

/**
 * The figures a commissioning record quotes for a level-control run, accumulated scan by scan
 * without allocation: largest deviation from setpoint of the true and of the indicated level,
 * integral of absolute level error, feed-valve travel, and recovery time (from the last scenario action until the level stays
 * within {@link #RECOVERY_BAND_M} of setpoint).
 */
public final class KeyFigures {
    /** Band for "recovered": ±10 mm around setpoint (our choice for the report, common practice order of magnitude). */
    public static final double RECOVERY_BAND_M = 0.010;

    private double maxDeviationM;
    private double maxDeviationAtS = Double.NaN;
    private double maxIndicatedDeviationM;
    private double maxIndicatedDeviationAtS = Double.NaN;
    private double iaeMS;
    private double valveTravelFrac;
    private double prevValve = Double.NaN;
    private double prevS = Double.NaN;
    private double lastActionS;
    private double lastOutsideS = Double.NaN;
    private double endS;

    public void lastActionAt(double tS) {
        lastActionS = tS;
    }

    public void add(Frame f) {
        double err = f.get(Channel.DRUM_LEVEL) - f.get(Channel.SETPOINT);
        double a = Math.abs(err);
        if (a > maxDeviationM || Double.isNaN(maxDeviationAtS)) {
            maxDeviationM = a;
            maxDeviationAtS = f.tS;
        }
        double ind = Math.abs(f.get(Channel.MEASURED_LEVEL) - f.get(Channel.SETPOINT));
        if (ind > maxIndicatedDeviationM || (Double.isNaN(maxIndicatedDeviationAtS) && !Double.isNaN(ind))) {
            maxIndicatedDeviationM = ind;
            maxIndicatedDeviationAtS = f.tS;
        }
        if (!Double.isNaN(prevS)) {
            iaeMS += a * (f.tS - prevS);
        }
        double v = f.get(Channel.FEED_VALVE);
        if (!Double.isNaN(prevValve)) {
            valveTravelFrac += Math.abs(v - prevValve);
        }
        prevValve = v;
        prevS = f.tS;
        if (!(a <= RECOVERY_BAND_M)) {
            lastOutsideS = f.tS;
        }
        endS = f.tS;
    }

    public double maxDeviationM() { return maxDeviationM; }

    public double maxDeviationAtS() { return maxDeviationAtS; }

    /**
     * Largest deviation of the indicated level (the controller's selected, compensated level) from
     * setpoint [m]; differs from the true level's when a transmitter reads wrong or the level leaves
     * the transmitters' range.
     */
    public double maxIndicatedDeviationM() { return maxIndicatedDeviationM; }

    public double maxIndicatedDeviationAtS() { return maxIndicatedDeviationAtS; }

    public double iaeMS() { return iaeMS; }

    public double valveTravelFrac() { return valveTravelFrac; }

    /** Seconds from the last action until the level stayed within the band; 0 when never outside after it; NaN when not recovered by the end. */
    public double recoveryS() {
        if (Double.isNaN(lastOutsideS) || lastOutsideS < lastActionS) {
            return 0.0;
        }
        if (lastOutsideS >= endS) {
            return Double.NaN;
        }
        return lastOutsideS - lastActionS;
    }
}
