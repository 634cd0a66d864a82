package org.drumloop.bench.tune;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;

import org.drumloop.core.control.PidParams;

/**
 * From fitted bump tests to PI settings by the SIMC rules ({@link Simc}), in cascade order: the
 * feed-flow slave first, then the level master against the closed slave, whose response SIMC makes
 * {@code e^(-theta s)/(tauC s + 1)}; the single-element loop against valve, flow and level in
 * series; the swell compensation from the non-minimum-phase integrator fitted to the steam step.
 *
 * <p>Effective delays: the fitted delay, the inverse-response time of the level (the right-half-plane
 * zero), half the largest neglected lag and every other lag in full (the half rule), plus half the
 * controller's scan period.
 *
 * <p>Swell compensation ({@code swell = K tau s/(tau s + 1) q_steam}): the washout is matched to the
 * part of the fitted swell that dies away. The swell is the level's response to a unit steam step
 * less its integrating part (the lag terms of the fit); with its final value {@code s_inf} (the
 * level a steadily higher load keeps at constant water inventory, which the master must correct
 * anyway) {@code K} is the peak above {@code max(s_inf, 0)} and {@code K tau} the area above it over
 * the record, so the compensation holds back as many level-seconds as the passing swell puts in.
 */
public final class TuningDesign {
    /** The loops {@code --loops} can name. */
    public enum Loop {
        SLAVE("slave"), MASTER("master"), SINGLE("single"), SWELL("swell");

        private final String word;

        Loop(String word) {
            this.word = word;
        }

        public String word() { return word; }

        public static Loop byWord(String w) {
            for (Loop l : values()) {
                if (l.word.equalsIgnoreCase(w.strip())) {
                    return l;
                }
            }
            return null;
        }
    }

    /** The fitted records: valve -> feed flow (FOPDT), feed flow -> level, steam flow -> level; each may be null. */
    public record Fits(BumpFit valve, BumpFit feed, BumpFit steam) { }

    /** Closed-loop time constants asked for; NaN = the SIMC default tauC = theta. */
    public record TauC(double slaveS, double masterS, double singleS) {
        public static TauC defaults() { return new TauC(Double.NaN, Double.NaN, Double.NaN); }
    }

    /**
     * One tuned PI loop.
     *
     * @param model  the reduced model the rule was applied to: gain (or slope for an integrating model),
     *               tau1 (infinite when integrating) and effective delay, SI
     * @param tauCS  closed-loop time constant used [s]
     * @param pi     settings: Kc in the loop's SI units (valve fraction per kg/s, kg/s per m, valve fraction per m)
     * @param basis  how the model was reduced, in words
     */
    public record LoopTuning(Loop loop, Simc.Fopdt model, double tauCS, Simc.Pi pi, String basis) {
        public boolean integrating() { return Double.isInfinite(model.tau1S()); }
    }

    /** Swell compensation: gain [m per kg/s] and washout time constant [s]. */
    public record SwellTuning(double gainMPerKgS, double tauS, String basis) { }

    /** Everything designed; a loop not asked for or without data is null, with a note saying why. */
    public record Design(LoopTuning slave, LoopTuning master, LoopTuning single, SwellTuning swell, List<String> notes) { }

    private TuningDesign() {
    }

    /**
     * @param fits   the fitted bump tests
     * @param scanS  the controller's scan period [s]
     * @param tauC   closed-loop time constants asked for
     * @param loops  loops to tune
     * @param baseSlave the base file's slave settings (for the closed slave when the slave is not retuned)
     */
    public static Design design(Fits fits, double scanS, TauC tauC, Set<Loop> loops, PidParams baseSlave) {
        List<String> notes = new ArrayList<>();
        double halfScan = scanS / 2;
        LoopTuning slave = null;
        if (loops.contains(Loop.SLAVE)) {
            if (fits.valve() == null) {
                notes.add("slave: no valve bump in the data; kept the base settings");
            } else {
                BumpFit v = fits.valve();
                double k = v.get("k");
                requirePositive(k, "valve -> feed flow gain");
                double theta = v.get("theta") + halfScan;
                double tc = pick(tauC.slaveS(), theta);
                slave = new LoopTuning(Loop.SLAVE, new Simc.Fopdt(k, v.get("tau1"), theta), tc,
                        Simc.fopdt(k, v.get("tau1"), theta, tc), "FOPDT fit; delay + scan/2");
            }
        }
        // the closed slave as the master sees it: e^(-theta s)/(tauC s + 1)
        double slaveLagS = 0;
        double slaveDelayS = 0;
        if (slave != null) {
            slaveLagS = slave.tauCS();
            slaveDelayS = slave.model().thetaS();
        } else if (fits.valve() != null) {
            BumpFit v = fits.valve();
            slaveDelayS = v.get("theta") + halfScan;
            // the tauC that SIMC would have needed to give the base gain
            slaveLagS = Math.max(0, v.get("tau1") / (v.get("k") * baseSlave.kc()) - slaveDelayS);
        } else {
            notes.add("master: no valve bump; the closed slave is taken as instantaneous");
        }
        LoopTuning master = null;
        LoopTuning single = null;
        if (fits.feed() == null) {
            if (loops.contains(Loop.MASTER) || loops.contains(Loop.SINGLE)) {
                notes.add("master, single: no feed-flow bump in the data; kept the base settings");
            }
        } else {
            Level lv = Level.of(fits.feed());
            requirePositive(lv.kI, "feed flow -> level slope");
            if (loops.contains(Loop.MASTER)) {
                Simc.Fopdt m = Simc.halfRuleIntegrating(lv.kI, lv.theta + slaveDelayS + halfScan,
                        lv.lagsWith(slaveLagS), new double[] {lv.inverse});
                double tc = pick(tauC.masterS(), m.thetaS());
                master = new LoopTuning(Loop.MASTER, m, tc, Simc.integrating(m.k(), m.thetaS(), tc), String.format(
                        Locale.ROOT, "integrator with inverse response (RHP zero) %.4g s and lags %s s; closed slave"
                                + " lag %.4g s, delay %.4g s; half rule + scan/2", lv.inverse, lagText(lv.lags),
                        slaveLagS, slaveDelayS));
            }
            if (loops.contains(Loop.SINGLE)) {
                if (fits.valve() == null) {
                    notes.add("single: no valve bump in the data; kept the base settings");
                } else {
                    BumpFit v = fits.valve();
                    double kv = v.get("k");
                    Simc.Fopdt s = Simc.halfRuleIntegrating(lv.kI * kv, lv.theta + v.get("theta") + halfScan,
                            lv.lagsWith(v.get("tau1")), new double[] {lv.inverse});
                    double tc = pick(tauC.singleS(), s.thetaS());
                    single = new LoopTuning(Loop.SINGLE, s, tc, Simc.integrating(s.k(), s.thetaS(), tc),
                            "valve FOPDT in series with the level model; half rule + scan/2");
                }
            }
            if (lv.note != null) {
                notes.add(lv.note);
            }
        }
        SwellTuning swell = null;
        if (loops.contains(Loop.SWELL)) {
            if (fits.steam() == null) {
                notes.add("swell: no steam-flow bump in the data; kept the base settings");
            } else {
                BumpFit s = fits.steam();
                double[] peakArea = swellPeakArea(s);
                if (!(peakArea[0] > 0) || !(s.get("kI") < 0)) {
                    notes.add(String.format(Locale.ROOT, "swell: the steam step shows no passing swell (level slope %.4g,"
                            + " passing swell %.4g m per kg/s); kept the base settings", s.get("kI"), peakArea[0]));
                } else {
                    double tau = peakArea[1] / peakArea[0];
                    swell = new SwellTuning(peakArea[0], tau, String.format(Locale.ROOT,
                            "washout matched to the passing part of the fitted swell: height %.4g m/(kg/s), area"
                                    + " %.4g m s/(kg/s), lasting swell %.4g m/(kg/s) left to the master", peakArea[0],
                            peakArea[1], peakArea[2]));
                }
            }
        }
        return new Design(slave, master, single, swell, notes);
    }

    /**
     * The level-on-feed fit read as an integrator {@code kI N(s) / (s (tau s + 1) (tau2 s + 1))}: the
     * zeros of {@code N} in the right half plane are inverse-response times (added to the delay); a
     * zero in the left half plane {@code (T0 s + 1)} is cancelled against the lag nearest in size,
     * leaving {@code max(0, lag - T0)} (a rough reading of the paper's rules for such zeros).
     */
    record Level(double kI, double[] lags, double inverse, double theta, String note) {
        static Level of(BumpFit f) {
            double kI = f.get("kI");
            boolean two = f.kind() == StepModel.Kind.INTEGRATOR_TWO_LAGS;
            double tau = f.get("tau");
            double kL = f.get("kL");
            double tau2 = two ? f.get("tau2") : 0;
            double kL2 = two ? f.get("kL2") : 0;
            // N(s) = 1 + a1 s + a2 s^2
            double a1 = tau + tau2 + (kL + kL2) / kI;
            double a2 = tau * tau2 + (kL * tau2 + kL2 * tau) / kI;
            double[] lags = two ? new double[] {tau, tau2} : new double[] {tau};
            double inverse = 0;
            StringBuilder note = new StringBuilder();
            double[] zeros; // real zero times T: N has a factor (1 - T s); T > 0 is an inverse response
            if (Math.abs(a2) < 1e-12 * Math.max(1, a1 * a1)) {
                zeros = new double[] {-a1};
            } else {
                double disc = a1 * a1 - 4 * a2;
                if (disc < 0) {
                    // complex pair: its share of a1 is the inverse response when a1 < 0
                    zeros = new double[] {-a1};
                } else {
                    double r1 = (-a1 + Math.sqrt(disc)) / (2 * a2);
                    double r2 = (-a1 - Math.sqrt(disc)) / (2 * a2);
                    zeros = new double[] {1 / r1, 1 / r2};
                }
            }
            for (double t : zeros) {
                if (t > 0) {
                    inverse += t;
                } else if (t < 0) {
                    int near = 0;
                    for (int i = 1; i < lags.length; i++) {
                        if (Math.abs(lags[i] + t) < Math.abs(lags[near] + t)) {
                            near = i;
                        }
                    }
                    note.append(String.format(Locale.ROOT, " LHP zero %.4g s cancelled against the %.4g s lag;", -t, lags[near]));
                    lags[near] = Math.max(0, lags[near] + t);
                }
            }
            return new Level(kI, lags, inverse, f.get("theta"), note.length() == 0 ? null : "level model:" + note);
        }

        double[] lagsWith(double extra) {
            double[] l = java.util.Arrays.copyOf(lags, lags.length + 1);
            l[lags.length] = extra;
            return l;
        }
    }

    /**
     * The passing swell: height above the lasting part [m per kg/s], area above it [m s per kg/s]
     * over the fitted record's length, and the lasting part {@code s_inf} itself, from the fitted
     * model's lag terms' response to a unit step.
     */
    static double[] swellPeakArea(BumpFit f) {
        boolean two = f.kind() == StepModel.Kind.INTEGRATOR_TWO_LAGS;
        double kL = f.get("kL");
        double tau = f.get("tau");
        double kL2 = two ? f.get("kL2") : 0;
        double tau2 = two ? f.get("tau2") : 1;
        double span = f.tS()[f.tS().length - 1] - f.tS()[0];
        int n = 20_000;
        double h = span / n;
        double lasting = kL + kL2;
        double floor = Math.max(0, lasting);
        double peak = 0;
        double area = 0;
        for (int i = 0; i <= n; i++) {
            double t = i * h;
            double v = kL * (1 - Math.exp(-t / tau)) + kL2 * (1 - Math.exp(-t / tau2)) - floor;
            peak = Math.max(peak, v);
            area += Math.max(0, v) * (i == 0 || i == n ? h / 2 : h);
        }
        return new double[] {peak, area, lasting};
    }

    private static String lagText(double[] lags) {
        StringBuilder sb = new StringBuilder();
        for (double l : lags) {
            sb.append(sb.length() == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.4g", l));
        }
        return sb.toString();
    }

    private static double pick(double asked, double theta) {
        return Double.isNaN(asked) ? theta : asked;
    }

    private static void requirePositive(double v, String what) {
        if (!(v > 0)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "%s is %.4g: a positive value was expected (is the input or output column the right one?)", what, v));
        }
    }
}
