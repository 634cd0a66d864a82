package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.drumloop.bench.ExitCode;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.bench.sim.SimulationSession;
import org.drumloop.core.config.ConfigException;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code drumloop perf} (hidden): the bench's own figures, measured in this process. Run it as a
 * fresh process so "start-up to first scan" includes JVM start: {@code ./drumloop perf}.
 */
@Command(name = "perf", hidden = true, mixinStandardHelpOptions = true,
        description = "Measure start-up to first scan, the demo's wall time and --speed max on a 24 h scenario.")
public final class PerfCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--hours", defaultValue = "24", description = "plant hours of the long run (default 24)")
    double hours;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        try {
            // 1. start-up: JVM start to the end of the first scan of the demo's loop
            Scenario demo = Runs.load(DemoCommand.DEMO);
            ScenarioRunner.Setup setup = ScenarioRunner.setup(demo);
            SimulationSession s = new SimulationSession(setup.plant(), setup.tuning(), demo.seed(),
                    demo.initialLoadFrac());
            s.scan();
            long startupMs = ManagementFactory.getRuntimeMXBean().getUptime();
            double processCpuS = ((com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean())
                    .getProcessCpuTime() * 1e-9;
            o.printf(Locale.ROOT, "start-up to first scan: %d ms wall (JVM start to the end of the first scan),"
                    + " process CPU %.2f s on all threads%n", startupMs, processCpuS);

            // 2. the demo with all records
            Path tmp = Files.createTempDirectory("drumloop-perf-");
            long t0 = System.nanoTime();
            RunSummary r = ScenarioRunner.run(Runs.load(DemoCommand.DEMO), ScenarioRunner.Options.fast(tmp));
            double demoS = (System.nanoTime() - t0) * 1e-9;
            o.printf(Locale.ROOT, "demo (%.0f s of plant time, records written): %.3f s wall, %s; JVM up %d ms%n",
                    r.endS(), demoS, r.passed() ? "pass" : "FAIL", ManagementFactory.getRuntimeMXBean().getUptime());

            // 3. a long scenario as fast as possible, without records (the loop itself)
            java.lang.management.ThreadMXBean mx = ManagementFactory.getThreadMXBean();
            for (int round = 1; round <= 2; round++) { // the first round includes the JIT's warm-up
                Scenario sc = ScenarioParser.parse("perf-" + hours + "h.scenario", null, longScenario(hours));
                long c1 = mx.getCurrentThreadCpuTime();
                long t1 = System.nanoTime();
                RunSummary d = ScenarioRunner.run(sc, ScenarioRunner.Options.fast(null));
                double dayS = (System.nanoTime() - t1) * 1e-9;
                double cpuS = (mx.getCurrentThreadCpuTime() - c1) * 1e-9;
                o.printf(Locale.ROOT, "--speed max, %.0f h of plant time, run %d (%d scans, no records): %.2f s wall ="
                        + " %.0f x real time (%.2f us per scan incl. plant step); thread CPU %.2f s = %.0f x%n", hours,
                        round, d.scans(), dayS, d.endS() / dayS, dayS / d.scans() * 1e6, cpuS, d.endS() / cpuS);
            }
            // 4. the same with the trend recorded every 10 scans
            Path tmp2 = Files.createTempDirectory("drumloop-perf-");
            long t2 = System.nanoTime();
            RunSummary d2 = ScenarioRunner.run(ScenarioParser.parse("perf.scenario", null, longScenario(hours)),
                    new ScenarioRunner.Options(tmp2, Double.POSITIVE_INFINITY, 10, null));
            double day2S = (System.nanoTime() - t2) * 1e-9;
            o.printf(Locale.ROOT, "--speed max, %.0f h with records (--record-every 10): %.2f s wall = %.0f x real time%n",
                    hours, day2S, d2.endS() / day2S);
            return ExitCode.OK;
        } catch (ConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        } catch (IOException e) {
            err.println(e.getMessage());
            return ExitCode.IO_ERROR;
        }
    }

    /** A long run with a load change every hour between 40 and 90 %. */
    static List<String> longScenario(double hours) {
        List<String> l = new ArrayList<>();
        l.add("title     Endurance: load changes every hour");
        l.add("plant     aux-boiler");
        l.add("tuning    default");
        l.add(String.format(Locale.ROOT, "duration  %.3f h", hours));
        for (int h = 0; h < hours; h++) {
            double load = h % 2 == 0 ? 90 : 40;
            l.add(String.format(Locale.ROOT, "at %d h ramp steam_demand to %.0f %% over 120 s", h, load));
        }
        return l;
    }
}
