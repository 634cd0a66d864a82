package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.ExitCode;
import org.drumloop.bench.record.AtomicOutput;
import org.drumloop.bench.record.RecordHeader;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.bench.tune.BumpAnalysis;
import org.drumloop.bench.tune.BumpFit;
import org.drumloop.bench.tune.PlantBumps;
import org.drumloop.bench.tune.Trend;
import org.drumloop.bench.tune.TrendCsv;
import org.drumloop.bench.tune.TrendSignal;
import org.drumloop.bench.tune.TuneReport;
import org.drumloop.bench.tune.TuningDesign;
import org.drumloop.bench.tune.TuningFileWriter;
import org.drumloop.bench.tune.Verification;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.config.ConfigException;
import org.drumloop.plant.PlantConfig;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code drumloop tune}: PI settings from bump tests by the SIMC rules, written as a tuning file and verified. */
@Command(name = "tune", mixinStandardHelpOptions = true,
        description = {"Tune the feed-flow slave, the level master, the single-element loop and the swell compensation"
                + " from bump tests: run them on a plant file (--plant) or read recorded ones (--trend), fit each by"
                + " least squares (Levenberg-Marquardt), apply the SIMC rules (Skogestad 2003), write DIR/tuned.tuning"
                + " and DIR/tune-report.html, and run the shipped scenarios that use the base tuning with both files.",
            "Tuned settings are a starting point; confirm them on the plant."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:the tuned file passes at least as many scenarios as the base",
            "1:it passes fewer (the table says which)",
            "2:bad input (file:line: column: message) or data that cannot be fitted",
            "3:cannot write the output"})
public final class TuneCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--plant", paramLabel = "FILE", description = "plant file or shipped plant name: run its bump tests"
            + " (and the verification on it)")
    String plant;

    @Option(names = "--tuning", paramLabel = "BASE", defaultValue = "default",
            description = "base tuning file or shipped name; limits and every other setting are kept (default: default)")
    String tuning;

    @Option(names = "--trend", paramLabel = "CSV", description = "recorded bump test (repeatable); time column and"
            + " signals drum_level, steam_flow, feed_flow, valve_demand or feed_valve with units in the header")
    List<Path> trends = new ArrayList<>();

    @Option(names = "--column", paramLabel = "NAME=HEADER", description = "map a signal to a header of the trend file"
            + " (repeatable), e.g. --column drum_level=LT101")
    List<String> columns = new ArrayList<>();

    @Option(names = "--tau-c", paramLabel = "SECONDS", description = "closed-loop time constant of the level loops"
            + " (master and single), or per loop: slave=S,master=M,single=S (default: tauC = theta)")
    String tauC;

    @Option(names = "--loops", paramLabel = "LIST", defaultValue = "slave,master,single,swell",
            description = "loops to tune: slave, master, single, swell (default: all)")
    String loops;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "folder for tuned.tuning and tune-report.html")
    Path out;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        return Guarded.run("tune", err, out, () -> run(o, err));
    }

    private int run(PrintWriter o, PrintWriter err) throws ConfigException, IOException {
        if (plant == null && trends.isEmpty()) {
            throw new ConfigException("tune", 0, "--plant", "give --plant FILE (simulated bump tests) or --trend CSV (recorded ones)");
        }
        Set<TuningDesign.Loop> loopSet = loops(loops);
        TuningDesign.TauC tc = tauC(tauC);
        Path basePath = ConfigResolver.resolve(tuning, "tuning", ".tuning", null);
        if (basePath == null) {
            throw new ConfigException(tuning, 0, "--tuning", "no such tuning file (shipped: "
                    + ConfigResolver.names("tuning", ".tuning") + ")");
        }
        FirmwareConfig base = FirmwareConfig.load(basePath);
        RecordHeader.Builder record = RecordHeader.begin("Tuning from bump tests"
                + (plant != null ? ": " + plant : ""));
        record.input("base tuning", basePath, ConfigResolver.displayName(basePath));
        Path plantPath = null;
        PlantConfig pc = null;
        if (plant != null) {
            plantPath = ConfigResolver.resolve(plant, "plants", ".plant", null);
            if (plantPath == null) {
                throw new ConfigException(plant, 0, "--plant", "no such plant file (shipped: "
                        + ConfigResolver.names("plants", ".plant") + ")");
            }
            pc = ScenarioRunner.loadPlant(plantPath);
            record.input("plant", plantPath, ConfigResolver.displayName(plantPath));
        }
        Files.createDirectories(out);
        List<String> sources = new ArrayList<>();
        List<String> written = new ArrayList<>();
        TuningDesign.Fits fits;
        List<String> analysisNotes = new ArrayList<>();
        if (!trends.isEmpty()) {
            Map<TrendSignal, String> map = TrendCsv.columnMap(columns);
            List<Trend> data = new ArrayList<>();
            for (Path t : trends) {
                Trend tr = TrendCsv.read(t, t.toString(), map, Set.of(TrendSignal.TIME), EnumSet.allOf(TrendSignal.class));
                data.add(tr);
                record.input("trend", t, t.toString());
                sources.add(String.format(Locale.ROOT, "recorded trend %s (SHA-256 %s, %d rows, %.1f s)", t, tr.sha256(),
                        tr.size(), tr.durationS()));
            }
            BumpAnalysis.Result r = BumpAnalysis.analyse(data);
            fits = r.fits();
            analysisNotes.addAll(r.notes());
        } else {
            List<Trend> bumps = new ArrayList<>();
            for (PlantBumps.Input in : PlantBumps.Input.values()) {
                Trend tr = PlantBumps.run(pc, in);
                bumps.add(tr);
                Path f = out.resolve("bump-" + in.name().toLowerCase(Locale.ROOT) + ".csv");
                try (AtomicOutput a = new AtomicOutput(f)) {
                    TrendCsv.write(tr, a.writer());
                    a.commit();
                }
                written.add(f.toString());
            }
            sources.add(String.format(Locale.ROOT, "simulated bump tests on %s (%s) at %.0f %% load, pressure control in automatic: feed"
                    + " valve %+.0f %% of travel for %.0f s, feed flow and steam flow each %+.0f %% of rating for %.0f s,"
                    + " steps at %.0f s; records bump-valve.csv, bump-feed.csv, bump-steam.csv",
                    ConfigResolver.displayName(plantPath), pc.name(), 100 * pc.nominalLoadFrac(),
                    100 * PlantBumps.VALVE_STEP_FRAC, PlantBumps.VALVE_DURATION_S, 100 * PlantBumps.FLOW_STEP_FRAC,
                    PlantBumps.LEVEL_DURATION_S, PlantBumps.STEP_AT_S));
            fits = BumpAnalysis.fitPlantBumps(bumps.get(0), bumps.get(1), bumps.get(2));
        }
        List<BumpFit> fitList = new ArrayList<>();
        for (BumpFit f : new BumpFit[] {fits.valve(), fits.feed(), fits.steam()}) {
            if (f != null) {
                fitList.add(f);
                o.printf(Locale.ROOT, "fit %s: %s; RMS %.3g, fit %.1f %%%n", f.title(), f.parameterText(), f.rms(), f.fitPercent());
            }
        }
        for (String n : analysisNotes) {
            o.println("note: " + n);
        }
        TuningDesign.Design d = TuningDesign.design(fits, base.scanPeriodS(), tc, loopSet, base.feedSlave());
        Map<String, String> changes = TuningFileWriter.changes(d);
        for (Map.Entry<String, String> e : changes.entrySet()) {
            o.printf("tuned %-34s %s%n", e.getKey(), e.getValue());
        }
        for (String n : d.notes()) {
            o.println("note: " + n);
        }
        Path tunedPath = out.resolve("tuned.tuning");
        writeTuned(basePath, base, d, changes, sources, fitList, tunedPath);
        written.add(0, tunedPath.toString());
        // verification: the shipped scenarios that use the base tuning
        List<Path> scenarios = new ArrayList<>();
        byte[] baseBytes = Files.readAllBytes(basePath);
        for (String name : ConfigResolver.names("scenarios", ".scenario")) {
            Scenario sc = Runs.load(name);
            Path st = ConfigResolver.resolve(sc.tuning(), "tuning", ".tuning", sc.path());
            if (st != null && Arrays.equals(Files.readAllBytes(st), baseBytes)
                    && (pc == null || samePlant(sc, pc))) {
                scenarios.add(sc.path());
            }
        }
        Verification.Result v = null;
        String vNote;
        if (scenarios.isEmpty()) {
            vNote = "No shipped scenario uses the base tuning" + (pc == null ? "" : " on this plant") + "; nothing to compare.";
            o.println(vNote);
        } else {
            v = Verification.run(scenarios, basePath, tunedPath, pc == null ? null : plantPath);
            vNote = "";
            o.print(v.text());
        }
        Path report = out.resolve("tune-report.html");
        written.add(report.toString());
        AtomicOutput.write(report, TuneReport.render(new TuneReport.Content(
                pc != null ? pc.name() : trends.toString(), sources, fitList, d, ConfigResolver.displayName(basePath),
                analysisNotes, v, vNote, written), record.finish()));
        o.println("wrote " + String.join(", ", written));
        if (v != null && !v.ok()) {
            err.printf(Locale.ROOT, "tune: the tuned file passes %d scenarios, the base %d%n", v.tunedPassed(), v.basePassed());
            return ExitCode.FAILED;
        }
        return ExitCode.OK;
    }

    private static boolean samePlant(Scenario sc, PlantConfig pc) throws ConfigException, IOException {
        Path p = ConfigResolver.resolve(sc.plant(), "plants", ".plant", sc.path());
        return p != null && ScenarioRunner.loadPlant(p).name().equals(pc.name());
    }

    /** Writes tuned.tuning and the interlocks file it names beside it; reads both back as the firmware would. */
    private void writeTuned(Path basePath, FirmwareConfig base, TuningDesign.Design d, Map<String, String> changes,
                            List<String> sources, List<BumpFit> fits, Path tunedPath) throws IOException, ConfigException {
        Path ilName = Path.of(base.interlocksFileName()).getFileName();
        Path ilSource = basePath.toAbsolutePath().getParent().resolve(base.interlocksFileName());
        AtomicOutput.write(out.resolve(ilName.toString()), Files.readString(ilSource, StandardCharsets.UTF_8));
        List<String> header = new ArrayList<>();
        header.add("Tuned by drumloop tune from " + ConfigResolver.displayName(basePath) + ".");
        header.add("Tuned settings are a starting point for bench tests: confirm them on the plant. A test bench, not a");
        header.add("safety system; alarm and trip settings come from the boiler maker, classification rules and local codes.");
        header.add("");
        header.add("Data:");
        for (String s : sources) {
            header.add("  " + s);
        }
        header.add("Fits (least squares, Levenberg-Marquardt; value +- standard error, SI units):");
        for (BumpFit f : fits) {
            header.add("  " + f.title() + ": " + f.parameterText() + String.format(Locale.ROOT, "; fit %.1f %%", f.fitPercent()));
        }
        header.add("Rules: SIMC (S. Skogestad, J. Process Control 13, 2003): FOPDT Kc = tau1/(k (tauC + theta)),");
        header.add("  tauI = min(tau1, 4 (tauC + theta)); integrating Kc = 1/(k' (tauC + theta)), tauI = 4 (tauC + theta);");
        header.add("  default tauC = theta; half rule for lags and inverse response, plus half the scan period;");
        header.add("  slave first, master against the closed slave; tracking time = integral time, derivative off (PI).");
        for (TuningDesign.LoopTuning l : new TuningDesign.LoopTuning[] {d.slave(), d.master(), d.single()}) {
            if (l != null) {
                header.add(String.format(Locale.ROOT, "  %s: k = %.4g, tau1 = %s, theta = %.4g s, tauC = %.4g s; %s", l.loop().word(),
                        l.model().k(), l.integrating() ? "integrating" : String.format(Locale.ROOT, "%.4g s", l.model().tau1S()),
                        l.model().thetaS(), l.tauCS(), l.basis()));
            }
        }
        if (d.swell() != null) {
            header.add("  swell compensation: " + d.swell().basis());
        }
        for (String n : d.notes()) {
            header.add("  note: " + n);
        }
        List<String> lines = TuningFileWriter.write(Files.readAllLines(basePath, StandardCharsets.UTF_8), changes, header,
                ilName.toString().equals(base.interlocksFileName()) ? null : ilName.toString());
        AtomicOutput.write(tunedPath, String.join("\n", lines) + "\n");
        FirmwareConfig.load(tunedPath); // the firmware reads it back, or the error names the line
    }

    static Set<TuningDesign.Loop> loops(String text) throws ConfigException {
        Set<TuningDesign.Loop> s = EnumSet.noneOf(TuningDesign.Loop.class);
        for (String w : text.split(",")) {
            TuningDesign.Loop l = TuningDesign.Loop.byWord(w);
            if (l == null) {
                throw new ConfigException("--loops", 0, w.strip(), "expected slave, master, single or swell");
            }
            s.add(l);
        }
        return s;
    }

    static TuningDesign.TauC tauC(String text) throws ConfigException {
        if (text == null) {
            return TuningDesign.TauC.defaults();
        }
        double[] v = {Double.NaN, Double.NaN, Double.NaN};
        for (String part : text.split(",")) {
            String[] kv = part.split("=", 2);
            double x;
            try {
                x = Double.parseDouble(kv[kv.length - 1].strip());
            } catch (NumberFormatException e) {
                throw new ConfigException("--tau-c", 0, part, "expected seconds, e.g. 300 or master=300");
            }
            if (!(x >= 0) || Double.isInfinite(x)) {
                throw new ConfigException("--tau-c", 0, part, "must be a non-negative number of seconds");
            }
            if (kv.length == 1) {
                v[1] = x;
                v[2] = x;
                continue;
            }
            switch (kv[0].strip()) {
                case "slave" -> v[0] = x;
                case "master" -> v[1] = x;
                case "single" -> v[2] = x;
                default -> throw new ConfigException("--tau-c", 0, kv[0], "expected slave, master or single");
            }
        }
        return new TuningDesign.TauC(v[0], v[1], v[2]);
    }
}
