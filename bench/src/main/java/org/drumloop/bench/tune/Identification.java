package org.drumloop.bench.tune;

import java.util.ArrayList;
import java.util.List;

import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.EvaluationRmsChecker;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresProblem;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.util.Pair;

/**
 * Fits a {@link StepModel} to a bump test by least squares on the simulated response (output error),
 * with Hipparchus' Levenberg–Marquardt optimiser and a forward-difference Jacobian. Time constants
 * stay positive and delays non-negative (the parameters are clamped into their bounds after every
 * step). Several starting points are tried, guessed from the record's shape; the best fit wins.
 */
public final class Identification {
    /** Iteration limit of one optimisation. */
    static final int MAX_ITERATIONS = 400;
    /** Relative finite-difference step of the Jacobian. */
    static final double FD_STEP = 1e-6;

    private Identification() {
    }

    /**
     * Fits a model to a record.
     *
     * @param title record title for the report
     * @param kind  model structure
     * @param tS    sample times [s]
     * @param u     input (SI, absolute); deviations are taken from its starting value
     * @param y     output (SI)
     * @throws IllegalArgumentException the input never moves, or the record is too short
     */
    public static BumpFit fit(String title, StepModel.Kind kind, double[] tS, double[] u, double[] y) {
        return fit(title, kind, tS, u, y, null);
    }

    /**
     * Fits from given starting points (parameters in {@link StepModel.Kind#names()} order) instead of
     * the guessed ones.
     */
    public static BumpFit fit(String title, StepModel.Kind kind, double[] tS, double[] u, double[] y,
                              List<double[]> startPoints) {
        int n = tS.length;
        if (n < TrendCsv.MIN_ROWS || u.length != n || y.length != n) {
            throw new IllegalArgumentException(title + ": record too short or arrays of unequal length");
        }
        Shape s = Shape.of(tS, u, y);
        double[] du = new double[n];
        for (int i = 0; i < n; i++) {
            du[i] = u[i] - s.u0;
        }
        double[] lo = new double[kind.size()];
        double[] hi = new double[kind.size()];
        bounds(kind, tS, lo, hi);
        BumpFit best = null;
        for (double[] start : startPoints != null ? startPoints : starts(kind, s, tS, du, y)) {
            start = start.clone();
            clamp(start, lo, hi);
            BumpFit f;
            try {
                f = optimise(title, kind, tS, u, du, y, start, lo, hi);
            } catch (MathIllegalStateException e) {
                continue; // this start did not converge; another may
            }
            if (best == null || f.rms() < best.rms()) {
                best = f;
            }
        }
        if (best == null) {
            throw new IllegalArgumentException(title + ": the fit did not converge from any starting point");
        }
        return best;
    }

    private static BumpFit optimise(String title, StepModel.Kind kind, double[] tS, double[] u, double[] du, double[] y,
                                    double[] start, double[] lo, double[] hi) {
        int n = tS.length;
        int m = kind.size();
        double[] scratch = new double[n];
        double[] scratch2 = new double[n];
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(start)
                .target(y)
                .model(point -> {
                    double[] p = point.toArray();
                    StepModel.simulate(kind, p, tS, du, scratch);
                    double[][] jac = new double[n][m];
                    for (int c = 0; c < m; c++) {
                        double[] q = p.clone();
                        double h = FD_STEP * Math.max(Math.abs(p[c]), typical(kind, c, tS, y));
                        q[c] = p[c] + h;
                        if (q[c] > hi[c]) {
                            h = -h;
                            q[c] = p[c] + h;
                        }
                        StepModel.simulate(kind, q, tS, du, scratch2);
                        for (int i = 0; i < n; i++) {
                            jac[i][c] = (scratch2[i] - scratch[i]) / h;
                        }
                    }
                    return new Pair<RealVector, RealMatrix>(new ArrayRealVector(scratch, true),
                            new Array2DRowRealMatrix(jac, false));
                })
                .parameterValidator(v -> {
                    double[] p = v.toArray();
                    clamp(p, lo, hi);
                    return new ArrayRealVector(p, false);
                })
                .checker(new EvaluationRmsChecker(1e-9)) // converged when the RMS error stops changing
                .maxEvaluations(20 * MAX_ITERATIONS)
                .maxIterations(MAX_ITERATIONS)
                .lazyEvaluation(false)
                .build();
        LeastSquaresOptimizer.Optimum opt = new LevenbergMarquardtOptimizer().optimize(problem);
        double[] p = opt.getPoint().toArray();
        double[] yHat = new double[n];
        StepModel.simulate(kind, p, tS, du, yHat);
        double ssr = 0;
        double mean = 0;
        for (double v : y) {
            mean += v / n;
        }
        double sst = 0;
        for (int i = 0; i < n; i++) {
            ssr += (y[i] - yHat[i]) * (y[i] - yHat[i]);
            sst += (y[i] - mean) * (y[i] - mean);
        }
        double[] se = standardErrors(opt, ssr, n, m);
        double fit = sst > 0 ? 100 * (1 - Math.sqrt(ssr / sst)) : 0;
        return new BumpFit(title, kind, p, se, Math.sqrt(ssr / n), fit, opt.getIterations(), tS, u, y, yHat);
    }

    /** Standard errors: square roots of the diagonal of s^2 (J'J)^-1, s^2 = SSR / (n - p). */
    static double[] standardErrors(LeastSquaresOptimizer.Optimum opt, double ssr, int n, int m) {
        double[] se = new double[m];
        try {
            RealMatrix cov = opt.getCovariances(1e-14);
            double s2 = ssr / Math.max(1, n - m);
            for (int i = 0; i < m; i++) {
                se[i] = Math.sqrt(Math.max(0, cov.getEntry(i, i) * s2));
            }
        } catch (MathIllegalStateException | org.hipparchus.exception.MathIllegalArgumentException e) {
            java.util.Arrays.fill(se, Double.POSITIVE_INFINITY); // singular: a parameter is not identifiable
        }
        return se;
    }

    /** Typical size of a parameter, for the finite-difference step when the parameter is near zero. */
    private static double typical(StepModel.Kind kind, int c, double[] tS, double[] y) {
        if (c == kind.thetaIndex()) {
            return tS[1] - tS[0];
        }
        for (int l : kind.lagIndices()) {
            if (c == l) {
                return tS[1] - tS[0];
            }
        }
        double span = 0;
        for (double v : y) {
            span = Math.max(span, Math.abs(v - y[0]));
        }
        return Math.max(span, 1e-9);
    }

    private static void bounds(StepModel.Kind kind, double[] tS, double[] lo, double[] hi) {
        double dur = tS[tS.length - 1] - tS[0];
        double minStep = Double.POSITIVE_INFINITY;
        for (int i = 1; i < tS.length; i++) {
            minStep = Math.min(minStep, tS[i] - tS[i - 1]);
        }
        java.util.Arrays.fill(lo, Double.NEGATIVE_INFINITY);
        java.util.Arrays.fill(hi, Double.POSITIVE_INFINITY);
        for (int tau : kind.lagIndices()) {
            lo[tau] = 0.01 * minStep;
            hi[tau] = dur / 3; // a lag must settle within the record, or it could pass for the integrator
        }
        lo[kind.thetaIndex()] = 0;
        hi[kind.thetaIndex()] = 0.5 * dur;
    }

    private static void clamp(double[] p, double[] lo, double[] hi) {
        for (int i = 0; i < p.length; i++) {
            p[i] = Math.min(hi[i], Math.max(lo[i], p[i]));
        }
    }

    /** Starting points guessed from the record's shape. */
    private static List<double[]> starts(StepModel.Kind kind, Shape s, double[] tS, double[] du, double[] y) {
        List<double[]> list = new ArrayList<>();
        double dt = tS[1] - tS[0];
        double after = tS[tS.length - 1] - s.tStep;
        if (kind == StepModel.Kind.FOPDT) {
            double k = s.duEnd != 0 ? (s.yEnd - s.y0) / s.duEnd : 1;
            // first move of the output beyond 5 % of its final change: the delay; 63 %: delay plus tau1
            double t5 = s.crossing(tS, y, 0.05);
            double t63 = s.crossing(tS, y, 0.632);
            double theta = Math.max(0, t5 - s.tStep);
            double tau = Math.max(dt, t63 - s.tStep - theta);
            list.add(new double[] {k, tau, theta, s.y0});
            list.add(new double[] {k, Math.max(dt, t63 - s.tStep), 0, s.y0});
        } else {
            // slope over the last third of the record: the integrating gain
            int a = (int) (tS.length * 2 / 3.0);
            int b = tS.length - 1;
            double slope = (y[b] - y[a]) / (tS[b] - tS[a]);
            double duAvg = s.duEnd != 0 ? s.duEnd : 1;
            double kI = slope / duAvg;
            // the tail line's offset at the step: kI * du * (t - tStep) + offset
            double offset = y[b] - s.y0 - slope * (tS[b] - s.tStep);
            double kL = offset / duAvg;
            double tExt = s.inverseExtremumTime(tS, y, Math.signum(slope * duAvg));
            for (double tau : new double[] {Math.max(dt, (tExt - s.tStep) / 3), Math.max(dt, after / 20), 10 * dt}) {
                if (kind == StepModel.Kind.INTEGRATOR_LAG) {
                    list.add(new double[] {kI, kL, tau, 0, s.y0});
                } else {
                    // the fast term makes the inverse response; a slow one of either sign the rest
                    double slow = Math.max(4 * tau, after / 6);
                    list.add(new double[] {kI, kL, tau, 0.2 * Math.abs(kL), slow, 0, s.y0});
                    list.add(new double[] {kI, kL, tau, -0.2 * Math.abs(kL), slow, 0, s.y0});
                }
            }
        }
        return list;
    }

    /** What the record looks like: when the input stepped, starting and final values. */
    static final class Shape {
        double u0;
        double y0;
        double tStep;
        int iStep;
        double duEnd;
        double yEnd;

        static Shape of(double[] tS, double[] u, double[] y) {
            Shape s = new Shape();
            int n = tS.length;
            double maxDev = 0;
            for (double v : u) {
                maxDev = Math.max(maxDev, Math.abs(v - u[0]));
            }
            if (!(maxDev > 0)) {
                throw new IllegalArgumentException("the input never moves: nothing to fit");
            }
            int i0 = 0;
            while (i0 < n - 1 && Math.abs(u[i0] - u[0]) <= 0.2 * maxDev) {
                i0++;
            }
            s.iStep = i0;
            s.tStep = tS[i0];
            int base = Math.max(1, i0);
            for (int i = 0; i < base; i++) {
                s.u0 += u[i] / base;
                s.y0 += y[i] / base;
            }
            int tail = Math.max(1, (n - i0) / 10);
            for (int i = n - tail; i < n; i++) {
                s.duEnd += (u[i] - s.u0) / tail;
                s.yEnd += y[i] / tail;
            }
            return s;
        }

        /** First time after the step the output has covered a fraction of its final change. */
        double crossing(double[] tS, double[] y, double frac) {
            double target = y0 + frac * (yEnd - y0);
            boolean up = yEnd >= y0;
            for (int i = iStep; i < tS.length; i++) {
                if (up ? y[i] >= target : y[i] <= target) {
                    return tS[i];
                }
            }
            return tS[tS.length - 1];
        }

        /**
         * Time of the largest excursion against the final trend (the bottom of a shrink, the top of a
         * swell); the step time when the output never moves the wrong way.
         */
        double inverseExtremumTime(double[] tS, double[] y, double trendSign) {
            double best = 0;
            double t = tS[iStep];
            for (int i = iStep; i < tS.length; i++) {
                double against = -trendSign * (y[i] - y0);
                if (against > best) {
                    best = against;
                    t = tS[i];
                }
            }
            return t;
        }
    }
}
