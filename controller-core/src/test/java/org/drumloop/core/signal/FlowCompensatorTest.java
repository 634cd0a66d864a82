package org.drumloop.core.signal;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Square-root extraction and density compensation of dp flow elements. Expected factors: the
 * project's check values (ISO 5167 flow equation, q ~ sqrt(dP rho); densities from IAPWS-IF97 via
 * com.hummeling:if97:1.0.5) with a design point of 10 bar(a), 200 degC (rho = 4.8543 kg/m3).
 */
class FlowCompensatorTest {
    static final double RANGE_KGS = 15_000.0 / 3600.0;
    static final double DP_RANGE_PA = 25_000.0;
    /**
     * Factors are quoted to 5 decimals (5e-6) and computed from unrounded densities, while the
     * densities here are quoted to 1e-4 kg/m3: that moves sqrt(rho_a/rho_d) by up to
     * 0.5 * (5e-5/4.3 + 5e-5/4.85) = 1.1e-5. Tolerance 1.5e-5.
     */
    static final double FACTOR_TOL = 1.5e-5;

    @Test
    void squareRootExtractionGivesHalfFlowAtAQuarterOfTheDpRange() {
        FlowCompensator f = new FlowCompensator(RANGE_KGS, DP_RANGE_PA, 4.8543, 0.0);
        // q = range * sqrt(dP/dP_range): sqrt(0.25) = 0.5 exactly
        assertEquals(0.5 * RANGE_KGS, f.flowKgS(0.25 * DP_RANGE_PA, 4.8543), 1e-12);
        assertEquals(RANGE_KGS, f.flowKgS(DP_RANGE_PA, 4.8543), 1e-12);
    }

    @Test
    void densityCompensationMatchesTheWorkedFactors() {
        FlowCompensator f = new FlowCompensator(1.0, DP_RANGE_PA, 4.8543, 0.0);
        // 9 bar(a), 200 degC: rho 4.3402, factor 0.94557
        assertEquals(0.94557, f.flowKgS(DP_RANGE_PA, 4.3402), FACTOR_TOL);
        // 10 bar(a), 250 degC: rho 4.2967, factor 0.94081
        assertEquals(0.94081, f.flowKgS(DP_RANGE_PA, 4.2967), FACTOR_TOL);
        // 11 bar(a), 200 degC: rho 5.3760, factor 1.05237
        assertEquals(1.05237, f.flowKgS(DP_RANGE_PA, 5.3760), FACTOR_TOL);
    }

    @Test
    void saturatedSteamFrom10To9BarWithTheFirmwaresOwnTables() {
        // check value: saturated, 10 -> 9 bar(a), factor 0.95104 (IF97 densities 5.1454 -> 4.6539)
        double rhoDesign = SteamTables.saturatedVapourDensity(10e5);
        FlowCompensator f = new FlowCompensator(1.0, DP_RANGE_PA, rhoDesign, 0.0);
        // both densities are grid points of the table (1e-5 rounding): 2e-5 covers factor rounding too
        assertEquals(0.95104, f.flowKgS(DP_RANGE_PA, SteamTables.saturatedVapourDensity(9e5)), 2e-5);
    }

    @Test
    void lowFlowCutOffAndNegativeDpReadZero() {
        FlowCompensator f = new FlowCompensator(RANGE_KGS, DP_RANGE_PA, 4.8543, 0.03);
        // 3 % flow is dp 0.09 % of range: just below reads zero, just above reads the flow
        assertEquals(0.0, f.flowKgS(0.0008 * DP_RANGE_PA, 4.8543), 0.0);
        assertEquals(Math.sqrt(0.001) * RANGE_KGS, f.flowKgS(0.001 * DP_RANGE_PA, 4.8543), 1e-12);
        assertEquals(0.0, f.flowKgS(-100.0, 4.8543), 0.0);
    }
}
