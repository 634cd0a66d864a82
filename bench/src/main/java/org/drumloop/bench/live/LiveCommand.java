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
import org.drumloop.bench.hil.LinkOptions;
import org.drumloop.bench.hil.ServerOptions;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.config.ConfigException;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.map.ChannelMap;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
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
            "With --rig the firmware runs in real time against a PLC or test rig over Modbus TCP or RTU (laid out by"
                + " --map) and WRITES valve demand, pump run commands and fuel cut-off to it. The page then shows the"
                + " firmware's view only, under a banner that cannot be hidden, asks before every command, and refuses"
                + " plant actions (faults, trips, load changes).",
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

    @Option(names = "--map", paramLabel = "NAME|FILE", defaultValue = "aux-microamp",
            description = "channel map for --loopback (default aux-microamp); required with --rig")
    String map;

    @Option(names = "--rig",
            description = "drive real hardware: the firmware in real time as Modbus client (master) of the device at --tcp"
                    + " or --rtu, no plant in this process")
    boolean rig;

    @Mixin
    LinkOptions link = new LinkOptions();

    @Mixin
    ServerOptions limits = new ServerOptions();

    /** Printed first with --rig: the same caution as drive-rig. */
    static final String RIG_BANNER = String.join(System.lineSeparator(),
            "*****************************************************************************",
            "* CAUTION: live --rig WRITES valve demand, pump run commands and fuel        *",
            "* cut-off to the connected device. Never connect to a live boiler without a  *",
            "* permit to work and licensed supervision. A test bench, not a safety        *",
            "* system: interlock settings come from the boiler maker, classification      *",
            "* rules and local codes.                                                     *",
            "*****************************************************************************");

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (rig) {
            out.println(RIG_BANNER);
            out.flush();
            String bad = rigProblem();
            if (bad != null) {
                err.println(bad);
                return ExitCode.BAD_INPUT;
            }
        } else if (given("--tcp", "--rtu", "--baud", "--parity", "--stop", "--unit")) {
            err.println("--tcp, --rtu, --baud, --parity, --stop and --unit are for --rig");
            return ExitCode.BAD_INPUT;
        }
        if (!loopback && given(ServerOptions.NAMES)) {
            err.println("--max-connections and --idle-timeout are for --loopback, where the plant is served over Modbus TCP");
            return ExitCode.BAD_INPUT;
        }
        if (limits.problem() != null) {
            err.println(limits.problem());
            return ExitCode.BAD_INPUT;
        }
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
            session = build(err);
            if (session == null) {
                return ExitCode.BAD_INPUT;
            }
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
            if (session instanceof AutoCloseable) {
                ((AutoCloseable) session).close();
            }
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
        if (info.hardware()) {
            out.println("  CONNECTED TO HARDWARE: " + info.ioDescription() + "; fail-safe on a stalled scan: "
                    + ((RigLiveSession) session).executive().watchdog().failSafe());
        }
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

    /** Options given on the command line (not defaults). */
    private boolean given(String... names) {
        CommandLine.ParseResult r = spec.commandLine().getParseResult();
        for (String n : names) {
            if (r != null && r.hasMatchedOption(n)) {
                return true;
            }
        }
        return false;
    }

    /** What is wrong with the options of a --rig session, or null. */
    private String rigProblem() {
        if (loopback) {
            return "give --rig or --loopback, not both";
        }
        for (String o : new String[] {"--scenario", "--plant", "--load", "--seed"}) {
            if (given(o)) {
                return o + ": not used with --rig: there is no simulated plant, the rig is the plant";
            }
        }
        if (speed != 1.0) {
            return "--speed: the firmware drives hardware in real time; --rig runs at 1x only";
        }
        if (!given("--map")) {
            return "--map: give the channel map of the rig (a file, or a name from config/maps/)";
        }
        return link.problem(null);
    }

    /**
     * The firmware against the rig: map checked for the control signals (every problem printed,
     * then null), tuning and interlocks loaded.
     */
    private LiveSession buildRig(PrintWriter err) throws ConfigException {
        Path m = ConfigResolver.resolve(map, "maps", ".csv", null);
        if (m == null) {
            throw new ConfigException(map, 0, "--map", "no such channel map file or shipped map name");
        }
        java.util.List<ConfigException> problems = ChannelMap.validate(m);
        ChannelMap cm = null;
        if (problems.isEmpty()) {
            cm = ChannelMap.load(m);
            problems = cm.requireSignals(RigLiveSession.REQUIRED_SIGNALS);
        }
        if (!problems.isEmpty()) {
            for (ConfigException e : problems) {
                err.println(e.getMessage());
            }
            return null;
        }
        if (link.unit() != null) {
            cm = cm.withUnitId(link.unit());
        }
        Path t = ConfigResolver.resolve(tuning, "tuning", ".tuning", null);
        if (t == null) {
            throw new ConfigException(tuning, 0, "--tuning", "no such tuning file or shipped tuning name");
        }
        FirmwareConfig fc = FirmwareConfig.load(t);
        RigClient.Options opts = RigClient.Options.defaults();
        RigClient client = link.isRtu() ? RigClient.rtu(cm, link.serial(), opts) : RigClient.tcp(cm, link.tcp(null), opts);
        String where = link.isRtu() ? "Modbus RTU " + link.serial().device() : "Modbus TCP " + link.tcp(null);
        return new RigLiveSession(client, fc, t, where + ", map " + m.getFileName());
    }

    private LiveSession build(PrintWriter err) throws ConfigException, IOException {
        if (rig) {
            return buildRig(err);
        }
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
        return new LoopbackLiveSession(sc, ChannelMap.load(m), limits.limits());
    }
}
