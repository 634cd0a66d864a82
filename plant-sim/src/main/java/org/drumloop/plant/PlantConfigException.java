package org.drumloop.plant;

import java.nio.file.Path;

/**
 * A problem in a plant file, located by file, line and key. {@link #getMessage()} reads
 * {@code file:line: key: message}. Line 0 means the problem concerns the whole file (for example a
 * key that is missing).
 */
public class PlantConfigException extends Exception {
    private final String file;
    private final int line;
    private final String key;
    private final String problem;

    public PlantConfigException(String file, int line, String key, String problem) {
        super(format(file, line, key, problem));
        this.file = file;
        this.line = line;
        this.key = key == null ? "" : key;
        this.problem = problem;
    }

    public PlantConfigException(Path file, int line, String key, String problem) {
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
