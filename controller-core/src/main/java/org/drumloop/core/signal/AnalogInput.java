package org.drumloop.core.signal;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;

/**
 * Validation of one analogue input, each scan: freshness, NAMUR NE 43 failure detection (on the loop
 * current when the image carries one, otherwise on the equivalent current of the engineering value),
 * scaling, and rate-of-change (spike) check.
 *
 * <p>The result is {@link #valueSi()} and {@link #quality()}. While the input is BAD the value holds the
 * last usable value, so that downstream arithmetic stays finite; blocks must look at the quality.
 * Allocation-free.
 */
public final class AnalogInput {
    private final Signal signal;
    private final AnalogCal cal;
    private double valueSi;
    private Quality quality = Quality.BAD;
    private double lastRawSi = Double.NaN;
    private boolean everUsable;

    public AnalogInput(Signal signal, AnalogCal cal) {
        this.signal = signal;
        this.cal = cal;
        this.valueSi = cal.lowSi();
    }

    /** Read and validate the input from {@code in} for the scan at {@code tS}, period {@code dtS}. */
    public void update(ProcessImage in, double tS, double dtS) {
        Quality q = in.quality(signal);
        if (tS - in.updatedS(signal) > cal.staleAfterS()) {
            q = Quality.BAD;
        }
        double mA = in.currentMa(signal);
        double raw;
        if (Double.isNaN(mA)) {
            raw = in.value(signal);
            if (Double.isFinite(raw)) {
                q = Ne43.worst(q, Ne43.classify(Ne43.currentFor(raw, cal.lowSi(), cal.highSi())));
            } else {
                q = Quality.BAD;
            }
        } else {
            q = Ne43.worst(q, Ne43.classify(mA));
            raw = Ne43.scale(mA, cal.lowSi(), cal.highSi());
        }
        // Spike check against the previous valid raw sample. A one-scan glitch is rejected; a
        // lasting jump is accepted from the next scan on (the chain restarts at the new value).
        boolean validRaw = q != Quality.BAD;
        if (validRaw && Double.isFinite(lastRawSi) && dtS > 0.0
                && Math.abs(raw - lastRawSi) > cal.rateLimitSiPerS() * dtS) {
            q = Quality.BAD;
        }
        lastRawSi = validRaw ? raw : Double.NaN;
        quality = q;
        if (q != Quality.BAD) {
            valueSi = raw;
            everUsable = true;
        }
    }

    public Signal signal() { return signal; }

    public AnalogCal cal() { return cal; }

    /** Validated value [SI]; the last usable value while BAD (the low range value before any). */
    public double valueSi() { return valueSi; }

    public Quality quality() { return quality; }

    /** Whether a usable value was ever seen. */
    public boolean everUsable() { return everUsable; }

    /** Whether the quality allows control use (GOOD or UNCERTAIN). */
    public boolean usable() { return quality != Quality.BAD; }
}
