package org.drumloop.bench.record;

import java.nio.file.Path;
import java.util.List;

/**
 * The command line the bench was started with, as a record quotes it: {@code drumloop} followed by
 * every argument, each quoted for a POSIX shell where needed, so the line can be pasted to repeat
 * the run (from the same working directory, which the record also names).
 */
public final class Invocation {
    private static volatile List<String> args;

    private Invocation() {
    }

    /** Remember the arguments of this process's command (set once by the entry point). */
    public static void set(String... a) {
        args = List.of(a);
    }

    /** Forget the arguments once the command is done (a later run in the same process is not from them). */
    public static void clear() {
        args = null;
    }

    /** The command line, or a note that the run did not come from the command line (e.g. a test). */
    public static String text() {
        List<String> a = args;
        if (a == null) {
            return "(not started from the drumloop command line)";
        }
        StringBuilder sb = new StringBuilder("drumloop");
        for (String s : a) {
            sb.append(' ').append(shellQuote(s));
        }
        return sb.toString();
    }

    /** The working directory relative paths on the command line are read from. */
    public static String workingDirectory() {
        return Path.of("").toAbsolutePath().toString();
    }

    /** A word as a POSIX shell reads it back: bare when safe, else in single quotes. */
    static String shellQuote(String s) {
        if (!s.isEmpty() && s.matches("[A-Za-z0-9_./:=+,@%^-]+")) {
            return s;
        }
        return "'" + s.replace("'", "'\\''") + "'";
    }
}
