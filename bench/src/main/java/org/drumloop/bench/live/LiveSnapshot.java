package org.drumloop.bench.live;

/**
 * Values of one scan, SI, plain fields so a session can fill it without allocating. Arrays are
 * sized for the interlocks listed in {@link LiveInfo#interlocks()}.
 */
public final class LiveSnapshot {
    public double tS;
    /** Drum level truth relative to NWL [m]. */
    public double levelM;
    /** The firmware's compensated, selected level [m]. */
    public double levelIndicatedM;
    public double levelSetpointM;
    public double steamFlowKgS;
    public double feedFlowKgS;
    /** The firmware's measured (compensated) steam and feed flows [kg/s]. */
    public double steamFlowMeasuredKgS;
    public double feedFlowMeasuredKgS;
    /** Feed flow setpoint from the master in three-element, NaN otherwise [kg/s]. */
    public double feedFlowSetpointKgS;
    /** Controller output = valve demand [1]. */
    public double valveDemandFrac;
    public double valvePositionFrac;
    public double drumPressurePa;
    public double feedTempK;
    public double feedPressurePa;
    public double firingFrac;
    public double steamDemandFrac;
    public boolean pumpARunning;
    public boolean pumpBRunning;
    public boolean burnerOn;
    public boolean fuelCutoff;
    /** True when the plant model left its valid range (risers uncovered, drum flooded, ...). */
    public boolean plantInvalid;
    /** "manual", "single-element" or "three-element" (a constant string). */
    public String mode = "manual";
    public boolean auto;
    /** Per interlock, in {@link LiveInfo#interlocks()} order. */
    public final boolean[] active;
    public final boolean[] latched;
    public final boolean[] acknowledged;
    public final boolean[] bypassed;
    public final boolean[] trip;
    /** Time left until a bypass expires [s], NaN when not bypassed or unknown. */
    public final double[] bypassLeftS;
    /** Index of the first-out trip, -1 when none. */
    public int firstOut = -1;
    /** Wall-clock instant the loop published this snapshot (System.nanoTime), for latency figures. */
    public long publishedNanos;
    /** Scan counter of the loop. */
    public long scan;

    public LiveSnapshot(int interlocks) {
        active = new boolean[interlocks];
        latched = new boolean[interlocks];
        acknowledged = new boolean[interlocks];
        bypassed = new boolean[interlocks];
        trip = new boolean[interlocks];
        bypassLeftS = new double[interlocks];
        java.util.Arrays.fill(bypassLeftS, Double.NaN);
    }

    /** Copy every field of {@code o} into this one. */
    void copyFrom(LiveSnapshot o) {
        tS = o.tS;
        levelM = o.levelM;
        levelIndicatedM = o.levelIndicatedM;
        levelSetpointM = o.levelSetpointM;
        steamFlowKgS = o.steamFlowKgS;
        feedFlowKgS = o.feedFlowKgS;
        steamFlowMeasuredKgS = o.steamFlowMeasuredKgS;
        feedFlowMeasuredKgS = o.feedFlowMeasuredKgS;
        feedFlowSetpointKgS = o.feedFlowSetpointKgS;
        valveDemandFrac = o.valveDemandFrac;
        valvePositionFrac = o.valvePositionFrac;
        drumPressurePa = o.drumPressurePa;
        feedTempK = o.feedTempK;
        feedPressurePa = o.feedPressurePa;
        firingFrac = o.firingFrac;
        steamDemandFrac = o.steamDemandFrac;
        pumpARunning = o.pumpARunning;
        pumpBRunning = o.pumpBRunning;
        burnerOn = o.burnerOn;
        fuelCutoff = o.fuelCutoff;
        plantInvalid = o.plantInvalid;
        mode = o.mode;
        auto = o.auto;
        System.arraycopy(o.active, 0, active, 0, active.length);
        System.arraycopy(o.latched, 0, latched, 0, latched.length);
        System.arraycopy(o.acknowledged, 0, acknowledged, 0, acknowledged.length);
        System.arraycopy(o.bypassed, 0, bypassed, 0, bypassed.length);
        System.arraycopy(o.trip, 0, trip, 0, trip.length);
        System.arraycopy(o.bypassLeftS, 0, bypassLeftS, 0, bypassLeftS.length);
        firstOut = o.firstOut;
        publishedNanos = o.publishedNanos;
        scan = o.scan;
    }
}
