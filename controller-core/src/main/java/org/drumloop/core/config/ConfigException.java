package org.drumloop.core.config;

import java.nio.file.Path;

/**
 * A problem in a user file (tuning, interlocks, channel map, scenario), located by file, line and
 * key so that the user can go straight to it. {@link #getMessage()} reads
 * {@code file:line: key: message}.
 */
public class ConfigException extends Exception {
    private final String file;
    private final int line;
    private final String key;
    private final String problem;

    /**
     * @param file the file as the user named it
     * @param line 1-based line number, or 0 when the problem concerns the whole file
     * @param key  the key, column or word that is wrong (may be empty)
     * @param problem what is wrong, in words a commissioning engineer understands
     */
    public ConfigException(String file, int line, String key, String problem) {
        super(format(file, line, key, problem));
        this.file = file;
        this.line = line;
        this.key = key == null ? "" : key;
        this.problem = problem;
    }

    public ConfigException(Path file, int line, String key, String problem) {
        this(file.toString(), line, key, problem);
    }

    public String file() { return file; }

    public int line() { return line; }

    public String key() { return key; }

    public String problem() { return problem; }

    static String format(String file, int line, String key, String problem) {
        StringBuilder sb = new StringBuilder(file);
        if (line > 0) {
            sb.append(':').append(line);
        }
        sb.append(": ");
        if (key != null && !key.isEmpty()) {
            sb.append(key).append(": ");
        }
        return sb.append(problem).toString();
    }
}
