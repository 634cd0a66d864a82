package org.drumloop.core.exec;

/**
 * Simulated time. It stands still while a scan works and jumps to each deadline when the executive
 * waits for it, so a scan never overruns in simulated time. Two speeds:
 * <ul>
 * <li>as fast as possible ({@link #asFastAsPossible()}): waiting costs nothing;</li>
 * <li>N times real time ({@link #paced(double)}): the wait also lets wall time reach
 *     {@code origin + deadline / N}, on absolute deadlines, so a slow scan is caught up rather
 *     than accumulated. {@link #lagS()} shows how far wall time has fallen behind.</li>
 * </ul>
 */
public final class SimulatedClock implements ScanClock {
    private final double speed;
    private final long spinNanos;
    private double nowS;
    private boolean originSet;
    private long originNanos;
    private double lagS;

    private SimulatedClock(double speed, double startS) {
        this.speed = speed;
        this.nowS = startS;
        this.spinNanos = Math.round(RealTimeClock.DEFAULT_SPIN_S * 1e9);
    }

    /** Simulated time from 0 s, no pacing. */
    public static SimulatedClock asFastAsPossible() { return new SimulatedClock(Double.POSITIVE_INFINITY, 0.0); }

    /** Simulated time from 0 s, paced at {@code speed} times real time (speed &gt; 0; infinity = no pacing). */
    public static SimulatedClock paced(double speed) {
        if (!(speed > 0)) {
            throw new IllegalArgumentException("speed factor must be positive, got " + speed);
        }
        return new SimulatedClock(speed, 0.0);
    }

    public boolean isPaced() { return speed != Double.POSITIVE_INFINITY; }

    /** Speed factor (simulated seconds per wall second), infinity when not paced. */
    public double speed() { return speed; }

    @Override
    public double nowS() { return nowS; }

    @Override
    public void waitUntil(double deadlineS) throws InterruptedException {
        if (deadlineS <= nowS) {
            return;
        }
        if (isPaced()) {
            if (!originSet) {
                originNanos = Pacer.nanoTime() - (long) (nowS / speed * 1e9);
                originSet = true;
            }
            long target = originNanos + (long) Math.ceil(deadlineS / speed * 1e9);
            long late = Pacer.nanoTime() - target;
            lagS = late > 0 ? late * 1e-9 * speed : 0.0;
            Pacer.waitUntilNanos(target, spinNanos);
        } else if (Thread.interrupted()) {
            throw new InterruptedException("interrupted while waiting for the next scan");
        }
        nowS = deadlineS;
    }

    /** Simulated time by which wall time was behind the pace at the last wait [s] (0 when keeping up). */
    public double lagS() { return lagS; }

    /** Wall time, so execution statistics are real even though simulated time stands still. */
    @Override
    public double workTimerS() { return Pacer.nanoTime() * 1e-9; }
}
