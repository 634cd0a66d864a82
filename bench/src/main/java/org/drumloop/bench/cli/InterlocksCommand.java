package org.drumloop.bench.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.ExitCode;
import org.drumloop.bench.record.HtmlReport;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.config.ConfigException;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code drumloop interlocks}: print the cause-and-effect table of a tuning's interlocks. */
@Command(name = "interlocks", mixinStandardHelpOptions = true,
        description = "Print the cause-and-effect table (alarms, trips, voting, delays, actions) of a tuning.",
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {"0:printed", "2:bad tuning or interlocks file"})
public final class InterlocksCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--tuning", paramLabel = "FILE", defaultValue = "default",
            description = "tuning file or name of a shipped tuning (default: default)")
    String tuning;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Path p = ConfigResolver.resolve(tuning, "tuning", ".tuning", null);
        if (p == null) {
            err.println(tuning + ": no such tuning file (shipped: " + ConfigResolver.names("tuning", ".tuning") + ")");
            return ExitCode.BAD_INPUT;
        }
        try {
            FirmwareConfig fc = FirmwareConfig.load(p);
            o.println("Cause and effect: " + ConfigResolver.displayName(java.nio.file.Paths.get(fc.interlocks().fileName())));
            o.println();
            o.print(fc.interlocks().causeEffectText());
            o.println();
            o.println(HtmlReport.CAUTION);
            return ExitCode.OK;
        } catch (ConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        }
    }
}
