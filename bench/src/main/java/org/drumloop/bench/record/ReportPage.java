package org.drumloop.bench.record;

/**
 * The frame every HTML record shares: one self-contained page (inline CSS, inline SVG; no scripts,
 * fonts or anything fetched) with the screen and print stylesheets, the caution, the record header
 * and the sign-off block. In print (A4 or Letter) every page carries the title, the date and
 * "page N of M"; plots and sign-off are never cut across pages and tables repeat their headings.
 */
public final class ReportPage {
    /** The caution printed on every record. */
    public static final String CAUTION = "drumloop is a test bench, not a safety system. Alarm and trip settings"
            + " shown here are bench defaults; on a real boiler every interlock setting comes from the boiler maker,"
            + " the classification rules and local codes, and is confirmed at commissioning. Never connect a"
            + " write-capable mode to a live boiler without a permit and licensed supervision.";

    private ReportPage() {
    }

    /**
     * Open a page: doctype, head with the stylesheets (the printed pages' margin lines name
     * {@code title} and {@code date}), and the body.
     */
    public static void open(StringBuilder sb, String title, String date) {
        sb.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n<title>")
                .append(Html.esc(title)).append(" - drumloop record</title>\n<style>\n").append(CSS).append(PRINT_CSS)
                .append("@page{@top-left{content:").append(cssString(title)).append("}@top-right{content:")
                .append(cssString(date)).append("}}\n</style></head><body>\n");
    }

    /** Close the page with a footer line. */
    public static void close(StringBuilder sb, String footer) {
        sb.append("<footer>").append(Html.esc(footer)).append("</footer>\n</body></html>\n");
    }

    /** The caution box. */
    public static void caution(StringBuilder sb) {
        sb.append("<aside class=\"caution\"><strong>Caution.</strong> ").append(Html.esc(CAUTION)).append("</aside>\n");
    }

    /**
     * The sign-off block: tested by, witnessed by, organisation, date and signature with blank lines
     * to write on, and a remarks box.
     */
    public static void signOff(StringBuilder sb) {
        sb.append("<section class=\"signoff\" id=\"sign-off\"><h2>Sign-off</h2>\n<table class=\"signoff\"><thead><tr>"
                + "<th></th><th>Tested by</th><th>Witnessed by</th></tr></thead><tbody>\n");
        for (String line : new String[] {"Name", "Organisation", "Date", "Signature"}) {
            sb.append("<tr><th>").append(line).append("</th><td class=\"blank\"></td><td class=\"blank\"></td></tr>\n");
        }
        sb.append("</tbody></table>\n<div class=\"remarks\"><div class=\"label\">Remarks</div></div>\n</section>\n");
    }

    /** A CSS string literal (CSS Syntax Level 3, 4.3.5): quotes and backslashes escaped, controls dropped. */
    static String cssString(String s) {
        StringBuilder b = new StringBuilder("\"");
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c == '"' || c == '\\') {
                b.append('\\').append(c);
            } else if (c == '<') {
                b.append("\\3c "); // never close the style element
            } else if (c >= 0x20) {
                b.append(c);
            }
        }
        return b.append('"').toString();
    }

    static final String CSS = String.join("\n",
            "body{font-family:system-ui,-apple-system,'Segoe UI',Roboto,'DejaVu Sans',sans-serif;color:#24282d;",
            "background:#f7f6f2;margin:0 auto;max-width:1080px;padding:18px 20px 40px;line-height:1.45}",
            "h1{font-size:1.45em;margin:.1em 0 .2em;font-weight:600}",
            "h2{font-size:1.1em;margin:1.6em 0 .5em;font-weight:600;color:#34557a;border-bottom:1px solid #d8d5cc;padding-bottom:3px}",
            "h3{font-size:.95em;margin:1em 0 .3em;font-weight:600;color:#444}",
            "header{border-bottom:2px solid #34557a;padding-bottom:6px;margin-bottom:10px}",
            ".meta{color:#5c626a;margin:0;font-size:.92em}",
            ".verdict{float:right;font-weight:700;padding:6px 14px;border-radius:3px;letter-spacing:.06em;color:#fff}",
            ".verdict.pass{background:#4a7a55}.verdict.fail{background:#a4513a}.verdict.none{background:#7b8088}",
            ".caution{background:#f1ead8;border-left:4px solid #b0892f;padding:8px 12px;font-size:.9em;margin:12px 0}",
            ".warn{background:#f4e1da;border-left:4px solid #a4513a;padding:8px 12px}",
            "table{border-collapse:collapse;width:100%;font-size:.9em;background:#fff}",
            "th,td{border:1px solid #dedbd3;padding:4px 8px;text-align:left;vertical-align:top}",
            "thead th{background:#eceae4;font-weight:600}",
            "table.figures th,table.header th{width:30%;font-weight:normal;color:#444}",
            "table.header,table.inputs{font-size:.85em}table.inputs{margin-top:6px}",
            "code.hash{font-size:.85em;word-break:break-all}td code,td a{overflow-wrap:anywhere}",
            "tr.expectation.pass td:nth-child(3){color:#3d6b47;font-weight:600}",
            "tr.expectation.fail td{background:#f8e8e3}tr.expectation.fail td:nth-child(3){color:#a4513a;font-weight:700}",
            "tr.k-trip td{color:#8e3f2b}tr.k-alarm td{color:#8a6a20}",
            "td.num{text-align:right;font-variant-numeric:tabular-nums}",
            "code{font-family:'DejaVu Sans Mono',Menlo,Consolas,monospace;font-size:.92em}",
            "figure{margin:10px 0 18px}figcaption{font-size:.88em;color:#5c626a;margin-bottom:3px}",
            "svg.plot{background:#fff;border:1px solid #dedbd3;max-width:100%;height:auto}",
            "svg .area{fill:#fff}svg .grid{stroke:#ebe9e3;stroke-width:1}",
            "svg text{font-family:system-ui,'DejaVu Sans',sans-serif;font-size:11px;fill:#5c626a}",
            "svg .ylab{text-anchor:end}svg .xlab{text-anchor:middle}svg .xunit{text-anchor:end}",
            "svg .legend{fill:#333}svg .mklab{font-size:9px}svg .mklab.trip{fill:#8e3f2b}svg .mklab.alarm{fill:#8a6a20}",
            "svg .series{fill:none;stroke-width:1.6;stroke-linejoin:round}svg .dashed{stroke-dasharray:5 3}",
            "svg .limit{stroke-width:1.2}svg .limit.alarm{stroke:#b0892f;stroke-dasharray:6 4}svg .limit.trip{stroke:#a4513a}",
            "svg .limlab{fill:#8a6a20;font-size:10px}",
            "svg .marker{stroke-width:1;opacity:.55}svg .marker.alarm{stroke:#b0892f;stroke-dasharray:2 3}svg .marker.trip{stroke:#a4513a}",
            "svg .mk-alarm{fill:#b0892f}svg .mk-trip{fill:#a4513a}",
            ".settings{columns:3 300px;column-gap:14px}.settings table{break-inside:avoid;margin-bottom:10px}",
            ".settings caption{text-align:left;font-weight:600;font-size:.95em;color:#444;padding:2px 0}",
            "table.causes{font-size:.8em}",
            "pre.source{background:#fff;border:1px solid #dedbd3;padding:8px;font-size:.85em;overflow-x:auto;white-space:pre-wrap}",
            "section.signoff{break-inside:avoid}table.signoff th:first-child{width:18%;font-weight:normal;color:#444}",
            "table.signoff td.blank{height:2.4em}",
            ".remarks{border:1px solid #dedbd3;background:#fff;min-height:7em;margin-top:8px;padding:4px 8px}",
            ".remarks .label{font-size:.85em;color:#5c626a}",
            "footer{margin-top:24px;color:#7b8088;font-size:.8em}",
            "");

    /**
     * Print: the page size is the printer's (A4 or Letter; the layout fits the narrower and the
     * shorter of both); margins leave room for the running title, date and page number.
     */
    static final String PRINT_CSS = String.join("\n",
            "@page{margin:17mm 12mm 17mm 12mm;",
            "@top-left{font:8pt sans-serif;color:#555}@top-right{font:8pt sans-serif;color:#555}",
            "@bottom-left{content:'drumloop record - a test bench, not a safety system';font:8pt sans-serif;color:#555}",
            "@bottom-right{content:'page ' counter(page) ' of ' counter(pages);font:8pt sans-serif;color:#555}}",
            "@media print{",
            "body{background:#fff;max-width:none;margin:0;padding:0;font-size:9pt;line-height:1.35}",
            "h2{break-after:avoid}h3{break-after:avoid}",
            "figure,svg,section.signoff,.remarks,.caution,.settings table,tr{break-inside:avoid}",
            "thead{display:table-header-group}",
            "svg.plot{width:100%;height:auto;border-color:#bbb}",
            ".verdict{border:2px solid #000;color:#000;background:#fff !important}",
            "tr.expectation.fail td{background:#fff}",
            "pre.source{font-size:.8em}",
            "}",
            "");
}
