package org.drumloop.bench;

/** Process exit codes of the {@code drumloop} command (listed in {@code --help}). */
public final class ExitCode {
    /** Everything ran and every expectation held. */
    public static final int OK = 0;
    /** A run completed but at least one expectation failed. */
    public static final int FAILED = 1;
    /** Bad input: a scenario, plant, tuning, interlocks or map file (or an option) is wrong. */
    public static final int BAD_INPUT = 2;
    /** Records could not be written (disk full, no permission, ...). */
    public static final int IO_ERROR = 3;
    /** An unexpected internal error. */
    public static final int INTERNAL = 4;


    private ExitCode() {
    }
}
