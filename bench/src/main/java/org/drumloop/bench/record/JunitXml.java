package org.drumloop.bench.record;

import java.util.List;
import java.util.Locale;

import org.drumloop.bench.expect.Outcome;

/**
 * JUnit XML (the de-facto format read by CI servers: {@code testsuites/testsuite/testcase/failure}):
 * one test suite per scenario, one test case per expectation.
 */
public final class JunitXml {
    private JunitXml() {
    }

    public static String render(List<RunSummary> runs) {
        int tests = 0;
        int failures = 0;
        double time = 0;
        for (RunSummary r : runs) {
            tests += r.outcomes().size();
            failures += r.failures();
            time += r.wallS();
        }
        StringBuilder sb = new StringBuilder("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
        sb.append(String.format(Locale.ROOT, "<testsuites name=\"drumloop\" tests=\"%d\" failures=\"%d\" time=\"%.3f\">%n",
                tests, failures, time));
        for (RunSummary r : runs) {
            sb.append(String.format(Locale.ROOT,
                    "  <testsuite name=\"%s\" tests=\"%d\" failures=\"%d\" errors=\"0\" skipped=\"0\" time=\"%.3f\">%n",
                    Html.esc(r.scenario().name()), r.outcomes().size(), r.failures(), r.wallS()));
            for (Outcome o : r.outcomes()) {
                sb.append(String.format(Locale.ROOT, "    <testcase classname=\"%s\" name=\"line %d: %s\" time=\"0\"",
                        Html.esc(r.scenario().name()), o.line(), Html.esc(o.text())));
                if (o.passed()) {
                    sb.append("/>\n");
                } else {
                    sb.append(">\n      <failure message=\"").append(Html.esc(o.measured())).append("\">")
                            .append(Html.esc(r.scenario().file() + ":" + o.line() + ": " + o.text() + " -- "
                                    + o.measured()))
                            .append("</failure>\n    </testcase>\n");
                }
            }
            sb.append("    <system-out>").append(Html.esc("plant " + r.plantName() + ", tuning " + r.tuningName()
                    + ", " + String.format(Locale.ROOT, "%.1f", r.endS()) + " s of plant time")).append("</system-out>\n");
            sb.append("  </testsuite>\n");
        }
        sb.append("</testsuites>\n");
        return sb.toString();
    }
}
