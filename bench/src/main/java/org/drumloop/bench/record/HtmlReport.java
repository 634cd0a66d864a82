package org.drumloop.bench.record;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Expectation;
import org.drumloop.bench.expect.Outcome;
import org.drumloop.core.io.EngUnit;

/**
 * {@code report.html}: one self-contained page (inline CSS and SVG; no scripts, fonts or anything
 * fetched) with the record header (date, build, inputs by hash), the scenario, every expectation
 * and its verdict, key figures, plots with the level limits and tagged alarm/trip markers, the
 * settings in use, the events, the scenario file, the sign-off block and the caution text.
 */
public final class HtmlReport {
    /** The caution printed on every report. */
    public static final String CAUTION = ReportPage.CAUTION;
    /** Events listed in the report (the events file has all). */
    static final int EVENTS_SHOWN = 400;

    private static final int W = 1040;
    private static final int H = 250;
    private static final int ML = 64;
    private static final int MR = 16;
    private static final int MT = 14;
    private static final int MB = 34;
    /** Rows of marker labels above a plot's markers (labels that would overlap go one row down). */
    private static final int MARKER_ROWS = 4;

    private static final String C_BLUE = "#34557a";
    private static final String C_TEAL = "#3f8585";
    private static final String C_OCHRE = "#b0892f";
    private static final String C_RUST = "#a4513a";
    private static final String C_GREY = "#7b8088";
    private static final String C_PLUM = "#6f5a88";

    private HtmlReport() {
    }

    /** One line on a plot. */
    record Series(Channel channel, String color, String label, boolean dashed) {
    }

    /**
     * An alarm or trip on the plots: a vertical marker labelled with its tag.
     *
     * @param tS   when it came on [s]
     * @param tag  LAL, LALL, ...
     * @param trip true for a trip
     */
    record Marker(double tS, String tag, boolean trip) {
    }

    /**
     * Physical limits of a plot's axis in its engineering unit (NaN: none): the axis follows the
     * data but is never drawn beyond what the signal can be (a valve's 0 to 100 %).
     */
    record AxisLimits(double lo, double hi) {
        static final AxisLimits NONE = new AxisLimits(Double.NaN, Double.NaN);
    }

    public static String render(RunSummary r) {
        StringBuilder sb = new StringBuilder(256 * 1024);
        String title = r.scenario().title();
        RunRecord rec = r.record();
        ReportPage.open(sb, title, rec == null ? "" : rec.header().dateText());
        RunSummary.Verdict v = r.verdict();
        sb.append("<header><div class=\"verdict ").append(v.css()).append("\" id=\"verdict\">")
                .append(v.text()).append("</div><h1>").append(Html.esc(title)).append("</h1>\n");
        sb.append("<p class=\"meta\">scenario <code>").append(Html.esc(r.scenario().file()))
                .append("</code> &middot; plant <code>").append(Html.esc(r.plantName()))
                .append("</code> &middot; tuning <code>").append(Html.esc(r.tuningName())).append("</code> &middot; ")
                .append(fmt(r.endS(), 1)).append(" s of plant time &middot; seed ").append(r.scenario().seed());
        if (rec != null) {
            sb.append(" &middot; run ").append(Html.esc(rec.header().utcText()));
        }
        sb.append("</p></header>\n");
        if (!r.scenario().description().isEmpty()) {
            sb.append("<p>").append(Html.esc(r.scenario().description())).append("</p>\n");
        }
        ReportPage.caution(sb);
        if (rec != null) {
            sb.append("<h2>Record</h2>\n");
            rec.header().html(sb);
        }
        if (r.plantInvalid()) {
            sb.append("<p class=\"warn\">The plant left the valid range of its model during this run (see events);"
                    + " figures after that point describe a clamped state.</p>\n");
        }

        // expectations
        sb.append("<h2>Acceptance criteria</h2>\n");
        if (v == RunSummary.Verdict.NO_CRITERIA) {
            sb.append("<p class=\"warn\" id=\"no-criteria\">NO CRITERIA: this scenario states no expectation, so"
                    + " the run proves nothing by itself. Add <code>expect</code> lines before filing it as a test.</p>\n");
        }
        sb.append("<table class=\"expect\" id=\"expectations\"><thead><tr><th>line</th>"
                + "<th>expectation</th><th>result</th><th>measured</th></tr></thead><tbody>\n");
        for (Outcome o : r.outcomes()) {
            sb.append("<tr class=\"expectation ").append(o.passed() ? "pass" : "fail").append("\"><td>")
                    .append(o.line()).append("</td><td><code>").append(Html.esc(o.text())).append("</code></td><td>")
                    .append(o.passed() ? "pass" : "FAIL").append("</td><td>").append(Html.esc(o.measured()))
                    .append("</td></tr>\n");
        }
        if (r.outcomes().isEmpty()) {
            sb.append("<tr><td colspan=\"4\">No expectations in this scenario.</td></tr>\n");
        }
        sb.append("</tbody></table>\n");

        // key figures
        KeyFigures k = r.figures();
        sb.append("<h2>Key figures</h2>\n<table class=\"figures\" id=\"figures\"><tbody>\n");
        row(sb, "largest deviation of the true drum level from setpoint", fmt(k.maxDeviationM() * 1000, 1) + " mm at "
                + fmt(k.maxDeviationAtS(), 1) + " s");
        row(sb, "largest deviation of the indicated level (controller's selected level) from setpoint",
                fmt(k.maxIndicatedDeviationM() * 1000, 1) + " mm at " + fmt(k.maxIndicatedDeviationAtS(), 1) + " s"
                + (Math.abs(k.maxIndicatedDeviationM() - k.maxDeviationM()) > DEVIATIONS_DIFFER_M
                        ? " &mdash; differs from the true level (transmitter range, failure, noise or density compensation)" : ""));
        row(sb, "integral of absolute level error (IAE, true level)", fmt(k.iaeMS() * 1000, 0) + " mm&middot;s");
        row(sb, "feed valve travel", fmt(k.valveTravelFrac() * 100, 1) + " % of stroke");
        double recovery = k.recoveryS();
        row(sb, "recovery after the last action (true level within &plusmn;"
                + fmt(KeyFigures.RECOVERY_BAND_M * 1000, 0) + " mm of setpoint)",
                Double.isNaN(recovery) ? "not recovered by the end" : fmt(recovery, 1) + " s");
        row(sb, "scans", Long.toString(r.scans()));
        row(sb, "events", r.events().size() + (r.soeLost() > 0 ? " (" + r.soeLost() + " SOE events lost)" : ""));
        sb.append("</tbody></table>\n");

        // plots
        List<Marker> markers = new ArrayList<>();
        for (EventRecord e : r.events()) {
            if (e.kind().equals("ALARM") || e.kind().equals("TRIP")) {
                markers.add(new Marker(e.tS(), e.tag(), e.kind().equals("TRIP")));
            }
        }
        AxisLimits percent = new AxisLimits(0, 100);
        AxisLimits nonNegative = new AxisLimits(0, Double.NaN);
        sb.append("<section id=\"trends\"><h2>Trends</h2>\n");
        sb.append("<figure id=\"plot-level\"><figcaption>Drum level relative to normal water level [mm]")
                .append(" &mdash; limits: alarm dashed, trip solid; markers: alarm &#9650; trip &#9632;, with their tag</figcaption>\n");
        plot(sb, r, "level", EngUnit.MM, List.of(
                new Series(Channel.DRUM_LEVEL, C_BLUE, "true level", false),
                new Series(Channel.MEASURED_LEVEL, C_TEAL, "indicated level", false),
                new Series(Channel.SETPOINT, C_GREY, "setpoint", true)), r.limits(), markers, AxisLimits.NONE);
        sb.append("</figure>\n<figure id=\"plot-flow\"><figcaption>Steam and feed flow [t/h]</figcaption>\n");
        plot(sb, r, "flow", EngUnit.T_PER_H, List.of(
                new Series(Channel.STEAM_FLOW, C_RUST, "steam flow", false),
                new Series(Channel.FEED_FLOW, C_BLUE, "feed flow", false),
                new Series(Channel.FEED_FLOW_SETPOINT, C_GREY, "feed flow setpoint", true)), List.of(), markers,
                nonNegative);
        sb.append("</figure>\n<figure id=\"plot-valve\"><figcaption>Feed valve and firing [%]</figcaption>\n");
        plot(sb, r, "valve", EngUnit.PERCENT, List.of(
                new Series(Channel.FEED_VALVE, C_BLUE, "valve position", false),
                new Series(Channel.VALVE_DEMAND, C_GREY, "valve demand", true),
                new Series(Channel.FIRING, C_OCHRE, "firing", false),
                new Series(Channel.STEAM_DEMAND, C_PLUM, "steam demand", true)), List.of(), markers, percent);
        sb.append("</figure>\n<figure id=\"plot-pressure\"><figcaption>Drum pressure [barg]</figcaption>\n");
        plot(sb, r, "pressure", EngUnit.BARG, List.of(
                new Series(Channel.DRUM_PRESSURE, C_RUST, "drum pressure", false)), List.of(), markers, AxisLimits.NONE);
        sb.append("</figure>\n</section>\n");

        if (rec != null) {
            rec.settingsHtml(sb);
        }

        // events
        sb.append("<h2>Events</h2>\n<table class=\"events\" id=\"events\"><thead><tr><th>t [s]</th><th>tag</th>"
                + "<th>kind</th><th>message</th></tr></thead><tbody>\n");
        int n = 0;
        for (EventRecord e : r.events()) {
            if (n++ >= EVENTS_SHOWN) {
                sb.append("<tr><td colspan=\"4\">&hellip; more in events.csv</td></tr>\n");
                break;
            }
            sb.append("<tr class=\"k-").append(Html.esc(e.kind().toLowerCase(Locale.ROOT))).append("\"><td>")
                    .append(fmt(e.tS(), 2)).append("</td><td>").append(Html.esc(e.tag())).append("</td><td>")
                    .append(Html.esc(e.kind())).append("</td><td>").append(Html.esc(e.message())).append("</td></tr>\n");
        }
        sb.append("</tbody></table>\n");

        sb.append("<h2>Scenario file</h2>\n<pre class=\"source\">");
        int ln = 1;
        for (String l : r.scenario().source()) {
            sb.append(String.format(Locale.ROOT, "%3d  ", ln++)).append(Html.esc(l)).append('\n');
        }
        sb.append("</pre>\n");
        ReportPage.signOff(sb);
        ReportPage.close(sb, "drumloop bench record - " + r.scans() + " scans in " + fmt(r.wallS(), 3)
                + " s wall time" + (rec == null ? "" : " - drumloop " + rec.header().build().describe()));
        return sb.toString();
    }

    /** True and indicated largest deviations closer than this are the same figure (one display step). */
    static final double DEVIATIONS_DIFFER_M = 0.0005;

    /**
     * A page with only the title, verdict and the plots of a run (for a picture of the trends, e.g.
     * in the README); same look as the report.
     */
    public static String renderPlots(RunSummary r) {
        String full = render(r);
        int h = full.indexOf("<header>");
        int he = full.indexOf("</header>") + "</header>".length();
        int p = full.indexOf("<section id=\"trends\">");
        int pe = full.indexOf("</section>", p) + "</section>".length();
        return full.substring(0, h) + full.substring(h, he) + full.substring(p, pe) + "</body></html>\n";
    }

    private static void row(StringBuilder sb, String k, String v) {
        sb.append("<tr><th>").append(k).append("</th><td>").append(v).append("</td></tr>\n");
    }

    static void plot(StringBuilder sb, RunSummary r, String id, EngUnit unit, List<Series> series,
                     List<RunSummary.LevelLimit> limits, List<Marker> markers, AxisLimits phys) {
        PlotBuffer p = r.plot();
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (Series s : series) {
            for (int b = 0; b < p.buckets(); b++) {
                if (p.filled(b)) {
                    double a = unit.fromSi(p.min(s.channel(), b));
                    double c = unit.fromSi(p.max(s.channel(), b));
                    if (Double.isFinite(a)) {
                        lo = Math.min(lo, a);
                    }
                    if (Double.isFinite(c)) {
                        hi = Math.max(hi, c);
                    }
                }
            }
        }
        for (RunSummary.LevelLimit l : limits) {
            double v = unit.fromSi(l.levelM());
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        if (!(hi >= lo)) {
            lo = 0;
            hi = 1;
        }
        double dataLo = lo;
        double dataHi = hi;
        if (hi - lo < 1e-9) {
            lo -= 1;
            hi += 1;
        }
        double pad = (hi - lo) * 0.06;
        lo -= pad;
        hi += pad;
        double[] ticks = ticks(lo, hi, 6);
        lo = Math.min(lo, ticks[0]);
        hi = Math.max(hi, ticks[ticks.length - 1]);
        // never beyond what the signal can physically be (data outside would still widen the axis)
        if (dataLo >= phys.lo()) { // false for NaN: no limit
            lo = Math.max(lo, phys.lo());
        }
        if (dataHi <= phys.hi()) {
            hi = Math.min(hi, phys.hi());
        }
        double t1 = p.durationS();
        int pw = W - ML - MR;
        int ph = H - MT - MB;
        sb.append("<svg class=\"plot\" id=\"svg-").append(id).append("\" xmlns=\"http://www.w3.org/2000/svg\" width=\"")
                .append(W).append("\" height=\"").append(H).append("\" viewBox=\"0 0 ").append(W).append(' ').append(H)
                .append("\" role=\"img\">\n");
        sb.append("<rect x=\"").append(ML).append("\" y=\"").append(MT).append("\" width=\"").append(pw)
                .append("\" height=\"").append(ph).append("\" class=\"area\"/>\n");
        for (double t : ticks) {
            if (t < lo - 1e-9 || t > hi + 1e-9) {
                continue;
            }
            double y = MT + ph * (hi - t) / (hi - lo);
            sb.append(String.format(Locale.ROOT,
                    "<line x1=\"%d\" x2=\"%d\" y1=\"%.1f\" y2=\"%.1f\" class=\"grid\"/><text x=\"%d\" y=\"%.1f\" class=\"ylab\">%s</text>%n",
                    ML, ML + pw, y, y, ML - 6, y + 4, trim(t)));
        }
        boolean minutes = t1 > 1800;
        double[] xt = ticks(0, minutes ? t1 / 60 : t1, 10);
        for (double t : xt) {
            double ts = minutes ? t * 60 : t;
            if (ts < 0 || ts > t1 + 1e-9) {
                continue;
            }
            double x = ML + pw * ts / t1;
            sb.append(String.format(Locale.ROOT,
                    "<line x1=\"%.1f\" x2=\"%.1f\" y1=\"%d\" y2=\"%d\" class=\"grid\"/><text x=\"%.1f\" y=\"%d\" class=\"xlab\">%s</text>%n",
                    x, x, MT, MT + ph, x, MT + ph + 16, trim(t)));
        }
        sb.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%d\" class=\"xunit\">%s</text>%n", ML + pw,
                H - 2, minutes ? "t [min]" : "t [s]"));
        for (RunSummary.LevelLimit l : limits) {
            double v = unit.fromSi(l.levelM());
            double y = MT + ph * (hi - v) / (hi - lo);
            sb.append(String.format(Locale.ROOT,
                    "<line x1=\"%d\" x2=\"%d\" y1=\"%.1f\" y2=\"%.1f\" class=\"limit %s\"/><text x=\"%d\" y=\"%.1f\" class=\"limlab\">%s</text>%n",
                    ML, ML + pw, y, y, l.trip() ? "trip" : "alarm", ML + 4, y - 3, Html.esc(l.tag())));
        }
        double[] rowEnd = new double[MARKER_ROWS];
        java.util.Arrays.fill(rowEnd, Double.NEGATIVE_INFINITY);
        for (Marker m : markers) {
            double x = ML + pw * Math.min(m.tS(), t1) / t1;
            String kind = m.trip() ? "trip" : "alarm";
            sb.append(String.format(Locale.ROOT,
                    "<line x1=\"%.1f\" x2=\"%.1f\" y1=\"%d\" y2=\"%d\" class=\"marker %s\"/>", x, x, MT, MT + ph, kind));
            if (m.trip()) {
                sb.append(String.format(Locale.ROOT, "<rect x=\"%.1f\" y=\"%d\" width=\"8\" height=\"8\" class=\"mk-trip\"/>",
                        x - 4, MT - 4));
            } else {
                sb.append(String.format(Locale.ROOT, "<path d=\"M%.1f %d l4 -8 l4 8 z\" class=\"mk-alarm\"/>", x - 4, MT + 4));
            }
            // the tag beside its marker, in the first row where it does not overlap an earlier label
            double width = 6.0 * m.tag().length() + 4;
            int row = 0;
            while (row < MARKER_ROWS - 1 && rowEnd[row] > x) {
                row++;
            }
            boolean left = x + 3 + width > ML + pw;
            rowEnd[row] = x + 3 + width;
            sb.append(String.format(Locale.ROOT, "<text x=\"%.1f\" y=\"%d\" class=\"mklab %s\"%s>%s</text>%n",
                    left ? x - 3 : x + 3, MT + 28 + 11 * row, kind, left ? " text-anchor=\"end\"" : "",
                    Html.esc(m.tag())));
        }
        int legendX = ML + 8;
        for (Series s : series) {
            StringBuilder d = new StringBuilder();
            boolean pen = false;
            for (int b = 0; b < p.buckets(); b++) {
                if (!p.filled(b)) {
                    continue;
                }
                double a = unit.fromSi(p.min(s.channel(), b));
                double c = unit.fromSi(p.max(s.channel(), b));
                if (!Double.isFinite(a) || !Double.isFinite(c)) {
                    pen = false;
                    continue;
                }
                double x = ML + pw * Math.min(p.timeS(b), t1) / t1;
                double ya = MT + ph * (hi - a) / (hi - lo);
                double yc = MT + ph * (hi - c) / (hi - lo);
                FixedFormat.append(d.append(pen ? 'L' : 'M'), x, 1).append(' ');
                FixedFormat.append(d, ya, 1);
                if (Math.abs(ya - yc) > 0.5) {
                    FixedFormat.append(d.append('L'), x, 1).append(' ');
                    FixedFormat.append(d, yc, 1);
                }
                pen = true;
            }
            sb.append("<path d=\"").append(d).append("\" class=\"series").append(s.dashed() ? " dashed" : "")
                    .append("\" stroke=\"").append(s.color()).append("\"><title>").append(Html.esc(s.label()))
                    .append("</title></path>\n");
            sb.append(String.format(Locale.ROOT,
                    "<line x1=\"%d\" x2=\"%d\" y1=\"%d\" y2=\"%d\" stroke=\"%s\" class=\"series%s\"/><text x=\"%d\" y=\"%d\" class=\"legend\">%s</text>%n",
                    legendX, legendX + 18, MT + 14, MT + 14, s.color(), s.dashed() ? " dashed" : "", legendX + 22,
                    MT + 18, Html.esc(s.label())));
            legendX += 40 + 7 * s.label().length();
        }
        sb.append("</svg>\n");
    }

    /** "Nice" tick values (1, 2, 5 × 10^k) covering lo..hi with about n steps. */
    static double[] ticks(double lo, double hi, int n) {
        double span = hi - lo;
        double raw = span / n;
        double mag = Math.pow(10, Math.floor(Math.log10(raw)));
        double step = mag;
        for (double m : new double[] {1, 2, 5, 10}) {
            if (m * mag >= raw) {
                step = m * mag;
                break;
            }
        }
        double first = Math.floor(lo / step) * step;
        double last = Math.ceil(hi / step) * step;
        int count = (int) Math.round((last - first) / step) + 1;
        double[] t = new double[count];
        for (int i = 0; i < count; i++) {
            t[i] = first + i * step;
        }
        return t;
    }

    static String trim(double v) {
        if (Math.abs(v - Math.rint(v)) < 1e-9) {
            return Long.toString(Math.round(v));
        }
        String s = String.format(Locale.ROOT, "%.3f", v);
        s = s.replaceAll("0+$", "");
        return s.endsWith(".") ? s.substring(0, s.length() - 1) : s;
    }

    static String fmt(double v, int d) {
        return Double.isNaN(v) ? "n/a" : Expectation.fmt(v, d);
    }
}
