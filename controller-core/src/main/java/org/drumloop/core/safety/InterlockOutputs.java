package org.drumloop.core.safety;

/**
 * Results of one {@link InterlockSet#evaluate} call: the demanded actions and the annunciator
 * states. Everything is overwritten on each evaluation.
 */
public final class InterlockOutputs {
    /** Action "fuel_cutoff": demanded by any effective (latched, not bypassed) interlock that names it. */
    public boolean fuelCutoff;
    /** Action "feed_pumps_stop". */
    public boolean feedPumpsStop;
    /** Action "feed_valve_close". */
    public boolean feedValveClose;
    /** Annunciator states (effective, not bypassed) of the interlocks mapped to them. */
    public boolean alarmLal, alarmLah, tripLall, tripLahh, alarmTal, alarmLdah;
    /** Index (see {@link InterlockSet#tag(int)}) of the first trip to latch since the last reset, -1 when none. */
    public int firstOut = -1;
    /** True while any interlock is bypassed (for a bypass lamp). */
    public boolean anyBypassed;
    /** True while any active alarm or latched trip is not yet acknowledged (for a horn). */
    public boolean unacknowledged;
}
