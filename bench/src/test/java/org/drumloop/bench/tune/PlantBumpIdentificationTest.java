package org.drumloop.bench.tune;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.drumloop.plant.BumpTest;
import org.drumloop.plant.FeedTrain;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantConfigException;
import org.drumloop.plant.PlantFile;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Identification on bump tests of the shipped plants, compared with the model's own linearisation
 * where one exists: the valve's static gain (the feed train's closed form differentiated at the
 * drum pressure setpoint) and the level's integrating gain with the pressure held by the plant's
 * control, {@code 1 / ((rho_w - rho_s) A)}: added mass fills the water volume, and the same volume
 * of steam leaves the drum (mass balance of the Åström–Bell model).
 */
class PlantBumpIdentificationTest {
    /** Required relative agreement with the linearisation. */
    private static final double REL = 0.02;

    static PlantConfig plant(String name) throws PlantConfigException {
        return PlantFile.load(Path.of("..", "config", "plants", name + ".plant"));
    }

    @ParameterizedTest
    @ValueSource(strings = {"aux-boiler", "ab160"})
    void valveGainMatchesTheFeedTrainLinearisation(String name) throws Exception {
        PlantConfig cfg = plant(name);
        Trend v = PlantBumps.run(cfg, PlantBumps.Input.VALVE);
        BumpFit f = Identification.fit("valve", StepModel.Kind.FOPDT, v.tS(), v.get(TrendSignal.VALVE_DEMAND),
                v.get(TrendSignal.FEED_FLOW));
        double[] u = v.get(TrendSignal.VALVE_DEMAND);
        Plant p = new Plant(cfg, 1);
        p.initSteadyState(cfg.nominalLoadFrac());
        FeedTrain ft = p.feedTrain();
        double rho = p.feedFlowKgS() / ft.feedM3S();
        double pd = cfg.pressureSetpointPa();
        double q0 = ft.solve(pd, u[0], 1, 0, rho) * rho;
        double q1 = ft.solve(pd, u[u.length - 1], 1, 0, rho) * rho;
        double linear = (q1 - q0) / (u[u.length - 1] - u[0]);
        assertEquals(linear, f.get("k"), REL * linear, name + ": fitted " + f.get("k") + " kg/s per valve travel");
        assertTrue(f.fitPercent() > 90, "fit " + f.fitPercent());
    }

    @Test
    void levelSlopesOnFeedAndSteamMatchTheMassBalanceOnTheReferencePlant() throws Exception {
        PlantConfig cfg = plant("ab160");
        double expected = massBalanceSlope(cfg);
        BumpFit f = levelFit(cfg, PlantBumps.Input.FEED, 600);
        assertEquals(expected, f.get("kI"), REL * expected, "fitted " + f.get("kI"));
        // the shrink: the feed step's inverse response (RHP zero) is positive
        assertTrue(-f.get("kL") / f.get("kI") - f.get("tau") > 0);
        BumpFit s = levelFit(cfg, PlantBumps.Input.STEAM, 600);
        assertEquals(-expected, s.get("kI"), REL * expected, "fitted " + s.get("kI"));
        assertTrue(s.get("kL") > 0, "swell");
    }

    @Test
    void levelSlopeOnFeedMatchesTheMassBalanceOnTheAuxiliaryBoilerOnceThePressureControlHasSettled() throws Exception {
        // the small drum's pressure control takes long to settle after cold feed: a record of 1800 s
        PlantConfig cfg = plant("aux-boiler");
        double expected = massBalanceSlope(cfg);
        BumpFit f = levelFit(cfg, PlantBumps.Input.FEED, 1800);
        assertEquals(expected, f.get("kI"), REL * expected, "fitted " + f.get("kI"));
    }

    /** An integrator with one lag fitted to a level bump test with the pressure control in automatic. */
    private static BumpFit levelFit(PlantConfig cfg, PlantBumps.Input input, double durationS) {
        Trend t = PlantBumps.run(cfg, input, durationS, false);
        TrendSignal u = input == PlantBumps.Input.FEED ? TrendSignal.FEED_FLOW : TrendSignal.STEAM_FLOW;
        return Identification.fit(input.name(), StepModel.Kind.INTEGRATOR_LAG, t.tS(), t.get(u), t.get(TrendSignal.DRUM_LEVEL));
    }

    @Test
    void theBumpCommandsOwnRecordIsReadAsItIsAndFitted() throws IOException, Exception {
        // drumloop bump output (firing held) read by the trend reader without any column mapping
        StringWriter w = new StringWriter();
        BumpTest.run(plant("aux-boiler"), BumpTest.Input.FEED, 5, 600, 1, w);
        Trend t = TrendCsv.parse("bump.csv", w.toString().lines().toList(), Map.of(), Set.of(TrendSignal.TIME),
                EnumSet.allOf(TrendSignal.class));
        BumpAnalysis.Result r = BumpAnalysis.analyse(List.of(t));
        BumpFit f = r.fits().feed();
        assertTrue(f != null && f.fitPercent() > 99, "fit " + (f == null ? "none" : f.fitPercent()));
        assertTrue(f.get("kI") > 0 && TuningDesign.Level.of(f).inverse() > 0, "integrating with a shrink");
        assertTrue(t.has(TrendSignal.FEED_TEMP), "feed_temperature[degC] is read as feed_temp");
    }

    /** 1 / ((rho_w - rho_s) A) at the setpoint pressure and NWL [m/s per kg/s]. */
    private static double massBalanceSlope(PlantConfig cfg) {
        Plant p = new Plant(cfg, 1);
        p.initSteadyState(cfg.nominalLoadFrac());
        return 1 / ((p.waterDensity() - p.steamDensity()) * p.geometry().surfaceArea(cfg.nwlHeightM()));
    }
}
