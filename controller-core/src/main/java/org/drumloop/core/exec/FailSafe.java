package org.drumloop.core.exec;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;

/**
 * The outputs the watchdog forces when the scan stops keeping time or fails: fuel cut off always,
 * feed valve held at its last good demand or driven to a set position, each feed pump stopped,
 * run or held at its last good command. Immutable.
 *
 * <p>Which choice is safe depends on the plant (holding the valve keeps water going into a boiler
 * whose fuel has just been cut; closing it protects a turbine from carry-over): the values come
 * from the boiler maker and the site, not from this program.
 */
public final class FailSafe {
    /** What a pump run command does under fail-safe. */
    public enum Pump { STOP, RUN, HOLD }

    private final int missedScans;
    private final double valveFrac;
    private final Pump pumpA;
    private final Pump pumpB;

    /**
     * @param missedScans consecutive missed deadlines that trip the watchdog, at least 1
     * @param valveFrac   feed valve demand under fail-safe, 0..1, or NaN to hold the last good demand
     * @param pumpA       pump A run command under fail-safe
     * @param pumpB       pump B run command under fail-safe
     */
    public FailSafe(int missedScans, double valveFrac, Pump pumpA, Pump pumpB) {
        if (missedScans < 1) {
            throw new IllegalArgumentException("missed_scans must be at least 1, got " + missedScans);
        }
        if (!Double.isNaN(valveFrac) && !(valveFrac >= 0.0 && valveFrac <= 1.0)) {
            throw new IllegalArgumentException("fail-safe valve position must be 0..1 or hold, got " + valveFrac);
        }
        this.missedScans = missedScans;
        this.valveFrac = valveFrac;
        this.pumpA = pumpA;
        this.pumpB = pumpB;
    }

    /** Three missed scans, valve and pumps held, fuel cut off. */
    public static FailSafe defaults() { return new FailSafe(3, Double.NaN, Pump.HOLD, Pump.HOLD); }

    public int missedScans() { return missedScans; }

    /** Fail-safe valve demand [1], NaN meaning "hold the last good demand". */
    public double valveFrac() { return valveFrac; }

    public boolean valveHold() { return Double.isNaN(valveFrac); }

    public Pump pumpA() { return pumpA; }

    public Pump pumpB() { return pumpB; }

    /**
     * Overwrite the actuator outputs of {@code out} with fail-safe values; held values come from
     * {@code lastGood} (the outputs of the last scan that completed in time). Allocates nothing.
     */
    public void apply(ProcessImage out, ProcessImage lastGood, double tS) {
        double valve = valveHold() ? lastGood.value(Signal.FEED_VALVE_DEMAND) : valveFrac;
        out.set(Signal.FEED_VALVE_DEMAND, valve, Quality.GOOD, tS);
        out.setBool(Signal.PUMP_A_RUN, pump(pumpA, lastGood.bool(Signal.PUMP_A_RUN)), Quality.GOOD, tS);
        out.setBool(Signal.PUMP_B_RUN, pump(pumpB, lastGood.bool(Signal.PUMP_B_RUN)), Quality.GOOD, tS);
        out.setBool(Signal.FUEL_CUTOFF, true, Quality.GOOD, tS);
    }

    private static boolean pump(Pump p, boolean last) {
        switch (p) {
            case RUN: return true;
            case STOP: return false;
            default: return last;
        }
    }

    @Override
    public String toString() {
        return "missed_scans " + missedScans + ", valve " + (valveHold() ? "hold" : (valveFrac * 100.0) + " %")
                + ", pump_a " + pumpA.name().toLowerCase() + ", pump_b " + pumpB.name().toLowerCase()
                + ", fuel cut off";
    }
}
