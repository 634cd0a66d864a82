package org.drumloop.bench.live;

import java.io.IOException;
import java.io.PrintWriter;
import java.net.BindException;
import java.net.InetAddress;
import java.net.UnknownHostException;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.ExitCode;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.core.config.ConfigException;
import org.drumloop.modbus.map.ChannelMap;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code drumloop live}: runs the closed loop in real time (or N× real time) and serves the live
 * page on 127.0.0.1 for training and bench work.
 */
@Command(name = "live", mixinStandardHelpOptions = true, subcommands = LiveBenchCommand.class,
        description = {"Run the closed loop in real time and watch and operate it in a web browser: process diagram,"
                + " trends, controller faceplate, alarms, and an instructor panel to inject faults and load changes."
                + " Save the session as a scenario file and replay it with 'drumloop run'.",
            "",
            "A simulator and test bench, not a safety system: interlock settings come from the boiler maker,"
                + " classification rules and local codes."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:stopped normally", "2:bad input or option (file:line: word: message)",
            "3:cannot listen on the address and port", "4:internal error"})
public final class LiveCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--port", paramLabel = "N", defaultValue = "8080", description = "TCP port of the page (default 8080; 0 picks a free one)")
    int port;

    @Option(names = "--bind", paramLabel = "ADDRESS", defaultValue = "127.0.0.1",
            description = "address to listen on (default 127.0.0.1: this computer only)")
    String bind;

    @Option(names = "--scenario", paramLabel = "FILE",
            description = "start from a scenario (plant, tuning, load, seed) and play its timed statements")
    String scenario;

    @Option(names = "--plant", paramLabel = "NAME|FILE", defaultValue = "aux-boiler",
            description = "plant when no --scenario is given (default aux-boiler)")
    String plant;

    @Option(names = "--tuning", paramLabel = "NAME|FILE", defaultValue = "default",
            description = "tuning when no --scenario is given (default: default)")
    String tuning;

    @Option(names = "--load", paramLabel = "PERCENT", defaultValue = "70",
            description = "initial steam demand in %% of rating when no --scenario is given (default 70)")
    double loadPercent;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "plant noise seed when no --scenario is given")
    long seed;

    @Option(names = "--speed", paramLabel = "N", defaultValue = "1", description = "N times real time (0.1 to 100; default 1)")
    double speed;

    @Option(names = "--loopback",
            description = "run the firmware's I/O over Modbus TCP on 127.0.0.1: plant served by the bridge's image server,"
                    + " firmware as master through the rig client, scan by scan")
    boolean loopback;

    @Option(names = "--map", paramLabel = "NAME|FILE", defaultValue = "aux-4-20ma",
            description = "channel map for --loopback (default aux-4-20ma)")
    String map;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (!(speed >= LiveServer.SPEED_MIN && speed <= LiveServer.SPEED_MAX)) {
            err.println("--speed: expected " + LiveAction.fmt(LiveServer.SPEED_MIN) + " to "
                    + LiveAction.fmt(LiveServer.SPEED_MAX) + ", got " + LiveAction.fmt(speed));
            return ExitCode.BAD_INPUT;
        }
        if (!(loadPercent >= 0 && loadPercent <= CommandParser.STEAM_DEMAND_MAX_PERCENT)) {
            err.println("--load: expected 0 to 120 %, got " + LiveAction.fmt(loadPercent));
            return ExitCode.BAD_INPUT;
        }
        if (port < 0 || port > 65_535) {
            err.println("--port: expected 0 to 65535, got " + port);
            return ExitCode.BAD_INPUT;
        }
        InetAddress address;
        try {
            address = InetAddress.getByName(bind);
        } catch (UnknownHostException e) {
            err.println("--bind: unknown address '" + bind + "'");
            return ExitCode.BAD_INPUT;
        }
        LiveSession session;
        try {
            session = build();
        } catch (ConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        } catch (IOException e) {
            err.println("cannot read: " + e.getMessage());
            return ExitCode.BAD_INPUT;
        }
        LiveLoop loop = new LiveLoop(session, speed);
        LiveServer server;
        try {
            server = new LiveServer(loop, address, port, LiveServer.DEFAULT_BROADCAST_MS);
        } catch (BindException e) {
            err.println("cannot listen on " + bind + ":" + port + ": " + e.getMessage() + "; choose another with --port");
            return ExitCode.IO_ERROR;
        }
        CountDownLatch stopped = new CountDownLatch(1);
        Thread hook = new Thread(() -> {
            server.close();
            try {
                loop.stop();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            if (session instanceof AutoCloseable) {
                try {
                    ((AutoCloseable) session).close();
                } catch (Exception e) {
                    // shutting down anyway
                }
            }
            stopped.countDown();
        }, "live-shutdown");
        Runtime.getRuntime().addShutdownHook(hook);
        loop.start();
        server.start();
        LiveInfo info = session.info();
        out.println("drumloop live: " + info.plantName() + " (" + info.description() + "), tuning " + info.tuningName()
                + ", " + LiveAction.fmt(speed) + "x real time");
        out.println("  open " + server.uri() + " in a web browser; Ctrl-C stops the bench");
        out.println("  SIMULATOR / TEST BENCH, not a safety system: interlock settings come from the boiler maker,");
        out.println("  classification rules and local codes.");
        if (!address.isLoopbackAddress()) {
            out.println("  WARNING: listening on " + bind + ": anyone who can reach this address can operate the bench.");
        }
        out.flush();
        stopped.await();
        return ExitCode.OK;
    }

    private LiveSession build() throws ConfigException, IOException {
        Scenario sc;
        if (scenario != null) {
            Path p = ConfigResolver.resolve(scenario, "scenarios", ".scenario", null);
            if (p == null) {
                throw new ConfigException(scenario, 0, "--scenario", "no such scenario file or shipped scenario name");
            }
            sc = ScenarioParser.load(p);
        } else {
            sc = SimLiveSession.idleScenario(plant, tuning, loadPercent / 100.0, seed);
        }
        if (!loopback) {
            return new SimLiveSession(sc);
        }
        Path m = ConfigResolver.resolve(map, "maps", ".csv", null);
        if (m == null) {
            throw new ConfigException(map, 0, "--map", "no such channel map file or shipped map name");
        }
        return new LoopbackLiveSession(sc, ChannelMap.load(m));
    }
}
