package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.nio.file.Path;
import java.util.Arrays;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.Quality;
import org.drumloop.core.soe.SoeLog;
import org.drumloop.core.soe.SoeSink;
import org.junit.jupiter.api.Test;

/**
 * {@code InterlockSet.evaluate} allocates nothing per scan, measured with the JVM's per-thread
 * allocation counter (com.sun.management.ThreadMXBean#getThreadAllocatedBytes) over 100 000 scans
 * in which alarms and trips come and go, resets are requested and the log is drained.
 */
class InterlockAllocationTest {
    private static final int WARMUP_SCANS = 200_000;
    private static final int MEASURED_SCANS = 100_000;
    /**
     * Allowed bytes over one measured window: one allocation per scan would be at least
     * 16 bytes x 100 000 = 1.6 MB. The bound leaves room for one-off JVM events (a late JIT
     * recompilation or deoptimisation can allocate a few hundred bytes once on a loaded machine);
     * the best of three windows counts.
     */
    private static final long MAX_BYTES = 4096;
    private static final int WINDOWS = 3;
    private static final SoeSink DISCARD = (t, s, tag, k, m) -> { };

    @Test
    void evaluatingAllocatesNothingPerScan() throws ConfigException {
        SoeLog log = new SoeLog(256);
        InterlockSet set = new InterlockSet(InterlockFile.load(Path.of("..", "config", "tuning", "default.interlocks")), log);
        InterlockInputs in = new InterlockInputs();
        InterlockOutputs out = new InterlockOutputs();
        Arrays.fill(in.levelQuality, Quality.GOOD);
        in.levelSelectedQuality = Quality.GOOD;
        in.feedTempQuality = Quality.GOOD;
        in.levelDeviationQuality = Quality.GOOD;
        set.bypass("LAH", "allocation test", 3600.0, 0.0);
        run(set, log, in, out, 0, WARMUP_SCANS);
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long tid = Thread.currentThread().getId();
        long best = Long.MAX_VALUE;
        for (int w = 0; w < WINDOWS; w++) {
            long before = mx.getThreadAllocatedBytes(tid);
            long overheadEnd = mx.getThreadAllocatedBytes(tid);
            run(set, log, in, out, WARMUP_SCANS + w * MEASURED_SCANS, MEASURED_SCANS);
            long after = mx.getThreadAllocatedBytes(tid);
            best = Math.min(best, (after - overheadEnd) - (overheadEnd - before));
        }
        assertTrue(best <= MAX_BYTES, "allocated " + best + " bytes over " + MEASURED_SCANS + " scans");
    }

    @Test
    void theCounterSeesAnAllocatingSink() throws ConfigException {
        // Control experiment: the same run with a sink that builds a string per event must exceed
        // the bound, showing the measurement can fail.
        java.util.List<String> kept = new java.util.ArrayList<>();
        SoeLog log = new SoeLog(256);
        InterlockSet set = new InterlockSet(InterlockFile.load(Path.of("..", "config", "tuning", "default.interlocks")), log);
        InterlockInputs in = new InterlockInputs();
        InterlockOutputs out = new InterlockOutputs();
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long tid = Thread.currentThread().getId();
        long before = mx.getThreadAllocatedBytes(tid);
        run(set, log, in, out, 0, MEASURED_SCANS, (t, s, tag, k, m) -> kept.add(tag + ": " + m));
        long bytes = mx.getThreadAllocatedBytes(tid) - before;
        assertTrue(bytes > MAX_BYTES, "allocated " + bytes + " bytes for " + kept.size() + " events");
    }

    private static void run(InterlockSet set, SoeLog log, InterlockInputs in, InterlockOutputs out, int from, int count) {
        run(set, log, in, out, from, count, DISCARD);
    }

    private static void run(InterlockSet set, SoeLog log, InterlockInputs in, InterlockOutputs out, int from, int count,
            SoeSink sink) {
        double dtS = 0.1;
        for (int k = from; k < from + count; k++) {
            double tS = k * dtS;
            // level swings +-300 mm with a 60 s period: every alarm and trip sets and clears
            double level = 0.3 * Math.sin(2 * Math.PI * tS / 60.0);
            for (int i = 0; i < 3; i++) {
                in.levelM[i] = level + 0.001 * i;
                in.levelQuality[i] = (k % 997 == 0 && i == 1) ? Quality.BAD : Quality.GOOD;
            }
            in.levelSelectedM = level;
            in.levelDeviationM = (k / 300) % 2 == 0 ? 0.002 : 0.080;
            in.feedTempK = (k / 500) % 2 == 0 ? 363.15 : 320.0;
            if (k % 50 == 0) {
                set.requestReset();
            }
            set.evaluate(in, tS, k, dtS, out);
            log.drainTo(sink);
        }
    }
}
