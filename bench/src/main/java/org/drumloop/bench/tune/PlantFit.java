package org.drumloop.bench.tune;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresProblem;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.util.Pair;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantKey;

/**
 * Calibrates numeric plant-file values to a recorded trend. The recorded inputs drive the plant
 * model from a balanced start at the record's first values; the level and pressure it computes are
 * compared with the recorded ones; Levenberg–Marquardt least squares moves the chosen values within
 * the plant file's ranges. Every model evaluation is a full simulation; the columns of the
 * forward-difference Jacobian are simulated in parallel.
 *
 * <p>Driving: steam flow as recorded; feed flow as the model's balanced start plus the recorded
 * change (a flow-meter offset would otherwise fill or drain the drum); firing (or heat) as the
 * model's start plus the recorded change; feed temperature as recorded when present. Compared: the
 * level's change from its start (transmitter zero and NWL need not agree) and the absolute pressure.
 * Residuals are scaled by each signal's recorded range, so level and pressure weigh alike. The
 * record must start at steady state. A row's inputs are taken to have acted over the interval that
 * ends at the row's time, as drumloop's records are written.
 */
public final class PlantFit {
    /** Relative finite-difference step. */
    static final double FD_STEP = 1e-4;
    /** Iteration limit. */
    static final int MAX_ITERATIONS = 60;
    /** Settling before the record, with the flows prescribed and the pressure control in automatic [s]. */
    static final double SETTLE_S = 300.0;
    static final double SETTLE_DT_S = 0.5;
    /** Samples averaged for the starting values. */
    static final int BASELINE_SAMPLES = 10;

    /** The recorded trend as the fit uses it, SI; firing and heat: exactly one non-null; feedTempK may be null. */
    public record Data(double[] tS, double[] steamKgS, double[] feedKgS, double[] feedTempK, double[] firingFrac,
                       double[] heatW, double[] levelM, double[] pressurePa) {

        /** The signals of a trend read with {@link TrendCsv}. */
        public static Data of(Trend t) {
            return new Data(t.tS(), t.get(TrendSignal.STEAM_FLOW), t.get(TrendSignal.FEED_FLOW),
                    t.has(TrendSignal.FEED_TEMP) ? t.get(TrendSignal.FEED_TEMP) : null,
                    t.has(TrendSignal.FIRING) ? t.get(TrendSignal.FIRING) : null,
                    t.has(TrendSignal.FIRING) ? null : t.get(TrendSignal.HEAT),
                    t.get(TrendSignal.DRUM_LEVEL), t.get(TrendSignal.DRUM_PRESSURE));
        }
    }

    /** The simulated level [m, change from start] and pressure [Pa], and whether the model stayed valid. */
    public record Response(double[] levelM, double[] pressurePa, boolean valid) { }

    /**
     * The outcome.
     *
     * @param keys     the fitted keys
     * @param start    their starting values, SI
     * @param values   fitted values, SI
     * @param stdErr   standard errors, SI (from the covariance at the optimum scaled by the residual variance)
     * @param fitted   the start configuration with the fitted values
     * @param before   response with the start values
     * @param after    response with the fitted values
     * @param recordedLevelM recorded level change from its start
     */
    public record Result(List<PlantKey> keys, double[] start, double[] values, double[] stdErr, PlantConfig fitted,
                         Response before, Response after, double[] recordedLevelM, double rmsLevelBeforeM,
                         double rmsPressureBeforePa, double rmsLevelM, double rmsPressurePa, int iterations,
                         int evaluations) { }

    private PlantFit() {
    }

    /** The bounds a key may move within: the plant file's range, narrowed by the cross-checks between keys. */
    static double[] bounds(PlantConfig c, PlantKey k) {
        double lo = k.minSi();
        double hi = k.maxSi();
        switch (k) {
            case STEAM_UNDER_SURFACE_VOLUME -> hi = Math.min(hi, 0.99 * c.value(PlantKey.DRUM_VOLUME));
            case RISER_METAL_MASS, DRUM_METAL_MASS -> hi = Math.min(hi, c.value(PlantKey.TOTAL_METAL_MASS));
            case TOTAL_METAL_MASS -> lo = Math.max(lo, Math.max(c.value(PlantKey.RISER_METAL_MASS),
                    c.value(PlantKey.DRUM_METAL_MASS)));
            default -> { }
        }
        return new double[] {lo, hi};
    }

    /** Simulates the plant driven by the recorded inputs. */
    public static Response simulate(PlantConfig cfg, Data d) {
        int n = d.tS().length;
        int b = Math.max(1, Math.min(BASELINE_SAMPLES, n / 20));
        double qs0 = mean(d.steamKgS(), b);
        double qf0 = mean(d.feedKgS(), b);
        double p0 = mean(d.pressurePa(), b);
        Plant p = new Plant(cfg, 1);
        p.setPressureSetpointPa(p0);
        if (d.feedTempK() != null) {
            p.setFeedTemperatureK(mean(d.feedTempK(), b));
        }
        p.initSteadyState(qs0 * cfg.nominalPressurePa() / (cfg.ratedSteamFlowKgS() * p0));
        double feedStart = p.feedFlowKgS();
        // prescribing the flows changes the feed enthalpy a little (drum instead of pump pressure):
        // settle there with the plant's pressure control, so the firing starts balanced
        p.setSteamFlowOverrideKgS(qs0);
        p.setFeedFlowOverrideKgS(feedStart);
        for (int i = 0; i < (int) Math.round(SETTLE_S / SETTLE_DT_S); i++) {
            p.step(SETTLE_DT_S);
        }
        double firing0 = p.firingFrac();
        double drive0 = d.firingFrac() != null ? mean(d.firingFrac(), b) : mean(d.heatW(), b);
        double[] level = new double[n];
        double[] pressure = new double[n];
        double level0 = p.levelM();
        level[0] = 0;
        pressure[0] = p.drumPressurePa();
        p.setFiringManual(firing0);
        for (int i = 0; i + 1 < n; i++) {
            // a row holds what acted over the interval that ends at its time (as drumloop records it)
            int k = i + 1;
            p.setSteamFlowOverrideKgS(d.steamKgS()[k]);
            p.setFeedFlowOverrideKgS(feedStart + d.feedKgS()[k] - qf0);
            if (d.feedTempK() != null) {
                p.setFeedTemperatureK(d.feedTempK()[k]);
            }
            if (d.firingFrac() != null) {
                p.setFiringManual(Math.min(1, Math.max(0, firing0 + d.firingFrac()[k] - drive0)));
            } else {
                p.setHeatStepW(d.heatW()[k] - drive0);
            }
            p.step(d.tS()[i + 1] - d.tS()[i]);
            level[i + 1] = p.levelM() - level0;
            pressure[i + 1] = p.drumPressurePa();
        }
        return new Response(level, pressure, !p.invalid());
    }

    /**
     * Fits plant-file values to a record.
     *
     * @param start   the starting configuration
     * @param d       the record
     * @param keys    numeric keys to fit
     * @param threads simulations run at once for the Jacobian (the machine's cores)
     */
    public static Result fit(PlantConfig start, Data d, List<PlantKey> keys, int threads) {
        for (PlantKey k : keys) {
            if (!k.numeric()) {
                throw new IllegalArgumentException(k.key() + ": not a numeric key");
            }
        }
        int n = d.tS().length;
        int m = keys.size();
        int b = Math.max(1, Math.min(BASELINE_SAMPLES, n / 20));
        double level0 = mean(d.levelM(), b);
        double[] recLevel = new double[n];
        for (int i = 0; i < n; i++) {
            recLevel[i] = d.levelM()[i] - level0;
        }
        double sL = Math.max(1e-3, range(recLevel));
        double sP = Math.max(1e3, range(d.pressurePa()));
        double[] target = new double[2 * n];
        for (int i = 0; i < n; i++) {
            target[i] = recLevel[i] / sL;
            target[n + i] = d.pressurePa()[i] / sP;
        }
        double[] x0 = new double[m];
        double[] scale = new double[m];
        double[] lo = new double[m];
        double[] hi = new double[m];
        for (int j = 0; j < m; j++) {
            double v = start.value(keys.get(j));
            double[] bd = bounds(start, keys.get(j));
            scale[j] = v != 0 ? Math.abs(v) : Math.max(1e-6, 0.01 * (bd[1] - bd[0]));
            x0[j] = v / scale[j];
            lo[j] = bd[0] / scale[j];
            hi[j] = bd[1] / scale[j];
        }
        int[] evaluations = {0};
        ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, threads));
        try {
            LeastSquaresProblem problem = new LeastSquaresBuilder()
                    .start(x0)
                    .target(target)
                    .model(point -> {
                        double[] x = point.toArray();
                        List<Future<double[]>> cols = new ArrayList<>();
                        cols.add(pool.submit(() -> residualModel(start, keys, x, scale, d, sL, sP)));
                        double[] h = new double[m];
                        for (int j = 0; j < m; j++) {
                            double[] xj = x.clone();
                            h[j] = FD_STEP * Math.max(Math.abs(x[j]), 1e-3);
                            if (xj[j] + h[j] > hi[j]) {
                                h[j] = -h[j];
                            }
                            xj[j] += h[j];
                            cols.add(pool.submit(() -> residualModel(start, keys, xj, scale, d, sL, sP)));
                        }
                        double[] f0 = join(cols.get(0));
                        double[][] jac = new double[2 * n][m];
                        for (int j = 0; j < m; j++) {
                            double[] fj = join(cols.get(j + 1));
                            for (int i = 0; i < 2 * n; i++) {
                                jac[i][j] = (fj[i] - f0[i]) / h[j];
                            }
                        }
                        evaluations[0] += m + 1;
                        return new Pair<RealVector, RealMatrix>(new ArrayRealVector(f0, false),
                                new Array2DRowRealMatrix(jac, false));
                    })
                    .parameterValidator(v -> {
                        double[] x = v.toArray();
                        for (int j = 0; j < m; j++) {
                            x[j] = Math.min(hi[j], Math.max(lo[j], x[j]));
                        }
                        return new ArrayRealVector(x, false);
                    })
                    .maxEvaluations(10 * MAX_ITERATIONS)
                    .maxIterations(MAX_ITERATIONS)
                    .lazyEvaluation(false)
                    .build();
            LeastSquaresOptimizer.Optimum opt = new LevenbergMarquardtOptimizer()
                    .withCostRelativeTolerance(1e-12).withParameterRelativeTolerance(1e-10)
                    .optimize(problem);
            double[] x = opt.getPoint().toArray();
            double[] values = new double[m];
            PlantConfig fitted = start;
            for (int j = 0; j < m; j++) {
                values[j] = x[j] * scale[j];
                fitted = fitted.with(keys.get(j), values[j]);
            }
            double ssr = 0;
            for (double r : opt.getResiduals().toArray()) {
                ssr += r * r;
            }
            double[] se = Identification.standardErrors(opt, ssr, 2 * n, m);
            for (int j = 0; j < m; j++) {
                se[j] *= scale[j];
            }
            Response before = simulate(start, d);
            Response after = simulate(fitted, d);
            return new Result(List.copyOf(keys), startValues(start, keys), values, se, fitted, before, after, recLevel,
                    rms(before.levelM(), recLevel), rms(before.pressurePa(), d.pressurePa()), rms(after.levelM(), recLevel),
                    rms(after.pressurePa(), d.pressurePa()), opt.getIterations(), evaluations[0]);
        } catch (MathIllegalStateException e) {
            throw new IllegalArgumentException("the fit did not converge: " + e.getMessage(), e);
        } finally {
            pool.shutdownNow();
        }
    }

    private static double[] residualModel(PlantConfig start, List<PlantKey> keys, double[] x, double[] scale, Data d,
                                          double sL, double sP) {
        PlantConfig c = start;
        for (int j = 0; j < keys.size(); j++) {
            c = c.with(keys.get(j), x[j] * scale[j]);
        }
        Response r = simulate(c, d);
        int n = d.tS().length;
        double[] f = new double[2 * n];
        for (int i = 0; i < n; i++) {
            f[i] = r.levelM()[i] / sL;
            f[n + i] = r.pressurePa()[i] / sP;
        }
        return f;
    }

    private static double[] join(Future<double[]> f) {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            throw e.getCause() instanceof RuntimeException re ? re : new IllegalStateException(e.getCause());
        }
    }

    private static double[] startValues(PlantConfig c, List<PlantKey> keys) {
        double[] v = new double[keys.size()];
        for (int j = 0; j < v.length; j++) {
            v[j] = c.value(keys.get(j));
        }
        return v;
    }

    static double rms(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += (a[i] - b[i]) * (a[i] - b[i]);
        }
        return Math.sqrt(s / a.length);
    }

    private static double mean(double[] v, int count) {
        return Arrays.stream(v, 0, count).average().orElse(v[0]);
    }

    private static double range(double[] v) {
        return Arrays.stream(v).max().orElse(0) - Arrays.stream(v).min().orElse(0);
    }
}
