package org.drumloop.core.exec;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.soe.EventKind;
import org.drumloop.core.soe.SoeLog;

/**
 * Runs the scan loop at a fixed period on absolute deadlines. Scan k is due at
 * {@code t0 + k * dt} on the clock ({@code t0} = clock time when the first scan is asked for) and
 * does, in this fixed order:
 * <ol>
 * <li>wait for the deadline (start jitter = start - deadline);</li>
 * <li>{@link ProcessIo#readInputs};</li>
 * <li>{@link ScanBody#scan} with {@code tS = k * dt} and {@code dtS} = time since the previous
 *     scan's slot;</li>
 * <li>watchdog: while tripped, the actuator outputs are overwritten with the fail-safe values
 *     ({@link FailSafe}); otherwise they are remembered as the last good outputs;</li>
 * <li>{@link ProcessIo#writeOutputs};</li>
 * <li>record: execution time (read to write), overrun (the work ended after the next deadline),
 *     watchdog count; a scan that trips the watchdog writes the fail-safe outputs at once;</li>
 * <li>{@link ScanListener#afterScan} (drain the event log, record trends).</li>
 * </ol>
 * After an overrun the schedule keeps its phase: slots already past are skipped (counted), and the
 * next scan gets a {@code dtS} spanning them. The loop allocates nothing per scan.
 *
 * <p>The watchdog runs on the scan thread, so by itself it sees late and failed scans; a body
 * that never returns is caught by a {@link HangMonitor} on another thread (real-time runs).
 */
public final class ScanExecutive {
    /** Allowed scan periods [s]: 10 ms to 1000 ms. */
    public static final double MIN_PERIOD_S = 0.010;
    public static final double MAX_PERIOD_S = 1.000;
    private static final String TAG = "watchdog";

    private final ScanClock clock;
    private final ProcessIo io;
    private final ScanBody body;
    private final double periodS;
    private final Watchdog watchdog;
    private final SoeLog soe;
    private final ProcessImage in = new ProcessImage();
    private final ProcessImage out = new ProcessImage();
    private final ProcessImage lastGood = new ProcessImage();
    private final ScanStatistics stats = new ScanStatistics();
    private ScanListener listener;
    private volatile boolean stopRequested;
    private boolean started;
    private double t0S;
    private long nextSlot;
    private long prevSlot = -1;
    private long scans;
    private RuntimeException lastFailure;
    /** Clock time the current scan's work began, NaN between scans (read by the hang monitor). */
    private volatile double workStartS = Double.NaN;
    private volatile double currentScanTimeS;

    /**
     * @param clock    simulated or real time
     * @param io       the field (simulated plant or a Modbus rig)
     * @param body     the firmware scan
     * @param periodS  scan period [s], 0.010..1.000
     * @param failSafe watchdog limit and fail-safe outputs
     * @param soe      log for watchdog events (the firmware's), or null
     */
    public ScanExecutive(ScanClock clock, ProcessIo io, ScanBody body, double periodS, FailSafe failSafe, SoeLog soe) {
        if (!(periodS >= MIN_PERIOD_S - 1e-12 && periodS <= MAX_PERIOD_S + 1e-12)) {
            throw new IllegalArgumentException("scan period must be 10..1000 ms, got " + periodS * 1e3 + " ms");
        }
        this.clock = clock;
        this.io = io;
        this.body = body;
        this.periodS = periodS;
        this.watchdog = new Watchdog(failSafe);
        this.soe = soe;
    }

    public void setListener(ScanListener listener) { this.listener = listener; }

    /** Run {@code count} scans (fewer if a stop is requested); returns how many ran. */
    public long runScans(long count) throws InterruptedException {
        long done = 0;
        while (done < count && !stopRequested) {
            scanOnce();
            done++;
        }
        return done;
    }

    /** Run scans until the next scan's time would exceed {@code tEndS} (scan time base); returns how many ran. */
    public long runUntil(double tEndS) throws InterruptedException {
        long done = 0;
        while (!stopRequested && nextSlot * periodS <= tEndS + 1e-9 * periodS) {
            scanOnce();
            done++;
        }
        return done;
    }

    /** Run until {@link #requestStop()}; the stop request is then cleared. */
    public void runUntilStopped() throws InterruptedException {
        while (!stopRequested) {
            scanOnce();
        }
        stopRequested = false;
    }

    /** Ask the running loop to stop after the current scan (any thread). */
    public void requestStop() { stopRequested = true; }

    /** Clear a stop request left by {@link #runScans} or {@link #runUntil}. */
    public void clearStop() { stopRequested = false; }

    /** Run exactly one scan (waiting for its deadline). */
    public void scanOnce() throws InterruptedException {
        if (!started) {
            t0S = clock.nowS();
            started = true;
        }
        long k = nextSlot;
        double deadlineS = t0S + k * periodS;
        clock.waitUntil(deadlineS);
        double startS = clock.nowS();
        double work0S = clock.workTimerS();
        double tS = k * periodS;
        double dtS = prevSlot < 0 ? periodS : (k - prevSlot) * periodS;

        if (watchdog.applyReset() && soe != null) {
            soe.record(tS, k, TAG, EventKind.RESET, "watchdog reset");
        }
        currentScanTimeS = tS;
        workStartS = startS;
        io.readInputs(in, tS);
        boolean failed = false;
        try {
            body.scan(in, out, tS, dtS);
        } catch (RuntimeException e) {
            failed = true;
            lastFailure = e;
            if (watchdog.failed() && soe != null) {
                soe.record(tS, k, TAG, EventKind.FAULT, "scan failed: fail-safe outputs");
            }
        }
        FailSafe fs = watchdog.failSafe();
        if (watchdog.tripped()) {
            fs.apply(out, lastGood, tS);
        } else {
            lastGood.copyFrom(out);
        }
        io.writeOutputs(out, tS);
        workStartS = Double.NaN;
        if (watchdog.takeHangNotice() && soe != null) {
            soe.record(tS, k, TAG, EventKind.FAULT, "scan did not complete in time: fail-safe outputs");
        }

        double nextDeadlineS = t0S + (k + 1) * periodS;
        double endS = clock.nowS();
        double work1S = clock.workTimerS();
        boolean overrun = endS > nextDeadlineS;
        if (!failed && watchdog.scanEnded(overrun)) {
            fs.apply(out, lastGood, tS);
            io.writeOutputs(out, tS);
            if (soe != null) {
                soe.record(tS, k, TAG, EventKind.FAULT, "missed scan deadlines: fail-safe outputs");
            }
        }
        stats.record(Math.round((work1S - work0S) * 1e9), Math.round((startS - deadlineS) * 1e9), overrun, failed);
        scans++;
        prevSlot = k;
        if (overrun) {
            long next = (long) Math.floor((endS - t0S) / periodS) + 1;
            if (next < k + 1) {
                next = k + 1;
            }
            stats.skipped(next - (k + 1));
            nextSlot = next;
        } else {
            nextSlot = k + 1;
        }
        ScanListener l = listener;
        if (l != null) {
            l.afterScan(k, tS, in, out);
        }
    }

    /** Clock time at which the scan now working began, NaN between scans (any thread). */
    public double workStartS() { return workStartS; }

    /** Scheduled time of the scan now working or last worked [s] (any thread). */
    public double currentScanTimeS() { return currentScanTimeS; }

    ScanClock clock() { return clock; }

    ProcessIo io() { return io; }

    /** Outputs of the last scan that completed in time (the hang monitor holds from them). */
    ProcessImage lastGood() { return lastGood; }

    public ScanStatistics statistics() { return stats; }

    public Watchdog watchdog() { return watchdog; }

    /** The input image (read it between scans or in the listener). */
    public ProcessImage inputs() { return in; }

    /** The output image as last written. */
    public ProcessImage outputs() { return out; }

    public double periodS() { return periodS; }

    /** Scans run so far. */
    public long scanCount() { return scans; }

    /** Scan time of the next scan [s]. */
    public double nextScanTimeS() { return nextSlot * periodS; }

    /** The last exception thrown by the body, or null. */
    public RuntimeException lastFailure() { return lastFailure; }
}
