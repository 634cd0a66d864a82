package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import org.junit.jupiter.api.Test;

/**
 * The live loop around the firmware scan and plant step allocates nothing per scan: queued-action
 * check, scan, event hand-over, snapshot fill and publish. Measured with the JVM's per-thread
 * allocation counter (com.sun.management.ThreadMXBean) over many scans of the real closed loop
 * at steady state, best of three windows so a stray event or JIT warm-up does not decide it.
 */
class LiveLoopAllocationTest {
    static final int WARM_UP_SCANS = 20_000;
    static final int WINDOW_SCANS = 20_000;

    @Test
    void aScanOfTheLiveLoopAllocatesNothing() throws Exception {
        SimLiveSession session = SimLiveSession.idle("aux-boiler", "default", 0.7, 3);
        LiveLoop loop = new LiveLoop(session, 1.0);
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long id = Thread.currentThread().getId();
        assertTrue(mx.isThreadAllocatedMemorySupported() && mx.isThreadAllocatedMemoryEnabled(),
                "this JVM must count allocated bytes per thread for the check to mean anything");
        for (int k = 0; k < WARM_UP_SCANS; k++) {
            loop.scanOnce();
        }
        java.util.List<LiveEvent> drained = new java.util.ArrayList<>();
        loop.drainEvents(drained);
        long best = Long.MAX_VALUE;
        for (int w = 0; w < 3; w++) {
            long before = mx.getThreadAllocatedBytes(id);
            for (int k = 0; k < WINDOW_SCANS; k++) {
                loop.scanOnce();
            }
            best = Math.min(best, mx.getThreadAllocatedBytes(id) - before);
            loop.drainEvents(drained);
        }
        // one allocation is at least 16 bytes (object header, 64-bit JVM, from memory); far
        // below one allocation per scan means the scan path itself allocates nothing
        assertTrue(best < WINDOW_SCANS, "allocated " + best + " bytes over " + WINDOW_SCANS + " scans");
    }
}
