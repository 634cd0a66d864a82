package org.drumloop.core.control;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Step responses of the PID block in closed loop against the closed-form responses of continuous
 * loops (Laplace transforms, closed-loop transfer functions as in Astrom and Hagglund, Advanced PID Control, ISA 2006). The block is
 * sampled, so it lags the continuous controller by up to one scan; with a 1 ms scan against closed-loop
 * time constants of 3 s or more the difference is a few 1e-4 of the step, hence the 1e-3 tolerances.
 */
class PidClosedFormTest {
    static final double H_S = 1e-3;
    /** One-scan lag against loop time constants >= 3 s: about h/tau_cl = 3e-4; 1e-3 leaves margin. */
    static final double TOL = 1e-3;

    /** First-order process K/(tau s + 1), exact zero-order-hold step. */
    static final class FirstOrder {
        final double k;
        final double a;
        double y;

        FirstOrder(double k, double tauS) {
            this.k = k;
            this.a = Math.exp(-H_S / tauS);
        }

        double step(double u) {
            y = a * y + (1 - a) * k * u;
            return y;
        }
    }

    /** P control of K/(tau s + 1): y = K Kc/(1 + K Kc) (1 - exp(-t (1 + K Kc)/tau)). */
    @Test
    void proportionalControlOfAFirstOrderProcessSettlesWithTheClosedFormOffset() {
        double k = 2.0;
        double tau = 10.0;
        double kc = 1.5;
        Pid pid = new Pid(new PidParams(kc, Double.POSITIVE_INFINITY, 0, 10, 1, 0, -100, 100, Double.POSITIVE_INFINITY, 1, true));
        pid.reset(0.0);
        FirstOrder p = new FirstOrder(k, tau);
        double yInf = k * kc / (1 + k * kc);
        double tauCl = tau / (1 + k * kc);
        double t = 0;
        for (int i = 1; i <= 20_000; i++) {
            double u = pid.update(1.0, p.y, 0.0, H_S);
            p.step(u);
            t = i * H_S;
            if (i % 2000 == 0) {
                assertEquals(yInf * (1 - Math.exp(-t / tauCl)), p.y, TOL, "t = " + t);
            }
        }
        assertEquals(0.75, p.y, TOL, "steady offset 1/(1 + K Kc) = 0.25 (closed form)");
    }

    /** PI with Ti = tau cancels the process pole: loop K Kc/(tau s), so y = 1 - exp(-t K Kc / tau). */
    @Test
    void piControlWithPoleCancellationGivesAFirstOrderResponse() {
        double k = 2.0;
        double tau = 10.0;
        double kc = 1.5;
        Pid pid = new Pid(PidParams.pi(kc, tau, -100, 100, true));
        FirstOrder p = new FirstOrder(k, tau);
        for (int i = 1; i <= 20_000; i++) {
            double u = pid.update(1.0, p.y, 0.0, H_S);
            p.step(u);
            if (i % 2000 == 0) {
                double t = i * H_S;
                assertEquals(1 - Math.exp(-t * k * kc / tau), p.y, TOL, "t = " + t);
            }
        }
    }

    /** P control of an integrator k'/s: y = 1 - exp(-k' Kc t). */
    @Test
    void proportionalControlOfAnIntegratorHasNoOffset() {
        double kp = 0.05;
        double kc = 2.0;
        Pid pid = new Pid(new PidParams(kc, Double.POSITIVE_INFINITY, 0, 10, 1, 0, -100, 100, Double.POSITIVE_INFINITY, 1, true));
        pid.reset(0.0);
        double y = 0;
        for (int i = 1; i <= 50_000; i++) {
            double u = pid.update(1.0, y, 0.0, H_S);
            y += kp * u * H_S;
            if (i % 5000 == 0) {
                double t = i * H_S;
                assertEquals(1 - Math.exp(-kp * kc * t), y, TOL, "t = " + t);
            }
        }
    }

    /**
     * PI control of an integrator with k' Kc = 2w and k' Kc/Ti = w^2 (critically damped poles):
     * Y/R = (2ws + w^2)/(s + w)^2, so y = 1 - exp(-wt) + wt exp(-wt), peak 1 + e^-2 at t = 2/w.
     */
    @Test
    void piControlOfAnIntegratorOvershootsAsTheClosedFormSays() {
        double w = 0.2;
        double kp = 0.05;
        double kc = 2 * w / kp;
        double ti = 2 / w;
        Pid pid = new Pid(PidParams.pi(kc, ti, -1e3, 1e3, true));
        double y = 0;
        double peak = 0;
        double tPeak = 0;
        for (int i = 1; i <= 40_000; i++) {
            double u = pid.update(1.0, y, 0.0, H_S);
            y += kp * u * H_S;
            double t = i * H_S;
            if (y > peak) {
                peak = y;
                tPeak = t;
            }
            if (i % 4000 == 0) {
                assertEquals(1 - Math.exp(-w * t) + w * t * Math.exp(-w * t), y, TOL, "t = " + t);
            }
        }
        assertEquals(1 + Math.exp(-2), peak, TOL, "peak 1 + e^-2 (closed form)");
        // the peak is flat (dy/dt = 0): its time is found to about +/-0.1 s on a 1 ms grid
        assertEquals(2 / w, tPeak, 0.1);
    }

    /**
     * SIMC tuning of an integrating process with delay, k' = 0.01 1/s, theta = 5 s, tau_c = 5 s:
     * Kc = 10, Ti = 40 s. Reference responses (check values of the project, Skogestad 2003 rules,
     * simulated with Euler at 1 ms): setpoint step overshoot 27.75 % with the peak at 25.39 s,
     * first reaching 0.9 at 13.80 s; unit input disturbance peak 0.0981 at 20.15 s.
     */
    @Test
    void simcTunedLoopOnAnIntegratorWithDelayMatchesTheReferenceSimulation() {
        double kp = 0.01;
        int delay = (int) Math.round(5.0 / H_S);
        double[] setpoint = simulate(kp, delay, 1.0, 0.0);
        // tolerances: the reference used another discretisation of the same loop; 1 ms steps move
        // peaks by a few ms and levels by about 1e-3
        assertEquals(0.2775, setpoint[0] - 1.0, 2e-3, "overshoot");
        assertEquals(25.39, setpoint[1], 0.05, "time of peak");
        assertEquals(13.80, setpoint[2], 0.01, "first reaches 0.9");
        double[] load = simulate(kp, delay, 0.0, 1.0);
        assertEquals(0.0981, load[0], 1e-3, "disturbance peak");
        assertEquals(20.15, load[1], 0.05, "time of disturbance peak");
    }

    /** Returns {peak, tPeak, t90}. */
    private static double[] simulate(double kp, int delay, double r, double d) {
        Pid pid = new Pid(PidParams.pi(10.0, 40.0, -1e3, 1e3, true));
        double[] buf = new double[delay];
        int head = 0;
        double y = 0;
        double peak = 0;
        double tPeak = 0;
        double t90 = Double.NaN;
        for (int i = 1; i <= 80_000; i++) {
            double u = pid.update(r, y, 0.0, H_S) + d;
            double delayed = buf[head];
            buf[head] = u;
            head = (head + 1) % delay;
            y += kp * delayed * H_S;
            double t = i * H_S;
            if (y > peak) {
                peak = y;
                tPeak = t;
            }
            if (Double.isNaN(t90) && y >= 0.9 && r > 0) {
                t90 = t;
            }
        }
        return new double[] {peak, tPeak, t90};
    }
}
