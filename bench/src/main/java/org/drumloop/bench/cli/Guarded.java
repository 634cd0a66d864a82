package org.drumloop.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;

import org.drumloop.bench.ExitCode;
import org.drumloop.core.config.ConfigException;

/**
 * Runs the body of a command that reads user data and writes files, and turns its failures into
 * one line on stderr and an exit code: bad input (a file's {@code file:line: column: message}, or
 * data the maths cannot use) 2, an output that cannot be written 3.
 */
final class Guarded {
    /** The command's work; returns its exit code. */
    interface Body {
        int run() throws ConfigException, IOException;
    }

    private Guarded() {
    }

    static int run(String command, PrintWriter err, Path out, Body body) {
        try {
            return body.run();
        } catch (ConfigException e) {
            err.println(e.getMessage());
            return ExitCode.BAD_INPUT;
        } catch (IllegalArgumentException | IllegalStateException e) {
            err.println(command + ": " + e.getMessage());
            return ExitCode.BAD_INPUT;
        } catch (IOException e) {
            err.println(command + ": cannot write " + out + ": " + e.getMessage());
            return ExitCode.IO_ERROR;
        }
    }
}
