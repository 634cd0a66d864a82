package org.drumloop.bench.hil;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.drumloop.bench.ExitCode;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.config.ConfigException;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantConfigException;
import org.drumloop.plant.PlantFile;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code drumloop loopback}: plant and firmware in one process, joined by real Modbus TCP on 127.0.0.1. */
@Command(name = "loopback", mixinStandardHelpOptions = true, subcommands = ModbusBenchCommand.class,
        description = {"Run the simulated plant as a Modbus server and the firmware as a Modbus client against it,"
                + " over real TCP on 127.0.0.1: the self-test of the whole chain and a training rig.",
            "Records in --out: trend.csv, events.csv, link-stats.csv.",
            "A test bench, not a safety system."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:the run completed", "2:bad input (file:line: key: message)", "3:records could not be written",
            "4:internal error"})
public final class LoopbackCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--duration", paramLabel = "S", defaultValue = "60", description = "run time [s] (default ${DEFAULT-VALUE})")
    double durationS;

    @Option(names = "--out", paramLabel = "DIR", description = "folder for the records (default out/loopback)")
    Path out;

    @Option(names = "--map", paramLabel = "MAP", defaultValue = "aux-microamp", description = "channel map (default ${DEFAULT-VALUE})")
    String map;

    @Option(names = "--plant", paramLabel = "FILE", defaultValue = "aux-boiler", description = "plant file (default ${DEFAULT-VALUE})")
    String plant;

    @Option(names = "--tuning", paramLabel = "FILE", defaultValue = "default", description = "tuning file (default ${DEFAULT-VALUE})")
    String tuning;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "plant noise seed (default ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--load", paramLabel = "PCT", defaultValue = "60", description = "steam demand at the start [%%] (default ${DEFAULT-VALUE})")
    double loadPct;

    @Option(names = "--step-load", paramLabel = "PCT", description = "steam demand after a load step [%%]")
    Double stepLoadPct;

    @Option(names = "--step-at", paramLabel = "S", defaultValue = "20", description = "time of the load step [s] (default ${DEFAULT-VALUE})")
    double stepAtS;

    @Mixin
    ServerOptions limits = new ServerOptions();

    @Option(names = "--speed", paramLabel = "1|max", defaultValue = "1",
            description = "1: real time, plant and client on their own threads (default); max: lockstep, as fast as the link allows")
    String speed;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        boolean lockstep;
        if ("max".equalsIgnoreCase(speed)) {
            lockstep = true;
        } else if ("1".equals(speed)) {
            lockstep = false;
        } else {
            err.println("--speed: 1 (real time) or max (lockstep), not '" + speed + "'");
            return ExitCode.BAD_INPUT;
        }
        if (!(durationS > 0) || !(loadPct >= 0 && loadPct <= 120) || (stepLoadPct != null && !(stepLoadPct >= 0 && stepLoadPct <= 120))) {
            err.println("--duration must be positive, --load and --step-load 0..120 %");
            return ExitCode.BAD_INPUT;
        }
        if (limits.problem() != null) {
            err.println(limits.problem());
            return ExitCode.BAD_INPUT;
        }
        ChannelMap m = HilFiles.map(map, HilFiles.CONTROL_SIGNALS, err);
        Path plantPath = HilFiles.find(plant, "plants", ".plant", err);
        Path tuningPath = HilFiles.find(tuning, "tuning", ".tuning", err);
        if (m == null || plantPath == null || tuningPath == null) {
            return ExitCode.BAD_INPUT;
        }
        PlantConfig pc;
        FirmwareConfig fc;
        try {
            pc = PlantFile.load(plantPath);
            fc = FirmwareConfig.load(tuningPath);
        } catch (ConfigException | PlantConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        }
        Path dir = out != null ? out : Paths.get("out", "loopback");
        Loopback.Options opts = new Loopback.Options(durationS, loadPct / 100.0,
                stepLoadPct == null ? Double.POSITIVE_INFINITY : stepAtS, stepLoadPct == null ? loadPct / 100.0 : stepLoadPct / 100.0,
                seed, lockstep, dir, limits.limits());
        o.println("loopback: " + m.file() + " over Modbus TCP on 127.0.0.1, " + (lockstep ? "lockstep" : "real time")
                + ", " + fmt(durationS) + " s");
        try {
            Loopback.Result r = Loopback.run(m, pc, fc, opts, o);
            o.println(String.format(Locale.ROOT, "scans %d, peak level deviation %.1f mm (after the step %.1f mm), %d events",
                    r.scans(), r.maxDeviationM() * 1e3, r.maxDeviationAfterStepM() * 1e3, r.events()));
            o.println(r.client());
            o.println(r.server());
            o.println(String.format(Locale.ROOT, "scan jitter p99 %.3f ms, max %.3f ms, overruns %d",
                    r.scan().jitterP99S() * 1e3, r.scan().jitterMaxS() * 1e3, r.scan().overruns()));
            o.println("records: " + dir);
            return ExitCode.OK;
        } catch (IOException e) {
            err.println("cannot write records: " + e.getMessage());
            return ExitCode.IO_ERROR;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return ExitCode.INTERNAL;
        }
    }

    static String fmt(double v) { return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v); }
}
