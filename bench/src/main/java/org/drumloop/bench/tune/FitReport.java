package org.drumloop.bench.tune;

import java.util.Locale;

import org.drumloop.bench.record.Html;
import org.drumloop.bench.record.RecordHeader;
import org.drumloop.bench.record.ReportPage;
import org.drumloop.core.io.EngUnit;

/**
 * The fit-plant report: record header, the fitted values and the simulated level and pressure over
 * the recorded ones, in the frame every drumloop record shares ({@link ReportPage}).
 */
public final class FitReport {
    private FitReport() {
    }

    public static String render(RecordHeader h, String startFile, String fittedFile,
                                PlantFit.Result r, double[] tS, double[] recordedPressurePa, double wallS) {
        StringBuilder sb = new StringBuilder();
        ReportPage.open(sb, h.title(), h.dateText());
        sb.append("<header><h1>").append(Html.esc(h.title())).append("</h1></header>\n");
        TuneReport.caution(sb, "A fitted plant model reproduces the record it was fitted to; confirm it on another"
                + " record before tests rely on it.");
        h.html(sb);
        sb.append("<p>Fitted file ").append(Html.esc(fittedFile)).append(" (the start file ").append(Html.esc(startFile))
                .append(" with the fitted lines changed): ").append(String.format(Locale.ROOT,
                        "%d iterations, %d simulations, %.2f s.</p>%n", r.iterations(), r.evaluations(), wallS));
        sb.append("<table><tr><th class=\"l\">key</th><th>start</th><th>fitted</th><th>std. error</th><th>change</th></tr>\n");
        for (int j = 0; j < r.keys().size(); j++) {
            sb.append(String.format(Locale.ROOT, "<tr><td class=\"l\">%s</td><td>%.6g</td><td>%.6g</td><td>%.2g</td>"
                    + "<td>%+.2f %%</td></tr>%n", r.keys().get(j).key(), r.start()[j], r.values()[j], r.stdErr()[j],
                    100 * (r.values()[j] / r.start()[j] - 1)));
        }
        sb.append(String.format(Locale.ROOT, "</table>%n<p>RMS error: level %.3g mm (start %.3g mm), pressure %.3g kPa"
                + " (start %.3g kPa). Values in SI.</p>%n", r.rmsLevelM() * 1e3, r.rmsLevelBeforeM() * 1e3,
                r.rmsPressurePa() / 1e3, r.rmsPressureBeforePa() / 1e3));
        int n = tS.length;
        double[][] level = new double[3][n];
        double[][] pressure = new double[3][n];
        for (int i = 0; i < n; i++) {
            level[0][i] = r.recordedLevelM()[i] * 1e3;
            level[1][i] = r.before().levelM()[i] * 1e3;
            level[2][i] = r.after().levelM()[i] * 1e3;
            pressure[0][i] = EngUnit.BARG.fromSi(recordedPressurePa[i]);
            pressure[1][i] = EngUnit.BARG.fromSi(r.before().pressurePa()[i]);
            pressure[2][i] = EngUnit.BARG.fromSi(r.after().pressurePa()[i]);
        }
        String[] labels = {"recorded", "start file", "fitted"};
        sb.append("<h2>Drum level (change from start)</h2>\n").append(SvgChart.render(tS, level, labels, "level [mm]"));
        sb.append("<h2>Drum pressure</h2>\n").append(SvgChart.render(tS, pressure, labels, "pressure [barg]"));
        ReportPage.signOff(sb);
        ReportPage.close(sb, "drumloop plant calibration record - drumloop " + h.build().describe());
        return sb.toString();
    }
}
