package org.drumloop.core.exec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.safety.InterlockFile;
import org.drumloop.core.safety.InterlockInputs;
import org.drumloop.core.safety.InterlockOutputs;
import org.drumloop.core.safety.InterlockSet;
import org.drumloop.core.soe.SoeLog;
import org.junit.jupiter.api.Test;

/**
 * The executive, the shipped interlocks and the event log together, in simulated time: every event
 * reaches the listener in the scan it happened, and the demo settings act at the scans worked out
 * by hand from check-values §6 (common practice: LALL -200 mm after 2 s, LAL -75 mm after 5 s).
 */
class ScanWithInterlocksTest {
    private static final double DT_S = 0.1;
    private static final int DROP_AT_SCAN = 50;
    private static final double DROPPED_LEVEL_M = -0.250;

    @Test
    void eventsAreDrainedInTheScanTheyHappenAndTripsActOnTime() throws ConfigException, InterruptedException {
        SoeLog soe = new SoeLog(64);
        InterlockSet set = new InterlockSet(InterlockFile.load(Path.of("..", "config", "tuning", "default.interlocks")), soe);
        InterlockInputs ilIn = new InterlockInputs();
        InterlockOutputs ilOut = new InterlockOutputs();
        long[] scanNo = {0};
        ProcessIo io = new ProcessIo() {
            @Override
            public void readInputs(ProcessImage in, double tS) {
                double level = scanNo[0] >= DROP_AT_SCAN ? DROPPED_LEVEL_M : 0.0;
                in.set(Signal.LEVEL_INDICATED, level, Quality.GOOD, tS);   // stands in for conditioned level
            }

            @Override
            public void writeOutputs(ProcessImage out, double tS) { }
        };
        ScanBody body = (in, out, tS, dtS) -> {
            double level = in.value(Signal.LEVEL_INDICATED);
            Arrays.fill(ilIn.levelM, level);
            Arrays.fill(ilIn.levelQuality, Quality.GOOD);
            ilIn.levelSelectedM = level;
            ilIn.levelSelectedQuality = Quality.GOOD;
            ilIn.feedTempK = 363.15;
            ilIn.feedTempQuality = Quality.GOOD;
            ilIn.levelDeviationM = 0.0;
            ilIn.levelDeviationQuality = Quality.GOOD;
            set.evaluate(ilIn, tS, scanNo[0], dtS, ilOut);
            out.setBool(Signal.FUEL_CUTOFF, ilOut.fuelCutoff, Quality.GOOD, tS);
        };
        ScanExecutive ex = new ScanExecutive(SimulatedClock.asFastAsPossible(), io, body, DT_S, FailSafe.defaults(), soe);
        List<String> seen = new ArrayList<>();
        ex.setListener((scan, tS, in, out) -> {
            soe.drainTo((t, s, tag, kind, m) -> {
                assertEquals(scan, s, "drained in the scan it was written");
                // scan time is k * dt on both sides: equal to the rounding of one product
                assertEquals(tS, t, 1e-12);
                seen.add(s + " " + tag + " " + kind);
            });
            scanNo[0]++;
        });
        ex.runScans(200);
        // LALL: 2 s = 20 scans after the drop; LAL: 5 s = 50 scans after it (hand-worked)
        assertEquals(List.of((DROP_AT_SCAN + 20) + " LALL TRIP", (DROP_AT_SCAN + 50) + " LAL ALARM"), seen);
        assertTrue(ex.outputs().bool(Signal.FUEL_CUTOFF));
    }
}
