package org.drumloop.core.soe;

/** Receives drained sequence-of-events entries, oldest first. */
@FunctionalInterface
public interface SoeSink {
    /**
     * @param tS      scan time [s] on the scan's time base
     * @param scan    scan number
     * @param tag     the interlock, signal or block concerned
     * @param kind    what happened
     * @param message constant or preformatted text
     */
    void accept(double tS, long scan, String tag, EventKind kind, String message);
}
