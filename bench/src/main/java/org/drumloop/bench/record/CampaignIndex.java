package org.drumloop.bench.record;

import java.nio.file.Path;
import java.util.List;

/**
 * {@code index.html}: the cover sheet of a test campaign (several scenarios run by one command):
 * the record header naming every input by hash, one line per scenario with its verdict, key figures
 * and a link to its report, the overall verdict, the caution and the sign-off block.
 */
public final class CampaignIndex {
    private CampaignIndex() {
    }

    /**
     * One scenario of the campaign.
     *
     * @param run    its summary (with its record)
     * @param report its report, relative to the index
     */
    public record Entry(RunSummary run, String report) {
    }

    /**
     * The header of a campaign: started when {@code header} was begun, every input of every run
     * (each once), the campaign's own lines.
     */
    public static RecordHeader header(RecordHeader.Builder header, List<RunSummary> runs) {
        for (RunSummary r : runs) {
            if (r.record() != null) {
                for (InputFile f : r.record().header().inputs()) {
                    header.input(f);
                }
            }
        }
        return header.finish();
    }

    /** The verdict of a campaign: FAIL if any run failed, else NO CRITERIA if any had none, else PASS. */
    public static RunSummary.Verdict verdict(List<RunSummary> runs) {
        RunSummary.Verdict v = RunSummary.Verdict.PASS;
        for (RunSummary r : runs) {
            if (r.verdict() == RunSummary.Verdict.FAIL) {
                return RunSummary.Verdict.FAIL;
            }
            if (r.verdict() == RunSummary.Verdict.NO_CRITERIA) {
                v = RunSummary.Verdict.NO_CRITERIA;
            }
        }
        return v;
    }

    /** Link from the index in {@code indexDir} to a report in {@code reportDir}. */
    public static String link(Path indexDir, Path reportDir) {
        Path rel = indexDir.toAbsolutePath().normalize().relativize(reportDir.toAbsolutePath().normalize()
                .resolve("report.html"));
        return rel.toString().replace('\\', '/');
    }

    public static String render(RecordHeader h, List<Entry> entries) {
        StringBuilder sb = new StringBuilder(64 * 1024);
        List<RunSummary> runs = new java.util.ArrayList<>();
        for (Entry e : entries) {
            runs.add(e.run());
        }
        RunSummary.Verdict v = verdict(runs);
        ReportPage.open(sb, h.title(), h.dateText());
        sb.append("<header><div class=\"verdict ").append(v.css()).append("\" id=\"verdict\">").append(v.text())
                .append("</div><h1>").append(Html.esc(h.title())).append("</h1>\n<p class=\"meta\">")
                .append(entries.size()).append(" scenarios &middot; run ").append(Html.esc(h.utcText()))
                .append("</p></header>\n");
        ReportPage.caution(sb);
        sb.append("<h2>Scenarios</h2>\n<table class=\"campaign\" id=\"campaign\"><thead><tr><th>#</th><th>scenario</th>"
                + "<th>result</th><th>criteria held</th><th>largest level deviation, true / indicated [mm]</th>"
                + "<th>IAE [mm&middot;s]</th><th>plant time [s]</th><th>report</th></tr></thead><tbody>\n");
        int i = 1;
        for (Entry e : entries) {
            RunSummary r = e.run();
            KeyFigures k = r.figures();
            sb.append("<tr class=\"scenario ").append(r.verdict().name().toLowerCase(java.util.Locale.ROOT))
                    .append("\"><td>").append(i++).append("</td><td>").append(Html.esc(r.scenario().title()))
                    .append("<br><code>").append(Html.esc(r.scenario().file())).append("</code></td><td>")
                    .append(r.verdict().text()).append("</td><td class=\"num\">")
                    .append(r.outcomes().size() - r.failures()).append(" / ").append(r.outcomes().size())
                    .append("</td><td class=\"num\">").append(HtmlReport.fmt(k.maxDeviationM() * 1000, 1)).append(" / ")
                    .append(HtmlReport.fmt(k.maxIndicatedDeviationM() * 1000, 1)).append("</td><td class=\"num\">")
                    .append(HtmlReport.fmt(k.iaeMS() * 1000, 0)).append("</td><td class=\"num\">")
                    .append(HtmlReport.fmt(r.endS(), 0)).append("</td><td><a href=\"").append(Html.esc(e.report()))
                    .append("\">").append(Html.esc(e.report())).append("</a></td></tr>\n");
        }
        sb.append("</tbody></table>\n<h2>Record</h2>\n");
        h.html(sb);
        ReportPage.signOff(sb);
        ReportPage.close(sb, "drumloop campaign record - drumloop " + h.build().describe());
        return sb.toString();
    }
}
