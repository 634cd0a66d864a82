package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.concurrent.Callable;

import org.drumloop.bench.ExitCode;
import org.drumloop.bench.record.HtmlReport;
import org.drumloop.bench.record.PdfPrinter;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.core.config.ConfigException;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code drumloop demo}: the built-in demonstration on the invented auxiliary boiler. */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Run the built-in demo on the invented auxiliary boiler: load changes, a transmitter"
                + " failure, a feed pump trip with standby start and a deliberate low-water trip test.",
            "Prints a summary and where the records are (trend.csv, events.csv, report.html)."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:the demo ran and its expectations held", "1:an expectation failed",
            "2:the shipped configuration is broken", "3:records could not be written", "4:internal error"})
public final class DemoCommand implements Callable<Integer> {
    /** Name of the demo scenario in config/scenarios (shipped in the jar). */
    public static final String DEMO = "demo";

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--out", paramLabel = "DIR", description = "folder for the records (default out/demo)")
    Path out = Paths.get("out", "demo");

    @CommandLine.Mixin
    PdfOptions pdf = new PdfOptions();

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        RunSummary r;
        try {
            Scenario sc = Runs.load(DEMO);
            Runs.checkWritable(out);
            PdfPrinter printer = pdf.printer();
            r = ScenarioRunner.run(sc, new ScenarioRunner.Options(out, Double.POSITIVE_INFINITY, 1,
                    Runs.progress()));
            pdf.print(printer, out, "report");
        } catch (ConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        } catch (PdfPrinter.UnavailableException e) {
            err.println(e.getMessage());
            return ExitCode.IO_ERROR;
        } catch (IOException e) {
            err.println("cannot write records: " + e.getMessage());
            return ExitCode.IO_ERROR;
        }
        o.println(r.scenario().title());
        o.printf("plant %s, tuning %s, %.0f s of plant time in %.2f s%n", r.plantName(), r.tuningName(), r.endS(),
                r.wallS());
        o.println();
        o.printf("  %-4s %4s  %-60s %s%n", "", "line", "expectation", "measured");
        Runs.printOutcomes(o, r);
        o.println();
        o.printf("largest level deviation %.1f mm (true level; indicated level %.1f mm), IAE %.0f mm*s,"
                + " valve travel %.0f %%%n", r.figures().maxDeviationM() * 1000,
                r.figures().maxIndicatedDeviationM() * 1000, r.figures().iaeMS() * 1000,
                r.figures().valveTravelFrac() * 100);
        o.println(r.passed() ? "PASS" : "FAIL: " + r.failures() + " expectation(s) did not hold");
        o.println("records: " + out.resolve("report.html") + "  (also trend.csv, events.csv"
                + (pdf.pdf ? ", report.pdf" : "") + ")");
        o.println();
        o.println(HtmlReport.CAUTION);
        return r.passed() ? ExitCode.OK : ExitCode.FAILED;
    }
}
