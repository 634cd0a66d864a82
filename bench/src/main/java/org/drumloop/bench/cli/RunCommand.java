package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import org.drumloop.bench.ExitCode;
import org.drumloop.bench.record.AtomicOutput;
import org.drumloop.bench.record.JunitXml;
import org.drumloop.bench.record.PdfPrinter;
import org.drumloop.bench.record.RecordHeader;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.core.config.ConfigException;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code drumloop run SCENARIO...}: run scenarios and judge their expectations. */
@Command(name = "run", mixinStandardHelpOptions = true,
        description = {"Run scenarios against the simulated plant and judge their expectations.",
            "Records per scenario: trend.csv, events.csv, report.html (in --out, default out/<scenario>/);"
                + " with several scenarios also index.html, the campaign's cover sheet, in the folder above them.",
            "Every file and output folder is checked before anything runs; nothing written earlier is lost on an"
                + " error. A scenario without expect lines gives NO CRITERIA (exit 0 with a warning)."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:every expectation held (or a scenario had none: NO CRITERIA)",
            "1:an expectation failed, or --require-criteria and a scenario had none",
            "2:bad input (file:line: word: message)", "3:records could not be written", "4:internal error"})
public final class RunCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "SCENARIO", description = "scenario file, or name of a shipped scenario")
    List<String> scenarios = new ArrayList<>();

    @Option(names = "--out", paramLabel = "DIR",
            description = "folder for the records (one scenario) or for one sub-folder per scenario (several)")
    Path out;

    @Option(names = "--junit", paramLabel = "FILE", description = "also write JUnit XML (one test per expectation)")
    Path junit;

    @Option(names = "--speed", paramLabel = "N|max", defaultValue = "max",
            description = "N times real time, or max (as fast as possible; default)")
    String speed;

    @Option(names = "--record-every", paramLabel = "N", defaultValue = "1",
            description = "write one trend row every N scans (default 1: every scan)")
    int recordEvery;

    @Option(names = "--require-criteria", description = "fail (exit 1) a scenario that has no expect lines")
    boolean requireCriteria;

    @CommandLine.Mixin
    PdfOptions pdf = new PdfOptions();

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        double sp;
        if ("max".equalsIgnoreCase(speed)) {
            sp = Double.POSITIVE_INFINITY;
        } else {
            try {
                sp = Double.parseDouble(speed);
            } catch (NumberFormatException e) {
                sp = Double.NaN;
            }
            if (!(sp > 0) || Double.isInfinite(sp)) {
                err.println("--speed: expected a positive number or 'max', got '" + speed + "'");
                return ExitCode.BAD_INPUT;
            }
        }
        if (recordEvery < 1) {
            err.println("--record-every: must be 1 or more, got " + recordEvery);
            return ExitCode.BAD_INPUT;
        }
        // check every input before running anything
        List<Scenario> parsed = new ArrayList<>();
        int bad = 0;
        for (String ref : scenarios) {
            try {
                Scenario sc = Runs.load(ref);
                ScenarioRunner.setup(sc);
                parsed.add(sc);
            } catch (ConfigException e) {
                err.println(e.getMessage());
                bad++;
            } catch (IOException e) {
                err.println(ref + ": cannot read: " + e.getMessage());
                bad++;
            }
        }
        if (bad > 0) {
            return ExitCode.BAD_INPUT;
        }
        List<RunSummary> results = new ArrayList<>();
        List<Path> dirs = new ArrayList<>();
        for (Scenario sc : parsed) {
            dirs.add(out == null ? Paths.get("out", sc.name()) : parsed.size() == 1 ? out : out.resolve(sc.name()));
        }
        Path indexDir = parsed.size() > 1 ? (out == null ? Paths.get("out") : out) : null;
        RecordHeader.Builder campaign = RecordHeader.begin("Test campaign: " + parsed.size() + " scenarios");
        PdfPrinter printer;
        try {
            // every output folder and the PDF printer before anything runs
            for (Path dir : dirs) {
                Runs.checkWritable(dir);
            }
            printer = pdf.printer();
        } catch (IOException e) {
            err.println(e.getMessage());
            return ExitCode.IO_ERROR;
        }
        PrintWriter progress = Runs.progress();
        try {
            for (int i = 0; i < parsed.size(); i++) {
                Path dir = dirs.get(i);
                RunSummary r = ScenarioRunner.run(parsed.get(i), new ScenarioRunner.Options(dir, sp, recordEvery, progress));
                results.add(r);
                Runs.printSummaryLine(o, r, dir);
                Runs.printVerdictDetail(o, err, r, requireCriteria);
                pdf.print(printer, dir, "report");
            }
            if (indexDir != null) {
                Runs.writeIndex(indexDir, campaign, results, dirs);
                pdf.print(printer, indexDir, "index");
                o.println("campaign: " + indexDir.resolve("index.html"));
            }
            if (junit != null) {
                AtomicOutput.write(junit, JunitXml.render(results));
            }
        } catch (ConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        } catch (IOException e) {
            err.println("cannot write records: " + e.getMessage());
            return ExitCode.IO_ERROR;
        }
        return Runs.exitCode(results, requireCriteria);
    }
}
