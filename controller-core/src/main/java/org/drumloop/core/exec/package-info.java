/**
 * The scan executive: a fixed-period loop on absolute deadlines
 * ({@link org.drumloop.core.exec.ScanExecutive}): wait, read inputs, run the scan body, write
 * outputs, record statistics, call the listener. Time comes from a
 * {@link org.drumloop.core.exec.ScanClock}: {@link org.drumloop.core.exec.SimulatedClock} (as fast
 * as possible, or paced at N times real time) or {@link org.drumloop.core.exec.RealTimeClock}
 * (park until shortly before the deadline, then spin). Overruns, skipped slots, execution time and
 * start jitter are kept in {@link org.drumloop.core.exec.ScanStatistics} (percentiles from a
 * preallocated histogram). A {@link org.drumloop.core.exec.Watchdog} forces the
 * {@link org.drumloop.core.exec.FailSafe} outputs (fuel cut off; valve and pumps held or set) after
 * consecutive missed deadlines or a failed scan, and a {@link org.drumloop.core.exec.HangMonitor}
 * does the same from another thread when a scan does not complete.
 *
 * <p>This package holds the only wall-clock reads of controller-core (in its two clocks).
 */
package org.drumloop.core.exec;
