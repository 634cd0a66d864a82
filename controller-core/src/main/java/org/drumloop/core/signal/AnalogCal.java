package org.drumloop.core.signal;

/**
 * Calibration and validation limits of one analogue input, in SI units.
 *
 * @param lowSi            value at 4 mA (lower range value) [SI unit of the signal]
 * @param highSi           value at 20 mA (upper range value); may be below {@code lowSi} for a
 *                         reverse-calibrated transmitter
 * @param rateLimitSiPerS  largest credible rate of change [SI unit/s]; a faster jump is a spike and
 *                         makes the input BAD for that scan (positive, may be infinite)
 * @param staleAfterS      an input not refreshed for longer than this is BAD [s] (positive)
 */
public record AnalogCal(double lowSi, double highSi, double rateLimitSiPerS, double staleAfterS) {
    public AnalogCal {
        if (!Double.isFinite(lowSi) || !Double.isFinite(highSi) || lowSi == highSi) {
            throw new IllegalArgumentException("range must be finite and non-empty");
        }
        if (!(rateLimitSiPerS > 0.0)) {
            throw new IllegalArgumentException("rate limit must be positive");
        }
        if (!(staleAfterS > 0.0)) {
            throw new IllegalArgumentException("stale time must be positive");
        }
    }

    /** Span magnitude |high - low|. */
    public double span() { return Math.abs(highSi - lowSi); }
}
