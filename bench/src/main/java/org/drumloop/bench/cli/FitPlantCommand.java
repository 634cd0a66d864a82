package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.Callable;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.ExitCode;
import org.drumloop.bench.record.AtomicOutput;
import org.drumloop.bench.record.RecordHeader;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.bench.tune.FitReport;
import org.drumloop.bench.tune.PlantFileWriter;
import org.drumloop.bench.tune.PlantFit;
import org.drumloop.bench.tune.Trend;
import org.drumloop.bench.tune.TrendCsv;
import org.drumloop.bench.tune.TrendSignal;
import org.drumloop.core.config.ConfigException;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantKey;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code drumloop fit-plant}: calibrate plant-file values to a recorded trend. */
@Command(name = "fit-plant", mixinStandardHelpOptions = true,
        description = {"Calibrate uncertain values of a plant file to a recorded trend: the recorded steam flow, feed"
                + " flow, firing (or heat) and feed temperature drive the plant model, and Levenberg-Marquardt least"
                + " squares moves the chosen values, within the plant file's ranges, until the computed drum level and"
                + " pressure match the recorded ones. Writes the start file with the fitted values (each line marked)"
                + " and a report beside it. The trend must start at steady state.",
            "Candidates: bubble_residence_time, steam_under_surface_volume, loop_friction, total_metal_mass,"
                + " riser_metal_mass, drum_metal_mass, burner_time_constant (any numeric key)."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:fitted and written",
            "2:bad input (file:line: column: message), or the fit failed",
            "3:cannot write the output"})
public final class FitPlantCommand implements Callable<Integer> {
    /** Keys fitted when --fit is not given. */
    static final String DEFAULT_KEYS = "bubble_residence_time,steam_under_surface_volume";

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--plant", required = true, paramLabel = "START", description = "start plant file or shipped name")
    String plant;

    @Option(names = "--trend", required = true, paramLabel = "CSV", description = "recorded trend: time, drum_level,"
            + " drum_pressure, steam_flow, feed_flow, firing or heat, optionally feed_temp; units in the header")
    Path trend;

    @Option(names = "--column", paramLabel = "NAME=HEADER", description = "map a signal to a header (repeatable)")
    List<String> columns = new ArrayList<>();

    @Option(names = "--fit", paramLabel = "KEY,KEY,...", defaultValue = DEFAULT_KEYS,
            description = "plant-file keys to fit (default: " + DEFAULT_KEYS + ")")
    String fit;

    @Option(names = "--threads", defaultValue = "2", paramLabel = "N",
            description = "simulations run at once for the Jacobian (default 2)")
    int threads;

    @Option(names = "--out", required = true, paramLabel = "FITTED.plant", description = "the fitted plant file to write")
    Path out;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        return Guarded.run("fit-plant", err, out, () -> run(o));
    }

    private int run(PrintWriter o) throws ConfigException, IOException {
        Path startPath = ConfigResolver.resolve(plant, "plants", ".plant", null);
        if (startPath == null) {
            throw new ConfigException(plant, 0, "--plant", "no such plant file (shipped: "
                    + ConfigResolver.names("plants", ".plant") + ")");
        }
        PlantConfig start = ScenarioRunner.loadPlant(startPath);
        RecordHeader.Builder record = RecordHeader.begin("Plant file fitted to a recorded trend: " + trend.getFileName());
        record.input("start plant", startPath, ConfigResolver.displayName(startPath));
        List<PlantKey> keys = keys(fit);
        if (!(threads >= 1 && threads <= 64)) {
            throw new ConfigException("--threads", 0, String.valueOf(threads), "must be 1 to 64");
        }
        Set<TrendSignal> required = EnumSet.of(TrendSignal.TIME, TrendSignal.DRUM_LEVEL, TrendSignal.DRUM_PRESSURE,
                TrendSignal.STEAM_FLOW, TrendSignal.FEED_FLOW);
        Trend t = TrendCsv.read(trend, trend.toString(), TrendCsv.columnMap(columns), required,
                EnumSet.of(TrendSignal.FIRING, TrendSignal.HEAT, TrendSignal.FEED_TEMP));
        if (!t.has(TrendSignal.FIRING) && !t.has(TrendSignal.HEAT)) {
            throw new ConfigException(trend.toString(), 1, "firing", "no firing or heat column: the model needs the"
                    + " heat input (map yours with --column firing=HEADER or --column heat=HEADER)");
        }
        record.input("trend", trend, trend.toString());
        long t0 = System.nanoTime();
        PlantFit.Result r = PlantFit.fit(start, PlantFit.Data.of(t), keys, threads);
        double wallS = (System.nanoTime() - t0) * 1e-9;
        if (!r.after().valid()) {
            throw new IllegalStateException("with the fitted values the plant leaves its valid range on this record");
        }
        for (int j = 0; j < keys.size(); j++) {
            o.printf(Locale.ROOT, "%-28s %12.6g -> %12.6g +- %.2g (SI)%n", keys.get(j).key(), r.start()[j], r.values()[j],
                    r.stdErr()[j]);
        }
        o.printf(Locale.ROOT, "RMS level %.3g -> %.3g mm, pressure %.3g -> %.3g kPa; %d iterations, %d simulations,"
                + " %.2f s%n", r.rmsLevelBeforeM() * 1e3, r.rmsLevelM() * 1e3, r.rmsPressureBeforePa() / 1e3,
                r.rmsPressurePa() / 1e3, r.iterations(), r.evaluations(), wallS);
        List<String> lines = PlantFileWriter.write(Files.readAllLines(startPath, StandardCharsets.UTF_8), keys, r.values(),
                PlantFileWriter.header(trend.getFileName().toString(), t.sha256(), r));
        ScenarioRunner.loadPlant(write(out, lines)); // the fitted file reads back, or the error names its line
        Path report = reportPath(out);
        AtomicOutput.write(report, FitReport.render(record.finish(), ConfigResolver.displayName(startPath),
                out.toString(), r, t.tS(), t.get(TrendSignal.DRUM_PRESSURE), wallS));
        o.println("wrote " + out + ", " + report);
        return ExitCode.OK;
    }

    private static Path write(Path target, List<String> lines) throws IOException {
        AtomicOutput.write(target, String.join("\n", lines) + "\n");
        return target;
    }

    /** {@code DIR/NAME.plant} gives {@code DIR/NAME-fit.html}. */
    static Path reportPath(Path fitted) {
        String name = fitted.getFileName().toString();
        String stem = name.endsWith(".plant") ? name.substring(0, name.length() - ".plant".length()) : name;
        return fitted.resolveSibling(stem + "-fit.html");
    }

    static List<PlantKey> keys(String text) throws ConfigException {
        List<PlantKey> keys = new ArrayList<>();
        for (String w : text.split(",")) {
            PlantKey k = PlantKey.of(w.strip());
            if (k == null || !k.numeric()) {
                throw new ConfigException("--fit", 0, w.strip(), k == null ? "no such plant-file key" : "not a numeric key");
            }
            if (!keys.contains(k)) {
                keys.add(k);
            }
        }
        return keys;
    }
}
