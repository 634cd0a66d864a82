package org.drumloop.core.control;

/**
 * Model-based shrink/swell compensation: an estimate of the swell caused by a change of steam flow,
 * subtracted from the measured level before the level controller sees it.
 *
 * <p>A rise in steam demand lowers drum pressure, the water boils harder, the bubble volume under the
 * surface grows and the level first rises although the water inventory falls (Astrom and Bell,
 * Drum-boiler dynamics, Automatica 36 (2000) 363-378). The swell is transient, so it is modelled as a
 * first-order high-pass (washout) of steam flow:
 * <pre>
 *   swell(s) = K_sw * tau s / (1 + tau s) * q_steam(s)
 * </pre>
 * discretised by backward Euler on the low-pass state x: x(k) = x(k-1) + h/(tau + h) (q(k) - x(k-1)),
 * swell(k) = K_sw (q(k) - x(k)). At steady steam flow the estimate is zero, so the compensation
 * never shifts the controlled level in the long run. While steam flow is unusable the input is
 * frozen, so the estimate decays away. Allocation-free.
 */
public final class SwellCompensator {
    private final double gainMPerKgS;
    private final double tauS;
    private double lowPassKgS;
    private double lastFlowKgS;
    private double estimateM;
    private boolean seeded;

    /**
     * @param gainMPerKgS swell gain K_sw [m per kg/s]; 0 disables the compensation
     * @param tauS        time constant of the swell decay [s], positive
     */
    public SwellCompensator(double gainMPerKgS, double tauS) {
        if (!Double.isFinite(gainMPerKgS) || !(tauS > 0.0) || !Double.isFinite(tauS)) {
            throw new IllegalArgumentException("swell gain must be finite and tau positive");
        }
        this.gainMPerKgS = gainMPerKgS;
        this.tauS = tauS;
    }

    /** Update with the compensated steam flow and return the swell estimate [m]. */
    public double update(double steamFlowKgS, boolean usable, double dtS) {
        double q = (usable && Double.isFinite(steamFlowKgS)) ? steamFlowKgS : lastFlowKgS;
        if (!seeded) {
            if (!(usable && Double.isFinite(steamFlowKgS))) {
                return estimateM;
            }
            lowPassKgS = q;
            seeded = true;
        }
        if (dtS > 0.0) {
            lowPassKgS += dtS / (tauS + dtS) * (q - lowPassKgS);
        }
        lastFlowKgS = q;
        estimateM = gainMPerKgS * (q - lowPassKgS);
        return estimateM;
    }

    /** Last swell estimate [m]. */
    public double estimateM() { return estimateM; }

    public double gainMPerKgS() { return gainMPerKgS; }

    public double tauS() { return tauS; }
}
