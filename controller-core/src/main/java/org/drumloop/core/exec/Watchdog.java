package org.drumloop.core.exec;

/**
 * Scan watchdog: trips after {@link FailSafe#missedScans()} consecutive scans miss their deadline,
 * or at once when a scan fails (its body throws). A tripped watchdog stays tripped (the executive
 * keeps forcing the fail-safe outputs) until an operator reset, which is applied at the start of
 * the next scan; if the cause persists it trips again. A {@link HangMonitor} on another thread
 * trips it too when one scan works for longer than the missed-scan limit.
 */
public final class Watchdog {
    private final FailSafe failSafe;
    private int consecutiveMisses;
    private volatile boolean tripped;
    private volatile long trips;
    private volatile boolean hangUnlogged;
    private volatile boolean resetRequested;

    public Watchdog(FailSafe failSafe) { this.failSafe = failSafe; }

    public FailSafe failSafe() { return failSafe; }

    /** A scan's body failed: trip now. Returns true when this call tripped it. */
    boolean failed() {
        consecutiveMisses++;
        return trip();
    }

    /**
     * A scan finished, on time or late. Returns true when this call tripped the watchdog.
     */
    boolean scanEnded(boolean missedDeadline) {
        if (!missedDeadline) {
            consecutiveMisses = 0;
            return false;
        }
        consecutiveMisses++;
        return consecutiveMisses >= failSafe.missedScans() && trip();
    }

    /** The hang monitor saw a scan that does not complete. Returns true when this call tripped it. */
    boolean hung() {
        boolean now = trip();
        if (now) {
            hangUnlogged = true;
        }
        return now;
    }

    /** True once after a hang trip, for the scan thread to log it when it comes back. */
    boolean takeHangNotice() {
        if (!hangUnlogged) {
            return false;
        }
        hangUnlogged = false;
        return true;
    }

    private synchronized boolean trip() {
        if (tripped) {
            return false;
        }
        tripped = true;
        trips++;
        return true;
    }

    /** Applied at the start of the next scan; safe to call from another thread. */
    public void requestReset() { resetRequested = true; }

    /** Apply a pending reset; returns true when one was applied. */
    synchronized boolean applyReset() {
        if (!resetRequested) {
            return false;
        }
        resetRequested = false;
        tripped = false;
        consecutiveMisses = 0;
        return true;
    }

    public boolean tripped() { return tripped; }

    /** How many times the watchdog has tripped. */
    public long trips() { return trips; }

    public int consecutiveMisses() { return consecutiveMisses; }
}
