package org.drumloop.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;

import picocli.CommandLine;

/**
 * Every command's --help page, hidden ones included, found by walking the command tree that the
 * drumloop command builds (so a new command is covered the day it is added): it prints a usage
 * page, exits 0, and neither the command nor the command-line library writes a warning.
 */
class HelpPagesTest {

    @Test
    void everyCommandPrintsItsHelpWithoutAWarning() {
        List<List<String>> paths = new ArrayList<>();
        collect(Main.commandLine(), new ArrayList<>(), paths);
        assertTrue(paths.size() >= 12, "commands found: " + paths);
        List<String> problems = new ArrayList<>();
        PrintStream stderr = System.err;
        for (List<String> path : paths) {
            ByteArrayOutputStream library = new ByteArrayOutputStream();
            StringWriter out = new StringWriter();
            StringWriter err = new StringWriter();
            List<String> args = new ArrayList<>(path);
            args.add("--help");
            int code;
            // the library reports format problems on System.err while it renders the page
            System.setErr(new PrintStream(library, true, StandardCharsets.UTF_8));
            try {
                code = Main.execute(new PrintWriter(out), new PrintWriter(err), args.toArray(new String[0]));
            } finally {
                System.setErr(stderr);
            }
            String name = String.join(" ", args);
            if (code != ExitCode.OK) {
                problems.add(name + ": exit " + code);
            }
            if (!out.toString().contains("Usage: drumloop")) {
                problems.add(name + ": no usage page");
            }
            if (!err.toString().isEmpty()) {
                problems.add(name + ": " + err);
            }
            String warnings = library.toString(StandardCharsets.UTF_8);
            if (!warnings.isEmpty()) {
                problems.add(name + ": " + warnings.strip());
            }
        }
        assertEquals(List.of(), problems);
    }

    private static void collect(CommandLine cl, List<String> path, List<List<String>> into) {
        into.add(path);
        for (Map.Entry<String, CommandLine> e : cl.getSubcommands().entrySet()) {
            if (!e.getKey().equals(e.getValue().getCommandName())) {
                continue; // an alias
            }
            List<String> p = new ArrayList<>(path);
            p.add(e.getKey());
            collect(e.getValue(), p, into);
        }
    }
}
