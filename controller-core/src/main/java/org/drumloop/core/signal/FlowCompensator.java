package org.drumloop.core.signal;

/**
 * Square-root extraction, density compensation and low-flow cut-off of a differential-pressure flow
 * element (orifice, nozzle).
 *
 * <p>For a differential-pressure element q_m = C/sqrt(1-beta^4) eps (pi/4) d^2 sqrt(2 dP rho1)
 * (source: ISO 5167-1:2003), so at the same element q_m is proportional to sqrt(dP rho1). An element
 * ranged to {@code rangeFlowKgS} at {@code rangeDpPa} with design density rho_d therefore reads
 * <pre>
 *   q_m = rangeFlowKgS * sqrt(dP / rangeDpPa) * sqrt(rho_actual / rho_d)
 * </pre>
 * ignoring the small change of the expansibility factor (source: check-values of the project,
 * following ISO 5167). Below {@code cutoffFrac} of the range the flow reads zero (low-flow cut-off,
 * common practice: the square root magnifies zero drift near zero dp). Negative dp reads zero.
 */
public final class FlowCompensator {
    private final double rangeFlowKgS;
    private final double rangeDpPa;
    private final double designDensityKgM3;
    private final double cutoffFrac;

    public FlowCompensator(double rangeFlowKgS, double rangeDpPa, double designDensityKgM3, double cutoffFrac) {
        if (!(rangeFlowKgS > 0.0) || !(rangeDpPa > 0.0) || !(designDensityKgM3 > 0.0)) {
            throw new IllegalArgumentException("flow range, dp range and design density must be positive");
        }
        if (!(cutoffFrac >= 0.0 && cutoffFrac < 1.0)) {
            throw new IllegalArgumentException("cut-off must be in [0, 1)");
        }
        this.rangeFlowKgS = rangeFlowKgS;
        this.rangeDpPa = rangeDpPa;
        this.designDensityKgM3 = designDensityKgM3;
        this.cutoffFrac = cutoffFrac;
    }

    /** Mass flow [kg/s] for the measured dp [Pa] and the actual upstream density [kg/m3]. */
    public double flowKgS(double dpPa, double actualDensityKgM3) {
        if (!(dpPa > 0.0) || !(actualDensityKgM3 > 0.0)) {
            return 0.0;
        }
        double q = rangeFlowKgS * Math.sqrt(dpPa / rangeDpPa * actualDensityKgM3 / designDensityKgM3);
        return q < cutoffFrac * rangeFlowKgS ? 0.0 : q;
    }

    public double rangeFlowKgS() { return rangeFlowKgS; }

    public double rangeDpPa() { return rangeDpPa; }

    public double designDensityKgM3() { return designDensityKgM3; }

    public double cutoffFrac() { return cutoffFrac; }
}
