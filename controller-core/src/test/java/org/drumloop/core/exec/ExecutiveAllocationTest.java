package org.drumloop.core.exec;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.soe.SoeLog;
import org.junit.jupiter.api.Test;

/**
 * The executive's loop in simulated time allocates nothing per scan (measured with
 * com.sun.management.ThreadMXBean#getThreadAllocatedBytes over 100 000 scans), including scans
 * under the watchdog's fail-safe outputs.
 */
class ExecutiveAllocationTest {
    private static final int WARMUP_SCANS = 200_000;
    private static final int MEASURED_SCANS = 100_000;
    /**
     * One allocation per scan would be at least 16 B x 200 000 = 3.2 MB here. The bound leaves room
     * for one-off JVM events in a measured window (a late JIT recompilation or deoptimisation can
     * allocate a few hundred bytes once, seen on a loaded machine); the best of three windows counts.
     */
    private static final long MAX_BYTES = 4096;
    private static final int WINDOWS = 3;

    @Test
    void runningScansAllocatesNothing() throws InterruptedException {
        ProcessIo io = new ProcessIo() {
            @Override
            public void readInputs(ProcessImage in, double tS) {
                in.set(Signal.DRUM_PRESSURE, 1e6 + tS, Quality.GOOD, tS);
            }

            @Override
            public void writeOutputs(ProcessImage out, double tS) { }
        };
        ScanBody body = (in, out, tS, dtS) -> out.set(Signal.FEED_VALVE_DEMAND, 0.5, Quality.GOOD, tS);
        SoeLog soe = new SoeLog(16);
        ScanExecutive ex = new ScanExecutive(SimulatedClock.asFastAsPossible(), io, body, 0.1, FailSafe.defaults(), soe);
        ex.setListener((scan, tS, in, out) -> soe.drainTo((t, s, tag, k, m) -> { }));
        ex.runScans(WARMUP_SCANS / 2);
        // a body failure trips the watchdog: the rest runs under fail-safe outputs
        ScanExecutive[] holder = {null};
        ScanExecutive failing = new ScanExecutive(SimulatedClock.asFastAsPossible(), io, (in, out, tS, dtS) -> {
            if (holder[0] != null && holder[0].scanCount() == 10) {
                throw new IllegalStateException("one failure");
            }
        }, 0.1, FailSafe.defaults(), soe);
        holder[0] = failing;
        failing.runScans(WARMUP_SCANS / 2);
        assertTrue(failing.watchdog().tripped());

        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long tid = Thread.currentThread().getId();
        long best = Long.MAX_VALUE;
        for (int w = 0; w < WINDOWS; w++) {
            long before = mx.getThreadAllocatedBytes(tid);
            long overheadEnd = mx.getThreadAllocatedBytes(tid);
            ex.runScans(MEASURED_SCANS);
            failing.runScans(MEASURED_SCANS);
            long after = mx.getThreadAllocatedBytes(tid);
            best = Math.min(best, (after - overheadEnd) - (overheadEnd - before));
        }
        assertTrue(best <= MAX_BYTES, "allocated " + best + " bytes over " + 2 * MEASURED_SCANS + " scans");
    }
}
