package org.drumloop.core.exec;

import org.drumloop.core.io.ProcessImage;

/** The work of one scan, between reading inputs and writing outputs (the firmware implements it). */
@FunctionalInterface
public interface ScanBody {
    /**
     * @param in  inputs just read
     * @param out outputs to compute (written to the field after this returns)
     * @param tS  scheduled time of this scan [s]
     * @param dtS time since the previous scan's scheduled time [s] (the period, or a multiple of it
     *            after an overrun made the executive skip slots)
     */
    void scan(ProcessImage in, ProcessImage out, double tS, double dtS);
}
