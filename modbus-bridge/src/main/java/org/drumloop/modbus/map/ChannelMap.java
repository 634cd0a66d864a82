package org.drumloop.modbus.map;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;

import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.EngUnit;
import org.drumloop.core.io.Signal;

/**
 * A channel map: the Modbus I/O list of one link, read from a CSV file with a header row.
 *
 * <p>Columns (order free; names in the header):
 * <pre>
 * signal        Signal tag, e.g. level_dp_a                                   required
 * direction     to_controller | from_controller (must match the signal)       required
 * table         coil | discrete_input | input_register | holding_register     required
 * unit          Modbus unit id 0..255                                          required
 * address       0-based PDU offset 0..65535 (decimal or 0x hex)                required
 * type          bool | int16 | uint16 | int32 | uint32 | float32               required
 * word_order    ABCD | CDAB | BADC | DCBA, required for 32-bit types
 * raw_lo,raw_hi raw range (required for integer types; float32 defaults to the eng range)
 * eng_lo,eng_hi engineering range (analogue channels)
 * eng_unit      an EngUnit symbol (mA for a 4-20 mA loop current delivered to the firmware)
 * clamp         yes | no (default no: faults stay visible)
 * fault_low,fault_high   failure thresholds in eng units (mA channels: NAMUR NE 43 3.6 / 21.0);
 *                        "none" for no threshold
 * stale_after_s age limit [s]; default 2 for inputs, none for outputs
 * description   free text (quote it when it holds a comma)
 * </pre>
 * Blank lines and lines starting with {@code #} are ignored. Addresses are PDU offsets: item 1 of
 * a table is address 0. A 1-based "Modicon" reference such as 40001 is rejected with a hint.
 */
public final class ChannelMap {
    /** Default age limit of inputs when the column is empty [s]. */
    public static final double DEFAULT_STALE_AFTER_S = 2.0;

    static final List<String> REQUIRED = List.of("signal", "direction", "table", "unit", "address", "type");
    static final List<String> KNOWN = List.of("signal", "direction", "table", "unit", "address", "type",
            "word_order", "raw_lo", "raw_hi", "eng_lo", "eng_hi", "eng_unit", "clamp", "fault_low", "fault_high",
            "stale_after_s", "description");
    private static final Pattern NUMBER = Pattern.compile("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?");

    private final String file;
    private final List<Channel> channels;
    private final Map<Signal, Channel> bySignal;

    private ChannelMap(String file, List<Channel> channels) {
        this.file = file;
        this.channels = List.copyOf(channels);
        Map<Signal, Channel> m = new EnumMap<>(Signal.class);
        for (Channel c : channels) {
            m.put(c.signal(), c);
        }
        this.bySignal = Collections.unmodifiableMap(m);
    }

    /** Read and validate a map; throws with every problem when there is any. */
    public static ChannelMap load(Path path) throws ChannelMapException {
        List<ConfigException> problems = new ArrayList<>();
        ChannelMap map = read(path, problems);
        if (!problems.isEmpty()) {
            throw new ChannelMapException(problems);
        }
        return map;
    }

    /** Every problem of a map file, in line order; empty when the file is good. */
    public static List<ConfigException> validate(Path path) {
        List<ConfigException> problems = new ArrayList<>();
        read(path, problems);
        return problems;
    }

    /** Parse map text; problems are appended, the map holds the good rows. */
    public static ChannelMap parse(String fileName, List<String> lines, List<ConfigException> problems) {
        return new Parser(fileName, problems).parse(lines);
    }

    private static ChannelMap read(Path path, List<ConfigException> problems) {
        String name = path.toString();
        List<String> lines;
        try {
            lines = Files.readAllLines(path, StandardCharsets.UTF_8);
        } catch (IOException e) {
            problems.add(new ConfigException(name, 0, "", "cannot read the channel map: " + e.getMessage()));
            return new ChannelMap(name, List.of());
        }
        return parse(name, lines, problems);
    }

    /** Problems for each signal in {@code needed} that the map lacks. */
    public List<ConfigException> requireSignals(Set<Signal> needed) {
        List<ConfigException> out = new ArrayList<>();
        for (Signal s : Signal.values()) {
            if (needed.contains(s) && !bySignal.containsKey(s)) {
                out.add(new ConfigException(file, 0, s.tag(), "this mode needs the signal but the map has no row for it"));
            }
        }
        return out;
    }

    public String file() { return file; }

    public List<Channel> channels() { return channels; }

    /** The channel of a signal, or null. */
    public Channel channel(Signal s) { return bySignal.get(s); }

    public List<Channel> inputs() {
        List<Channel> out = new ArrayList<>();
        for (Channel c : channels) {
            if (c.signal().isInput()) {
                out.add(c);
            }
        }
        return out;
    }

    public List<Channel> outputs() {
        List<Channel> out = new ArrayList<>();
        for (Channel c : channels) {
            if (!c.signal().isInput()) {
                out.add(c);
            }
        }
        return out;
    }

    /** The same map with every channel moved to one unit id. */
    public ChannelMap withUnitId(int unitId) {
        List<Channel> moved = new ArrayList<>();
        for (Channel c : channels) {
            moved.add(c.withUnitId(unitId));
        }
        return new ChannelMap(file, moved);
    }

    /** Parses lines; collects problems instead of stopping at the first. */
    private static final class Parser {
        private final String file;
        private final List<ConfigException> problems;
        private Map<String, Integer> columns;
        private String[] cells;
        private int line;
        private int before;
        private Signal rowSignal;

        Parser(String file, List<ConfigException> problems) {
            this.file = file;
            this.problems = problems;
        }

        ChannelMap parse(List<String> lines) {
            List<Channel> good = new ArrayList<>();
            Map<Signal, Integer> seen = new EnumMap<>(Signal.class);
            for (int i = 0; i < lines.size(); i++) {
                line = i + 1;
                String text = lines.get(i).strip();
                if (text.isEmpty() || text.startsWith("#")) {
                    continue;
                }
                cells = split(text);
                if (columns == null) {
                    header();
                    if (columns == null) {
                        return new ChannelMap(file, good);
                    }
                    continue;
                }
                Channel c = row();
                if (rowSignal != null) {
                    Integer first = seen.putIfAbsent(rowSignal, line);
                    if (first != null) {
                        problem("signal", "duplicate signal " + rowSignal.tag() + ", first mapped on line " + first);
                        continue;
                    }
                }
                if (c != null) {
                    good.add(c);
                }
            }
            if (columns == null) {
                problems.add(new ConfigException(file, 0, "", "no header row; the first non-comment line must name the columns"));
            }
            overlaps(good);
            problems.sort(Comparator.comparingInt(ConfigException::line));
            return new ChannelMap(file, good);
        }

        private void header() {
            Map<String, Integer> cols = new HashMap<>();
            boolean ok = true;
            for (int k = 0; k < cells.length; k++) {
                String name = cells[k].toLowerCase(Locale.ROOT);
                if (!KNOWN.contains(name)) {
                    problem(cells[k], "unknown column; known columns are " + String.join(", ", KNOWN));
                    ok = false;
                } else if (cols.put(name, k) != null) {
                    problem(name, "column named twice");
                    ok = false;
                }
            }
            for (String r : REQUIRED) {
                if (!cols.containsKey(r)) {
                    problem(r, "required column missing");
                    ok = false;
                }
            }
            columns = ok ? cols : null;
        }

        private Channel row() {
            before = problems.size();
            String tag = cell("signal");
            Signal signal = Signal.byTag(tag);
            rowSignal = signal;
            if (signal == null) {
                problem("signal", "unknown signal '" + tag + "'");
            }
            String dir = cell("direction");
            if (!dir.equals("to_controller") && !dir.equals("from_controller")) {
                problem("direction", "must be to_controller or from_controller, not '" + dir + "'");
            } else if (signal != null && signal.isInput() != dir.equals("to_controller")) {
                problem("direction", signal.tag() + " is " + signal.direction().name().toLowerCase(Locale.ROOT));
            }
            Table table = Table.byWord(cell("table"));
            if (table == null) {
                problem("table", "must be coil, discrete_input, input_register or holding_register, not '" + cell("table") + "'");
            }
            int unit = integer("unit", 0, 255);
            int address = address(table);
            DataType type = DataType.byWord(cell("type"));
            if (type == null) {
                problem("type", "must be bool, int16, uint16, int32, uint32 or float32, not '" + cell("type") + "'");
            }
            WordOrder order = null;
            String wo = cell("word_order");
            if (type != null && type.is32()) {
                order = WordOrder.byName(wo.toUpperCase(Locale.ROOT));
                if (order == null) {
                    problem("word_order", "a 32-bit value needs ABCD, CDAB, BADC or DCBA" + (wo.isEmpty() ? "" : ", not '" + wo + "'"));
                }
                if (address >= 0 && address + 1 > 65535) {
                    problem("address", "a 32-bit value at " + address + " would run past address 65535");
                }
            } else if (!wo.isEmpty() && !wo.equals("-")) {
                problem("word_order", "only 32-bit types have a word order");
            }
            if (table != null && type != null) {
                if (table.isBits() != (type == DataType.BOOL)) {
                    problem("type", table.isBits() ? "a bit table holds type bool" : "a register table holds a numeric type, not bool");
                }
                if (signal != null && (signal.kind() == Signal.Kind.BOOL) != table.isBits()) {
                    problem("table", signal.tag() + (signal.kind() == Signal.Kind.BOOL
                            ? " is binary: use coil or discrete_input" : " is analogue: use input_register or holding_register"));
                }
                if (signal != null && !signal.isInput() && !table.isWritable()) {
                    problem("table", signal.tag() + " is written by the controller: use coil or holding_register");
                }
            }
            boolean analog = type != null && type != DataType.BOOL;
            double engLo = Double.NaN;
            double engHi = Double.NaN;
            double rawLo = Double.NaN;
            double rawHi = Double.NaN;
            EngUnit unitEu = EngUnit.BOOL;
            double faultLow = Double.NaN;
            double faultHigh = Double.NaN;
            if (analog) {
                engLo = number("eng_lo", true);
                engHi = number("eng_hi", true);
                if (engLo >= engHi) {
                    problem("eng_hi", engLo == engHi ? "empty engineering range" : "reversed engineering range (eng_lo > eng_hi)");
                }
                String us = cell("eng_unit");
                unitEu = EngUnit.bySymbol(us);
                if (unitEu == null || unitEu == EngUnit.BOOL) {
                    problem("eng_unit", (us.isEmpty() ? "missing" : "unknown unit '" + us + "'")
                            + "; use an engineering unit symbol such as mm, barg, t/h, %, degC, mA");
                    unitEu = null;
                } else if (signal != null && signal.kind() == Signal.Kind.ANALOG) {
                    if (unitEu == EngUnit.MA && !signal.isInput()) {
                        problem("eng_unit", "mA loop currents are inputs only; scale " + signal.tag() + " in " + signal.siUnit());
                    } else if (unitEu != EngUnit.MA && !unitEu.siUnit().equals(signal.siUnit())) {
                        problem("eng_unit", us + " measures " + unitEu.siUnit() + " but " + signal.tag() + " is in " + signal.siUnit());
                    }
                }
                boolean needRaw = type != DataType.FLOAT32;
                rawLo = number("raw_lo", needRaw);
                rawHi = number("raw_hi", needRaw);
                if (!needRaw && Double.isNaN(rawLo) && Double.isNaN(rawHi)) {
                    rawLo = engLo;
                    rawHi = engHi;
                }
                if (rawLo >= rawHi) {
                    problem("raw_hi", rawLo == rawHi ? "empty raw range" : "reversed raw range (raw_lo > raw_hi)");
                }
                if (rawLo < type.minRaw() || rawHi > type.maxRaw()) {
                    problem("raw_lo", "raw range " + fmt(rawLo) + ".." + fmt(rawHi) + " does not fit " + type.word());
                }
                boolean ma = unitEu == EngUnit.MA;
                faultLow = optional("fault_low", ma ? Channel.NE43_FAIL_LOW_MA : Double.NaN);
                faultHigh = optional("fault_high", ma ? Channel.NE43_FAIL_HIGH_MA : Double.NaN);
                if (faultLow >= faultHigh) {
                    problem("fault_high", "fault_low must be below fault_high");
                }
            } else {
                for (String k : List.of("raw_lo", "raw_hi", "eng_lo", "eng_hi", "fault_low", "fault_high")) {
                    if (!cell(k).isEmpty()) {
                        problem(k, "a bool channel has no range or fault threshold");
                    }
                }
                String us = cell("eng_unit");
                if (!us.isEmpty() && !us.equals("bool")) {
                    problem("eng_unit", "a bool channel has unit bool or none");
                }
            }
            String cl = cell("clamp").toLowerCase(Locale.ROOT);
            if (!cl.isEmpty() && !cl.equals("yes") && !cl.equals("no")) {
                problem("clamp", "must be yes or no");
            }
            double defaultStale = signal == null || signal.isInput() ? DEFAULT_STALE_AFTER_S : Double.POSITIVE_INFINITY;
            double stale = optional("stale_after_s", defaultStale);
            if (!(stale > 0)) {
                problem("stale_after_s", "must be a positive number of seconds");
            }
            if (problems.size() > before) {
                return null;
            }
            return new Channel(signal, table, unit, address, type, order, rawLo, rawHi, engLo, engHi, unitEu,
                    cl.equals("yes"), faultLow, faultHigh, stale, cell("description"), line);
        }

        private int address(Table table) {
            String s = cell("address");
            if (s.isEmpty()) {
                problem("address", "missing");
                return -1;
            }
            if (table != null && s.length() >= 5 && s.length() <= 6 && s.chars().allMatch(Character::isDigit)
                    && s.charAt(0) == table.referencePrefix()) {
                int ref = Integer.parseInt(s.substring(1));
                if (ref >= 1) {
                    problem("address", "'" + s + "' looks like a 1-based " + table.referencePrefix()
                            + "xxxx reference; write the 0-based PDU offset " + (ref - 1)
                            + " (or 0x" + Integer.toHexString(Integer.parseInt(s)).toUpperCase(Locale.ROOT)
                            + " if you really mean offset " + s + ")");
                    return -1;
                }
            }
            try {
                int a = s.startsWith("0x") || s.startsWith("0X") ? Integer.parseInt(s.substring(2), 16) : Integer.parseInt(s);
                if (a < 0 || a > 65535) {
                    problem("address", "must be 0..65535, not " + s);
                    return -1;
                }
                return a;
            } catch (NumberFormatException e) {
                problem("address", "not an address: '" + s + "'");
                return -1;
            }
        }

        private int integer(String key, int lo, int hi) {
            String s = cell(key);
            try {
                int v = Integer.parseInt(s);
                if (v < lo || v > hi) {
                    problem(key, "must be " + lo + ".." + hi + ", not " + s);
                }
                return v;
            } catch (NumberFormatException e) {
                problem(key, s.isEmpty() ? "missing" : "not an integer: '" + s + "'");
                return -1;
            }
        }

        private double number(String key, boolean required) {
            String s = cell(key);
            if (s.isEmpty()) {
                if (required) {
                    problem(key, "missing");
                }
                return Double.NaN;
            }
            if (!NUMBER.matcher(s).matches()) {
                problem(key, "not a number: '" + s + "'");
                return Double.NaN;
            }
            return Double.parseDouble(s);
        }

        private double optional(String key, double dflt) {
            String s = cell(key);
            if (s.isEmpty()) {
                return dflt;
            }
            if (s.equalsIgnoreCase("none")) {
                return key.startsWith("stale") ? Double.POSITIVE_INFINITY : Double.NaN;
            }
            return number(key, true);
        }

        private String cell(String key) {
            Integer k = columns.get(key);
            return k == null || k >= cells.length ? "" : cells[k];
        }

        private void problem(String key, String msg) {
            problems.add(new ConfigException(file, line, key, msg));
        }

        private void overlaps(List<Channel> good) {
            List<Channel> sorted = new ArrayList<>(good);
            sorted.sort(Comparator.comparingInt(Channel::unitId).thenComparing(Channel::table)
                    .thenComparingInt(Channel::address));
            for (int i = 1; i < sorted.size(); i++) {
                Channel a = sorted.get(i - 1);
                Channel b = sorted.get(i);
                if (a.unitId() == b.unitId() && a.table() == b.table() && b.address() <= a.lastAddress()) {
                    Channel later = a.line() > b.line() ? a : b;
                    Channel earlier = later == a ? b : a;
                    problems.add(new ConfigException(file, later.line(), "address", later.table().word() + " "
                            + later.address() + ".." + later.lastAddress() + " of unit " + later.unitId()
                            + " overlaps " + earlier.signal().tag() + " (line " + earlier.line() + ")"));
                }
            }
        }

        private static String fmt(double v) {
            return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
        }

        /** Split a CSV line; double quotes protect commas, "" is a quote. */
        static String[] split(String text) {
            List<String> out = new ArrayList<>();
            StringBuilder sb = new StringBuilder();
            boolean quoted = false;
            for (int i = 0; i < text.length(); i++) {
                char ch = text.charAt(i);
                if (quoted) {
                    if (ch == '"' && i + 1 < text.length() && text.charAt(i + 1) == '"') {
                        sb.append('"');
                        i++;
                    } else if (ch == '"') {
                        quoted = false;
                    } else {
                        sb.append(ch);
                    }
                } else if (ch == '"') {
                    quoted = true;
                } else if (ch == ',') {
                    out.add(sb.toString().strip());
                    sb.setLength(0);
                } else {
                    sb.append(ch);
                }
            }
            out.add(sb.toString().strip());
            return out.toArray(new String[0]);
        }
    }
}
