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
            "Records per scenario: trend.csv, events.csv, report.html (in --out, default out/<scenario>/).",
            "Every file is checked before anything runs; nothing written earlier is lost on an error."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:every expectation held", "1:an expectation failed",
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
        PrintWriter progress = Runs.progress();
        try {
            for (Scenario sc : parsed) {
                Path dir = out == null ? Paths.get("out", sc.name()) : parsed.size() == 1 ? out : out.resolve(sc.name());
                Runs.checkWritable(dir);
                RunSummary r = ScenarioRunner.run(sc, new ScenarioRunner.Options(dir, sp, recordEvery, progress));
                results.add(r);
                Runs.printSummaryLine(o, r, dir);
                if (!r.passed()) {
                    Runs.printOutcomes(o, r);
                }
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
        for (RunSummary r : results) {
            if (!r.passed()) {
                return ExitCode.FAILED;
            }
        }
        return ExitCode.OK;
    }
}
