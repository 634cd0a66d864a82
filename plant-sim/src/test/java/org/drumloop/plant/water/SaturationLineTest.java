package org.drumloop.plant.water;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * Saturated water and steam at drum pressures, from the direct IF97 evaluation and from the
 * standard table, against published saturation values and the Clapeyron relation.
 *
 * <p>Printed reference values are rounded, so each check allows half a unit of the last printed
 * digit plus a small margin (stated per check) for the way the reference differenced its
 * derivatives.
 */
class SaturationLineTest {

    private static final double BAR = 1e5;
    private static final double KJ = 1e3;
    private static final double ZERO_CELSIUS_K = 273.15;

    private final SaturationTable table = SaturationTable.standard();
    private final SaturationState direct = new SaturationState();
    private final SaturationState looked = new SaturationState();

    /** Half a unit of the last printed digit (rounding), plus {@code extraRel} of the value. */
    private static void assertPrinted(double expected, double halfUnit, double extraRel,
            double actual, String what) {
        assertEquals(expected, actual, halfUnit + Math.abs(expected) * extraRel, what);
    }

    /**
     * Drum-pressure rows: p (bar abs), Tsat (degC), rho_l, rho_v (kg/m3), h_l, h_v (kJ/kg).
     * source: check-values §1.2 saturation table, computed with the com.hummeling:if97:1.0.5
     * library from IAPWS-IF97.
     */
    private static final double[][] SATURATION_ROWS = {
        {5, 151.8362, 915.284, 2.6681, 640.19, 2748.11},
        {7, 164.9528, 902.556, 3.6662, 697.14, 2762.75},
        {8, 170.4135, 897.032, 4.1610, 721.02, 2768.30},
        {10, 179.8856, 887.127, 5.1454, 762.68, 2777.12},
        {16, 201.3783, 863.054, 8.0820, 858.61, 2792.88},
        {20, 212.3845, 849.798, 10.0421, 908.62, 2798.38},
        {40, 250.3575, 798.358, 20.0898, 1087.43, 2800.90},
        {60, 275.5864, 757.993, 30.8179, 1213.73, 2784.56},
        {85, 299.2722, 713.630, 45.6084, 1340.70, 2750.96},
    };

    /**
     * Pressure derivatives at the same pressures, all per bar: d rho_l, d rho_v (kg/m3/bar),
     * d h_l, d h_v (kJ/kg/bar), dTsat (K/bar), Clapeyron dTsat (K/bar).
     * source: check-values §1.2 derivative table, computed with the com.hummeling:if97:1.0.5
     * library by central differences of +-0.01 bar.
     */
    private static final double[][] DERIVATIVE_ROWS = {
        {-7.0970, 0.50283, 32.575, 8.913, 7.5350, 7.5345},
        {-5.7580, 0.49596, 25.138, 6.034, 5.7619, 5.7617},
        {-5.3067, 0.49377, 22.709, 5.112, 5.1830, 5.1828},
        {-4.6395, 0.49092, 19.193, 3.798, 4.3455, 4.3454},
        {-3.5320, 0.48920, 13.574, 1.756, 3.0070, 3.0071},
        {-3.1220, 0.49116, 11.567, 1.045, 2.5281, 2.5283},
        {-2.2069, 0.51692, 7.214, -0.482, 1.4825, 1.4825},
        {-1.8748, 0.55807, 5.617, -1.091, 1.0875, 1.0874},
        {-1.7031, 0.62920, 4.654, -1.573, 0.8331, 0.8331},
    };

    @Test
    void drumPressureValuesMatchThePublishedSaturationTable() {
        for (double[] r : SATURATION_ROWS) {
            double p = r[0] * BAR;
            String at = " at " + r[0] + " bar";
            for (SaturationState s : evaluate(p)) {
                // source: check-values §1.2 (computed with IF97 lib); tolerance half a unit of
                // the last printed digit: 4 decimals for Tsat, 3 or 4 for densities, 2 for h
                assertPrinted(r[1], 0.5e-4, 1e-12, s.tsK - ZERO_CELSIUS_K, "Tsat" + at);
                assertPrinted(r[2], 0.5e-3, 1e-12, s.rhoW, "rho_l" + at);
                assertPrinted(r[3], 0.5e-4, 1e-12, s.rhoS, "rho_v" + at);
                assertPrinted(r[4], 0.5e-2, 1e-12, s.hW / KJ, "h_l" + at);
                assertPrinted(r[5], 0.5e-2, 1e-12, s.hS / KJ, "h_v" + at);
            }
        }
    }

    @Test
    void drumPressureDerivativesMatchThePublishedSaturationTable() {
        for (int k = 0; k < SATURATION_ROWS.length; k++) {
            double p = SATURATION_ROWS[k][0] * BAR;
            double[] d = DERIVATIVE_ROWS[k];
            String at = " at " + SATURATION_ROWS[k][0] + " bar";
            for (SaturationState s : evaluate(p)) {
                // source: check-values §1.2 (computed with IF97 lib, +-0.01 bar central
                // differences, whose truncation error is below 1e-5 relative at 5 bar and
                // above); tolerance half a unit of the last printed digit plus 1e-5 relative
                assertPrinted(d[0], 0.5e-4, 1e-5, s.dRhoWDp * BAR, "drho_l/dp" + at);
                assertPrinted(d[1], 0.5e-5, 1e-5, s.dRhoSDp * BAR, "drho_v/dp" + at);
                assertPrinted(d[2], 0.5e-3, 1e-5, s.dHWDp * BAR / KJ, "dh_l/dp" + at);
                assertPrinted(d[3], 0.5e-3, 1e-5, s.dHSDp * BAR / KJ, "dh_v/dp" + at);
                assertPrinted(d[4], 0.5e-4, 1e-5, s.dTsDp * BAR, "dTsat/dp" + at);
                assertPrinted(d[5], 0.5e-4, 1e-5, clapeyron(s) * BAR, "Clapeyron dTsat/dp" + at);
            }
        }
    }

    /**
     * Rows of the drum-model reference: p (MPa), Ts (degC), rho_w, rho_s, h_w, h_s (kJ/kg),
     * dTs/dp (K/Pa), d rho_w/dp, d rho_s/dp (kg/m3/Pa), d h_w/dp, d h_s/dp (J/kg/Pa).
     * source: drum-boiler-model §5 saturation table (computed, IF97).
     */
    private static final double[][] DRUM_MODEL_ROWS = {
        {0.9, 175.36, 891.91, 4.654, 742.7, 2773.0, 4.722e-5, -4.942e-5, 4.921e-6, 0.2077, 0.04386},
        {8.5, 299.27, 713.63, 45.608, 1340.7, 2751.0, 8.331e-6, -1.703e-5, 6.292e-6, 0.04654, -0.01573},
    };

    @Test
    void drumModelReferenceRowsAreReproduced() {
        for (double[] r : DRUM_MODEL_ROWS) {
            double p = r[0] * 1e6;
            String at = " at " + r[0] + " MPa";
            for (SaturationState s : evaluate(p)) {
                // source: drum-boiler-model §5 (computed, IF97); tolerance half a unit of the
                // last printed digit of each column
                assertPrinted(r[1], 0.5e-2, 1e-12, s.tsK - ZERO_CELSIUS_K, "Ts" + at);
                assertPrinted(r[2], 0.5e-2, 1e-12, s.rhoW, "rho_w" + at);
                assertPrinted(r[3], 0.5e-3, 1e-12, s.rhoS, "rho_s" + at);
                assertPrinted(r[4], 0.5e-1, 1e-12, s.hW / KJ, "h_w" + at);
                assertPrinted(r[5], 0.5e-1, 1e-12, s.hS / KJ, "h_s" + at);
                // derivatives are printed with four significant digits
                assertPrinted(r[6], halfUnitOf4Digits(r[6]), 1e-9, s.dTsDp, "dTs/dp" + at);
                assertPrinted(r[7], halfUnitOf4Digits(r[7]), 1e-9, s.dRhoWDp, "drho_w/dp" + at);
                assertPrinted(r[8], halfUnitOf4Digits(r[8]), 1e-9, s.dRhoSDp, "drho_s/dp" + at);
                assertPrinted(r[9], halfUnitOf4Digits(r[9]), 1e-9, s.dHWDp, "dh_w/dp" + at);
                assertPrinted(r[10], halfUnitOf4Digits(r[10]), 1e-9, s.dHSDp, "dh_s/dp" + at);
            }
        }
    }

    @Test
    void oneAtmosphereMatchesThePublishedSanityRow() {
        // source: check-values §1.2 sanity check at 1 atm (computed with IF97 lib); tolerance
        // half a unit of the last printed digit
        for (SaturationState s : evaluate(101325.0)) {
            assertPrinted(99.9743, 0.5e-4, 1e-12, s.tsK - ZERO_CELSIUS_K, "Tsat at 1 atm");
            assertPrinted(958.373, 0.5e-3, 1e-12, s.rhoW, "rho_l at 1 atm");
            assertPrinted(418.991, 0.5e-3, 1e-12, s.hW / KJ, "h_l at 1 atm");
            assertPrinted(2675.53, 0.5e-2, 1e-12, s.hS / KJ, "h_v at 1 atm");
        }
    }

    @Test
    void clapeyronRelationHoldsAlongTheWholeTable() {
        // dTs/dp = Ts (v_v - v_l) / (h_v - h_l) is exact thermodynamics; IF97's separate
        // region equations satisfy it to about 1e-4 (source: check-values §1.2, "better than
        // 1e-4 relative, use 2e-4 as a test tolerance"). Checked on both sides of 16.529 MPa.
        double lnMin = Math.log(table.pMinPa());
        double lnMax = Math.log(table.pMaxPa());
        for (int k = 0; k <= 200; k++) {
            double p = Math.min(table.pMaxPa(), Math.exp(lnMin + (lnMax - lnMin) * k / 200.0));
            table.lookup(p, looked);
            assertEquals(clapeyron(looked), looked.dTsDp, 2e-4 * Math.abs(looked.dTsDp),
                    "Clapeyron at " + p + " Pa");
        }
    }

    @Test
    void saturatedSteamEnthalpyPeaksNear31Bar() {
        // source: check-values §1.2: hv peaks at 2803.285 kJ/kg near 30.78 bar (computed with
        // IF97 lib); find the peak by golden-section search on the table
        double a = 20 * BAR;
        double b = 40 * BAR;
        double g = (Math.sqrt(5) - 1) / 2;
        for (int k = 0; k < 80; k++) {
            double c = b - g * (b - a);
            double d = a + g * (b - a);
            if (hs(c) > hs(d)) {
                b = d;
            } else {
                a = c;
            }
        }
        double pPeak = 0.5 * (a + b);
        // tolerance: half a unit of the printed digits (0.005 bar, 0.0005 kJ/kg)
        assertEquals(30.78, pPeak / BAR, 0.005, "pressure of the hv peak, bar");
        assertEquals(2803.285, hs(pPeak) / KJ, 0.0005, "hv at the peak, kJ/kg");
        table.lookup(pPeak, looked);
        // the derivative changes sign there: |dhv/dp| is tiny relative to its 5 bar value
        // (source: check-values §1.2 derivative table, dhv/dp = 8.913 kJ/kg/bar at 5 bar)
        assertTrue(Math.abs(looked.dHSDp * BAR / KJ) < 1e-3, "dhv/dp at the peak");
    }

    @Test
    void backwardAndForwardSaturationEquationsInvertEachOther() {
        // IF97 designs eq. 30 and eq. 31 as exact inverses of the same quadratic (source:
        // IAPWS-IF97 §8.1-8.2); round trip to 1e-13 relative (a few ulps of arithmetic)
        for (double t = 273.16; t <= 647.0; t += 3.7) {
            double p = Iapws97.saturationPressurePa(t);
            assertEquals(t, Iapws97.saturationTemperatureK(p), 1e-13 * t, "round trip at " + t + " K");
        }
    }

    private double hs(double p) {
        table.lookup(p, looked);
        return looked.hS;
    }

    private SaturationState[] evaluate(double p) {
        SaturationTable.direct(p, direct);
        table.lookup(p, looked);
        return new SaturationState[] {direct, looked};
    }

    private static double clapeyron(SaturationState s) {
        return s.tsK * (1.0 / s.rhoS - 1.0 / s.rhoW) / (s.hS - s.hW);
    }

    private static double halfUnitOf4Digits(double v) {
        double exp = Math.floor(Math.log10(Math.abs(v)));
        return 0.5 * Math.pow(10, exp - 3);
    }
}
