package org.drumloop.bench.expect;

/**
 * One sample of a run, reused scan after scan: time, every {@link Channel} in SI, the control mode
 * label and the state of each interlock (in the order of the firmware's interlock set).
 */
public final class Frame {
    public double tS;
    public final double[] value = new double[Channel.count()];
    /** Mode label as the firmware spells it ("manual", "single-element", "three-element"). */
    public String modeLabel = "";
    /** Interlock (alarm or trip) active, by interlock index. */
    public final boolean[] interlockActive;

    public Frame(int interlockCount) {
        this.interlockActive = new boolean[interlockCount];
    }

    public double get(Channel c) { return value[c.ordinal()]; }

    public void set(Channel c, double si) { value[c.ordinal()] = si; }
}
