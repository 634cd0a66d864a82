package org.drumloop.bench.tune;

/**
 * The linear models a bump test is fitted to, simulated exactly on sampled data. Input and output
 * are deviations from the record's starting steady state; the input is held between samples
 * (zero-order hold: the value recorded at {@code t[i]} acts until {@code t[i+1]}), delayed by
 * {@code theta}, and the model is integrated exactly over every piece on which the delayed input
 * is constant, so neither the sampling nor a delay between samples costs accuracy.
 *
 * <ul>
 * <li>{@link Kind#FOPDT} first order plus dead time, {@code k e^(-theta s) / (tau1 s + 1)};
 *     parameters {@code k, tau1, theta, y0}.</li>
 * <li>{@link Kind#INTEGRATOR_LAG} an integrator with a first-order lag term,
 *     {@code (kI / s + kL / (tau s + 1)) e^(-theta s)}; parameters {@code kI, kL, tau, theta, y0}.
 *     Level on feed flow is {@code kI (1 - T s) / (s (tau s + 1))} with the right-half-plane zero
 *     time {@code T = -kL/kI - tau} (inverse response, shrink); level on steam flow is the
 *     non-minimum-phase integrator with {@code kI < 0} and the swell {@code kL > 0}.</li>
 * <li>{@link Kind#INTEGRATOR_TWO_LAGS} the same with a second, slower lag term,
 *     {@code (kI / s + kL / (tau s + 1) + kL2 / (tau2 s + 1)) e^(-theta s)}; parameters
 *     {@code kI, kL, tau, kL2, tau2, theta, y0}: the level of a boiler whose pressure control acts
 *     during the test (the pressure dip and its recovery move the bubbles a second time).</li>
 * </ul>
 * {@code y0} is the output's starting value (the fit estimates it with the rest).
 */
public final class StepModel {
    /** Model structures. */
    public enum Kind {
        FOPDT(new String[] {"k", "tau1", "theta", "y0"}),
        INTEGRATOR_LAG(new String[] {"kI", "kL", "tau", "theta", "y0"}),
        INTEGRATOR_TWO_LAGS(new String[] {"kI", "kL", "tau", "kL2", "tau2", "theta", "y0"});

        private final String[] names;

        Kind(String[] names) {
            this.names = names;
        }

        /** Parameter names in order. */
        public String[] names() { return names.clone(); }

        public int size() { return names.length; }

        /** Index of the delay parameter. */
        public int thetaIndex() { return this == FOPDT ? 2 : this == INTEGRATOR_LAG ? 3 : 5; }

        /** Indices of the time-constant parameters. */
        public int[] lagIndices() { return this == FOPDT ? new int[] {1} : this == INTEGRATOR_LAG ? new int[] {2} : new int[] {2, 4}; }
    }

    private StepModel() {
    }

    /**
     * Simulates a model on the sample times of a record.
     *
     * @param kind model structure
     * @param p    parameters in {@link Kind#names()} order
     * @param tS   sample times, strictly increasing
     * @param du   input deviation from its starting value at each sample (held until the next)
     * @param out  output at each sample (y0 plus the response)
     */
    public static void simulate(Kind kind, double[] p, double[] tS, double[] du, double[] out) {
        int n = tS.length;
        double theta = p[kind.thetaIndex()];
        double tau = kind == Kind.FOPDT ? p[1] : p[2];
        double tau2 = kind == Kind.INTEGRATOR_TWO_LAGS ? p[4] : 1;
        double x1 = 0; // integrator state, or the output (FOPDT)
        double x2 = 0; // lag state, unit gain
        double x3 = 0; // second lag state, unit gain
        int j = -1; // index of the input sample acting now (delayed); -1 = before the record: deviation 0
        double now = tS[0];
        out[0] = output(kind, p, x1, x2, x3);
        for (int i = 1; i < n; i++) {
            double end = tS[i];
            while (now < end) {
                // the delayed input changes next at t[j+1] + theta
                double next = j + 1 < n ? tS[j + 1] + theta : Double.POSITIVE_INFINITY;
                if (next <= now) {
                    j++;
                    continue;
                }
                double stop = Math.min(next, end);
                double d = stop - now;
                double w = j < 0 ? 0 : du[j];
                if (kind == Kind.FOPDT) {
                    double target = p[0] * w;
                    x1 = target + (x1 - target) * Math.exp(-d / tau);
                } else {
                    x1 += w * d;
                    x2 = w + (x2 - w) * Math.exp(-d / tau);
                    if (kind == Kind.INTEGRATOR_TWO_LAGS) {
                        x3 = w + (x3 - w) * Math.exp(-d / tau2);
                    }
                }
                now = stop;
            }
            out[i] = output(kind, p, x1, x2, x3);
        }
    }

    private static double output(Kind kind, double[] p, double x1, double x2, double x3) {
        switch (kind) {
            case FOPDT: return x1 + p[3];
            case INTEGRATOR_LAG: return p[0] * x1 + p[1] * x2 + p[4];
            default: return p[0] * x1 + p[1] * x2 + p[3] * x3 + p[6];
        }
    }
}
