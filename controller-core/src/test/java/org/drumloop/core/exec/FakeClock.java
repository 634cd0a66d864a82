package org.drumloop.core.exec;

/**
 * A clock the test moves by hand: waiting jumps to the deadline (plus an optional late wake-up),
 * work advances it through {@link #advance}. No real time passes.
 */
final class FakeClock implements ScanClock {
    double nowS;
    /** Added to every wake-up, to make start jitter. */
    double lateWakeS;
    int waits;

    @Override
    public double nowS() { return nowS; }

    @Override
    public void waitUntil(double deadlineS) {
        waits++;
        if (deadlineS + lateWakeS > nowS) {
            nowS = deadlineS + lateWakeS;
        }
    }

    void advance(double s) { nowS += s; }
}
