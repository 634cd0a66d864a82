package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import org.drumloop.bench.ExitCode;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.core.Firmware;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.safety.InterlockFile;
import org.drumloop.modbus.map.ChannelMap;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

/** {@code drumloop check FILE...}: validate user files by their extension. */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = {"Validate scenario, plant, tuning, interlocks and channel-map files (.scenario, .plant,"
                + " .tuning, .interlocks, .csv).",
            "Every error is listed as file:line: message; a scenario is checked together with the plant and"
                + " tuning it names."},
        exitCodeListHeading = "%nExit codes:%n", exitCodeList = {"0:every file is valid", "2:an error was found"})
public final class CheckCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "FILE", description = "files to check")
    List<Path> files = new ArrayList<>();

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        int errors = 0;
        for (Path f : files) {
            List<String> problems = check(f);
            for (String p : problems) {
                err.println(p);
            }
            if (problems.isEmpty()) {
                o.println(f + ": ok");
            }
            errors += problems.size();
        }
        return errors == 0 ? ExitCode.OK : ExitCode.BAD_INPUT;
    }

    /** Every problem found in one file, as {@code file:line: message} lines; empty when valid. */
    public static List<String> check(Path f) {
        List<String> out = new ArrayList<>();
        String name = f.getFileName() == null ? f.toString() : f.getFileName().toString();
        if (!Files.isRegularFile(f)) {
            out.add(f + ": no such file");
            return out;
        }
        try {
            if (name.endsWith(".scenario")) {
                Scenario sc = ScenarioParser.load(f);
                ScenarioRunner.Setup s = ScenarioRunner.setup(sc);
                ScenarioRunner.bind(sc, new Firmware(s.tuning()).interlocks());
            } else if (name.endsWith(".plant")) {
                ScenarioRunner.loadPlant(f);
            } else if (name.endsWith(".tuning")) {
                FirmwareConfig.load(f);
            } else if (name.endsWith(".interlocks")) {
                InterlockFile.load(f);
            } else if (name.endsWith(".csv")) {
                for (ConfigException e : ChannelMap.validate(f)) {
                    out.add(e.getMessage());
                }
            } else {
                out.add(f + ": unknown kind of file (expected .scenario, .plant, .tuning, .interlocks or .csv)");
            }
        } catch (ConfigException e) {
            out.add(e.getMessage());
        } catch (IOException e) {
            out.add(f + ": cannot read: " + e.getMessage());
        }
        return out;
    }
}
