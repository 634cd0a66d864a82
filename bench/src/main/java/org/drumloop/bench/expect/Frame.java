package org.drumloop.bench.expect;

import org.drumloop.core.io.Quality;

/**
 * One sample of a run, reused scan after scan: time, every {@link Channel} in SI, the control mode
 * label, the level transmitters' qualities, and the state, bypass and first-out of the interlocks
 * (in the order of the firmware's interlock set).
 */
public final class Frame {
    public double tS;
    public final double[] value = new double[Channel.count()];
    /** Mode label as the firmware spells it ("manual", "single-element", "three-element"). */
    public String modeLabel = "";
    /** Interlock (alarm or trip) active, by interlock index. */
    public final boolean[] interlockActive;

    /** Interlock bypassed, by interlock index. */
    public final boolean[] interlockBypassed;
    /** Quality of level transmitters A, B, C as the controller judged them. */
    public final Quality[] levelTxQuality = {Quality.BAD, Quality.BAD, Quality.BAD};
    /** Index of the first-out trip in the interlock set, -1 when none. */
    public int firstOut = -1;

    public Frame(int interlockCount) {
        this.interlockActive = new boolean[interlockCount];
        this.interlockBypassed = new boolean[interlockCount];
    }

    public double get(Channel c) { return value[c.ordinal()]; }

    public void set(Channel c, double si) { value[c.ordinal()] = si; }
}
