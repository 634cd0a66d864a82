package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;

/**
 * Fixed-step RK4 against a tight-tolerance reference integrator (Hipparchus
 * DormandPrince853Integrator, rtol 1e-10) on the same model over a 60 s steam step of +10 kg/s at
 * the 160 MW operating point. The project reference §8 (computed) says RK4 with dt = 0.1 s stays
 * within 2e-7 mm of the tight solution and explicit Euler at dt = 0.1 s is off by about 3e-3 mm.
 */
class IntegrationAccuracyTest {
    private static final double DURATION_S = 60;
    private static final double TIGHT_MM = 1e-6; // bound required by the project's test list

    private static double[] reference() {
        PaperCase c = new PaperCase();
        c.model.qsFixedKgS += 10;
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 4;
            }

            @Override
            public double[] computeDerivatives(double t, double[] y) {
                double[] d = new double[4];
                c.model.computeDerivatives(t, y, d);
                return d;
            }
        };
        double[] scale = {57.2, 8.5e6, 0.051, 4.9};
        double[] abs = new double[4];
        double[] rel = new double[4];
        for (int i = 0; i < 4; i++) {
            abs[i] = 1e-12 * scale[i];
            rel[i] = 1e-10;
        }
        DormandPrince853Integrator dp = new DormandPrince853Integrator(1e-6, 10, abs, rel);
        ODEStateAndDerivative end = dp.integrate(ode, new ODEState(0, c.y.clone()), DURATION_S);
        return end.getPrimaryState();
    }

    private static double[] rk4(double dtS) {
        PaperCase c = new PaperCase();
        c.model.qsFixedKgS += 10;
        Rk4 rk4 = new Rk4(4);
        int n = (int) Math.round(DURATION_S / dtS);
        for (int i = 0; i < n; i++) {
            rk4.step(c.model, i * dtS, c.y, dtS);
        }
        return c.y;
    }

    private static double[] euler(double dtS) {
        PaperCase c = new PaperCase();
        c.model.qsFixedKgS += 10;
        double[] d = new double[4];
        int n = (int) Math.round(DURATION_S / dtS);
        for (int i = 0; i < n; i++) {
            c.model.computeDerivatives(i * dtS, c.y, d);
            for (int k = 0; k < 4; k++) {
                c.y[k] += dtS * d[k];
            }
        }
        return c.y;
    }

    private static double levelMm(double[] y) {
        return new PaperCase().levelM(y) * 1e3;
    }

    @Test
    void rk4AtTenthSecondMatchesDormandPrince853() {
        double ref = levelMm(reference());
        double got = levelMm(rk4(0.1));
        assertEquals(ref, got, TIGHT_MM, "level after 60 s [mm]");
    }

    @Test
    void rk4AtTenthAndTwentiethSecondAgree() {
        assertEquals(levelMm(rk4(0.05)), levelMm(rk4(0.1)), TIGHT_MM, "level after 60 s [mm]");
        assertEquals(rk4(0.05)[1], rk4(0.1)[1], 1e-3, "pressure after 60 s [Pa]; RK4 error ~dt^4");
    }

    @Test
    void explicitEulerMissesTheTightBound() {
        // proves the comparison can fail: Euler at 0.1 s is about 3e-3 mm off (reference §8)
        double err = Math.abs(levelMm(euler(0.1)) - levelMm(reference()));
        assertTrue(err > 100 * TIGHT_MM, "Euler error " + err + " mm should exceed the tight bound");
        assertTrue(err < 0.1, "but stay small: " + err + " mm");
    }
}
