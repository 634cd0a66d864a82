package org.drumloop.modbus.map;

import java.util.List;

import org.drumloop.core.config.ConfigException;

/** A channel map with problems; carries all of them, each as {@code file:line: key: message}. */
public final class ChannelMapException extends ConfigException {
    private final transient List<ConfigException> problems;

    public ChannelMapException(List<ConfigException> problems) {
        super(problems.get(0).file(), problems.get(0).line(), problems.get(0).key(), problems.get(0).problem());
        this.problems = List.copyOf(problems);
    }

    /** Every problem, in line order. */
    public List<ConfigException> problems() { return problems; }

    /** All problems, one per line. */
    @Override
    public String getMessage() {
        StringBuilder sb = new StringBuilder();
        for (ConfigException p : problems) {
            if (sb.length() > 0) {
                sb.append(System.lineSeparator());
            }
            sb.append(p.getMessage());
        }
        return sb.toString();
    }
}
