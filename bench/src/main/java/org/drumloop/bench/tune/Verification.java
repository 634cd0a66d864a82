package org.drumloop.bench.tune;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.core.config.ConfigException;

/**
 * Runs scenarios with a base and a tuned tuning file side by side (each run with the scenario's own
 * plant unless one is given), two runs at a time, and tabulates max level deviation, IAE and valve
 * travel per scenario. Nothing is written to disk.
 */
public final class Verification {
    /** One scenario, run with both files. */
    public record Row(Scenario scenario, RunSummary base, RunSummary tuned) { }

    /** The table. */
    public record Result(List<Row> rows) {
        public int basePassed() { return (int) rows.stream().filter(r -> r.base().passed()).count(); }

        public int tunedPassed() { return (int) rows.stream().filter(r -> r.tuned().passed()).count(); }

        /** True when the tuned file passes at least as many scenarios as the base. */
        public boolean ok() { return tunedPassed() >= basePassed(); }

        /** The table as text, engineering units. */
        public String text() {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT,
                    "%-24s | %-4s %9s %10s %8s | %-4s %9s %10s %8s%n", "scenario", "base", "max dev", "IAE", "travel",
                    "tuned", "max dev", "IAE", "travel"));
            sb.append(String.format(Locale.ROOT, "%-24s | %-4s %9s %10s %8s | %-4s %9s %10s %8s%n", "", "", "[mm]",
                    "[mm*s]", "[%]", "", "[mm]", "[mm*s]", "[%]"));
            for (Row r : rows) {
                sb.append(String.format(Locale.ROOT, "%-24s | %s | %s%n", clip(r.scenario().name()), cells(r.base()),
                        cells(r.tuned())));
            }
            sb.append(String.format(Locale.ROOT, "passed: base %d of %d, tuned %d of %d%n", basePassed(), rows.size(),
                    tunedPassed(), rows.size()));
            return sb.toString();
        }

        private static String cells(RunSummary s) {
            return String.format(Locale.ROOT, "%-4s %9.1f %10.0f %8.1f", s.passed() ? "PASS" : "FAIL",
                    s.figures().maxDeviationM() * 1000, s.figures().iaeMS() * 1000, s.figures().valveTravelFrac() * 100);
        }

        private static String clip(String s) {
            return s.length() <= 24 ? s : s.substring(0, 21) + "...";
        }
    }

    private Verification() {
    }

    /**
     * @param scenarios scenario files to run (each run parses its own copy: expectations keep state)
     * @param base      base tuning file
     * @param tuned     tuned tuning file
     * @param plant     plant file to run them on, or null for each scenario's own
     */
    public static Result run(List<Path> scenarios, Path base, Path tuned, Path plant)
            throws ConfigException, IOException {
        ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, Math.min(2, Runtime.getRuntime().availableProcessors())));
        try {
            List<Future<RunSummary>> futures = new ArrayList<>();
            List<Scenario> parsed = new ArrayList<>();
            for (Path file : scenarios) {
                parsed.add(load(file));
                for (Path tuning : new Path[] {base, tuned}) {
                    Scenario s = with(load(file), tuning, plant);
                    futures.add(pool.submit(() -> ScenarioRunner.run(s, ScenarioRunner.Options.fast(null))));
                }
            }
            List<Row> rows = new ArrayList<>();
            for (int i = 0; i < scenarios.size(); i++) {
                rows.add(new Row(parsed.get(i), get(futures.get(2 * i)), get(futures.get(2 * i + 1))));
            }
            return new Result(rows);
        } finally {
            pool.shutdownNow();
        }
    }

    private static RunSummary get(Future<RunSummary> f) throws ConfigException, IOException {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted", e);
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof ConfigException ce) {
                throw ce;
            }
            if (c instanceof IOException io) {
                throw io;
            }
            if (c instanceof RuntimeException re) {
                throw re;
            }
            throw new IllegalStateException(c);
        }
    }

    private static Scenario load(Path file) throws ConfigException, IOException {
        return ScenarioParser.load(file, ConfigResolver.displayName(file));
    }

    /** The scenario with another tuning file (and plant file). */
    static Scenario with(Scenario s, Path tuning, Path plant) {
        String t = tuning.toAbsolutePath().toString();
        String p = plant == null ? s.plant() : plant.toAbsolutePath().toString();
        return new Scenario(s.file(), s.path(), s.name(), s.title(), s.description(), p, s.plantLine(), t,
                s.tuningLine(), s.durationS(), s.seed(), s.initialLoadFrac(), s.swellComp(), s.actions(),
                s.expectations(), s.source());
    }
}
