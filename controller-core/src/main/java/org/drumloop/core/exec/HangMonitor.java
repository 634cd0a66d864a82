package org.drumloop.core.exec;

import java.util.concurrent.locks.LockSupport;
import org.drumloop.core.io.ProcessImage;

/**
 * Watches a {@link ScanExecutive} from another thread: when one scan has been working for longer
 * than the watchdog's missed-scan limit ({@code missedScans * period}), the body is taken to hang;
 * the watchdog trips and the fail-safe outputs (held values from the last good scan) are written
 * from this thread, once per hung scan. When the scan comes back, the executive logs the fault
 * and keeps the fail-safe outputs until the watchdog is reset.
 *
 * <p>It relies on {@link org.drumloop.core.io.ProcessIo} never blocking (its contract): a hang is
 * in the body, so writing outputs from here does not race the scan thread's own I/O.
 */
public final class HangMonitor implements Runnable {
    private final ScanExecutive ex;
    private final ProcessImage image = new ProcessImage();
    private volatile boolean stop;
    private double handledStartS = Double.NaN;
    private long detections;

    public HangMonitor(ScanExecutive ex) { this.ex = ex; }

    /**
     * Look once. Returns true when a hung scan was found and the fail-safe outputs were written.
     */
    public boolean check() {
        double startedS = ex.workStartS();
        if (Double.isNaN(startedS) || startedS == handledStartS) {
            return false;
        }
        FailSafe fs = ex.watchdog().failSafe();
        double limitS = fs.missedScans() * ex.periodS();
        if (ex.clock().nowS() - startedS <= limitS) {
            return false;
        }
        handledStartS = startedS;
        detections++;
        ex.watchdog().hung();
        double tS = ex.currentScanTimeS();
        image.copyFrom(ex.lastGood());
        fs.apply(image, ex.lastGood(), tS);
        ex.io().writeOutputs(image, tS);
        return true;
    }

    /** Hung scans found so far. */
    public long detections() { return detections; }

    /** Check every half period until {@link #stop()}. */
    @Override
    public void run() {
        long pauseNanos = Math.max(1_000_000L, Math.round(ex.periodS() * 0.5e9));
        while (!stop && !Thread.currentThread().isInterrupted()) {
            LockSupport.parkNanos(pauseNanos);
            check();
        }
    }

    public void stop() { stop = true; }

    /** Start {@link #run()} on a daemon thread named "scan-hang-monitor". */
    public Thread start() {
        Thread t = new Thread(this, "scan-hang-monitor");
        t.setDaemon(true);
        t.start();
        return t;
    }
}
