package org.drumloop.bench.tune;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeFormatterBuilder;
import java.time.format.DateTimeParseException;
import java.time.temporal.ChronoField;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

import org.drumloop.bench.record.InputFile;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;
import org.drumloop.core.io.EngUnit;

/**
 * Reads a recorded trend: a CSV file whose first non-comment line is the header, one cell per
 * column written {@code name[unit]} (drumloop's {@code trend.csv} and {@code bump} output as they
 * are; a historian export with its columns mapped by {@code NAME=HEADER}). Values are converted to
 * SI through {@link EngUnit}.
 *
 * <p>Refused, each as {@code file:line: column: message}: a missing column, a header without a unit
 * (or with a unit of the wrong quantity, or a bare {@code bar} for an absolute pressure), a cell that
 * is not a number, a row with too few cells, time that does not increase, and gaps (a time step
 * more than {@value #GAP_FACTOR} times the median step). Lines starting with {@code #} are comments.
 */
public final class TrendCsv {
    /** A time step longer than this many median steps is a gap in the record. */
    public static final double GAP_FACTOR = 5.0;
    /** Fewest rows a fit can use. */
    public static final int MIN_ROWS = 10;
    /** Problems listed before the reader stops. */
    private static final int MAX_PROBLEMS = 20;

    private static final DateTimeFormatter DATE_TIME = new DateTimeFormatterBuilder()
            .appendPattern("yyyy-MM-dd").optionalStart().appendLiteral('T').optionalEnd()
            .optionalStart().appendLiteral(' ').optionalEnd().appendPattern("HH:mm:ss")
            .optionalStart().appendFraction(ChronoField.NANO_OF_SECOND, 1, 9, true).optionalEnd()
            .toFormatter(Locale.ROOT);

    private TrendCsv() {
    }

    /**
     * Parses {@code --column NAME=HEADER} options into a map from our signal to the file's header.
     *
     * @throws ConfigException an option is malformed or names no signal we know
     */
    public static Map<TrendSignal, String> columnMap(List<String> options) throws ConfigException {
        Map<TrendSignal, String> m = new EnumMap<>(TrendSignal.class);
        for (String o : options) {
            int eq = o.indexOf('=');
            if (eq <= 0 || eq == o.length() - 1) {
                throw new ConfigException("--column", 0, o, "expected NAME=HEADER, e.g. drum_level=LT101");
            }
            TrendSignal s = TrendSignal.byTag(o.substring(0, eq).strip());
            if (s == null) {
                throw new ConfigException("--column", 0, o.substring(0, eq),
                        "no such signal (known: " + TrendSignal.tags() + ")");
            }
            m.put(s, o.substring(eq + 1).strip());
        }
        return m;
    }

    /**
     * Reads a trend.
     *
     * @param file     the file
     * @param shown    the file's name in messages
     * @param mapping  our signal to the file's header name, where they differ
     * @param required signals that must be present
     * @param optional signals read when present
     * @throws ConfigException every problem found (up to {@value #MAX_PROBLEMS}), located by line and column
     */
    public static Trend read(Path file, String shown, Map<TrendSignal, String> mapping, Set<TrendSignal> required,
                             Set<TrendSignal> optional) throws ConfigException {
        List<String> lines;
        String sha;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
            sha = InputFile.sha256(file);
        } catch (IOException e) {
            throw new ConfigException(shown, 0, "", "cannot read: " + e.getMessage());
        }
        Trend t = parse(shown, lines, mapping, required, optional);
        return new Trend(t.file(), sha, t.tS(), t.signals(), t.headers());
    }

    /** Parses the lines of a trend file (see {@link #read}). */
    public static Trend parse(String shown, List<String> lines, Map<TrendSignal, String> mapping,
                              Set<TrendSignal> required, Set<TrendSignal> optional) throws ConfigException {
        int headerLine = -1;
        for (int i = 0; i < lines.size(); i++) {
            String s = lines.get(i).strip();
            if (!s.isEmpty() && !s.startsWith("#")) {
                headerLine = i;
                break;
            }
        }
        if (headerLine < 0) {
            throw new ConfigException(shown, 0, "", "empty file: expected a header line such as t[s],drum_level[mm],...");
        }
        String headerText = lines.get(headerLine);
        char sep = headerText.indexOf(',') >= 0 ? ',' : headerText.indexOf(';') >= 0 ? ';' : '\t';
        String[] header = split(headerText, sep);
        int hl = headerLine + 1;
        List<ConfigException> problems = new ArrayList<>();
        Map<TrendSignal, Column> cols = new LinkedHashMap<>();
        List<TrendSignal> wanted = new ArrayList<>(required);
        for (TrendSignal s : optional) {
            if (!wanted.contains(s)) {
                wanted.add(s);
            }
        }
        wanted.remove(TrendSignal.TIME);
        wanted.add(0, TrendSignal.TIME);
        for (TrendSignal s : wanted) {
            boolean need = s == TrendSignal.TIME || required.contains(s);
            int idx = find(header, s, mapping.get(s));
            if (idx < 0) {
                if (need || mapping.containsKey(s)) {
                    String name = mapping.getOrDefault(s, s.tag());
                    problems.add(new ConfigException(shown, hl, name, "no such column (header: " + String.join(",", header)
                            + (mapping.containsKey(s) ? ")" : "; map yours with --column " + s.tag() + "=HEADER)")));
                }
                continue;
            }
            try {
                cols.put(s, column(shown, hl, header[idx], idx, s));
            } catch (ConfigException e) {
                problems.add(e);
            }
        }
        if (!problems.isEmpty()) {
            throw all(problems);
        }
        Column time = cols.get(TrendSignal.TIME);
        int n = 0;
        double[][] v = new double[cols.size()][16];
        int[] lineOf = new int[16];
        LocalDateTime t0 = null;
        for (int i = headerLine + 1; i < lines.size() && problems.size() < MAX_PROBLEMS; i++) {
            String text = lines.get(i);
            if (text.isBlank() || text.strip().startsWith("#")) {
                continue;
            }
            String[] cells = split(text, sep);
            if (n == lineOf.length) {
                lineOf = Arrays.copyOf(lineOf, 2 * n);
                for (int c = 0; c < v.length; c++) {
                    v[c] = Arrays.copyOf(v[c], 2 * n);
                }
            }
            boolean ok = true;
            int c = 0;
            for (Column col : cols.values()) {
                if (col.index >= cells.length || cells[col.index].isEmpty()) {
                    problems.add(new ConfigException(shown, i + 1, col.header, "no value (the row has "
                            + cells.length + " cells, the header " + header.length + ")"));
                    ok = false;
                    break;
                }
                String cell = cells[col.index];
                double x;
                if (col == time && time.unit == null) {
                    try {
                        LocalDateTime dt = LocalDateTime.parse(cell, DATE_TIME);
                        if (t0 == null) {
                            t0 = dt;
                        }
                        x = ChronoUnit.NANOS.between(t0, dt) * 1e-9;
                    } catch (DateTimeParseException e) {
                        problems.add(new ConfigException(shown, i + 1, col.header, "'" + cell
                                + "' is not a date-time (yyyy-MM-dd HH:mm:ss[.fff]); give the column a unit such"
                                + " as [s] for numeric time"));
                        ok = false;
                        break;
                    }
                } else {
                    try {
                        x = col.unit.toSi(Double.parseDouble(cell));
                    } catch (NumberFormatException e) {
                        x = Double.NaN;
                    }
                    if (!Double.isFinite(x)) {
                        problems.add(new ConfigException(shown, i + 1, col.header, "'" + cell + "' is not a number"));
                        ok = false;
                        break;
                    }
                }
                v[c++][n] = x;
            }
            if (ok) {
                lineOf[n] = i + 1;
                n++;
            }
        }
        if (!problems.isEmpty()) {
            throw all(problems);
        }
        if (n < MIN_ROWS) {
            throw new ConfigException(shown, 0, "", n + " data rows; a fit needs at least " + MIN_ROWS);
        }
        double[] t = Arrays.copyOf(v[0], n);
        checkTime(shown, t, lineOf, time.header, problems);
        if (!problems.isEmpty()) {
            throw all(problems);
        }
        double start = t[0];
        for (int i = 0; i < n; i++) {
            t[i] -= start;
        }
        Map<TrendSignal, double[]> sig = new EnumMap<>(TrendSignal.class);
        Map<TrendSignal, String> heads = new EnumMap<>(TrendSignal.class);
        int c = 0;
        for (Map.Entry<TrendSignal, Column> e : cols.entrySet()) {
            if (e.getKey() != TrendSignal.TIME) {
                sig.put(e.getKey(), Arrays.copyOf(v[c], n));
            }
            heads.put(e.getKey(), e.getValue().header);
            c++;
        }
        return new Trend(shown, "", t, sig, heads);
    }

    /** Strictly increasing, no gaps; each problem names the line where it shows. */
    private static void checkTime(String shown, double[] t, int[] lineOf, String column, List<ConfigException> problems) {
        int n = t.length;
        double[] steps = new double[n - 1];
        for (int i = 1; i < n; i++) {
            steps[i - 1] = t[i] - t[i - 1];
            if (!(t[i] > t[i - 1])) {
                problems.add(new ConfigException(shown, lineOf[i], column, "time does not increase ("
                        + KeyLines.number(t[i] - t[0], 6) + " s after " + KeyLines.number(t[i - 1] - t[0], 6)
                        + " s on line " + lineOf[i - 1] + ")"));
                if (problems.size() >= MAX_PROBLEMS) {
                    return;
                }
            }
        }
        if (!problems.isEmpty()) {
            return;
        }
        double[] sorted = steps.clone();
        Arrays.sort(sorted);
        double median = sorted[sorted.length / 2];
        for (int i = 0; i < steps.length && problems.size() < MAX_PROBLEMS; i++) {
            if (steps[i] > GAP_FACTOR * median) {
                problems.add(new ConfigException(shown, lineOf[i + 1], column, "gap in the record: "
                        + KeyLines.number(steps[i], 6) + " s between line " + lineOf[i] + " and this line (sampled every "
                        + KeyLines.number(median, 6) + " s)"));
            }
        }
    }

    private static ConfigException all(List<ConfigException> problems) {
        return problems.size() == 1 ? problems.get(0) : new ConfigProblems(problems);
    }

    private record Column(String header, int index, Unit unit) { }

    /** A unit: si = value * factor + offset. */
    private record Unit(double factor, double offset) {
        double toSi(double v) { return v * factor + offset; }
    }

    private static Column column(String shown, int line, String header, int idx, TrendSignal s) throws ConfigException {
        int lb = header.indexOf('[');
        int rb = header.lastIndexOf(']');
        String unitText = lb >= 0 && rb > lb ? header.substring(lb + 1, rb).strip() : "";
        if (unitText.isEmpty()) {
            if (s == TrendSignal.TIME) {
                return new Column(header, idx, null); // date-time values, checked row by row
            }
            throw new ConfigException(shown, line, header, "the header carries no unit; write it as "
                    + s.tag() + "[" + example(s) + "]");
        }
        if (s == TrendSignal.TIME) {
            switch (unitText) {
                case "s": return new Column(header, idx, new Unit(1, 0));
                case "ms": return new Column(header, idx, new Unit(1e-3, 0));
                case "min": return new Column(header, idx, new Unit(60, 0));
                case "h": return new Column(header, idx, new Unit(3600, 0));
                default:
                    throw new ConfigException(shown, line, header, "unit '" + unitText + "' is not a time unit (s, ms, min, h)");
            }
        }
        EngUnit u = EngUnit.bySymbol(unitText);
        if (u == null || !u.siUnit().equals(s.siUnit()) || u == EngUnit.BOOL) {
            throw new ConfigException(shown, line, header, "unit '" + unitText + "' does not measure "
                    + s.tag() + " (e.g. " + example(s) + ")");
        }
        if (s == TrendSignal.DRUM_PRESSURE && (u == EngUnit.BAR || u == EngUnit.MBAR || u == EngUnit.MMH2O)) {
            throw new ConfigException(shown, line, header, "unit '" + unitText
                    + "' does not say gauge or absolute; write bara or barg");
        }
        return new Column(header, idx, new Unit(u.toSi(1) - u.toSi(0), u.toSi(0)));
    }

    /**
     * Writes a trend in drumloop's own form ({@code t[s]}, then each signal as {@code tag[unit]} in
     * the engineering unit {@link #example} names), readable by {@link #read}.
     */
    public static void write(Trend t, java.io.Writer w) throws IOException {
        List<TrendSignal> cols = new ArrayList<>();
        StringBuilder h = new StringBuilder("t[s]");
        for (TrendSignal s : TrendSignal.values()) {
            if (s != TrendSignal.TIME && t.has(s)) {
                cols.add(s);
                h.append(',').append(s.tag()).append('[').append(example(s)).append(']');
            }
        }
        w.write(h.append('\n').toString());
        StringBuilder row = new StringBuilder();
        for (int i = 0; i < t.size(); i++) {
            row.setLength(0);
            row.append(KeyLines.number(t.tS()[i], 9));
            for (TrendSignal s : cols) {
                EngUnit u = EngUnit.bySymbol(example(s));
                row.append(',').append(String.format(Locale.ROOT, "%.7g", u.fromSi(t.get(s)[i])));
            }
            w.write(row.append('\n').toString());
        }
        w.flush();
    }

    private static String example(TrendSignal s) {
        switch (s) {
            case DRUM_LEVEL: return "mm";
            case DRUM_PRESSURE: return "barg";
            case STEAM_FLOW:
            case FEED_FLOW: return "t/h";
            case FEED_VALVE:
            case VALVE_DEMAND:
            case FIRING: return "%";
            case HEAT: return "MW";
            case FEED_TEMP: return "degC";
            default: return "s";
        }
    }

    /** Index of the column for a signal: the mapped header or our tag (or an alias), by name or whole text. */
    private static int find(String[] header, TrendSignal s, String mapped) {
        List<String> names = new ArrayList<>();
        if (mapped != null) {
            names.add(mapped);
        } else {
            names.add(s.tag());
            names.addAll(s.aliases());
        }
        for (String want : names) {
            for (int i = 0; i < header.length; i++) {
                String h = header[i];
                int lb = h.indexOf('[');
                String name = (lb >= 0 ? h.substring(0, lb) : h).strip();
                if (h.equalsIgnoreCase(want) || name.equalsIgnoreCase(want)) {
                    return i;
                }
            }
        }
        return -1;
    }

    private static String[] split(String line, char sep) {
        String[] cells = line.split(sep == '\t' ? "\t" : String.valueOf(sep), -1);
        for (int i = 0; i < cells.length; i++) {
            String c = cells[i].strip();
            if (c.length() >= 2 && c.startsWith("\"") && c.endsWith("\"")) {
                c = c.substring(1, c.length() - 1).strip();
            }
            cells[i] = c;
        }
        return cells;
    }
}
