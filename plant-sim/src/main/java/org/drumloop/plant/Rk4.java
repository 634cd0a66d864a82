package org.drumloop.plant;

/**
 * Classical fourth-order Runge–Kutta with a fixed step, work arrays allocated once. The model's
 * derivative function must not change its inputs.
 */
public final class Rk4 {
    /** A system {@code yDot = f(t, y)}. */
    @FunctionalInterface
    public interface Ode {
        void computeDerivatives(double tS, double[] y, double[] yDot);
    }

    private final double[] k1;
    private final double[] k2;
    private final double[] k3;
    private final double[] k4;
    private final double[] tmp;

    public Rk4(int dimension) {
        k1 = new double[dimension];
        k2 = new double[dimension];
        k3 = new double[dimension];
        k4 = new double[dimension];
        tmp = new double[dimension];
    }

    /** Advances {@code y} in place from {@code tS} by {@code hS}. */
    public void step(Ode f, double tS, double[] y, double hS) {
        int n = y.length;
        f.computeDerivatives(tS, y, k1);
        for (int i = 0; i < n; i++) {
            tmp[i] = y[i] + 0.5 * hS * k1[i];
        }
        f.computeDerivatives(tS + 0.5 * hS, tmp, k2);
        for (int i = 0; i < n; i++) {
            tmp[i] = y[i] + 0.5 * hS * k2[i];
        }
        f.computeDerivatives(tS + 0.5 * hS, tmp, k3);
        for (int i = 0; i < n; i++) {
            tmp[i] = y[i] + hS * k3[i];
        }
        f.computeDerivatives(tS + hS, tmp, k4);
        double h6 = hS / 6;
        for (int i = 0; i < n; i++) {
            y[i] += h6 * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]);
        }
    }
}
