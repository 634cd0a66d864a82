package org.drumloop.bench;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;

import org.drumloop.bench.cli.BumpCommand;
import org.drumloop.bench.cli.CheckCommand;
import org.drumloop.bench.cli.DemoCommand;
import org.drumloop.bench.cli.FitPlantCommand;
import org.drumloop.bench.cli.InterlocksCommand;
import org.drumloop.bench.cli.PerfCommand;
import org.drumloop.bench.cli.RunCommand;
import org.drumloop.bench.cli.TuneCommand;
import org.drumloop.bench.record.BuildInfo;
import org.drumloop.bench.record.Invocation;
import org.slf4j.LoggerFactory;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.Logger;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** The {@code drumloop} command: entry point and composition root of the bench. */
@Command(name = "drumloop", mixinStandardHelpOptions = true, versionProvider = Main.Version.class,
        description = {"Bench for boiler drum-level (feedwater) control: runs the controller firmware against a"
                + " simulated drum boiler, scripted test scenarios with acceptance criteria, and records for a"
                + " commissioning file.",
            "",
            "A test bench, not a safety system: interlock settings come from the boiler maker, classification"
                + " rules and local codes."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {
            "0:every run completed and every expectation held",
            "1:an expectation failed",
            "2:bad input (file:line: word: message on stderr) or bad option",
            "3:records could not be written",
            "4:internal error"},
        subcommands = {DemoCommand.class, RunCommand.class, CheckCommand.class, InterlocksCommand.class, BumpCommand.class,
            PerfCommand.class, TuneCommand.class, FitPlantCommand.class,
            CommandLine.HelpCommand.class})
public final class Main implements Runnable {
    /** Subcommands of other parts of the bench, registered when present on the class path. */
    static final String[] OPTIONAL_COMMANDS = {
        "org.drumloop.bench.hil.ServePlantCommand",
        "org.drumloop.bench.hil.DriveRigCommand",
        "org.drumloop.bench.hil.LoopbackCommand",
        "org.drumloop.bench.live.LiveCommand",
    };

    private static volatile boolean verbose;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    /** True when --verbose was given: debug detail and timing lines go to the log. */
    public static boolean verbose() { return verbose; }

    @Option(names = "--verbose", description = "log debug detail and timing lines to stderr",
            scope = CommandLine.ScopeType.INHERIT)
    void setVerbose(boolean on) {
        if (on) {
            verbose = true;
            ((Logger) LoggerFactory.getLogger(org.slf4j.Logger.ROOT_LOGGER_NAME)).setLevel(Level.DEBUG);
        }
    }

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    public static void main(String[] args) {
        System.exit(execute(new PrintWriter(System.out, true), new PrintWriter(System.err, true), args));
    }

    /** Run the command line with the given streams; returns the exit code. */
    public static int execute(PrintWriter out, PrintWriter err, String... args) {
        CommandLine cl = commandLine();
        cl.setOut(out);
        cl.setErr(err);
        Invocation.set(args);
        int code;
        try {
            code = cl.execute(args);
        } finally {
            Invocation.clear();
        }
        out.flush();
        err.flush();
        return code;
    }

    /** The command tree with every subcommand that exists in this build. */
    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        for (String name : OPTIONAL_COMMANDS) {
            try {
                Class<?> c = Class.forName(name);
                cl.addSubcommand(c.getDeclaredConstructor().newInstance());
            } catch (ReflectiveOperationException | LinkageError e) {
                // not part of this build
            }
        }
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            commandLine.getErr().println("drumloop: internal error: " + ex);
            LoggerFactory.getLogger(Main.class).debug("internal error", ex);
            return ExitCode.INTERNAL;
        });
        return cl;
    }

    /** Names of the registered subcommands, for tests and help. */
    public static List<String> subcommandNames() {
        return new ArrayList<>(commandLine().getSubcommands().keySet());
    }

    /** The build as every record names it: project version and git commit. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"drumloop " + BuildInfo.current().describe()};
        }
    }
}
