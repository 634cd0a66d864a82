package org.drumloop.core;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.signal.LevelCompensator;
import org.drumloop.core.signal.SteamTables;

/**
 * A deliberately simple drum for firmware tests: the water inventory integrates feed minus steam,
 * dL/dt = (q_feed - q_steam) / (rho_l A) (mass balance of a drum with constant surface area; shrink
 * and swell ignored), feed flow proportional to valve position with a first-order valve lag, constant
 * pressure and feed temperature. It writes the transmitters' engineering values (no loop current)
 * into a process image with GOOD quality: level dp from the hydrostatic formula, flow dp from the
 * square law. Allocation-free, so it can sit inside the zero-allocation measurement.
 */
final class DrumRig {
    final FirmwareConfig cfg;
    double levelM;
    double steamKgS;
    double feedKgS;
    double valvePos;
    double pressurePa;
    double feedTempK;
    double feedPressurePa;
    /** Feed flow at a fully open valve [kg/s]. */
    final double feedMaxKgS;
    final double areaM2;
    final double valveTauS = 2.0;
    boolean pumpATrips;
    boolean pumpARunning;
    boolean pumpBRunning;
    final Quality[] quality = new Quality[Signal.count()];
    private final LevelCompensator lc;
    private final double steamDpRangePa;
    private final double feedDpRangePa;

    DrumRig(FirmwareConfig cfg, double areaM2, double feedMaxKgS, double pressurePa, double feedTempK) {
        this.cfg = cfg;
        this.areaM2 = areaM2;
        this.feedMaxKgS = feedMaxKgS;
        this.pressurePa = pressurePa;
        this.feedTempK = feedTempK;
        this.feedPressurePa = pressurePa + 3e5;
        this.lc = cfg.levelCompensator();
        this.steamDpRangePa = cfg.steamFlowCal().highSi();
        this.feedDpRangePa = cfg.feedFlowCal().highSi();
        for (int i = 0; i < quality.length; i++) {
            quality[i] = Quality.GOOD;
        }
    }

    /** Steady state at a steam flow: feed equals steam, valve positioned to give it. */
    void steady(double steamKgS) {
        this.steamKgS = steamKgS;
        this.feedKgS = steamKgS;
        this.valvePos = steamKgS / feedMaxKgS;
        this.pumpARunning = true;
    }

    /** Apply the firmware's outputs and advance by dtS (explicit Euler; exact for the level integrator at constant flows). */
    void step(ProcessImage out, double dtS) {
        double demand = out.value(Signal.FEED_VALVE_DEMAND);
        valvePos += dtS / (valveTauS + dtS) * (demand - valvePos);
        boolean anyPump = (out.bool(Signal.PUMP_A_RUN) && !pumpATrips) || out.bool(Signal.PUMP_B_RUN);
        pumpARunning = out.bool(Signal.PUMP_A_RUN) && !pumpATrips;
        pumpBRunning = out.bool(Signal.PUMP_B_RUN);
        feedKgS = anyPump ? valvePos * feedMaxKgS : 0.0;
        double rhoL = SteamTables.saturatedLiquidDensity(pressurePa);
        levelM += (feedKgS - steamKgS) / (rhoL * areaM2) * dtS;
    }

    /** Write the transmitter values for the scan at tS. */
    void write(ProcessImage in, double tS) {
        double rhoL = SteamTables.saturatedLiquidDensity(pressurePa);
        double rhoV = SteamTables.saturatedVapourDensity(pressurePa);
        double rhoRef = SteamTables.liquidDensity(lc.refLegTempK(), pressurePa);
        double dp = LevelCompensator.dpPa(levelM + lc.nwlAboveLowerTapM(), lc.tapSpanM(), rhoRef, rhoL, rhoV);
        set(in, Signal.LEVEL_DP_A, dp, tS);
        set(in, Signal.LEVEL_DP_B, dp, tS);
        set(in, Signal.LEVEL_DP_C, dp, tS);
        set(in, Signal.STEAM_FLOW_DP, flowDp(steamKgS, cfg.steamFlowRangeKgS(), steamDpRangePa,
                cfg.steamFlowDesignDensity(), rhoV), tS);
        double rhoFeed = SteamTables.liquidDensity(feedTempK, feedPressurePa);
        set(in, Signal.FEED_FLOW_DP, flowDp(feedKgS, cfg.feedFlowRangeKgS(), feedDpRangePa,
                cfg.feedFlowDesignDensity(), rhoFeed), tS);
        set(in, Signal.DRUM_PRESSURE, pressurePa, tS);
        set(in, Signal.FEED_TEMP, feedTempK, tS);
        set(in, Signal.FEED_PRESSURE, feedPressurePa, tS);
        in.setBool(Signal.PUMP_A_RUNNING, pumpARunning, quality[Signal.PUMP_A_RUNNING.ordinal()], tS);
        in.setBool(Signal.PUMP_B_RUNNING, pumpBRunning, quality[Signal.PUMP_B_RUNNING.ordinal()], tS);
        in.setBool(Signal.BURNER_ON, true, Quality.GOOD, tS);
    }

    private void set(ProcessImage in, Signal s, double v, double tS) {
        in.set(s, v, quality[s.ordinal()], tS);
    }

    /** dp of a flow element ranged {@code range} at {@code dpRange} with design density, at the actual density (inverse of the square law). */
    static double flowDp(double qKgS, double range, double dpRange, double rhoDesign, double rhoActual) {
        double r = qKgS / range;
        return dpRange * r * r * rhoDesign / rhoActual;
    }
}
