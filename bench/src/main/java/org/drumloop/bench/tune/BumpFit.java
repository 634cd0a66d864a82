package org.drumloop.bench.tune;

import java.util.Locale;

/**
 * A fitted bump test: the model, its parameters with standard errors, the fit error and the data it
 * was fitted to (for the report's overlay).
 *
 * @param title      what was bumped and what responded, e.g. "feed valve -> feed flow"
 * @param kind       model structure
 * @param p          fitted parameters, SI, in {@link StepModel.Kind#names()} order
 * @param stdErr     standard error of each parameter, from the covariance at the optimum scaled by
 *                   the residual variance (optimistic when the residuals are correlated)
 * @param rms        root-mean-square residual, output SI unit
 * @param fitPercent normalised fit, 100 (1 - |y - yhat| / |y - mean y|) [%]
 * @param iterations optimiser iterations
 * @param tS         sample times [s]
 * @param u          input (SI, absolute)
 * @param y          recorded output (SI)
 * @param yHat       model output (SI)
 */
public record BumpFit(String title, StepModel.Kind kind, double[] p, double[] stdErr, double rms, double fitPercent,
                      int iterations, double[] tS, double[] u, double[] y, double[] yHat) {

    /** A parameter by name. */
    public double get(String name) {
        return p[index(name)];
    }

    /** Standard error of a parameter by name. */
    public double stdErr(String name) {
        return stdErr[index(name)];
    }

    private int index(String name) {
        String[] n = kind.names();
        for (int i = 0; i < n.length; i++) {
            if (n[i].equals(name)) {
                return i;
            }
        }
        throw new IllegalArgumentException("no parameter " + name + " in " + kind);
    }

    /** Relative standard error of a parameter [%], infinite for a zero estimate. */
    public double relErrPercent(String name) {
        double v = Math.abs(get(name));
        return v > 0 ? 100 * stdErr(name) / v : Double.POSITIVE_INFINITY;
    }

    /** One line per parameter: name, value and standard error (SI). */
    public String parameterText() {
        StringBuilder sb = new StringBuilder();
        String[] n = kind.names();
        for (int i = 0; i < n.length; i++) {
            sb.append(String.format(Locale.ROOT, "%s = %.6g +- %.2g", n[i], p[i], stdErr[i]));
            if (i + 1 < n.length) {
                sb.append(", ");
            }
        }
        return sb.toString();
    }
}
