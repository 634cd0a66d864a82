package org.drumloop.bench.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.expect.Channel;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.TransmitterId;
import org.junit.jupiter.api.Test;

class SimulationSessionTest {
    /** Steady-state load used for the checks (fraction of rating). */
    private static final double LOAD = 0.6;
    /** Scans for the allocation check: 100 s of plant time at the default 100 ms scan. */
    private static final int SCANS = 1000;
    /** Allowed heap allocation over those scans: a few KiB for lazy JIT-time structures, none per scan. */
    private static final long ALLOC_BUDGET_BYTES = 16 * 1024;

    static PlantConfig plant() throws Exception {
        return ScenarioRunner.loadPlant(ConfigResolver.resolve("aux-boiler", "plants", ".plant", null));
    }

    static FirmwareConfig tuning() throws Exception {
        return FirmwareConfig.load(ConfigResolver.resolve("default", "tuning", ".tuning", null));
    }

    @Test
    void plantIoCopiesEveryTransmitterAsValueAndLoopCurrent() throws Exception {
        Plant p = new Plant(plant(), 7);
        p.initSteadyState(LOAD);
        PlantIo io = new PlantIo(p);
        ProcessImage in = new ProcessImage();
        io.readInputs(in, 1.5);
        // the wiring is a copy: the image holds exactly the transmitter's value and current
        assertEquals(p.transmitter(TransmitterId.LEVEL_A).value(), in.value(Signal.LEVEL_DP_A), 0.0);
        assertEquals(p.transmitter(TransmitterId.LEVEL_C).currentMa(), in.currentMa(Signal.LEVEL_DP_C), 0.0);
        assertEquals(p.transmitter(TransmitterId.DRUM_PRESSURE).value(), in.value(Signal.DRUM_PRESSURE), 0.0);
        assertEquals(p.transmitter(TransmitterId.FEED_TEMP).currentMa(), in.currentMa(Signal.FEED_TEMP), 0.0);
        assertEquals(Quality.GOOD, in.quality(Signal.STEAM_FLOW_DP));
        assertEquals(1.5, in.updatedS(Signal.FEED_FLOW_DP), 0.0);
        assertTrue(in.bool(Signal.PUMP_A_RUNNING));
        assertTrue(in.bool(Signal.BURNER_ON));
        // loop current within the NAMUR NE 43 measuring band 3.8..20.5 mA for a healthy transmitter
        double ma = in.currentMa(Signal.LEVEL_DP_B);
        assertTrue(ma >= 3.8 && ma <= 20.5, "NE 43 measuring band: " + ma);

        ProcessImage out = new ProcessImage();
        out.set(Signal.FEED_VALVE_DEMAND, 0.25, Quality.GOOD, 1.5);
        out.setBool(Signal.PUMP_A_RUN, true, Quality.GOOD, 1.5);
        out.setBool(Signal.PUMP_B_RUN, true, Quality.GOOD, 1.5);
        out.setBool(Signal.FUEL_CUTOFF, false, Quality.GOOD, 1.5);
        io.writeOutputs(out, 1.5);
        for (int i = 0; i < 100; i++) {
            p.step(0.1);
        }
        // after 10 s both pumps run (B started on command) and the valve moved toward 25 %
        assertTrue(p.pumpRunning(1), "pump B started on its run command");
        assertTrue(p.feedValvePositionFrac() < 0.5, "valve moves toward the demand: " + p.feedValvePositionFrac());
    }

    @Test
    void theLoopHoldsSteadyStateWithoutDisturbance() throws Exception {
        SimulationSession s = new SimulationSession(plant(), tuning(), 1, LOAD);
        for (int i = 0; i < 50; i++) {
            s.scan();
        }
        // 5 s after a balanced start: no bump. 20 mm is a quarter of the usual +-75 mm alarm band (common practice)
        assertEquals(0.0, s.frame().get(Channel.DRUM_LEVEL), 0.020);
        // the frame holds the last scan: scan 49 at 49 x 0.1 s (rounding of the product only)
        assertEquals(4.9, s.frame().tS, 1e-12);
        assertEquals(50, s.scans());
        assertEquals("three-element", s.frame().modeLabel);
    }

    @Test
    void theSameScenarioAndSeedGiveTheSameRecord(@org.junit.jupiter.api.io.TempDir java.nio.file.Path tmp)
            throws Exception {
        java.util.List<String> lines = java.util.List.of("title repeat", "duration 60 s", "seed 5",
                "at 0 s set steam_demand 50 %", "at 10 s ramp steam_demand to 70 % over 10 s",
                "at 20 s fault level_tx_a noise-burst 200 Pa for 10 s", "expect trip LALL never");
        for (String run : new String[] {"a", "b"}) {
            ScenarioRunner.run(org.drumloop.bench.scenario.ScenarioParser.parse("repeat.scenario", null, lines),
                    ScenarioRunner.Options.fast(tmp.resolve(run)));
        }
        // plant and firmware are deterministic for a seed (no wall clock, seeded noise): byte-identical trends
        assertEquals(-1L, java.nio.file.Files.mismatch(tmp.resolve("a/trend.csv"), tmp.resolve("b/trend.csv")));
        assertEquals(-1L, java.nio.file.Files.mismatch(tmp.resolve("a/events.csv"), tmp.resolve("b/events.csv")));
    }

    @Test
    void aScanAllocatesNothing() throws Exception {
        SimulationSession s = new SimulationSession(plant(), tuning(), 1, LOAD);
        s.setEventSink(null);
        for (int i = 0; i < SCANS; i++) {
            s.scan(); // warm up
        }
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long tid = Thread.currentThread().getId();
        long before = mx.getThreadAllocatedBytes(tid);
        for (int i = 0; i < SCANS; i++) {
            s.scan();
        }
        long bytes = mx.getThreadAllocatedBytes(tid) - before;
        assertTrue(bytes < ALLOC_BUDGET_BYTES, "allocated " + bytes + " bytes over " + SCANS + " scans");
    }
}
