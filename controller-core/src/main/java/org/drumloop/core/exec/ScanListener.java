package org.drumloop.core.exec;

import org.drumloop.core.io.ProcessImage;

/**
 * Called on the scan thread after each scan has written its outputs and its statistics: the place
 * to drain the sequence-of-events log and record trends, before the next scan begins.
 */
@FunctionalInterface
public interface ScanListener {
    /**
     * @param scan scan number (0 for the first)
     * @param tS   scheduled time of the scan [s]
     * @param in   the inputs the scan used
     * @param out  the outputs it wrote (fail-safe values while the watchdog holds them)
     */
    void afterScan(long scan, double tS, ProcessImage in, ProcessImage out);
}
