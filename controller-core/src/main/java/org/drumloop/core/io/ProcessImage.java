package org.drumloop.core.io;

import java.util.Arrays;

/**
 * A process image: for each {@link Signal} a value in SI units, a quality and the time it was last
 * refreshed. Preallocated arrays, no allocation on get/set, so it can live in the scan.
 *
 * <p>Booleans are stored as 0.0/1.0. For analogue inputs that come from a 4-20 mA loop the loop
 * current may be set too ({@link #setCurrentMa}); it is NaN when the source delivers engineering
 * values (e.g. a float32 register), in which case the firmware uses {@link #value} as is.
 */
public final class ProcessImage {
    private final double[] value = new double[Signal.count()];
    private final double[] currentMa = new double[Signal.count()];
    private final Quality[] quality = new Quality[Signal.count()];
    private final double[] updatedS = new double[Signal.count()];

    public ProcessImage() {
        Arrays.fill(value, 0.0);
        Arrays.fill(currentMa, Double.NaN);
        Arrays.fill(quality, Quality.BAD);
        Arrays.fill(updatedS, Double.NEGATIVE_INFINITY);
    }

    public double value(Signal s) { return value[s.ordinal()]; }

    public boolean bool(Signal s) { return value[s.ordinal()] >= 0.5; }

    /** Loop current [mA], or NaN when the signal is not delivered as a current. */
    public double currentMa(Signal s) { return currentMa[s.ordinal()]; }

    public Quality quality(Signal s) { return quality[s.ordinal()]; }

    /** Time [s] of the last refresh, on the scan's time base. */
    public double updatedS(Signal s) { return updatedS[s.ordinal()]; }

    /** Set an engineering (SI) value with its quality and refresh time; clears the loop current. */
    public void set(Signal s, double valueSi, Quality q, double tS) {
        int i = s.ordinal();
        value[i] = valueSi;
        currentMa[i] = Double.NaN;
        quality[i] = q;
        updatedS[i] = tS;
    }

    public void setBool(Signal s, boolean on, Quality q, double tS) {
        set(s, on ? 1.0 : 0.0, q, tS);
    }

    /**
     * Set a 4-20 mA loop current; the value field is left for the firmware's own scaling (it keeps
     * its previous content). Quality here is the transport's view (GOOD unless stale or lost).
     */
    public void setCurrentMa(Signal s, double mA, Quality q, double tS) {
        int i = s.ordinal();
        currentMa[i] = mA;
        quality[i] = q;
        updatedS[i] = tS;
    }

    /** Change only the quality (e.g. the bridge marks a stale input BAD). */
    public void setQuality(Signal s, Quality q) { quality[s.ordinal()] = q; }

    /** Copy every field of every signal from another image. */
    public void copyFrom(ProcessImage o) {
        System.arraycopy(o.value, 0, value, 0, value.length);
        System.arraycopy(o.currentMa, 0, currentMa, 0, currentMa.length);
        System.arraycopy(o.quality, 0, quality, 0, quality.length);
        System.arraycopy(o.updatedS, 0, updatedS, 0, updatedS.length);
    }
}
