package org.drumloop.plant;

import java.nio.file.Path;
import java.util.List;

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
    private final transient List<PlantConfigException> all;

    public PlantConfigException(String file, int line, String key, String problem) {
        super(format(file, line, key, problem));
        this.file = file;
        this.line = line;
        this.key = key == null ? "" : key;
        this.problem = problem;
        this.all = List.of(this);
    }

    /**
     * Several problems of one file, reported at once: {@link #getMessage()} has one
     * {@code file:line: key: message} line per problem; file, line and key are those of the first.
     */
    public PlantConfigException(List<PlantConfigException> problems) {
        super(joined(problems));
        PlantConfigException first = problems.get(0);
        this.file = first.file;
        this.line = first.line;
        this.key = first.key;
        this.problem = first.problem;
        this.all = List.copyOf(problems);
    }

    /** Every problem carried (this one alone when it is a single problem). */
    public List<PlantConfigException> problems() { return all; }

    private static String joined(List<PlantConfigException> problems) {
        StringBuilder sb = new StringBuilder();
        for (PlantConfigException p : problems) {
            if (sb.length() > 0) {
                sb.append(System.lineSeparator());
            }
            sb.append(p.getMessage());
        }
        return sb.toString();
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
