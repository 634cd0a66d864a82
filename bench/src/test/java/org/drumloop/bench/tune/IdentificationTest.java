package org.drumloop.bench.tune;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.junit.jupiter.api.Test;

/**
 * Identification recovers the parameters of known models from synthetic records with noise. The
 * reference is the generating model itself (its closed-form step response), outside the fit.
 */
class IdentificationTest {
    private static final double DT_S = 0.5;
    private static final double STEP_AT_S = 10;
    /** Required relative accuracy of a recovered parameter. */
    private static final double REL = 0.02;

    @Test
    void simulationOfAFirstOrderModelMatchesItsClosedFormStepResponse() {
        // k (1 - e^(-(t - t0 - theta)/tau1)) with the input held from t0: exact at every sample
        double[] t = times(200);
        double[] u = step(t, 1.0, 3.0);
        double[] y = new double[t.length];
        StepModel.simulate(StepModel.Kind.FOPDT, new double[] {2.0, 7.0, 1.3, 0.5}, t, deviation(u), y);
        for (int i = 0; i < t.length; i++) {
            double s = t[i] - STEP_AT_S - 1.3;
            double expected = 0.5 + (s > 0 ? 2.0 * 2.0 * (1 - Math.exp(-s / 7.0)) : 0);
            assertEquals(expected, y[i], 1e-12, "t = " + t[i]);
        }
    }

    @Test
    void simulationOfAnIntegratorWithLagMatchesItsClosedFormStepResponse() {
        // kI s' + kL (1 - e^(-s'/tau)), s' = t - t0 - theta (closed form of (kI/s + kL/(tau s + 1)) e^(-theta s))
        double[] t = times(300);
        double[] u = step(t, 0.0, 1.0);
        double[] y = new double[t.length];
        StepModel.simulate(StepModel.Kind.INTEGRATOR_LAG, new double[] {0.01, -0.8, 12.0, 0.75, 0.0}, t, u, y);
        for (int i = 0; i < t.length; i++) {
            double s = t[i] - STEP_AT_S - 0.75;
            double expected = s > 0 ? 0.01 * s - 0.8 * (1 - Math.exp(-s / 12.0)) : 0;
            assertEquals(expected, y[i], 1e-12, "t = " + t[i]);
        }
    }

    @Test
    void firstOrderPlusDeadTimeIsRecoveredWithinTwoPercentFromANoisyRecord() {
        // known model: k = 2.5, tau1 = 12 s, theta = 3.3 s (a delay between samples), noise 1 % of the step response
        double[] truth = {2.5, 12.0, 3.3, 40.0};
        double[] t = times(240);
        double[] u = step(t, 10.0, 12.0);
        double[] y = noisy(StepModel.Kind.FOPDT, truth, t, u, 0.05, 1);
        BumpFit f = Identification.fit("synthetic", StepModel.Kind.FOPDT, t, u, y);
        assertRel(2.5, f.get("k"));
        assertRel(12.0, f.get("tau1"));
        assertRel(3.3, f.get("theta"));
        assertTrue(f.fitPercent() > 90, "fit " + f.fitPercent());
        // the standard error is a fair measure of the error: the truth lies within 4 of them
        assertEquals(12.0, f.get("tau1"), 4 * f.stdErr("tau1"));
    }

    @Test
    void integratorWithInverseResponseIsRecoveredWithinTwoPercentFromANoisyRecord() {
        // known model kI (1 - T s)/(s (tau s + 1)) e^(-theta s): kI = 2e-4 m/s per kg/s, T = 150 s, tau = 10 s,
        // theta = 1.2 s, so kL = -kI (T + tau) = -0.032; noise 0.2 mm on a response of about 20 mm
        double kI = 2e-4;
        double[] truth = {kI, -kI * 160, 10.0, 1.2, 0.0};
        double[] t = times(1200);
        double[] u = step(t, 3.0, 3.5);
        double[] y = noisy(StepModel.Kind.INTEGRATOR_LAG, truth, t, u, 2e-4, 2);
        BumpFit f = Identification.fit("synthetic", StepModel.Kind.INTEGRATOR_LAG, t, u, y);
        assertRel(kI, f.get("kI"));
        assertRel(-kI * 160, f.get("kL"));
        assertRel(10.0, f.get("tau"));
        assertEquals(1.2, f.get("theta"), 0.02 * 10, "delay within 2 % of the lag it hides in");
    }

    @Test
    void theSwellOfANonMinimumPhaseIntegratorIsRecovered() {
        // steam to level: kI = -1.5e-4, swell kL = +0.05 m per kg/s with tau = 5 s, no delay
        double[] truth = {-1.5e-4, 0.05, 5.0, 0.0, 0.01};
        double[] t = times(1200);
        double[] u = step(t, 2.0, 2.4);
        double[] y = noisy(StepModel.Kind.INTEGRATOR_LAG, truth, t, u, 1e-4, 3);
        BumpFit f = Identification.fit("synthetic", StepModel.Kind.INTEGRATOR_LAG, t, u, y);
        assertRel(-1.5e-4, f.get("kI"));
        assertRel(0.05, f.get("kL"));
        assertRel(5.0, f.get("tau"));
    }

    @Test
    void aRecordWhoseInputNeverMovesIsRefused() {
        double[] t = times(100);
        double[] u = new double[t.length];
        assertThrows(IllegalArgumentException.class,
                () -> Identification.fit("flat", StepModel.Kind.FOPDT, t, u, u.clone()));
    }

    private static void assertRel(double expected, double actual) {
        assertEquals(expected, actual, REL * Math.abs(expected), "expected " + expected + " within 2 %, got " + actual);
    }

    private static double[] times(int n) {
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * DT_S;
        }
        return t;
    }

    private static double[] step(double[] t, double before, double after) {
        double[] u = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            u[i] = t[i] >= STEP_AT_S ? after : before;
        }
        return u;
    }

    private static double[] deviation(double[] u) {
        double[] d = new double[u.length];
        for (int i = 0; i < u.length; i++) {
            d[i] = u[i] - u[0];
        }
        return d;
    }

    private static double[] noisy(StepModel.Kind kind, double[] p, double[] t, double[] u, double sigma, long seed) {
        double[] y = new double[t.length];
        StepModel.simulate(kind, p, t, deviation(u), y);
        Random r = new Random(seed);
        for (int i = 0; i < y.length; i++) {
            y[i] += sigma * r.nextGaussian();
        }
        return y;
    }
}
