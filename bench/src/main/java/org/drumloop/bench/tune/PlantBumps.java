package org.drumloop.bench.tune;

import java.util.EnumMap;
import java.util.Map;

import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;

/**
 * Open-loop bump tests on the simulated plant, as they are run on a boiler: from steady state at the
 * plant file's nominal load, with the feedwater control open (valve or feed flow held) and the
 * plant's own pressure control (firing) in automatic, as it is in every scenario, one input is
 * stepped at {@value #STEP_AT_S} s ({@code drumloop bump} holds the firing instead, a different
 * test):
 * <ul>
 * <li>feed valve demand by {@link #VALVE_STEP_FRAC} of travel (down when the valve is above 80 %),
 *     feed flow from the pump and valve hydraulics: the slave's process;</li>
 * <li>feed flow by {@link #FLOW_STEP_FRAC} of the rated steam flow, steam flow held: level on feed,
 *     the master's process through a perfect slave;</li>
 * <li>steam flow by the same amount, feed flow held: the swell.</li>
 * </ul>
 * The plant's true values are recorded every {@value #DT_S} s.
 */
public final class PlantBumps {
    /** Time of the step [s]. */
    public static final double STEP_AT_S = 10.0;
    /** Plant step and record interval [s]. */
    public static final double DT_S = 0.1;
    /** Valve step, fraction of travel. */
    public static final double VALVE_STEP_FRAC = 0.10;
    /** Feed and steam steps, fraction of the rated steam flow. */
    public static final double FLOW_STEP_FRAC = 0.05;
    /** Length of the valve bump [s]. */
    public static final double VALVE_DURATION_S = 60.0;
    /** Length of the level bumps [s]. */
    public static final double LEVEL_DURATION_S = 600.0;

    /**
     * Settling time with the flows prescribed before the record starts [s]: prescribing the feed flow
     * takes the pump's discharge pressure out of the feed enthalpy, a small transient that must not
     * be mistaken for the response.
     */
    public static final double SETTLE_S = 300.0;

    /** The input stepped. */
    public enum Input { VALVE, FEED, STEAM }

    private PlantBumps() {
    }

    /**
     * Runs one bump test.
     *
     * @throws IllegalStateException the plant left its valid range during the test
     */
    public static Trend run(PlantConfig cfg, Input input) {
        return run(cfg, input, input == Input.VALVE ? VALVE_DURATION_S : LEVEL_DURATION_S, false);
    }

    /**
     * Runs one bump test.
     *
     * @param durationS  length of the record [s]
     * @param holdFiring true to hold the firing (as {@code drumloop bump} does), false to leave the
     *                   plant's pressure control in automatic
     * @throws IllegalStateException the plant left its valid range during the test
     */
    public static Trend run(PlantConfig cfg, Input input, double durationS, boolean holdFiring) {
        Plant plant = new Plant(cfg, 1);
        plant.initSteadyState(cfg.nominalLoadFrac());
        double qs0 = plant.steamFlowKgS();
        double qf0 = plant.feedFlowKgS();
        double u0 = plant.feedValveDemandFrac();
        double step = FLOW_STEP_FRAC * cfg.ratedSteamFlowKgS();
        if (input != Input.VALVE) {
            plant.setSteamFlowOverrideKgS(qs0);
            plant.setFeedFlowOverrideKgS(qf0);
            if (holdFiring) {
                plant.setFiringManual(plant.firingFrac());
            }
            for (int i = 0; i < (int) Math.round(SETTLE_S / DT_S); i++) {
                plant.step(DT_S);
            }
        }
        int n = (int) Math.round(durationS / DT_S) + 1;
        Map<TrendSignal, double[]> v = new EnumMap<>(TrendSignal.class);
        for (TrendSignal s : new TrendSignal[] {TrendSignal.DRUM_LEVEL, TrendSignal.DRUM_PRESSURE, TrendSignal.STEAM_FLOW,
            TrendSignal.FEED_FLOW, TrendSignal.FEED_VALVE, TrendSignal.VALVE_DEMAND, TrendSignal.FIRING, TrendSignal.HEAT,
            TrendSignal.FEED_TEMP}) {
            v.put(s, new double[n]);
        }
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            double now = i * DT_S;
            if (Math.abs(now - STEP_AT_S) < DT_S / 2) {
                switch (input) {
                    case VALVE -> plant.setFeedValveDemand(u0 > 0.8 ? u0 - VALVE_STEP_FRAC : u0 + VALVE_STEP_FRAC);
                    case FEED -> plant.setFeedFlowOverrideKgS(qf0 + step);
                    case STEAM -> plant.setSteamFlowOverrideKgS(qs0 + step);
                    default -> throw new IllegalArgumentException(input.toString());
                }
            }
            if (i > 0) {
                plant.step(DT_S);
            }
            if (plant.invalid()) {
                throw new IllegalStateException(String.format(java.util.Locale.ROOT,
                        "%s bump test: the plant left its valid range at %.1f s", input, now));
            }
            t[i] = now;
            v.get(TrendSignal.DRUM_LEVEL)[i] = plant.levelM();
            v.get(TrendSignal.DRUM_PRESSURE)[i] = plant.drumPressurePa();
            v.get(TrendSignal.STEAM_FLOW)[i] = plant.steamFlowKgS();
            v.get(TrendSignal.FEED_FLOW)[i] = plant.feedFlowKgS();
            v.get(TrendSignal.FEED_VALVE)[i] = plant.feedValvePositionFrac();
            v.get(TrendSignal.VALVE_DEMAND)[i] = plant.feedValveDemandFrac();
            v.get(TrendSignal.FIRING)[i] = plant.firingFrac();
            v.get(TrendSignal.HEAT)[i] = plant.heatW();
            v.get(TrendSignal.FEED_TEMP)[i] = plant.feedTempK();
        }
        return Trend.of(cfg.name() + " " + input.name().toLowerCase(java.util.Locale.ROOT) + " bump", t, v);
    }
}
