package org.drumloop.plant;

import java.io.IOException;
import java.io.Writer;
import java.util.Locale;

/**
 * Open-loop bump test of the plant alone: steady state at the file's nominal load, every input
 * frozen (prescribed steam and feed flows, firing in manual), then one input stepped by a percentage
 * of its rating at t = 10 s. Writes a CSV trend, one row per 100 ms.
 *
 * <p>Ratings: STEAM and FEED steps are percent of the rated steam flow; FUEL steps the manual firing
 * by percent of the maximum heat (through the burner lag).
 */
public final class BumpTest {
    /** The input to step. */
    public enum Input { STEAM, FEED, FUEL }

    /** Time of the step [s]. */
    public static final double STEP_TIME_S = 10.0;
    /** Plant step and trend interval [s]. */
    public static final double DT_S = 0.1;

    /** CSV header; first column is time, then engineering units named in brackets. */
    public static final String HEADER = "t[s],drum_level[mm],drum_pressure[barg],steam_flow[t/h],feed_flow[t/h],"
            + "heat[MW],firing[%],riser_quality[-],riser_void_fraction[-],downcomer_flow[kg/s],"
            + "steam_under_surface[m3],feed_temperature[degC],invalid[-]";

    /** Extremes of the level response after the step. */
    public record Result(double maxLevelM, double maxLevelTimeS, double minLevelM, double minLevelTimeS,
                         double finalLevelM, double finalPressurePa) { }

    private BumpTest() { }

    public static Result run(PlantConfig cfg, Input input, double stepPercentOfRating, double durationS,
                             long seed, Writer trendCsv) throws IOException {
        Plant plant = new Plant(cfg, seed);
        plant.initSteadyState(cfg.nominalLoadFrac());
        double qs0 = plant.steamFlowKgS();
        double qf0 = plant.feedFlowKgS();
        double firing0 = plant.firingFrac();
        plant.setSteamFlowOverrideKgS(qs0);
        plant.setFeedFlowOverrideKgS(qf0);
        plant.setFiringManual(firing0);
        double step = stepPercentOfRating / 100.0;
        if (trendCsv != null) {
            trendCsv.write(HEADER);
            trendCsv.write('\n');
        }
        double maxL = 0;
        double maxT = 0;
        double minL = 0;
        double minT = 0;
        long n = Math.round(durationS / DT_S);
        boolean stepped = false;
        for (long i = 0; i <= n; i++) {
            double t = i * DT_S;
            if (!stepped && t >= STEP_TIME_S - 1e-9) {
                stepped = true;
                switch (input) {
                    case STEAM -> plant.setSteamFlowOverrideKgS(qs0 + step * cfg.ratedSteamFlowKgS());
                    case FEED -> plant.setFeedFlowOverrideKgS(qf0 + step * cfg.ratedSteamFlowKgS());
                    case FUEL -> plant.setFiringManual(Math.min(1, Math.max(0, firing0 + step)));
                    default -> throw new IllegalArgumentException(input.toString());
                }
            }
            if (i > 0) {
                plant.step(DT_S);
            }
            double l = plant.levelM();
            if (stepped) {
                if (l > maxL) {
                    maxL = l;
                    maxT = plant.timeS() - STEP_TIME_S;
                }
                if (l < minL) {
                    minL = l;
                    minT = plant.timeS() - STEP_TIME_S;
                }
            }
            if (trendCsv != null) {
                trendCsv.write(String.format(Locale.ROOT, "%.1f,%.3f,%.5f,%.4f,%.4f,%.5f,%.3f,%.6f,%.6f,%.3f,%.5f,%.3f,%d%n",
                        plant.timeS(), l * 1e3, (plant.drumPressurePa() - 101_325) / 1e5,
                        plant.steamFlowKgS() * 3.6, plant.feedFlowKgS() * 3.6, plant.heatW() / 1e6,
                        plant.firingFrac() * 100, plant.riserQuality(), plant.riserVoidFraction(),
                        plant.downcomerFlowKgS(), plant.steamUnderSurfaceM3(), plant.feedTempK() - 273.15,
                        plant.invalid() ? 1 : 0));
            }
        }
        if (trendCsv != null) {
            trendCsv.flush();
        }
        return new Result(maxL, maxT, minL, minT, plant.levelM(), plant.drumPressurePa());
    }
}
