package org.drumloop.bench.tune;

import java.util.Arrays;

/**
 * SIMC PI rules and the half rule for model reduction (S. Skogestad, "Simple analytic rules for model
 * reduction and PID controller tuning", J. Process Control 13 (2003) 291–309).
 *
 * <ul>
 * <li>First order plus delay {@code k e^(-theta s)/(tau1 s + 1)}: {@code Kc = tau1 / (k (tauC + theta))},
 *     {@code tauI = min(tau1, 4 (tauC + theta))}.</li>
 * <li>Integrating plus delay {@code k' e^(-theta s)/s}: {@code Kc = 1 / (k' (tauC + theta))},
 *     {@code tauI = 4 (tauC + theta)}.</li>
 * <li>Default {@code tauC = theta} ("tight but robust").</li>
 * <li>Half rule: the largest neglected lag is split evenly between the delay and the smallest kept
 *     lag; smaller lags and every inverse-response (right-half-plane zero) time are added to the
 *     delay in full. A digital controller with scan period {@code h} adds {@code h/2} to the delay
 *     (the paper's treatment of sampling, from memory).</li>
 * </ul>
 */
public final class Simc {
    /** PI settings in the process's own units: {@code Kc} in input per output, {@code tauI} in s. */
    public record Pi(double kc, double tiS) { }

    /** A first-order-plus-delay model; {@code tau1S} is infinite for an integrating model. */
    public record Fopdt(double k, double tau1S, double thetaS) { }

    private Simc() {
    }

    /** SIMC PI for a first-order-plus-delay process. */
    public static Pi fopdt(double k, double tau1S, double thetaS, double tauCS) {
        check(thetaS, tauCS);
        if (!(k != 0) || !(tau1S > 0)) {
            throw new IllegalArgumentException("gain must be non-zero and tau1 positive");
        }
        return new Pi(tau1S / (k * (tauCS + thetaS)), Math.min(tau1S, 4 * (tauCS + thetaS)));
    }

    /** SIMC PI for an integrating-plus-delay process with slope {@code kPrime} (output per input per second). */
    public static Pi integrating(double kPrime, double thetaS, double tauCS) {
        check(thetaS, tauCS);
        if (!(kPrime != 0)) {
            throw new IllegalArgumentException("integrating gain must be non-zero");
        }
        return new Pi(1 / (kPrime * (tauCS + thetaS)), 4 * (tauCS + thetaS));
    }

    private static void check(double thetaS, double tauCS) {
        if (!(thetaS >= 0) || !(tauCS >= 0) || !(tauCS + thetaS > 0)) {
            throw new IllegalArgumentException("delay and tauC must be non-negative and not both zero");
        }
    }

    /**
     * Half rule to a first-order-plus-delay model.
     *
     * @param k       steady-state gain
     * @param theta0S delay [s]
     * @param lagsS   time constants of the lags [s]
     * @param inverseS inverse-response times (right-half-plane zeros {@code -T s + 1}) [s]
     */
    public static Fopdt halfRule(double k, double theta0S, double[] lagsS, double[] inverseS) {
        double[] l = sortedDescending(lagsS);
        if (l.length == 0) {
            throw new IllegalArgumentException("a first-order model needs at least one lag");
        }
        double tau1 = l[0] + (l.length > 1 ? l[1] / 2 : 0);
        double theta = theta0S + (l.length > 1 ? l[1] / 2 : 0) + sum(l, 2) + sum(inverseS, 0);
        return new Fopdt(k, tau1, theta);
    }

    /**
     * Half rule to an integrating-plus-delay model: the integrator is the kept (infinitely slow) lag,
     * so half the largest lag goes to the delay, the other lags and inverse-response times in full.
     */
    public static Fopdt halfRuleIntegrating(double kPrime, double theta0S, double[] lagsS, double[] inverseS) {
        double[] l = sortedDescending(lagsS);
        double theta = theta0S + (l.length > 0 ? l[0] / 2 : 0) + sum(l, 1) + sum(inverseS, 0);
        return new Fopdt(kPrime, Double.POSITIVE_INFINITY, theta);
    }

    private static double[] sortedDescending(double[] a) {
        double[] s = Arrays.stream(a).filter(v -> v > 0).sorted().toArray();
        for (int i = 0; i < s.length / 2; i++) {
            double t = s[i];
            s[i] = s[s.length - 1 - i];
            s[s.length - 1 - i] = t;
        }
        return s;
    }

    private static double sum(double[] a, int from) {
        double s = 0;
        for (int i = from; i < a.length; i++) {
            s += Math.max(0, a[i]);
        }
        return s;
    }
}
