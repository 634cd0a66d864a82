package org.drumloop.bench.sim;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.Main;
import org.drumloop.bench.expect.Binder;
import org.drumloop.bench.expect.Expectation;
import org.drumloop.bench.expect.Frame;
import org.drumloop.bench.expect.Outcome;
import org.drumloop.bench.record.AtomicOutput;
import org.drumloop.bench.record.EventLog;
import org.drumloop.bench.record.HtmlReport;
import org.drumloop.bench.record.KeyFigures;
import org.drumloop.bench.record.PlotBuffer;
import org.drumloop.bench.record.RunRecord;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.record.TrendWriter;
import org.drumloop.bench.scenario.Action;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;
import org.drumloop.core.exec.SimulatedClock;
import org.drumloop.core.safety.InterlockSet;
import org.drumloop.core.safety.InterlockSpec;
import org.drumloop.plant.Fault;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantConfigException;
import org.drumloop.plant.PlantFile;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Runs a {@link Scenario} on a {@link SimulationSession}: applies its timed statements, judges its
 * expectations scan by scan, keeps key figures and plot data, and writes {@code trend.csv},
 * {@code events.csv} and {@code report.html} into the output folder (each written to a temporary
 * file and moved into place only when complete).
 */
public final class ScenarioRunner {
    /** Time buckets of the plots. */
    static final int PLOT_BUCKETS = 1200;
    /** Tolerance when comparing an action's time with the scan time (well under any scan period). */
    static final double TIME_EPS_S = 1e-6;

    /**
     * How to run.
     *
     * @param outDir      folder for the records, or null to write nothing
     * @param speed       times real time; {@code Double.POSITIVE_INFINITY} = as fast as possible
     * @param recordEvery write one trend row every this many scans (1 = every scan)
     * @param progress    where to print a progress line (a terminal), or null
     */
    public record Options(Path outDir, double speed, int recordEvery, PrintWriter progress) {
        public static Options fast(Path outDir) {
            return new Options(outDir, Double.POSITIVE_INFINITY, 1, null);
        }
    }

    /** Plant and firmware resolved for a scenario (so the CLI can report them). */
    public record Setup(Path plantPath, PlantConfig plant, Path tuningPath, FirmwareConfig tuning) {
    }

    private ScenarioRunner() {
    }

    /** The logger, created only when something is logged: a quiet run never starts the logging system. */
    private static Logger log() {
        return LoggerFactory.getLogger(ScenarioRunner.class);
    }

    /** Resolve and load the plant and tuning a scenario names; errors point at the scenario line. */
    public static Setup setup(Scenario sc) throws ConfigException, IOException {
        Path plantPath = ConfigResolver.resolve(sc.plant(), "plants", ".plant", sc.path());
        if (plantPath == null) {
            throw new ConfigException(sc.file(), sc.plantLine(), sc.plant(),
                    "no such plant (not a file, not in config/plants, not shipped; shipped: "
                            + ConfigResolver.names("plants", ".plant") + ")");
        }
        Path tuningPath = ConfigResolver.resolve(sc.tuning(), "tuning", ".tuning", sc.path());
        if (tuningPath == null) {
            throw new ConfigException(sc.file(), sc.tuningLine(), sc.tuning(),
                    "no such tuning (not a file, not in config/tuning, not shipped; shipped: "
                            + ConfigResolver.names("tuning", ".tuning") + ")");
        }
        FirmwareConfig fc = FirmwareConfig.load(tuningPath);
        if (!sc.swellComp()) {
            fc = fc.withoutSwellCompensation();
        }
        return new Setup(plantPath, loadPlant(plantPath), tuningPath, fc);
    }

    /** Load a plant file, with its errors in the bench's error type. */
    public static PlantConfig loadPlant(Path p) throws ConfigException, IOException {
        try {
            return PlantFile.load(p);
        } catch (PlantConfigException e) {
            List<ConfigException> all = new ArrayList<>();
            for (PlantConfigException p1 : e.problems()) {
                all.add(new ConfigException(p1.file(), p1.line(), p1.key(), p1.problem()));
            }
            throw all.size() == 1 ? all.get(0) : new ConfigProblems(all);
        }
    }

    /** Bind a scenario's names (interlock tags, modes, swell compensation) to a firmware. */
    public static void bind(Scenario sc, InterlockSet il) throws ConfigException {
        Binder b = new Binder() {
            @Override
            public int interlockIndex(String tag) { return indexOf(il, tag); }

            @Override
            public boolean interlockIsTrip(int index) { return il.isTrip(index); }

            @Override
            public String interlockTags() { return tags(il); }
        };
        for (Expectation e : sc.expectations()) {
            e.bind(b);
        }
        for (Action a : sc.actions()) {
            if ((a.type() == Action.Type.BYPASS || (a.type() == Action.Type.ACKNOWLEDGE
                    && !"all".equalsIgnoreCase(a.target()))) && indexOf(il, a.target()) < 0) {
                throw new ConfigException(sc.file(), a.line(), a.target(),
                        "no such alarm or trip in the interlocks (known: " + tags(il) + ")");
            }
        }
    }

    static int indexOf(InterlockSet il, String tag) {
        for (int i = 0; i < il.size(); i++) {
            if (il.tag(i).equalsIgnoreCase(tag)) {
                return i;
            }
        }
        return -1;
    }

    static String tags(InterlockSet il) {
        List<String> t = new ArrayList<>();
        for (int i = 0; i < il.size(); i++) {
            t.add(il.tag(i));
        }
        return String.join(", ", t);
    }

    /** Level limits to draw on the level plot: every level alarm and trip of the interlocks. */
    public static List<RunSummary.LevelLimit> limits(InterlockSet il) {
        List<RunSummary.LevelLimit> l = new ArrayList<>();
        for (int i = 0; i < il.size(); i++) {
            InterlockSpec s = il.spec(i);
            if (s.variable() == InterlockSpec.Variable.LEVEL) {
                l.add(new RunSummary.LevelLimit(s.tag(), s.setpointSi(), s.isTrip()));
            }
        }
        return l;
    }

    /**
     * Run a scenario.
     *
     * @throws ConfigException a file it names is wrong
     * @throws IOException     records could not be written
     */
    public static RunSummary run(Scenario sc, Options o) throws ConfigException, IOException {
        long t0 = System.nanoTime();
        Setup setup = setup(sc);
        RunRecord.Builder record = RunRecord.begin(sc, setup.plantPath(), setup.tuningPath(), setup.tuning());
        SimulationSession s = new SimulationSession(setup.plant(), setup.tuning(), sc.seed(), sc.initialLoadFrac());
        InterlockSet il = s.firmware().interlocks();
        bind(sc, il);
        if (Main.verbose()) {
            log().debug(String.format(java.util.Locale.ROOT, "%s: plant %s, tuning %s loaded and session built in %.1f ms;"
                    + " JVM up %d ms", sc.name(), setup.plantPath(), setup.tuningPath(), (System.nanoTime() - t0) * 1e-6,
                    java.lang.management.ManagementFactory.getRuntimeMXBean().getUptime()));
        }
        AtomicOutput trendOut = null;
        AtomicOutput eventsOut = null;
        try {
            TrendWriter trend = null;
            EventLog events;
            if (o.outDir() != null) {
                trendOut = new AtomicOutput(o.outDir().resolve("trend.csv"));
                eventsOut = new AtomicOutput(o.outDir().resolve("events.csv"));
                trend = new TrendWriter(trendOut.writer(), interlockTags(il));
                events = new EventLog(eventsOut.writer());
            } else {
                events = new EventLog(null);
            }
            s.setEventSink(events::add);
            RunSummary summary;
            try {
                summary = loop(sc, o, setup, s, trend, events);
            } catch (UncheckedIOException e) {
                throw e.getCause();
            }
            summary = summary.withRecord(record.finish());
            if (o.outDir() != null) {
                trendOut.commit();
                eventsOut.commit();
                AtomicOutput.write(o.outDir().resolve("report.html"), HtmlReport.render(summary));
            }
            return summary;
        } finally {
            if (trendOut != null) {
                trendOut.close();
            }
            if (eventsOut != null) {
                eventsOut.close();
            }
        }
    }

    private static List<String> interlockTags(InterlockSet il) {
        List<String> t = new ArrayList<>();
        for (int i = 0; i < il.size(); i++) {
            t.add(il.tag(i));
        }
        return t;
    }

    private static RunSummary loop(Scenario sc, Options o, Setup setup, SimulationSession s, TrendWriter trend,
                                   EventLog events) throws IOException {
        List<Action> actions = sc.actions();
        int na = actions.size();
        Fault[] faults = new Fault[na];
        for (int i = 0; i < na; i++) {
            Action a = actions.get(i);
            if (a.type() == Action.Type.FAULT) {
                faults[i] = ActionApplier.faultOf(a);
            }
        }
        ActionApplier applier = new ActionApplier(s);
        Expectation[] ex = sc.expectations().toArray(new Expectation[0]);
        for (Expectation e : ex) {
            e.start();
        }
        KeyFigures fig = new KeyFigures();
        PlotBuffer plot = new PlotBuffer(sc.durationS(), PLOT_BUCKETS);
        double lastActionS = 0;
        for (Action a : actions) {
            lastActionS = Math.max(lastActionS, a.type() == Action.Type.RAMP ? a.atS() + a.overS() : a.atS());
        }
        fig.lastActionAt(lastActionS);
        SimulatedClock clock = Double.isInfinite(o.speed()) ? SimulatedClock.asFastAsPossible()
                : SimulatedClock.paced(o.speed());
        double dt = s.scanPeriodS();
        long total = (long) Math.floor(sc.durationS() / dt + 1e-9) + 1;
        int next = 0;
        int every = Math.max(1, o.recordEvery());
        long wall0 = System.nanoTime();
        long lastProgress = wall0;
        Frame f = s.frame();
        for (long k = 0; k < total; k++) {
            double t = k * dt;
            if (clock.isPaced()) {
                try {
                    clock.waitUntil(t);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    break;
                }
            }
            while (next < na && actions.get(next).atS() <= t + TIME_EPS_S) {
                Action a = actions.get(next);
                events.add(t, "scenario", "ACTION", a.text());
                applier.apply(a, faults[next]);
                next++;
            }
            applier.updateRamps(t);
            s.scan();
            for (Expectation e : ex) {
                e.observe(f);
            }
            fig.add(f);
            plot.add(f);
            if (trend != null && k % every == 0) {
                trend.write(f);
            }
            if (o.progress() != null && (k & 1023) == 0) {
                long now = System.nanoTime();
                if (now - lastProgress > 250_000_000L) {
                    lastProgress = now;
                    o.progress().printf("\r%s: %5.1f %% (%.0f of %.0f s)", sc.name(), 100.0 * k / total, t,
                            sc.durationS());
                    o.progress().flush();
                }
            }
        }
        double wallS = (System.nanoTime() - wall0) * 1e-9;
        if (o.progress() != null) {
            o.progress().print("\r" + " ".repeat(60) + "\r");
            o.progress().flush();
        }
        double endS = s.frame().tS;
        List<Outcome> outcomes = new ArrayList<>();
        for (Expectation e : ex) {
            outcomes.add(e.finish(endS));
        }
        if (Main.verbose()) {
            log().debug(String.format(java.util.Locale.ROOT, "%s: %d scans, %.1f s of plant time in %.3f s wall"
                    + " (%.0f x real time, %.2f us per scan)", sc.name(), s.scans(), endS, wallS,
                    wallS > 0 ? endS / wallS : Double.POSITIVE_INFINITY, wallS / Math.max(1, s.scans()) * 1e6));
        }
        Plant p = s.plant();
        return new RunSummary(sc, setup.plantPath().getFileName().toString(),
                setup.tuningPath().getFileName().toString(), endS, wallS, s.scans(), outcomes, fig, plot,
                events.kept(), limits(s.firmware().interlocks()), s.firmware().events().lost(), p.invalid());
    }
}
