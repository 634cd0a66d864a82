package org.drumloop.core.control;

/**
 * Settings of a {@link Pid} block, ideal (ISA standard) form:
 * <pre>
 *   u = s Kc [ (b r - y) + (1/Ti) int(r - y) dt + Td d/dt(c r - y)_filtered ] + feedforward
 * </pre>
 * with s = +1 for reverse action (output rises when the measurement falls below the setpoint, e.g.
 * level to feed valve) and s = -1 for direct action. The derivative is filtered,
 * Td s / (1 + Td s / N). Anti-windup by back-calculation with tracking time constant Tt
 * (Astrom and Hagglund, Advanced PID Control, ISA 2006; Astrom and Hagglund, PID Controllers:
 * Theory, Design, and Tuning, 2nd ed., 1995, section 3.5 for back-calculation and Tt).
 *
 * @param kc          controller gain Kc, output unit per measurement unit (SI), non-negative
 * @param tiS         integral time Ti [s]; {@code Double.POSITIVE_INFINITY} for no integral action
 * @param tdS         derivative time Td [s]; 0 for none
 * @param n           derivative filter divisor N (typically 8-20), positive
 * @param b           setpoint weight of the proportional term, in [0, 1]
 * @param c           setpoint weight of the derivative term, in [0, 1]; 0 = derivative on measurement
 * @param outMin      lower output limit
 * @param outMax      upper output limit (above outMin)
 * @param rateMaxPerS output rate limit [output unit/s], positive; infinite for none
 * @param ttS         tracking (back-calculation) time constant Tt [s], positive; infinite disables
 *                    anti-windup
 * @param reverse     true for reverse action (error r - y), false for direct (error y - r)
 */
public record PidParams(double kc, double tiS, double tdS, double n, double b, double c,
                        double outMin, double outMax, double rateMaxPerS, double ttS, boolean reverse) {
    public PidParams {
        if (!(kc >= 0.0) || !Double.isFinite(kc)) {
            throw new IllegalArgumentException("Kc must be finite and non-negative");
        }
        if (!(tiS > 0.0)) {
            throw new IllegalArgumentException("Ti must be positive (infinite for no integral action)");
        }
        if (!(tdS >= 0.0) || !Double.isFinite(tdS)) {
            throw new IllegalArgumentException("Td must be finite and non-negative");
        }
        if (!(n > 0.0) || !Double.isFinite(n)) {
            throw new IllegalArgumentException("N must be finite and positive");
        }
        if (!(b >= 0.0 && b <= 1.0) || !(c >= 0.0 && c <= 1.0)) {
            throw new IllegalArgumentException("setpoint weights must be in [0, 1]");
        }
        if (!Double.isFinite(outMin) || !Double.isFinite(outMax) || !(outMax > outMin)) {
            throw new IllegalArgumentException("output limits must be finite and ordered");
        }
        if (!(rateMaxPerS > 0.0)) {
            throw new IllegalArgumentException("rate limit must be positive (infinite for none)");
        }
        if (!(ttS > 0.0)) {
            throw new IllegalArgumentException("Tt must be positive (infinite to disable anti-windup)");
        }
    }

    /** A PI controller with b = 1, no derivative, no rate limit and Tt = Ti (common choice for PI). */
    public static PidParams pi(double kc, double tiS, double outMin, double outMax, boolean reverse) {
        return new PidParams(kc, tiS, 0.0, 10.0, 1.0, 0.0, outMin, outMax, Double.POSITIVE_INFINITY,
                Double.isFinite(tiS) ? tiS : 1.0, reverse);
    }

    /** Copy with other output limits. */
    public PidParams withLimits(double min, double max) {
        return new PidParams(kc, tiS, tdS, n, b, c, min, max, rateMaxPerS, ttS, reverse);
    }

    /** Copy with another gain. */
    public PidParams withKc(double newKc) {
        return new PidParams(newKc, tiS, tdS, n, b, c, outMin, outMax, rateMaxPerS, ttS, reverse);
    }

    /** Copy with another tracking time constant. */
    public PidParams withTt(double newTtS) {
        return new PidParams(kc, tiS, tdS, n, b, c, outMin, outMax, rateMaxPerS, newTtS, reverse);
    }

    /** Copy with another rate limit. */
    public PidParams withRate(double newRateMaxPerS) {
        return new PidParams(kc, tiS, tdS, n, b, c, outMin, outMax, newRateMaxPerS, ttS, reverse);
    }
}
