package org.drumloop.core.signal;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Density compensation of a dp level transmitter with a cold reference leg against the project's
 * worked example (check values, drum level measurement: H = 0.800 m, reference leg at 50 degC, true
 * level 0.400 m above the lower tap; densities and dp computed with IAPWS-IF97 via
 * com.hummeling:if97:1.0.5).
 */
class LevelCompensatorTest {
    static final double H_M = 0.800;
    /** dp values are quoted to 0.01 Pa: 0.01/(g*(rho_l - rho_v)) ~ 1.2e-6 m; 1e-5 m leaves margin for table rounding. */
    static final double TOL_M = 1e-5;

    @Test
    void theForwardFormulaReproducesTheWorkedDifferentialPressures() {
        // 10 bar(a): rho_l 887.127, rho_v 5.1454, rho_ref 988.438
        assertEquals(4254.53, LevelCompensator.dpPa(0.4, H_M, 988.438, 887.127, 5.1454), 0.01);
        assertEquals(7714.25, LevelCompensator.dpPa(0.0, H_M, 988.438, 887.127, 5.1454), 0.01);
        assertEquals(794.81, LevelCompensator.dpPa(H_M, H_M, 988.438, 887.127, 5.1454), 0.01);
        // 60 bar(a): rho_l 757.993, rho_v 30.8179, rho_ref 990.597
        assertEquals(4677.32, LevelCompensator.dpPa(0.4, H_M, 990.597, 757.993, 30.8179), 0.01);
        assertEquals(7529.78, LevelCompensator.dpPa(0.0, H_M, 990.597, 757.993, 30.8179), 0.01);
        assertEquals(1824.85, LevelCompensator.dpPa(H_M, H_M, 990.597, 757.993, 30.8179), 0.01);
    }

    @Test
    void compensationWithItsOwnTablesReadsTheTrueLevelAtBothPressures() {
        // NWL at the middle of the taps, so the true level 0.400 m is 0 relative to NWL
        LevelCompensator c = new LevelCompensator(H_M, 0.4, 50 + 273.15);
        assertEquals(0.0, c.levelM(4254.53, 10e5), TOL_M);
        assertEquals(0.0, c.levelM(4677.32, 60e5), TOL_M);
    }

    @Test
    void wrongDensitiesGiveTheWorkedErrors() {
        // densities for 10 bar applied to a drum at 60 bar reads 0.3511 m; the reverse reads 0.4593 m
        assertEquals(0.3511, LevelCompensator.heightM(4677.32, H_M, 988.438, 887.127, 5.1454), 5e-5);
        assertEquals(0.4593, LevelCompensator.heightM(4254.53, H_M, 990.597, 757.993, 30.8179), 5e-5);
        // cold calibration: all water at 20 degC (998.206), no steam term: 0.3654 m at 10 bar, 0.3222 m at 60 bar
        assertEquals(0.3654, LevelCompensator.heightM(4254.53, H_M, 998.206, 998.206, 0.0), 5e-5);
        assertEquals(0.3222, LevelCompensator.heightM(4677.32, H_M, 998.206, 998.206, 0.0), 5e-5);
    }
}
