package org.drumloop.plant.water;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The interpolated saturation table against direct IF97 evaluation, its range handling and its
 * allocation-free lookup. The reference for every numeric check here is the direct IF97
 * evaluation ({@link SaturationTable#direct}), itself checked against the IF97 verification
 * tables and the reference library in the other test classes.
 */
class SaturationTableTest {

    private static final long SEED = 20_240_611L;
    private static final int RANDOM_PRESSURES = 20_000;
    /**
     * Values: cubic Hermite in ln(p) with about 2000 nodes has an interpolation error of order
     * dx^4/384 times the fourth log-derivative, measured at most 5e-10 relative (region 3 side,
     * near 18 MPa); 2e-9 leaves margin and meets the 1e-9-class accuracy the drum model needs.
     */
    private static final double VALUE_REL_TOL = 2e-9;
    /**
     * Derivatives: the Hermite derivative is one order less accurate (dx^3), measured 2e-7
     * relative; 1e-6 of the derivative plus 1e-7 of f/p (for dh_s/dp, which passes through zero
     * near 31 bar, where a purely relative check is meaningless).
     */
    private static final double DERIV_REL_TOL = 1e-6;
    private static final double DERIV_SCALE_TOL = 1e-7;

    private final SaturationTable table = SaturationTable.standard();
    private final SaturationState direct = new SaturationState();
    private final SaturationState looked = new SaturationState();

    @Test
    void standardTableCovers10KpaTo18MpaAndIsShared() {
        // range required by the bench's 1-180 bar cross-check, with margin below
        assertEquals(0.01e6, table.pMinPa(), 0.0, "exact configured bound");
        assertEquals(18e6, table.pMaxPa(), 0.0, "exact configured bound");
        assertSame(table, SaturationTable.standard());
    }

    @Test
    void lookupMatchesDirectIf97AtRandomPressures() {
        SplittableRandom random = new SplittableRandom(SEED);
        double lnMin = Math.log(table.pMinPa());
        double lnSpan = Math.log(table.pMaxPa()) - lnMin;
        for (int k = 0; k < RANDOM_PRESSURES; k++) {
            double p = Math.min(table.pMaxPa(), Math.exp(lnMin + random.nextDouble() * lnSpan));
            compare(table, p, VALUE_REL_TOL, DERIV_REL_TOL, DERIV_SCALE_TOL);
        }
    }

    @Test
    void lookupMatchesDirectIf97AroundTheRegion3Boundary() {
        // 16.529 MPa: the saturated liquid changes from IF97 region 1 to region 3; the table
        // keeps a segment on each side, so accuracy holds right up to the boundary
        SplittableRandom random = new SplittableRandom(SEED + 1);
        double pb = SaturationTable.REGION3_BOUNDARY_PRESSURE_PA;
        for (int k = 0; k < 2_000; k++) {
            double p = pb * (1.0 + (random.nextDouble() - 0.5) * 2e-3);
            compare(table, p, VALUE_REL_TOL, DERIV_REL_TOL, DERIV_SCALE_TOL);
        }
        for (double p : new double[] {pb, Math.nextDown(pb), Math.nextUp(pb)}) {
            compare(table, p, VALUE_REL_TOL, DERIV_REL_TOL, DERIV_SCALE_TOL);
        }
    }

    @Test
    void region3BoundaryJumpIsSmallAndTsIsContinuous() {
        // IF97 regions 1 and 3 are fitted separately and meet only approximately at 623.15 K;
        // the release's consistency requirement is a relative difference in v of the order of
        // 1e-4 or less along the boundary (from memory); 1e-3 is a loose bound that still
        // proves the region 3 branch found the liquid, not the vapour or a spinodal point
        double pb = SaturationTable.REGION3_BOUNDARY_PRESSURE_PA;
        SaturationState below = new SaturationState();
        SaturationState above = new SaturationState();
        SaturationTable.direct(pb, false, below);
        SaturationTable.direct(pb, true, above);
        assertEquals(below.tsK, above.tsK, 0.0, "Ts comes from region 4 on both sides");
        // source: IAPWS-IF97, definition of the region 1/3 boundary at T = 623.15 K
        assertEquals(623.15, below.tsK, 1e-9, "Ts at the boundary pressure, K (eq. 30/31 round trip)");
        assertEquals(below.rhoW, above.rhoW, 1e-3 * below.rhoW, "saturated liquid density");
        assertEquals(below.rhoS, above.rhoS, 1e-3 * below.rhoS, "saturated vapour density");
        assertEquals(below.hW, above.hW, 1e-3 * below.hW, "saturated liquid enthalpy");
        assertEquals(below.hS, above.hS, 1e-3 * below.hS, "saturated vapour enthalpy");
    }

    @Test
    void tableEndsAreExact() {
        for (double p : new double[] {table.pMinPa(), table.pMaxPa()}) {
            compare(table, p, 1e-12, 1e-9, 1e-12); // nodes: the stored numbers themselves
        }
    }

    @Test
    void smallerCustomTableIsAccurateToo() {
        // 200 nodes over 1-10 bar: dx three times the standard's, so error about 100 times
        // larger (fourth power); 1e-7 / 1e-5 bounds (from the error model above)
        SaturationTable small = new SaturationTable(1e5, 1e6, 200);
        SplittableRandom random = new SplittableRandom(SEED + 2);
        for (int k = 0; k < 2_000; k++) {
            double p = 1e5 * Math.pow(10.0, random.nextDouble());
            compare(small, p, 1e-7, 1e-5, 1e-6);
        }
    }

    @Test
    void tableAboveTheRegion3BoundaryOnlyWorks() {
        // a table lying wholly in region 3 (17-21 MPa, up to the highest accepted pressure),
        // checked against direct IF97 (1e-8, 1e-5 with 400 nodes; measured 4e-11 and 8e-8)
        SaturationTable upper = new SaturationTable(17e6, 21e6, 400);
        for (double p = 17e6; p <= 21e6; p += 0.0123e6) {
            compare(upper, p, 1e-8, 1e-5, 1e-6);
        }
    }

    @Test
    void lookupOutsideTheTableIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> table.lookup(0.0099e6, looked));
        assertThrows(IllegalArgumentException.class, () -> table.lookup(18.0001e6, looked));
        assertThrows(IllegalArgumentException.class, () -> table.lookup(Double.NaN, looked));
        assertTrue(table.contains(0.01e6) && table.contains(18e6), "both ends inside");
        assertTrue(!table.contains(0.0099e6) && !table.contains(18.0001e6) && !table.contains(Double.NaN),
                "outside and NaN refused");
    }

    @Test
    void impossibleTablesAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> new SaturationTable(1e6, 1e5, 100));
        assertThrows(IllegalArgumentException.class, () -> new SaturationTable(100.0, 1e6, 100));
        assertThrows(IllegalArgumentException.class, () -> new SaturationTable(1e5, 22.0e6, 100));
        assertThrows(IllegalArgumentException.class, () -> new SaturationTable(1e5, 1e6, 3));
    }

    @Test
    void lookupAllocatesNothing() {
        com.sun.management.ThreadMXBean bean =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        assertTrue(bean.isThreadAllocatedMemorySupported(), "JVM reports allocated bytes");
        bean.setThreadAllocatedMemoryEnabled(true);
        double[] pressures = new double[1024];
        SplittableRandom random = new SplittableRandom(SEED + 3);
        for (int k = 0; k < pressures.length; k++) {
            pressures[k] = 0.1e6 + random.nextDouble() * 17.8e6;
        }
        double sum = run(pressures, 200_000); // warm-up, lets the JIT compile the loop
        long before = bean.getCurrentThreadAllocatedBytes();
        sum += run(pressures, 100_000);
        long after = bean.getCurrentThreadAllocatedBytes();
        assertTrue(Double.isFinite(sum), "results used");
        // 100,000 lookups: zero bytes expected; up to 1 KB tolerated for the measuring itself
        assertTrue(after - before < 1024, "allocated " + (after - before) + " bytes");
    }

    private double run(double[] pressures, int lookups) {
        double sum = 0.0;
        for (int k = 0; k < lookups; k++) {
            table.lookup(pressures[k & (pressures.length - 1)], looked);
            sum += looked.rhoW;
        }
        return sum;
    }

    private void compare(SaturationTable t, double p, double valueTol, double derivTol,
            double scaleTol) {
        SaturationTable.direct(p, direct);
        t.lookup(p, looked);
        String at = " at " + p + " Pa";
        assertEquals(p, looked.pPa, 0.0, "pressure echoed");
        value(direct.tsK, looked.tsK, valueTol, "Ts" + at);
        value(direct.rhoW, looked.rhoW, valueTol, "rhoW" + at);
        value(direct.rhoS, looked.rhoS, valueTol, "rhoS" + at);
        value(direct.hW, looked.hW, valueTol, "hW" + at);
        value(direct.hS, looked.hS, valueTol, "hS" + at);
        deriv(direct.dTsDp, looked.dTsDp, direct.tsK / p, derivTol, scaleTol, "dTs/dp" + at);
        deriv(direct.dRhoWDp, looked.dRhoWDp, direct.rhoW / p, derivTol, scaleTol, "drhoW/dp" + at);
        deriv(direct.dRhoSDp, looked.dRhoSDp, direct.rhoS / p, derivTol, scaleTol, "drhoS/dp" + at);
        deriv(direct.dHWDp, looked.dHWDp, direct.hW / p, derivTol, scaleTol, "dhW/dp" + at);
        deriv(direct.dHSDp, looked.dHSDp, direct.hS / p, derivTol, scaleTol, "dhS/dp" + at);
    }

    private static void value(double expected, double actual, double relTol, String what) {
        assertEquals(expected, actual, Math.abs(expected) * relTol, what);
    }

    private static void deriv(double expected, double actual, double scale, double relTol,
            double scaleTol, String what) {
        assertEquals(expected, actual, Math.abs(expected) * relTol + Math.abs(scale) * scaleTol, what);
    }
}
