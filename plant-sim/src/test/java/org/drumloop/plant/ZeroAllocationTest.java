package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import org.junit.jupiter.api.Test;

/** The plant step allocates nothing (hot-path rule), measured with the JVM's per-thread counter. */
class ZeroAllocationTest {

    @Test
    void hundredThousandStepsAllocateNothing() throws Exception {
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        Plant p = new Plant(PlantFiles.aux(), 5);
        long[] count = new long[1];
        p.setEventListener((t, tag, msg) -> count[0]++);
        p.inject(Fault.of(Fault.Kind.DRIFT, "level_tx_a", 0.01));
        for (int i = 0; i < 20_000; i++) { // warm-up so that JIT compilation is done
            p.step(0.1);
        }
        p.setSteamDemand(1.1);
        long tid = Thread.currentThread().getId();
        long best = Long.MAX_VALUE;
        for (int window = 0; window < 3; window++) { // best of three: a late JIT event may allocate once
            long before = mx.getThreadAllocatedBytes(tid);
            for (int i = 0; i < 100_000; i++) {
                p.step(0.1);
            }
            best = Math.min(best, mx.getThreadAllocatedBytes(tid) - before);
        }
        // the counter itself may allocate a few hundred bytes; 100,000 steps allocating even one
        // 16-byte object each would show 1.6 MB
        assertTrue(best < 10_000, "allocated " + best + " bytes");
    }
}
