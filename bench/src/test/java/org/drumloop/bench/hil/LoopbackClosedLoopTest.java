package org.drumloop.bench.hil;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.drumloop.bench.sim.SimulationSession;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantFile;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Closed loop over Modbus: the firmware holds the drum level through a steam load step with the
 * plant on the far side of a real TCP link (lockstep pacing, faster than real time), within the
 * same band as the same plant, tuning and seed run in process. The in-process simulation is the
 * reference; the link may add only register quantisation.
 */
class LoopbackClosedLoopTest {
    private static final Path PLANT = Path.of("..", "config", "plants", "aux-boiler.plant");
    private static final Path TUNING = Path.of("..", "config", "tuning", "default.tuning");
    private static final long SEED = 7;
    private static final double LOAD_FRAC = 0.6;
    private static final double STEP_TO_FRAC = 0.8;
    private static final double STEP_AT_S = 20.0;
    private static final double DURATION_S = 150.0;
    /**
     * Allowed difference in the peak level deviation: a few millimetres. The maps quantise a 4-20 mA
     * loop to 16/27648 mA or 1 µA per count (0.01-0.04 mm of a 600 mm level range) and flows/temperatures to a
     * count of their ranges; the closed loop damps such differences, so millimetres cover them with
     * a wide margin while a lost or scrambled signal would show tens of millimetres.
     */
    private static final double BAND_TOL_M = 0.005;

    @TempDir
    Path dir;

    @ParameterizedTest
    @ValueSource(strings = {"aux-microamp.csv", "aux-4-20ma.csv", "aux-float32.csv", "aux-mixed.csv"})
    void loopbackHoldsLevelThroughALoadStepLikeTheInProcessSimulation(String mapName) throws Exception {
        PlantConfig pc = PlantFile.load(PLANT);
        FirmwareConfig fc = FirmwareConfig.load(TUNING);
        ChannelMap map = ChannelMap.load(Path.of("..", "config", "maps", mapName));

        // the in-process wiring delivers loop currents or engineering values as the map does for the level
        boolean loopCurrents = map.channel(Signal.LEVEL_DP_A).isLoopCurrent();
        double reference = inProcessBand(pc, fc, loopCurrents);
        Loopback.Result r = Loopback.run(map, pc, fc,
                new Loopback.Options(DURATION_S, LOAD_FRAC, STEP_AT_S, STEP_TO_FRAC, SEED, true, dir), null);

        assertEquals(Math.round(DURATION_S / fc.scanPeriodS()), r.scans(), 1.0, "every scan ran");
        assertTrue(r.maxDeviationAfterStepM() > 0.001, "the step must move the level, else the test proves nothing");
        assertEquals(reference, r.maxDeviationAfterStepM(), BAND_TOL_M,
                "peak level deviation after the step, loopback vs in process");
        assertEquals(0, r.client().errors(), r.client().toString());
        assertTrue(r.client().ok() > 0);
        List<String> trend = Files.readAllLines(dir.resolve("trend.csv"));
        assertTrue(trend.size() > 1000, "one row per scan");
        assertEquals(4, Files.readAllLines(dir.resolve("link-stats.csv")).size(), "header + client + server + its one connection");
    }

    /** Peak |level - setpoint| after the step with the same plant, tuning and seed, no Modbus. */
    private static double inProcessBand(PlantConfig pc, FirmwareConfig fc, boolean loopCurrents) {
        SimulationSession s = new SimulationSession(pc, fc, SEED, LOAD_FRAC);
        s.io().setLoopCurrents(loopCurrents);
        double dt = fc.scanPeriodS();
        long n = Math.round(DURATION_S / dt);
        double peak = 0.0;
        for (long k = 0; k < n; k++) {
            double tS = k * dt;
            if (Math.abs(tS - STEP_AT_S) < dt / 2) {
                s.setSteamDemand(STEP_TO_FRAC);
            }
            s.scan();
            if (tS + dt >= STEP_AT_S) {
                peak = Math.max(peak, Math.abs(s.plant().levelM() - fc.levelSetpointM()));
            }
        }
        return peak;
    }
}
