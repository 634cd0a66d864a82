package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.expect.Outcome;
import org.drumloop.bench.ExitCode;
import org.drumloop.bench.record.AtomicOutput;
import org.drumloop.bench.record.CampaignIndex;
import org.drumloop.bench.record.RecordHeader;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.core.config.ConfigException;

/** Helpers shared by the commands that run scenarios. */
final class Runs {
    private Runs() {
    }

    /** Find and parse a scenario given as a path or a name ({@code load-step-up}). */
    static Scenario load(String ref) throws ConfigException, IOException {
        Path p = ConfigResolver.resolve(ref, "scenarios", ".scenario", null);
        if (p == null) {
            throw new ConfigException(ref, 0, "", "no such scenario file (nor a scenario of that name in"
                    + " config/scenarios or shipped: " + ConfigResolver.names("scenarios", ".scenario") + ")");
        }
        return ScenarioParser.load(p, ConfigResolver.displayName(p));
    }

    /** A progress writer when stdout is a terminal, else null (no progress when piped). */
    static PrintWriter progress() {
        return System.console() != null ? new PrintWriter(System.err, true) : null;
    }

    /** Print the expectations of one run as a short table. */
    static void printOutcomes(PrintWriter out, RunSummary r) {
        for (Outcome o : r.outcomes()) {
            out.printf(Locale.ROOT, "  %-4s %4d  %-60s %s%n", o.passed() ? "ok" : "FAIL", o.line(),
                    clip(o.text(), 60), o.measured());
        }
    }

    static String clip(String s, int n) {
        return s.length() <= n ? s : s.substring(0, n - 3) + "...";
    }

    /** One summary line per run. */
    static void printSummaryLine(PrintWriter out, RunSummary r, Path dir) {
        out.printf(Locale.ROOT, "%-28s %-11s %3d/%-3d  max dev %6.1f mm (indicated %6.1f)  IAE %8.0f mm*s  %7.0f s plant"
                + "  %6.2f s wall%s%n",
                clip(r.scenario().name(), 28), r.verdict().text(),
                r.outcomes().size() - r.failures(), r.outcomes().size(), r.figures().maxDeviationM() * 1000,
                r.figures().maxIndicatedDeviationM() * 1000,
                r.figures().iaeMS() * 1000, r.endS(), r.wallS(), dir == null ? "" : "  " + dir);
    }

    /** After a run's summary line: the failed expectations, or the warning of a run without criteria. */
    static void printVerdictDetail(PrintWriter out, PrintWriter err, RunSummary r, boolean requireCriteria) {
        if (r.verdict() == RunSummary.Verdict.FAIL) {
            printOutcomes(out, r);
        } else if (r.verdict() == RunSummary.Verdict.NO_CRITERIA) {
            err.println((requireCriteria ? "error: " : "warning: ") + r.scenario().file()
                    + ": NO CRITERIA: the scenario has no expect lines, so the run proves nothing by itself"
                    + (requireCriteria ? " (--require-criteria)" : " (--require-criteria makes this a failure)"));
        }
    }

    /** Exit code of a set of runs: 1 when one failed, or had no criteria while they are required; else 0. */
    static int exitCode(List<RunSummary> runs, boolean requireCriteria) {
        for (RunSummary r : runs) {
            if (r.verdict() == RunSummary.Verdict.FAIL
                    || (requireCriteria && r.verdict() == RunSummary.Verdict.NO_CRITERIA)) {
                return ExitCode.FAILED;
            }
        }
        return ExitCode.OK;
    }

    /** The campaign's cover sheet: {@code indexDir/index.html}, linking each run's report. */
    static void writeIndex(Path indexDir, RecordHeader.Builder campaign, List<RunSummary> runs, List<Path> dirs)
            throws IOException {
        List<CampaignIndex.Entry> entries = new ArrayList<>();
        for (int i = 0; i < runs.size(); i++) {
            entries.add(new CampaignIndex.Entry(runs.get(i), CampaignIndex.link(indexDir, dirs.get(i))));
        }
        AtomicOutput.write(indexDir.resolve("index.html"),
                CampaignIndex.render(CampaignIndex.header(campaign, runs), entries));
    }

    static void checkWritable(Path dir) throws IOException {
        AtomicOutput.checkFolder(dir);
    }
}
