package org.drumloop.core.exec;

import java.util.concurrent.locks.LockSupport;

/**
 * Waiting for an absolute {@link System#nanoTime()} deadline: park until shortly before it, then
 * spin, so the wake-up is not left to the scheduler's timer slack. The only place in
 * controller-core that reads the wall clock, used by the two clocks of this package.
 */
final class Pacer {
    private Pacer() {
    }

    static long nanoTime() { return System.nanoTime(); }

    /**
     * Return once {@code System.nanoTime() - targetNanos >= 0}.
     *
     * @param spinNanos how long before the target to stop parking and start spinning
     */
    static void waitUntilNanos(long targetNanos, long spinNanos) throws InterruptedException {
        while (true) {
            long remaining = targetNanos - System.nanoTime();
            if (remaining <= 0) {
                return;
            }
            if (Thread.interrupted()) {
                throw new InterruptedException("interrupted while waiting for the next scan");
            }
            if (remaining > spinNanos) {
                LockSupport.parkNanos(remaining - spinNanos);
            } else {
                Thread.onSpinWait();
            }
        }
    }
}
