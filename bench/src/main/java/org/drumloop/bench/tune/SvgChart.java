package org.drumloop.bench.tune;

import java.util.Locale;

import org.drumloop.bench.record.Html;

/**
 * A small self-contained SVG line chart for the fit reports: recorded data against the model, over
 * time, with labelled axes. At most {@value #MAX_POINTS} points per series are drawn (evenly thinned).
 */
final class SvgChart {
    static final int MAX_POINTS = 1500;
    private static final int W = 860;
    private static final int H = 240;
    private static final int ML = 70;
    private static final int MR = 14;
    private static final int MT = 12;
    private static final int MB = 36;
    private static final String[] COLOURS = {"#7b8088", "#a4513a", "#34557a", "#3f8585"};

    private SvgChart() {
    }

    /**
     * @param t      time [s]
     * @param series values in display units, one array per series
     * @param labels legend text per series
     * @param yLabel the y axis's quantity and unit
     */
    static String render(double[] t, double[][] series, String[] labels, String yLabel) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double[] s : series) {
            for (double v : s) {
                if (Double.isFinite(v)) {
                    lo = Math.min(lo, v);
                    hi = Math.max(hi, v);
                }
            }
        }
        if (!(hi > lo)) {
            hi = lo + 1;
            lo = lo - 1;
        }
        double pad = 0.05 * (hi - lo);
        lo -= pad;
        hi += pad;
        double t0 = t[0];
        double t1 = t[t.length - 1];
        int pw = W - ML - MR;
        int ph = H - MT - MB;
        StringBuilder sb = new StringBuilder();
        sb.append("<svg class=\"plot\" xmlns=\"http://www.w3.org/2000/svg\" width=\"").append(W).append("\" height=\"")
                .append(H).append("\" viewBox=\"0 0 ").append(W).append(' ').append(H).append("\">\n");
        sb.append("<rect x=\"").append(ML).append("\" y=\"").append(MT).append("\" width=\"").append(pw)
                .append("\" height=\"").append(ph).append("\" fill=\"#fff\" stroke=\"#ccc\"/>\n");
        for (double y : ticks(lo, hi)) {
            double py = MT + ph * (hi - y) / (hi - lo);
            sb.append(String.format(Locale.ROOT, "<line x1=\"%d\" x2=\"%d\" y1=\"%.1f\" y2=\"%.1f\" stroke=\"#eee\"/>"
                    + "<text x=\"%d\" y=\"%.1f\" font-size=\"11\" text-anchor=\"end\">%s</text>\n",
                    ML, ML + pw, py, py, ML - 4, py + 4, label(y)));
        }
        for (double x : ticks(t0, t1)) {
            double px = ML + pw * (x - t0) / (t1 - t0);
            sb.append(String.format(Locale.ROOT, "<line x1=\"%.1f\" x2=\"%.1f\" y1=\"%d\" y2=\"%d\" stroke=\"#eee\"/>"
                    + "<text x=\"%.1f\" y=\"%d\" font-size=\"11\" text-anchor=\"middle\">%s</text>\n",
                    px, px, MT, MT + ph, px, MT + ph + 14, label(x)));
        }
        sb.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%d\" font-size=\"11\" text-anchor=\"end\">t [s]</text>\n",
                ML + pw, H - 4));
        sb.append(String.format(Locale.ROOT, "<text x=\"12\" y=\"%d\" font-size=\"11\" transform=\"rotate(-90 12 %d)\""
                + " text-anchor=\"middle\">%s</text>\n", MT + ph / 2, MT + ph / 2, Html.esc(yLabel)));
        int every = Math.max(1, t.length / MAX_POINTS);
        for (int s = 0; s < series.length; s++) {
            sb.append("<polyline fill=\"none\" stroke=\"").append(COLOURS[s % COLOURS.length])
                    .append("\" stroke-width=\"").append(s == 0 ? "2.2" : "1.5").append("\"")
                    .append(s == 0 ? " opacity=\"0.7\"" : "").append(" points=\"");
            for (int i = 0; i < t.length; i += every) {
                double px = ML + pw * (t[i] - t0) / (t1 - t0);
                double py = MT + ph * (hi - series[s][i]) / (hi - lo);
                sb.append(String.format(Locale.ROOT, "%.1f,%.1f ", px, py));
            }
            sb.append("\"/>\n");
            sb.append(String.format(Locale.ROOT, "<rect x=\"%d\" y=\"%d\" width=\"14\" height=\"3\" fill=\"%s\"/>"
                    + "<text x=\"%d\" y=\"%d\" font-size=\"11\">%s</text>\n", ML + 10 + 200 * s, MT + 8,
                    COLOURS[s % COLOURS.length], ML + 28 + 200 * s, MT + 12, Html.esc(labels[s])));
        }
        sb.append("</svg>\n");
        return sb.toString();
    }

    /** About five round tick values between lo and hi. */
    static double[] ticks(double lo, double hi) {
        double raw = (hi - lo) / 5;
        double mag = Math.pow(10, Math.floor(Math.log10(raw)));
        double step = raw / mag < 1.5 ? mag : raw / mag < 3.5 ? 2 * mag : raw / mag < 7.5 ? 5 * mag : 10 * mag;
        double first = Math.ceil(lo / step) * step;
        int n = (int) Math.floor((hi - first) / step) + 1;
        double[] t = new double[Math.max(0, n)];
        for (int i = 0; i < t.length; i++) {
            t[i] = first + i * step;
        }
        return t;
    }

    private static String label(double v) {
        return KeyLines.number(Math.abs(v) < 1e-12 ? 0 : v, 4);
    }
}
