package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.ExitCode;
import org.drumloop.bench.record.AtomicOutput;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.core.config.ConfigException;
import org.drumloop.plant.BumpTest;
import org.drumloop.plant.PlantConfig;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code drumloop bump}: open-loop step test of the plant alone (no controller). */
@Command(name = "bump", mixinStandardHelpOptions = true,
        description = {"Open-loop bump test of the plant alone: from steady state, step one input by a percentage"
                + " of its rating at t = 10 s and record the response to DIR/trend.csv (one row per 100 ms)."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {"0:written", "2:bad input", "3:cannot write"})
public final class BumpCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--plant", paramLabel = "FILE", defaultValue = "aux-boiler",
            description = "plant file or name of a shipped plant (default: aux-boiler)")
    String plant;

    @Option(names = "--input", required = true, paramLabel = "steam|feed|fuel", description = "input to step")
    String input;

    @Option(names = "--step", required = true, paramLabel = "PERCENT", description = "step in %% of the input's rating (may be negative)")
    double stepPercent;

    @Option(names = "--duration", required = true, paramLabel = "SECONDS", description = "length of the record [s]")
    double durationS;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "folder for trend.csv")
    Path out;

    @Option(names = "--seed", defaultValue = "1", description = "transmitter noise seed (default 1)")
    long seed;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        BumpTest.Input in;
        switch (input.toLowerCase(Locale.ROOT)) {
            case "steam": in = BumpTest.Input.STEAM; break;
            case "feed": in = BumpTest.Input.FEED; break;
            case "fuel": in = BumpTest.Input.FUEL; break;
            default:
                err.println("--input: expected steam, feed or fuel, got '" + input + "'");
                return ExitCode.BAD_INPUT;
        }
        if (!(durationS > 10.0 && durationS <= 86_400.0)) {
            err.println("--duration: must be above 10 s (the step comes at 10 s) and at most 86400 s");
            return ExitCode.BAD_INPUT;
        }
        if (!(Math.abs(stepPercent) <= 100.0)) {
            err.println("--step: must be within -100..100 %");
            return ExitCode.BAD_INPUT;
        }
        Path p = ConfigResolver.resolve(plant, "plants", ".plant", null);
        if (p == null) {
            err.println(plant + ": no such plant file (shipped: " + ConfigResolver.names("plants", ".plant") + ")");
            return ExitCode.BAD_INPUT;
        }
        PlantConfig pc;
        try {
            pc = ScenarioRunner.loadPlant(p);
        } catch (ConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        } catch (IOException e) {
            err.println(p + ": cannot read: " + e.getMessage());
            return ExitCode.BAD_INPUT;
        }
        Path target = out.resolve("trend.csv");
        try (AtomicOutput a = new AtomicOutput(target)) {
            BumpTest.Result res = BumpTest.run(pc, in, stepPercent, durationS, seed, a.writer());
            a.commit();
            o.printf(Locale.ROOT, "level: max %+.1f mm %.1f s after the step, min %+.1f mm %.1f s after the step, final %+.1f mm;"
                    + " final pressure %.3f barg%n", res.maxLevelM() * 1000, res.maxLevelTimeS(),
                    res.minLevelM() * 1000, res.minLevelTimeS(), res.finalLevelM() * 1000,
                    org.drumloop.core.io.EngUnit.BARG.fromSi(res.finalPressurePa()));
        } catch (IOException e) {
            err.println("cannot write " + target + ": " + e.getMessage());
            return ExitCode.IO_ERROR;
        }
        o.println("bump test: " + pc.name() + ", " + input + " " + stepPercent + " % at 10 s, " + durationS
                + " s -> " + target);
        return ExitCode.OK;
    }
}
