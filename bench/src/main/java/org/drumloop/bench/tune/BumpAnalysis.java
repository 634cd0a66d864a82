package org.drumloop.bench.tune;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Finds the bump tests in recorded trends and fits them. A trend serves every fit whose input moved
 * while the other input stayed put:
 * <ul>
 * <li>the feed valve (demand, else position) moved: valve to feed flow, first order plus delay;</li>
 * <li>the feed flow moved and the steam flow did not: feed flow to level, integrator with lag and
 *     delay (the recorded feed flow is the input, whatever moved it);</li>
 * <li>the steam flow moved and the feed flow did not: steam flow to level, the same structure (the swell).</li>
 * </ul>
 * An input "moved" when it changed by more than {@value #MOVED_FRAC} of its starting value (or of
 * the other flow, for a flow starting at zero); "stayed put" when it changed by less than a tenth of that.
 */
public final class BumpAnalysis {
    /** Relative change that counts as a bump. */
    static final double MOVED_FRAC = 0.02;
    /** Relative RMS improvement a second lag term must bring to be kept. */
    static final double SECOND_LAG_GAIN = 0.3;
    /** Smallest valve move that counts as a bump, fraction of travel. */
    static final double VALVE_MOVED = 0.01;

    /** Fits found and what was skipped. */
    public record Result(TuningDesign.Fits fits, List<String> notes) { }

    private BumpAnalysis() {
    }

    /** Fits the three simulated bump tests of {@link PlantBumps}, each to the loop it was run for. */
    public static TuningDesign.Fits fitPlantBumps(Trend valveBump, Trend feedBump, Trend steamBump) {
        return new TuningDesign.Fits(
                Identification.fit(valveBump.file() + ": valve -> feed flow", StepModel.Kind.FOPDT, valveBump.tS(),
                        valveBump.get(TrendSignal.VALVE_DEMAND), valveBump.get(TrendSignal.FEED_FLOW)),
                level(feedBump.file() + ": feed flow -> level", feedBump.tS(), feedBump.get(TrendSignal.FEED_FLOW),
                        feedBump.get(TrendSignal.DRUM_LEVEL)),
                swell(steamBump));
    }

    /** Classifies recorded trends and fits what each holds. */
    public static Result analyse(List<Trend> trends) {
        BumpFit valve = null;
        BumpFit feed = null;
        BumpFit steam = null;
        List<String> notes = new ArrayList<>();
        for (Trend t : trends) {
            double[] valveU = t.has(TrendSignal.VALVE_DEMAND) ? t.get(TrendSignal.VALVE_DEMAND)
                    : t.has(TrendSignal.FEED_VALVE) ? t.get(TrendSignal.FEED_VALVE) : null;
            double[] qf = t.has(TrendSignal.FEED_FLOW) ? t.get(TrendSignal.FEED_FLOW) : null;
            double[] qs = t.has(TrendSignal.STEAM_FLOW) ? t.get(TrendSignal.STEAM_FLOW) : null;
            double[] level = t.has(TrendSignal.DRUM_LEVEL) ? t.get(TrendSignal.DRUM_LEVEL) : null;
            double scale = Math.max(qf == null ? 0 : Math.abs(qf[0]), qs == null ? 0 : Math.abs(qs[0]));
            boolean valveMoved = valveU != null && range(valveU) > VALVE_MOVED;
            boolean feedMoved = qf != null && range(qf) > MOVED_FRAC * scale;
            boolean steamMoved = qs != null && range(qs) > MOVED_FRAC * scale;
            boolean feedStill = qf == null || range(qf) < 0.1 * MOVED_FRAC * scale;
            boolean steamStill = qs == null || range(qs) < 0.1 * MOVED_FRAC * scale;
            boolean used = false;
            if (valveMoved && qf != null) {
                valve = better(valve, Identification.fit(t.file() + ": valve -> feed flow", StepModel.Kind.FOPDT,
                        t.tS(), valveU, qf));
                used = true;
            }
            if (level != null && feedMoved && steamStill) {
                feed = better(feed, level(t.file() + ": feed flow -> level", t.tS(), qf, level));
                used = true;
            }
            if (level != null && steamMoved && feedStill) {
                steam = better(steam, swell(t));
                used = true;
            }
            if (level != null && feedMoved && steamMoved) {
                notes.add(t.file() + ": feed and steam flow both moved; the level fits need one of them held");
            }
            if (!used) {
                notes.add(String.format(Locale.ROOT, "%s: no usable bump (valve moved %b, feed moved %b, steam moved %b)",
                        t.file(), valveMoved, feedMoved, steamMoved));
            }
        }
        return new Result(new TuningDesign.Fits(valve, feed, steam), notes);
    }

    /** The swell: steam flow to level. */
    static BumpFit swell(Trend t) {
        return level(t.file() + ": steam flow -> level", t.tS(), t.get(TrendSignal.STEAM_FLOW), t.get(TrendSignal.DRUM_LEVEL));
    }

    /**
     * A level response: an integrator with one lag term, or with two when the second term lowers the
     * RMS error by more than {@value #SECOND_LAG_GAIN} (the pressure control's share of the response);
     * the two lags are returned fast first.
     */
    static BumpFit level(String title, double[] tS, double[] u, double[] y) {
        BumpFit one = Identification.fit(title, StepModel.Kind.INTEGRATOR_LAG, tS, u, y);
        BumpFit two;
        try {
            // from the one-lag optimum, with a slow second term of either sign and a few time constants
            double[] q = one.p();
            java.util.List<double[]> starts = new java.util.ArrayList<>();
            for (double f : new double[] {3, 10, 30}) {
                for (double sign : new double[] {-0.3, 0.3, -1}) {
                    // -1: a transient that dies away again (swell that the pressure control takes back)
                    starts.add(new double[] {q[0], q[1], q[2], sign * q[1], f * q[2], q[3], q[4]});
                }
            }
            two = Identification.fit(title, StepModel.Kind.INTEGRATOR_TWO_LAGS, tS, u, y, starts);
        } catch (IllegalArgumentException e) {
            return one;
        }
        if (!(two.rms() < (1 - SECOND_LAG_GAIN) * one.rms())) {
            return one;
        }
        if (two.p()[2] <= two.p()[4]) {
            return two;
        }
        double[] p = two.p().clone();
        double[] se = two.stdErr().clone();
        swap(p, 1, 3);
        swap(p, 2, 4);
        swap(se, 1, 3);
        swap(se, 2, 4);
        return new BumpFit(two.title(), two.kind(), p, se, two.rms(), two.fitPercent(), two.iterations(), two.tS(),
                two.u(), two.y(), two.yHat());
    }

    private static void swap(double[] a, int i, int j) {
        double t = a[i];
        a[i] = a[j];
        a[j] = t;
    }

    /**
     * Of two fits of the same loop, the one on the longer record (a level response needs time to
     * show its integrating part), else the better normalised fit.
     */
    private static BumpFit better(BumpFit a, BumpFit b) {
        if (a == null) {
            return b;
        }
        double da = a.tS()[a.tS().length - 1] - a.tS()[0];
        double db = b.tS()[b.tS().length - 1] - b.tS()[0];
        if (Math.abs(da - db) > 0.1 * Math.max(da, db)) {
            return db > da ? b : a;
        }
        return b.fitPercent() > a.fitPercent() ? b : a;
    }

    private static double range(double[] v) {
        double lo = v[0];
        double hi = v[0];
        for (double x : v) {
            lo = Math.min(lo, x);
            hi = Math.max(hi, x);
        }
        return hi - lo;
    }
}
