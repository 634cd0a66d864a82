package org.drumloop.core.config;

import java.util.List;

/**
 * Every problem found in one file, so that a user sees them all at once instead of one per run.
 * {@link #getMessage()} has one {@code file:line: key: message} line per problem, in file order;
 * {@link #file()}, {@link #line()} and {@link #key()} are those of the first.
 */
public class ConfigProblems extends ConfigException {
    private final transient List<ConfigException> problems;

    /** @param problems at least one problem */
    public ConfigProblems(List<ConfigException> problems) {
        super(problems.get(0).file(), problems.get(0).line(), problems.get(0).key(), problems.get(0).problem());
        this.problems = List.copyOf(problems);
    }

    /** Every problem, in the order found. */
    public List<ConfigException> problems() { return problems; }

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
