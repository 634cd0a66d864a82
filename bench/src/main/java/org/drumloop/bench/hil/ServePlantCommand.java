package org.drumloop.bench.hil;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.EnumSet;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.drumloop.bench.ExitCode;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.exec.RealTimeClock;
import org.drumloop.core.io.EngUnit;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.server.ImageServer;
import org.drumloop.modbus.stats.LinkStatistics;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantConfigException;
import org.drumloop.plant.PlantFile;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * {@code drumloop serve-plant}: the simulated plant in real time, served as a Modbus server
 * (slave) so that an external controller can read level, flows and pressure and write the valve
 * demand and pump commands.
 */
@Command(name = "serve-plant", mixinStandardHelpOptions = true,
        description = {"Run the simulated plant in real time and serve it as a Modbus TCP or RTU server (slave)"
                + " laid out by a channel map: an external controller reads the transmitters and writes the"
                + " valve demand, pump run commands and fuel cut-off.",
            "A controller output not yet written keeps the plant's own start state; a stale one holds its last value.",
            "A test bench, not a safety system."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:the run ended", "2:bad input (file:line: key: message) or option", "3:the link or records failed",
            "4:internal error"})
public final class ServePlantCommand implements Callable<Integer> {
    /** Default Modbus TCP address: loopback, an unprivileged port. */
    static final String DEFAULT_TCP = "127.0.0.1:1502";

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--map", paramLabel = "MAP", required = true, description = "channel map (file or name in config/maps)")
    String map;

    @Mixin
    LinkOptions link = new LinkOptions();

    @Mixin
    ServerOptions limits = new ServerOptions();

    @Option(names = "--plant", paramLabel = "FILE", defaultValue = "aux-boiler", description = "plant file (default ${DEFAULT-VALUE})")
    String plant;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "plant noise seed (default ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--load", paramLabel = "PCT", defaultValue = "60", description = "steam demand [%%] (default ${DEFAULT-VALUE})")
    double loadPct;

    @Option(names = "--duration", paramLabel = "S", defaultValue = "0", description = "run time [s]; 0 runs until stopped (default)")
    double durationS;

    @Option(names = "--step", paramLabel = "S", defaultValue = "0.1", description = "plant step [s] (default ${DEFAULT-VALUE})")
    double stepS;

    @Option(names = "--out", paramLabel = "DIR", description = "write link-stats.csv here at the end")
    Path out;

    private boolean given(String... names) {
        for (String n : names) {
            if (spec.commandLine().getParseResult().hasMatchedOption(n)) {
                return true;
            }
        }
        return false;
    }

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        String bad = link.problem(DEFAULT_TCP);
        if (bad == null && link.isRtu() && given(ServerOptions.NAMES)) {
            bad = "--max-connections and --idle-timeout are for Modbus TCP, not --rtu";
        }
        if (bad == null) {
            bad = limits.problem();
        }
        if (bad != null) {
            err.println(bad);
            return ExitCode.BAD_INPUT;
        }
        if (!(stepS >= 0.01 && stepS <= 1.0) || durationS < 0 || !(loadPct >= 0 && loadPct <= 120)) {
            err.println("--step must be 0.01..1 s, --duration >= 0, --load 0..120 %");
            return ExitCode.BAD_INPUT;
        }
        // a served plant must offer every input a controller may read and accept the actuator outputs
        EnumSet<Signal> needed = EnumSet.of(Signal.LEVEL_DP_A, Signal.LEVEL_DP_B, Signal.LEVEL_DP_C, Signal.STEAM_FLOW_DP,
                Signal.FEED_FLOW_DP, Signal.DRUM_PRESSURE, Signal.FEED_VALVE_DEMAND);
        ChannelMap m = HilFiles.map(map, needed, err);
        Path plantPath = HilFiles.find(plant, "plants", ".plant", err);
        if (m == null || plantPath == null) {
            return ExitCode.BAD_INPUT;
        }
        if (link.unit != null) {
            m = m.withUnitId(link.unit);
        }
        PlantConfig pc;
        try {
            pc = PlantFile.load(plantPath);
        } catch (PlantConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        }
        Plant p = new Plant(pc, seed);
        p.initSteadyState(loadPct / 100.0);
        ImageServer server;
        try {
            server = link.isRtu() ? ImageServer.rtu(m, link.serial()) : ImageServer.tcp(m, link.tcp(DEFAULT_TCP), limits.limits());
        } catch (IOException e) {
            err.println("cannot open the Modbus link: " + e.getMessage());
            return ExitCode.IO_ERROR;
        }
        o.println("serving " + plantPath.getFileName() + " with map " + m.file() + " on "
                + (link.isRtu() ? link.serial().device() + " " + link.baud + " baud" : "tcp " + link.tcp(DEFAULT_TCP).host() + ":" + server.port()
                        + " (at most " + limits.maxConnections + " connections, idle timeout " + LoopbackCommand.fmt(limits.idleTimeoutS) + " s)")
                + (durationS > 0 ? " for " + durationS + " s" : " until stopped (Ctrl-C)"));
        o.println("A test bench, not a safety system.");
        o.flush();
        Thread main = Thread.currentThread();
        boolean[] stop = {false};
        Thread hook = new Thread(() -> {
            synchronized (stop) {
                stop[0] = true;
            }
            try {
                main.join(3000);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        });
        Runtime.getRuntime().addShutdownHook(hook);
        try (server) {
            PlantLoop loop = new PlantLoop(p, server, loadPct / 100.0);
            loop.publish(0.0);
            RealTimeClock clock = new RealTimeClock();
            double t0 = clock.nowS();
            long k = 0;
            double nextPrintS = 10.0;
            while (durationS == 0 || k * stepS < durationS) {
                synchronized (stop) {
                    if (stop[0]) {
                        break;
                    }
                }
                clock.waitUntil(t0 + (k + 1) * stepS);
                double tS = k * stepS;
                loop.step(tS, stepS);
                k++;
                if (tS >= nextPrintS) {
                    nextPrintS += 10.0;
                    o.println(String.format(Locale.ROOT, "%8.1f s  level %+7.1f mm  pressure %5.2f barg  steam %5.2f t/h  feed %5.2f t/h  valve %5.1f %%",
                            tS, EngUnit.MM.fromSi(p.levelM()), EngUnit.BARG.fromSi(p.drumPressurePa()),
                            EngUnit.T_PER_H.fromSi(p.steamFlowKgS()), EngUnit.T_PER_H.fromSi(p.feedFlowKgS()),
                            100 * p.feedValvePositionFrac()));
                    o.println("          " + server.statistics().snapshot());
                    o.flush();
                }
            }
            o.println(server.statistics().snapshot());
            if (out != null) {
                Files.createDirectories(out);
                LinkStatistics.writeCsv(out.resolve("link-stats.csv"), server.statistics());
            }
            return ExitCode.OK;
        } catch (IOException e) {
            err.println("cannot write records: " + e.getMessage());
            return ExitCode.IO_ERROR;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return ExitCode.OK;
        } finally {
            try {
                Runtime.getRuntime().removeShutdownHook(hook);
            } catch (IllegalStateException e) {
                // already shutting down
            }
        }
    }
}
