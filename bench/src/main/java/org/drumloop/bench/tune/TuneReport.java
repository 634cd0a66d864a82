package org.drumloop.bench.tune;

import java.util.List;
import java.util.Locale;

import org.drumloop.bench.record.Html;
import org.drumloop.bench.record.RecordHeader;
import org.drumloop.bench.record.ReportPage;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.core.io.EngUnit;

/**
 * {@code tune-report.html}: the record header, the data, each fit overlaid on its record, the design
 * and the verification, in the frame every drumloop record shares ({@link ReportPage}).
 */
public final class TuneReport {
    private TuneReport() {
    }

    /** What the report shows. */
    public record Content(String source, List<String> sources, List<BumpFit> fits, TuningDesign.Design design,
                          String baseTuning, List<String> analysisNotes, Verification.Result verification,
                          String verificationNote, List<String> written) { }

    public static String render(Content c, RecordHeader h) {
        StringBuilder sb = new StringBuilder();
        ReportPage.open(sb, h.title(), h.dateText());
        sb.append("<header><h1>").append(Html.esc(h.title())).append("</h1></header>\n");
        caution(sb, "Tuned settings are a starting point: confirm them on the plant, step by step, with the"
                + " boiler maker's limits and under the site's permit to work.");
        h.html(sb);
        sb.append("<h2>Data</h2>\n<ul>\n");
        for (String s : c.sources()) {
            sb.append("<li>").append(Html.esc(s)).append("</li>\n");
        }
        sb.append("<li>base tuning: ").append(Html.esc(c.baseTuning())).append("</li>\n</ul>\n");
        sb.append("<h2>Fits</h2>\n<p>Least squares on the simulated response (Levenberg–Marquardt); standard errors"
                + " from the covariance at the optimum scaled by the residual variance (optimistic when the residuals"
                + " are correlated, as model-structure error makes them). Values in SI (s, m, kg/s, valve fraction)."
                + "</p>\n");
        for (BumpFit f : c.fits()) {
            fit(sb, f);
        }
        for (String n : c.analysisNotes()) {
            sb.append("<p class=\"note\">").append(Html.esc(n)).append("</p>\n");
        }
        design(sb, c.design());
        sb.append("<h2>Verification</h2>\n");
        if (c.verification() == null || c.verification().rows().isEmpty()) {
            sb.append("<p>").append(Html.esc(c.verificationNote())).append("</p>\n");
        } else {
            verification(sb, c.verification());
        }
        sb.append("<h2>Files</h2>\n<ul>\n");
        for (String w : c.written()) {
            sb.append("<li>").append(Html.esc(w)).append("</li>\n");
        }
        sb.append("</ul>\n");
        ReportPage.signOff(sb);
        ReportPage.close(sb, "drumloop tuning record - drumloop " + h.build().describe());
        return sb.toString();
    }

    /** The shared caution and what is particular to this record. */
    static void caution(StringBuilder sb, String extra) {
        ReportPage.caution(sb);
        sb.append("<p class=\"note\">").append(Html.esc(extra)).append("</p>\n");
    }

    private static void fit(StringBuilder sb, BumpFit f) {
        sb.append("<h3>").append(Html.esc(f.title())).append("</h3>\n");
        sb.append("<p>Model: ").append(Html.esc(modelText(f.kind()))).append(String.format(Locale.ROOT,
                "; RMS error %.4g (SI); fit %.2f %%; %d iterations.</p>\n", f.rms(), f.fitPercent(), f.iterations()));
        sb.append("<table><tr><th class=\"l\">parameter</th><th>value</th><th>std. error</th><th>rel.</th></tr>\n");
        String[] n = f.kind().names();
        for (int i = 0; i < n.length; i++) {
            sb.append(String.format(Locale.ROOT, "<tr><td class=\"l\">%s</td><td>%.6g</td><td>%.3g</td><td>%s</td></tr>%n",
                    n[i], f.p()[i], f.stdErr()[i], f.p()[i] == 0 ? "" : String.format(Locale.ROOT, "%.2g %%",
                            100 * f.stdErr()[i] / Math.abs(f.p()[i]))));
        }
        sb.append("</table>\n");
        boolean level = f.kind() != StepModel.Kind.FOPDT;
        EngUnit u = level ? EngUnit.MM : EngUnit.T_PER_H;
        double[] y = new double[f.y().length];
        double[] yh = new double[y.length];
        for (int i = 0; i < y.length; i++) {
            y[i] = u.fromSi(f.y()[i]);
            yh[i] = u.fromSi(f.yHat()[i]);
        }
        sb.append(SvgChart.render(f.tS(), new double[][] {y, yh}, new String[] {"recorded", "model"},
                (level ? "drum level" : "feed flow") + " [" + u.symbol() + "]"));
    }

    static String modelText(StepModel.Kind k) {
        switch (k) {
            case FOPDT: return "first order plus dead time, k e^(-theta s)/(tau1 s + 1)";
            case INTEGRATOR_LAG: return "integrator with a lag term, (kI/s + kL/(tau s + 1)) e^(-theta s)";
            default: return "integrator with two lag terms, (kI/s + kL/(tau s + 1) + kL2/(tau2 s + 1)) e^(-theta s)";
        }
    }

    private static void design(StringBuilder sb, TuningDesign.Design d) {
        sb.append("<h2>Settings (SIMC, Skogestad 2003)</h2>\n<p>First order plus delay: Kc = tau1/(k (tauC + theta)),"
                + " tauI = min(tau1, 4 (tauC + theta)); integrating plus delay: Kc = 1/(k' (tauC + theta)),"
                + " tauI = 4 (tauC + theta); default tauC = theta. Cascade: slave first, master against the closed slave."
                + "</p>\n<table><tr><th class=\"l\">loop</th><th>k or k'</th><th>tau1 [s]</th><th>theta [s]</th>"
                + "<th>tauC [s]</th><th>gain</th><th>integral time [s]</th><th class=\"l\">model reduction</th></tr>\n");
        row(sb, d.slave(), TuningFileWriter.PERCENT_PER_TPH, "%/(t/h)");
        row(sb, d.master(), TuningFileWriter.TPH_PER_MM, "(t/h)/mm");
        row(sb, d.single(), TuningFileWriter.PERCENT_PER_MM, "%/mm");
        sb.append("</table>\n");
        if (d.swell() != null) {
            sb.append(String.format(Locale.ROOT, "<p>Swell compensation: gain %.4g mm/(t/h), time constant %.4g s (%s).</p>%n",
                    d.swell().gainMPerKgS() / TuningFileWriter.MM_PER_TPH, d.swell().tauS(), Html.esc(d.swell().basis())));
        }
        for (String n : d.notes()) {
            sb.append("<p class=\"note\">").append(Html.esc(n)).append("</p>\n");
        }
    }

    private static void row(StringBuilder sb, TuningDesign.LoopTuning l, double unitSi, String unit) {
        if (l == null) {
            return;
        }
        sb.append(String.format(Locale.ROOT, "<tr><td class=\"l\">%s</td><td>%.4g</td><td>%s</td><td>%.4g</td><td>%.4g</td>"
                + "<td>%.4g %s</td><td>%.4g</td><td class=\"l\">%s</td></tr>%n", l.loop().word(), l.model().k(),
                l.integrating() ? "integrating" : String.format(Locale.ROOT, "%.4g", l.model().tau1S()),
                l.model().thetaS(), l.tauCS(), l.pi().kc() / unitSi, Html.esc(unit), l.pi().tiS(), Html.esc(l.basis())));
    }

    private static void verification(StringBuilder sb, Verification.Result v) {
        sb.append(String.format(Locale.ROOT, "<p>Scenarios passed: base %d of %d, tuned %d of %d.</p>%n", v.basePassed(),
                v.rows().size(), v.tunedPassed(), v.rows().size()));
        sb.append("<table><tr><th class=\"l\" rowspan=\"2\">scenario</th><th colspan=\"4\">base</th><th colspan=\"4\">tuned"
                + "</th></tr>\n<tr><th>result</th><th>max dev [mm]</th><th>IAE [mm s]</th><th>valve travel [%]</th>"
                + "<th>result</th><th>max dev [mm]</th><th>IAE [mm s]</th><th>valve travel [%]</th></tr>\n");
        for (Verification.Row r : v.rows()) {
            sb.append("<tr><td class=\"l\">").append(Html.esc(r.scenario().name())).append("</td>");
            cells(sb, r.base());
            cells(sb, r.tuned());
            sb.append("</tr>\n");
        }
        sb.append("</table>\n");
    }

    private static void cells(StringBuilder sb, RunSummary s) {
        sb.append(String.format(Locale.ROOT, "<td class=\"%s\">%s</td><td>%.1f</td><td>%.0f</td><td>%.1f</td>",
                s.passed() ? "pass" : "fail", s.passed() ? "PASS" : "FAIL", s.figures().maxDeviationM() * 1000,
                s.figures().iaeMS() * 1000, s.figures().valveTravelFrac() * 100));
    }
}
