package org.drumloop.core.exec;

/**
 * Wall time on {@link System#nanoTime()}, from the moment of construction. Deadlines are absolute
 * (the executive asks for {@code t0 + k * dt}), so the time the work takes never shifts the
 * schedule; the wait parks until {@code spinS} before the deadline, then spins.
 */
public final class RealTimeClock implements ScanClock {
    /** Default spin window: 0.2 ms, a little above typical OS timer slack (common practice). */
    public static final double DEFAULT_SPIN_S = 200e-6;

    private final long originNanos;
    private final long spinNanos;

    public RealTimeClock() { this(DEFAULT_SPIN_S); }

    /** @param spinS how long before each deadline to stop sleeping and spin [s], 0..0.01 */
    public RealTimeClock(double spinS) {
        if (!(spinS >= 0 && spinS <= 0.01)) {
            throw new IllegalArgumentException("spin window must be 0..10 ms, got " + spinS + " s");
        }
        this.spinNanos = Math.round(spinS * 1e9);
        this.originNanos = Pacer.nanoTime();
    }

    @Override
    public double nowS() { return (Pacer.nanoTime() - originNanos) * 1e-9; }

    @Override
    public void waitUntil(double deadlineS) throws InterruptedException {
        Pacer.waitUntilNanos(originNanos + (long) Math.ceil(deadlineS * 1e9), spinNanos);
    }
}
