package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.drumloop.plant.water.SaturationState;
import org.drumloop.plant.water.SaturationTable;
import org.junit.jupiter.api.Test;

/**
 * Partial derivatives of the riser void fraction against central finite differences at the
 * operating points of the project reference (§4.5: checked there to 1e-9 relative; §11 asks for
 * 1e-6): the 160 MW unit (8.5 MPa, ar = 0.051) and the auxiliary boiler (0.9 MPa, ar = 0.0472).
 */
class VoidFractionTest {
    private static final double REL_TOL = 1e-6; // project reference §11
    private static final double REL_STEP = 1e-6; // central difference, truncation ~1e-12

    private static void checkPartials(double pPa, double ar) {
        SaturationState s = new SaturationState();
        SaturationTable.standard().lookup(pPa, s);
        double rw = s.rhoW;
        double rs = s.rhoS;
        double h = ar * REL_STEP;
        double fdAr = (VoidFraction.av(ar + h, rw, rs) - VoidFraction.av(ar - h, rw, rs)) / (2 * h);
        double dAr = VoidFraction.dAvDar(ar, rw, rs);
        assertEquals(fdAr, dAr, REL_TOL * Math.abs(fdAr), "d av/d ar at " + pPa);
        double hw = rw * REL_STEP;
        double fdRw = (VoidFraction.av(ar, rw + hw, rs) - VoidFraction.av(ar, rw - hw, rs)) / (2 * hw);
        double dRw = VoidFraction.dAvDrw(ar, rw, rs);
        assertEquals(fdRw, dRw, REL_TOL * Math.abs(fdRw), "d av/d rw at " + pPa);
        double hs = rs * REL_STEP;
        double fdRs = (VoidFraction.av(ar, rw, rs + hs) - VoidFraction.av(ar, rw, rs - hs)) / (2 * hs);
        double dRs = VoidFraction.dAvDrs(ar, rw, rs);
        assertEquals(fdRs, dRs, REL_TOL * Math.abs(fdRs), "d av/d rs at " + pPa);
    }

    @Test
    void partialsMatchFiniteDifferencesAtTheReferencePlantPoint() {
        checkPartials(8.5e6, 0.051);
    }

    @Test
    void partialsMatchFiniteDifferencesAtTheAuxiliaryBoilerPoint() {
        checkPartials(0.9e6, 0.0472);
    }

    @Test
    void voidFractionMatchesTheReferenceValues() {
        SaturationState s = new SaturationState();
        SaturationTable.standard().lookup(8.5e6, s);
        // av = 0.2704 at 8.5 MPa, ar = 0.051 (project reference §6, computed); half a last digit
        assertEquals(0.2704, VoidFraction.av(0.051, s.rhoW, s.rhoS), 5e-5);
        SaturationTable.standard().lookup(0.9e6, s);
        // av = 0.748 at 0.9 MPa, ar = 0.0472 (project reference §10, computed); half a last digit
        assertEquals(0.748, VoidFraction.av(0.0472, s.rhoW, s.rhoS), 5e-4);
    }

    @Test
    void seriesAndClosedFormAgreeAtTheirJoin() {
        // closed form and series must meet at eta = 1e-4 (project reference §4.5); the series is
        // truncated after eta^3, so its error there is ~eta^4 relative: 1e-12 allows for round-off
        double rw = 713.63;
        double rs = 45.608;
        double arJoin = VoidFraction.SERIES_ETA * rs / (rw - rs);
        double below = VoidFraction.av(arJoin * (1 - 1e-12), rw, rs);
        double above = VoidFraction.av(arJoin * (1 + 1e-12), rw, rs);
        assertEquals(above, below, 1e-9 * above, "av continuous");
        assertEquals(VoidFraction.dAvDar(arJoin * (1 + 1e-12), rw, rs),
                VoidFraction.dAvDar(arJoin * (1 - 1e-12), rw, rs), 1e-8 * rw / rs, "d av / d ar continuous");
        double cAbove = VoidFraction.dAvDrw(arJoin * (1 + 1e-12), rw, rs);
        assertEquals(cAbove, VoidFraction.dAvDrw(arJoin * (1 - 1e-12), rw, rs), 1e-6 * Math.abs(cAbove), "d av / d rw continuous");
    }
}
