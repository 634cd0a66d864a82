package org.drumloop.modbus.interop;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;

/** The most Java threads alive at once since the watch started (ThreadMXBean's peak, reset at the start). */
final class ThreadWatch {
    private final ThreadMXBean mx = ManagementFactory.getThreadMXBean();
    private final int atStart;

    ThreadWatch() {
        mx.resetPeakThreadCount();
        atStart = mx.getThreadCount();
    }

    /** Threads alive when the watch started. */
    int atStart() { return atStart; }

    /** Most threads alive at once since then, beyond those alive at the start. */
    int peakAdded() { return mx.getPeakThreadCount() - atStart; }
}
