package org.drumloop.core.exec;

/**
 * The time base of the scan executive. Two implementations: {@link SimulatedClock} (simulated time,
 * as fast as possible or paced at N times real time) and {@link RealTimeClock} (wall time, absolute
 * deadlines).
 */
public interface ScanClock {
    /** Current time on this clock's time base [s]. */
    double nowS();

    /**
     * Return when {@link #nowS()} has reached {@code deadlineS} (immediately when it already has).
     * Deadlines are absolute, so late work never shifts the schedule.
     */
    void waitUntil(double deadlineS) throws InterruptedException;

    /**
     * A monotonic timer [s] for measuring how long the scan work takes. For a real-time clock it is
     * {@link #nowS()}; a simulated clock measures work in wall time so that execution statistics
     * stay meaningful while simulated time stands still inside a scan.
     */
    default double workTimerS() { return nowS(); }
}
