package org.drumloop.core.safety;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.drumloop.core.exec.FailSafe;

/**
 * A validated interlock configuration: the alarms and trips in file order, the watchdog's
 * fail-safe outputs and the name of the file they came from. Immutable.
 */
public final class InterlockConfig {
    private final String fileName;
    private final List<InterlockSpec> specs;
    private final FailSafe failSafe;

    public InterlockConfig(String fileName, List<InterlockSpec> specs, FailSafe failSafe) {
        this.fileName = Objects.requireNonNull(fileName, "fileName");
        this.specs = Collections.unmodifiableList(new ArrayList<>(specs));
        this.failSafe = failSafe == null ? FailSafe.defaults() : failSafe;
        for (int i = 0; i < this.specs.size(); i++) {
            for (int j = 0; j < i; j++) {
                if (this.specs.get(i).tag().equalsIgnoreCase(this.specs.get(j).tag())) {
                    throw new IllegalArgumentException("duplicate interlock tag " + this.specs.get(i).tag());
                }
            }
        }
    }

    /** The file the configuration was read from, as the user named it. */
    public String fileName() { return fileName; }

    public List<InterlockSpec> specs() { return specs; }

    public int size() { return specs.size(); }

    public InterlockSpec spec(int i) { return specs.get(i); }

    /** Outputs the scan executive's watchdog forces. */
    public FailSafe failSafe() { return failSafe; }

    /** Column headings of {@link #causeEffectTable()}. */
    public static final String[] CAUSE_EFFECT_HEADER = {
        "tag", "kind", "cause", "voting", "on-delay", "bad input", "fuel_cutoff", "feed_pumps_stop",
        "feed_valve_close", "latch", "bypass max", "description"};

    /**
     * The cause-and-effect matrix: a heading row, then one row per interlock; effect columns hold
     * "X" where the interlock demands that action.
     */
    public List<String[]> causeEffectTable() {
        List<String[]> rows = new ArrayList<>();
        rows.add(CAUSE_EFFECT_HEADER.clone());
        for (InterlockSpec s : specs) {
            String cause = s.variable().text() + " [" + s.channelsText() + "] "
                    + (s.direction() == InterlockSpec.Direction.LOW ? "<= " : ">= ") + s.setpointText()
                    + " (hyst " + s.hysteresisText() + ")";
            String bad = s.badCountsAsTripped() ? "trips" : "ignored";
            if (!s.uncertainUsable()) {
                bad += ", uncertain = bad";
            }
            rows.add(new String[] {
                s.tag(),
                s.isTrip() ? "trip" : "alarm",
                cause,
                s.voting().text(),
                fmt(s.onDelayS()) + " s",
                bad,
                s.has(Action.FUEL_CUTOFF) ? "X" : "",
                s.has(Action.FEED_PUMPS_STOP) ? "X" : "",
                s.has(Action.FEED_VALVE_CLOSE) ? "X" : "",
                s.latch() ? "yes" : "no",
                s.bypassMaxS() > 0 ? fmt(s.bypassMaxS()) + " s" : "not allowed",
                s.description()});
        }
        return rows;
    }

    /** The cause-and-effect matrix as a plain-text table with aligned columns. */
    public String causeEffectText() { return formatTable(causeEffectTable()); }

    /** Align rows of cells into a plain-text table (first row is the heading). */
    public static String formatTable(List<String[]> rows) {
        int cols = 0;
        for (String[] r : rows) {
            cols = Math.max(cols, r.length);
        }
        int[] width = new int[cols];
        for (String[] r : rows) {
            for (int c = 0; c < r.length; c++) {
                width[c] = Math.max(width[c], r[c].length());
            }
        }
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < rows.size(); i++) {
            String[] r = rows.get(i);
            appendRow(sb, r, width);
            if (i == 0) {
                String[] rule = new String[cols];
                for (int c = 0; c < cols; c++) {
                    rule[c] = "-".repeat(width[c]);
                }
                appendRow(sb, rule, width);
            }
        }
        return sb.toString();
    }

    private static void appendRow(StringBuilder sb, String[] r, int[] width) {
        StringBuilder line = new StringBuilder();
        for (int c = 0; c < r.length; c++) {
            if (c > 0) {
                line.append(" | ");
            }
            line.append(r[c]);
            line.append(" ".repeat(width[c] - r[c].length()));
        }
        int end = line.length();
        while (end > 0 && line.charAt(end - 1) == ' ') {
            end--;
        }
        sb.append(line, 0, end).append('\n');
    }

    private static String fmt(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return Double.toString(v);
    }
}
