package org.drumloop.core.safety;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;
import org.drumloop.core.exec.FailSafe;
import org.drumloop.core.io.EngUnit;

/**
 * Reader of {@code .interlocks} files: plain text, one {@code key value} per line, {@code #}
 * starts a comment, blocks opened by a header line.
 *
 * <pre>
 * watchdog                        # optional; outputs forced when the scan stops keeping time
 *   missed_scans   3              # consecutive missed deadlines (or one failed scan) that trip it
 *   valve          hold           # hold | a position with unit, e.g. 0 %
 *   pump_a         hold           # hold | run | stop
 *   pump_b         hold
 *
 * interlock LALL                  # one block per alarm or trip; the tag is unique
 *   kind           trip           # alarm | trip (trips always latch)
 *   description    Drum level low-low: fuel cut-off     # optional, rest of line
 *   variable       level          # level | feed_temp | level_deviation
 *   voting         2oo3           # 1oo1 | 1oo2 | 2oo2 | 2oo3 (level only; others are 1oo1)
 *   channels       a b c          # optional for level: a, b, c, selected;
 *                                 #   default 1oo1: selected, 1oo2/2oo2: a b, 2oo3: a b c
 *   direction      low            # low | high
 *   setpoint       -200 mm        # level in mm or m from normal water level; temperature in degC or K
 *   hysteresis     10 mm          # same dimension, a difference
 *   on_delay       2 s            # s or min
 *   bad_counts_as_tripped  yes    # yes | no
 *   uncertain_usable       no     # optional, default no: UNCERTAIN counts as BAD
 *   actions        fuel_cutoff    # any of fuel_cutoff feed_pumps_stop feed_valve_close, or none
 *   latch          yes            # optional: default yes for trips (required), no for alarms
 *   bypass_max     0 s            # optional, default 0 s = may not be bypassed
 *   annunciator    lall           # optional: lal lah lall lahh tal ldah none; default from the tag
 * </pre>
 *
 * Errors read {@code file:line: key: message}.
 */
public final class InterlockFile {
    private static final String[] REQUIRED = {
        "kind", "variable", "direction", "setpoint", "hysteresis", "on_delay", "bad_counts_as_tripped", "actions"};
    private static final String[] KEYS = {
        "kind", "description", "variable", "voting", "channels", "direction", "setpoint", "hysteresis", "on_delay",
        "bad_counts_as_tripped", "uncertain_usable", "actions", "latch", "bypass_max", "annunciator"};
    private static final String[] WATCHDOG_KEYS = {"missed_scans", "valve", "pump_a", "pump_b"};

    private InterlockFile() {
    }

    /** Read and validate a file; the file name in error messages is the path as given. */
    public static InterlockConfig load(Path p) throws ConfigException {
        List<String> lines;
        try {
            lines = Files.readAllLines(p, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new ConfigException(p.toString(), 0, "", "cannot read: " + e.getMessage());
        }
        return parse(p.toString(), lines);
    }

    /** Parse and validate the lines of a file named {@code fileName} (for messages). */
    public static InterlockConfig parse(String fileName, List<String> lines) throws ConfigException {
        List<ConfigException> problems = new ArrayList<>();
        List<Block> blocks = new ArrayList<>();
        Block watchdog = null;
        Block current = null;
        for (int ln = 1; ln <= lines.size(); ln++) {
            String text = stripComment(lines.get(ln - 1)).strip();
            if (text.isEmpty()) {
                continue;
            }
            String[] kv = text.split("\\s+", 2);
            String key = kv[0];
            String value = kv.length > 1 ? kv[1].strip() : "";
            try {
                if (key.equals("interlock")) {
                    if (value.isEmpty() || value.contains(" ")) {
                        throw new ConfigException(fileName, ln, key, "expected one tag after 'interlock', e.g. 'interlock LALL'");
                    }
                    for (Block b : blocks) {
                        if (b.name.equalsIgnoreCase(value)) {
                            throw new ConfigException(fileName, ln, key, "duplicate tag " + value
                                    + " (first defined on line " + b.line + ")");
                        }
                    }
                    current = new Block(value, ln, false);
                    blocks.add(current);
                    continue;
                }
                if (key.equals("watchdog")) {
                    if (watchdog != null) {
                        throw new ConfigException(fileName, ln, key, "second watchdog block (first on line " + watchdog.line + ")");
                    }
                    if (!value.isEmpty()) {
                        throw new ConfigException(fileName, ln, key, "nothing may follow 'watchdog' on its line");
                    }
                    watchdog = new Block("watchdog", ln, true);
                    current = watchdog;
                    continue;
                }
                if (current == null) {
                    throw new ConfigException(fileName, ln, key, "expected 'interlock TAG' or 'watchdog' before settings");
                }
                String[] allowed = current.watchdog ? WATCHDOG_KEYS : KEYS;
                if (!contains(allowed, key)) {
                    throw new ConfigException(fileName, ln, key, "unknown key in " + (current.watchdog ? "watchdog" : "interlock")
                            + " block; expected one of " + String.join(", ", allowed));
                }
                if (current.values.containsKey(key)) {
                    throw new ConfigException(fileName, ln, key, "given twice in this block (first on line "
                            + current.lines.get(key) + ")");
                }
                if (value.isEmpty()) {
                    throw new ConfigException(fileName, ln, key, "missing value");
                }
                current.values.put(key, value);
                current.lines.put(key, ln);
            } catch (ConfigException e) {
                problems.add(e); // go on: the user sees every problem of the file at once
                if (key.equals("interlock") || key.equals("watchdog") || current == null) {
                    // the settings under a refused (or missing) block line belong to no block:
                    // absorb them quietly instead of reporting each one again
                    current = new Block(value, ln, key.equals("watchdog"));
                }
            }
        }
        if (blocks.isEmpty()) {
            problems.add(new ConfigException(fileName, 0, "interlock", "no interlock defined"));
        }
        List<InterlockSpec> specs = new ArrayList<>();
        for (Block b : blocks) {
            try {
                specs.add(toSpec(fileName, b));
            } catch (ConfigException e) {
                problems.add(e);
            }
        }
        FailSafe fs = FailSafe.defaults();
        if (watchdog != null) {
            try {
                fs = toFailSafe(fileName, watchdog);
            } catch (ConfigException e) {
                problems.add(e);
            }
        }
        if (!problems.isEmpty()) {
            // in file order; problems of the whole file (line 0) last
            problems.sort(java.util.Comparator.comparingInt(e -> e.line() == 0 ? Integer.MAX_VALUE : e.line()));
            throw problems.size() == 1 ? problems.get(0) : new ConfigProblems(problems);
        }
        return new InterlockConfig(fileName, specs, fs);
    }

    private static InterlockSpec toSpec(String file, Block b) throws ConfigException {
        for (String k : REQUIRED) {
            if (!b.values.containsKey(k)) {
                throw new ConfigException(file, b.line, k, "missing in interlock " + b.name);
            }
        }
        InterlockSpec.Kind kind = switch (b.values.get("kind")) {
            case "alarm" -> InterlockSpec.Kind.ALARM;
            case "trip" -> InterlockSpec.Kind.TRIP;
            default -> throw b.error(file, "kind", "expected alarm or trip");
        };
        InterlockSpec.Variable variable = InterlockSpec.Variable.byText(b.values.get("variable"));
        if (variable == null) {
            throw b.error(file, "variable", "expected level, feed_temp or level_deviation");
        }
        InterlockSpec.Direction dir = switch (b.values.get("direction")) {
            case "low" -> InterlockSpec.Direction.LOW;
            case "high" -> InterlockSpec.Direction.HIGH;
            default -> throw b.error(file, "direction", "expected low or high");
        };
        Voting voting = Voting.ONE_OO_ONE;
        if (b.values.containsKey("voting")) {
            voting = Voting.byText(b.values.get("voting"));
            if (voting == null) {
                throw b.error(file, "voting", "expected 1oo1, 1oo2, 2oo2 or 2oo3");
            }
        } else if (variable == InterlockSpec.Variable.LEVEL) {
            throw new ConfigException(file, b.line, "voting", "missing in interlock " + b.name
                    + " (level functions must say how they vote)");
        }
        if (variable != InterlockSpec.Variable.LEVEL && voting != Voting.ONE_OO_ONE) {
            throw b.error(file, "voting", variable.text() + " has one channel; only 1oo1 is possible");
        }
        int[] channels = channels(file, b, variable, voting);
        String unitSi = variable.siUnit();
        double sp = quantity(file, b, "setpoint", unitSi, false);
        double hyst = quantity(file, b, "hysteresis", unitSi, true);
        if (hyst < 0) {
            throw b.error(file, "hysteresis", "must not be negative");
        }
        double delay = seconds(file, b, "on_delay");
        double bypassMax = b.values.containsKey("bypass_max") ? seconds(file, b, "bypass_max") : 0.0;
        boolean badTrips = yesNo(file, b, "bad_counts_as_tripped", false);
        boolean uncertainUsable = yesNo(file, b, "uncertain_usable", false);
        boolean latch = yesNo(file, b, "latch", kind == InterlockSpec.Kind.TRIP);
        if (kind == InterlockSpec.Kind.TRIP && !latch) {
            throw b.error(file, "latch", "a trip always latches until reset");
        }
        Action[] actions = actions(file, b);
        Annunciator ann;
        if (b.values.containsKey("annunciator")) {
            ann = Annunciator.byText(b.values.get("annunciator"));
            if (ann == null) {
                throw b.error(file, "annunciator", "expected lal, lah, lall, lahh, tal, ldah or none");
            }
        } else {
            ann = Annunciator.byText(b.name);
            if (ann == null) {
                ann = Annunciator.NONE;
            }
        }
        try {
            return new InterlockSpec(b.name, b.line, b.values.getOrDefault("description", ""), kind, variable, channels,
                    voting, dir, sp, hyst, delay, badTrips, uncertainUsable, latch, actions, bypassMax, ann,
                    b.values.get("setpoint"), b.values.get("hysteresis"));
        } catch (IllegalArgumentException e) {
            throw new ConfigException(file, b.line, "interlock", e.getMessage());
        }
    }

    private static int[] channels(String file, Block b, InterlockSpec.Variable variable, Voting voting)
            throws ConfigException {
        if (variable != InterlockSpec.Variable.LEVEL) {
            if (b.values.containsKey("channels")) {
                throw b.error(file, "channels", variable.text() + " has a single channel; remove this key");
            }
            return new int[] {0};
        }
        if (!b.values.containsKey("channels")) {
            return switch (voting) {
                case ONE_OO_ONE -> new int[] {InterlockSpec.CH_SELECTED};
                case ONE_OO_TWO, TWO_OO_TWO -> new int[] {InterlockSpec.CH_A, InterlockSpec.CH_B};
                case TWO_OO_THREE -> new int[] {InterlockSpec.CH_A, InterlockSpec.CH_B, InterlockSpec.CH_C};
            };
        }
        String[] words = b.values.get("channels").split("[\\s,]+");
        if (words.length != voting.channels()) {
            throw b.error(file, "channels", voting.text() + " votes over " + voting.channels() + " channels, "
                    + words.length + " given");
        }
        int[] ch = new int[words.length];
        for (int i = 0; i < words.length; i++) {
            ch[i] = switch (words[i]) {
                case "a" -> InterlockSpec.CH_A;
                case "b" -> InterlockSpec.CH_B;
                case "c" -> InterlockSpec.CH_C;
                case "selected" -> InterlockSpec.CH_SELECTED;
                default -> throw b.error(file, "channels", "unknown channel '" + words[i] + "'; expected a, b, c or selected");
            };
            for (int j = 0; j < i; j++) {
                if (ch[j] == ch[i]) {
                    throw b.error(file, "channels", "channel " + words[i] + " listed twice");
                }
            }
        }
        return ch;
    }

    private static Action[] actions(String file, Block b) throws ConfigException {
        String v = b.values.get("actions");
        if (v.equals("none")) {
            return new Action[0];
        }
        String[] words = v.split("[\\s,]+");
        List<Action> list = new ArrayList<>();
        for (String w : words) {
            Action a = Action.byText(w);
            if (a == null) {
                throw b.error(file, "actions", "unknown action '" + w
                        + "'; expected fuel_cutoff, feed_pumps_stop, feed_valve_close or none");
            }
            if (list.contains(a)) {
                throw b.error(file, "actions", "action " + w + " listed twice");
            }
            list.add(a);
        }
        return list.toArray(new Action[0]);
    }

    /** A value with a unit in the dimension {@code siUnit}; a difference when {@code delta}. */
    private static double quantity(String file, Block b, String key, String siUnit, boolean delta) throws ConfigException {
        String[] w = b.values.get(key).split("\\s+");
        if (w.length != 2) {
            throw b.error(file, key, "expected a number and a unit, e.g. " + ("m".equals(siUnit) ? "-200 mm" : "60 degC"));
        }
        double x = number(file, b, key, w[0]);
        EngUnit u = EngUnit.bySymbol(w[1]);
        if (u == null || !u.siUnit().equals(siUnit)) {
            throw b.error(file, key, "unit '" + w[1] + "' is not a " + ("m".equals(siUnit) ? "length (mm, m)"
                    : "temperature (degC, K)"));
        }
        return delta ? u.toSi(x) - u.toSi(0.0) : u.toSi(x);
    }

    private static double seconds(String file, Block b, String key) throws ConfigException {
        String[] w = b.values.get(key).split("\\s+");
        if (w.length != 2) {
            throw b.error(file, key, "expected a number and a unit, e.g. 2 s");
        }
        double x = number(file, b, key, w[0]);
        double f = switch (w[1]) {
            case "s" -> 1.0;
            case "min" -> 60.0;
            case "h" -> 3600.0;
            default -> throw b.error(file, key, "unit '" + w[1] + "' is not a time (s, min, h)");
        };
        if (x < 0) {
            throw b.error(file, key, "must not be negative");
        }
        return x * f;
    }

    private static double number(String file, Block b, String key, String s) throws ConfigException {
        try {
            double x = Double.parseDouble(s);
            if (!Double.isFinite(x)) {
                throw b.error(file, key, "not a finite number: " + s);
            }
            return x;
        } catch (NumberFormatException e) {
            throw b.error(file, key, "not a number: " + s);
        }
    }

    private static boolean yesNo(String file, Block b, String key, boolean dflt) throws ConfigException {
        String v = b.values.get(key);
        if (v == null) {
            return dflt;
        }
        return switch (v) {
            case "yes" -> true;
            case "no" -> false;
            default -> throw b.error(file, key, "expected yes or no");
        };
    }

    private static FailSafe toFailSafe(String file, Block b) throws ConfigException {
        int missed = 3;
        if (b.values.containsKey("missed_scans")) {
            try {
                missed = Integer.parseInt(b.values.get("missed_scans"));
            } catch (NumberFormatException e) {
                throw b.error(file, "missed_scans", "expected a whole number of scans");
            }
            if (missed < 1) {
                throw b.error(file, "missed_scans", "must be at least 1");
            }
        }
        double valve = Double.NaN;
        if (b.values.containsKey("valve") && !b.values.get("valve").equals("hold")) {
            String[] w = b.values.get("valve").split("\\s+");
            if (w.length != 2) {
                throw b.error(file, "valve", "expected hold or a position with unit, e.g. 0 %");
            }
            double x = number(file, b, "valve", w[0]);
            EngUnit u = EngUnit.bySymbol(w[1]);
            if (u == null || !u.siUnit().equals("1")) {
                throw b.error(file, "valve", "unit '" + w[1] + "' is not a fraction (%, 1)");
            }
            valve = u.toSi(x);
            if (valve < 0 || valve > 1) {
                throw b.error(file, "valve", "position must be within 0..100 %");
            }
        }
        return new FailSafe(missed, valve, pump(file, b, "pump_a"), pump(file, b, "pump_b"));
    }

    private static FailSafe.Pump pump(String file, Block b, String key) throws ConfigException {
        String v = b.values.getOrDefault(key, "hold");
        return switch (v) {
            case "hold" -> FailSafe.Pump.HOLD;
            case "run" -> FailSafe.Pump.RUN;
            case "stop" -> FailSafe.Pump.STOP;
            default -> throw b.error(file, key, "expected hold, run or stop");
        };
    }

    private static String stripComment(String line) {
        int i = line.indexOf('#');
        return i < 0 ? line : line.substring(0, i);
    }

    private static boolean contains(String[] a, String s) {
        for (String x : a) {
            if (x.equals(s)) {
                return true;
            }
        }
        return false;
    }

    /** A header line and its key/value lines. */
    private static final class Block {
        final String name;
        final int line;
        final boolean watchdog;
        final Map<String, String> values = new HashMap<>();
        final Map<String, Integer> lines = new HashMap<>();

        Block(String name, int line, boolean watchdog) {
            this.name = name;
            this.line = line;
            this.watchdog = watchdog;
        }

        ConfigException error(String file, String key, String msg) {
            Integer ln = lines.get(key);
            return new ConfigException(file, ln == null ? line : ln, key, msg);
        }
    }
}
