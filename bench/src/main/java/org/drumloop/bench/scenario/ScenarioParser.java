package org.drumloop.bench.scenario;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

import org.drumloop.bench.expect.BandExpectation;
import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Expectation;
import org.drumloop.bench.expect.IaeExpectation;
import org.drumloop.bench.expect.InterlockExpectation;
import org.drumloop.bench.expect.ModeExpectation;
import org.drumloop.bench.expect.SettleExpectation;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;

/**
 * Reads {@code .scenario} files: one statement a line, {@code #} starts a comment, every number
 * carries its unit. Header statements ({@code title}, {@code plant}, {@code tuning}, {@code duration},
 * {@code seed}, {@code load}, {@code description}) may come in any order; timed statements start with
 * {@code at TIME}; acceptance criteria start with {@code expect}. Errors read
 * {@code file:line: word: message}.
 */
public final class ScenarioParser {
    /** Mode labels the firmware knows (Mode.label()). */
    static final List<String> MODES = List.of("manual", "single-element", "three-element");
    /** Transmitter tags a fault can target, with the SI unit of their measured value. */
    static final String[][] TRANSMITTERS = {
        {"level_tx_a", "Pa"}, {"level_tx_b", "Pa"}, {"level_tx_c", "Pa"},
        {"steam_flow_tx", "Pa"}, {"feed_flow_tx", "Pa"}, {"pressure_tx", "Pa"},
        {"feed_temp_tx", "K"}, {"feed_pressure_tx", "Pa"},
    };
    /** Default steam demand the plant starts balanced at when the scenario does not say. */
    static final double DEFAULT_LOAD_FRAC = 0.7;
    /** Longest run accepted: 7 days of plant time. */
    static final double MAX_DURATION_S = 7 * 86_400.0;

    private ScenarioParser() {
    }

    public static Scenario load(Path p) throws ConfigException, IOException {
        return load(p, p.toString());
    }

    /** Load with the name to show in messages and records (e.g. {@code config/scenarios/demo.scenario}). */
    public static Scenario load(Path p, String shownAs) throws ConfigException, IOException {
        List<String> lines = Files.readAllLines(p, StandardCharsets.UTF_8);
        return parse(shownAs, p, lines);
    }

    public static Scenario parse(String file, Path path, List<String> lines) throws ConfigException {
        String title = null;
        StringBuilder description = new StringBuilder();
        String plant = "aux-boiler";
        int plantLine = 0;
        String tuning = "default";
        int tuningLine = 0;
        double durationS = Double.NaN;
        long seed = 1;
        double loadFrac = Double.NaN;
        boolean swellComp = true;
        List<ConfigException> problems = new ArrayList<>();
        // pass 1: header
        for (int i = 0; i < lines.size(); i++) {
            String text = strip(lines.get(i));
            if (text.isEmpty()) {
                continue;
            }
            try {
                Words w = new Words(file, i + 1, text);
                String key = w.next("statement").toLowerCase(Locale.ROOT);
                switch (key) {
                    case "title":
                        if (title != null) {
                            throw w.error(key, "title given twice");
                        }
                        title = w.rest();
                        if (title.isEmpty()) {
                            throw w.error(key, "title is empty");
                        }
                        break;
                    case "description":
                        description.append(description.length() == 0 ? "" : " ").append(w.rest());
                        break;
                    case "plant":
                        plant = w.next("plant name or file");
                        plantLine = i + 1;
                        w.end();
                        break;
                    case "tuning":
                        tuning = w.next("tuning name or file");
                        tuningLine = i + 1;
                        w.end();
                        break;
                    case "duration":
                        if (!Double.isNaN(durationS)) {
                            throw w.error(key, "duration given twice");
                        }
                        durationS = w.timeS("duration");
                        if (!(durationS > 0 && durationS <= MAX_DURATION_S)) {
                            throw w.error(w.last(), "duration must be above 0 and at most 7 days");
                        }
                        w.end();
                        break;
                    case "seed": {
                        String s = w.next("seed");
                        try {
                            seed = Long.parseLong(s);
                        } catch (NumberFormatException e) {
                            throw w.error(s, "seed must be a whole number");
                        }
                        w.end();
                        break;
                    }
                    case "load":
                        loadFrac = w.quantity("1", "initial load");
                        if (!(loadFrac >= 0 && loadFrac <= 1.2)) {
                            throw w.error(w.last(), "initial load must be 0..120 %");
                        }
                        w.end();
                        break;
                    case "swell_comp": {
                        String v = w.next("on or off").toLowerCase(Locale.ROOT);
                        if (!v.equals("on") && !v.equals("off")) {
                            throw w.error(v, "swell_comp is 'on' or 'off'");
                        }
                        swellComp = v.equals("on");
                        w.end();
                        break;
                    }
                    case "at":
                    case "expect":
                        break;
                    default:
                        throw w.error(key, "unknown statement (title, description, plant, tuning, duration, seed,"
                                + " load, swell_comp, at, expect)");
                }
            } catch (ConfigException e) {
                problems.add(e); // go on: the user sees every problem of the file at once
            }
        }
        if (title == null) {
            problems.add(new ConfigException(file, 0, "title", "missing: every scenario needs a title line"));
        }
        if (Double.isNaN(durationS)) {
            problems.add(new ConfigException(file, 0, "duration", "missing: say how long to run, e.g. 'duration 900 s'"));
            durationS = MAX_DURATION_S; // still check the timed statements against the longest run
        }
        // pass 2: timed statements and expectations
        List<Action> actions = new ArrayList<>();
        List<Expectation> expectations = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            String text = strip(lines.get(i));
            if (text.isEmpty()) {
                continue;
            }
            try {
                Words w = new Words(file, i + 1, text);
                String key = w.next("statement").toLowerCase(Locale.ROOT);
                text = text.replaceAll("\\s+", " "); // as shown in events and reports
                if (key.equals("at")) {
                    actions.add(action(w, text, durationS));
                } else if (key.equals("expect")) {
                    expectations.add(expectation(w, text, durationS));
                }
            } catch (ConfigException e) {
                problems.add(e);
            }
        }
        if (!problems.isEmpty()) {
            problems.sort(Comparator.comparingInt(ConfigException::line));
            throw problems.size() == 1 ? problems.get(0) : new ConfigProblems(problems);
        }
        actions.sort(Comparator.comparingDouble(Action::atS)); // stable: file order for equal times
        if (Double.isNaN(loadFrac)) {
            loadFrac = DEFAULT_LOAD_FRAC;
            for (Action a : actions) {
                if (a.atS() == 0.0 && a.type() == Action.Type.SET && a.input() == Action.Input.STEAM_DEMAND) {
                    loadFrac = a.value();
                }
            }
        }
        String name = path != null ? path.getFileName().toString() : file;
        int dot = name.lastIndexOf('.');
        if (dot > 0) {
            name = name.substring(0, dot);
        }
        return new Scenario(file, path, name, title, description.toString(), plant, plantLine, tuning, tuningLine,
                durationS, seed, loadFrac, swellComp, List.copyOf(actions), List.copyOf(expectations), List.copyOf(lines));
    }

    /** The statement without comment and surrounding blanks ({@code #} inside quotes is kept). */
    static String strip(String line) {
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (c == '"') {
                quoted = !quoted;
            } else if (c == '#' && !quoted) {
                return line.substring(0, i).trim();
            }
        }
        return line.trim();
    }

    // ------------------------------------------------------------------------------------------
    private static Action action(Words w, String text, double durationS) throws ConfigException {
        double atS = w.timeS("time of the action");
        if (atS < 0 || atS > durationS) {
            throw w.error(w.last(), "time is outside the run (0.." + fmt(durationS) + " s)");
        }
        String verb = w.next("action").toLowerCase(Locale.ROOT);
        int line = w.line();
        Action a;
        switch (verb) {
            case "set": {
                String what = w.next("what to set");
                String lw = what.toLowerCase(Locale.ROOT);
                if (lw.equals("mode")) {
                    a = new Action(atS, line, text, Action.Type.MODE, null, Double.NaN, Double.NaN, mode(w), null,
                            null);
                } else if (lw.equals("swell_comp")) {
                    throw w.error(what, "swell compensation is chosen for the whole run: write 'swell_comp off'"
                            + " as a line of its own, not after 'at'");
                } else {
                    Action.Input in = input(w, what);
                    double v;
                    if (in == Action.Input.FIRING && w.accept("auto")) {
                        v = Double.NaN;
                    } else {
                        v = w.quantity(in.siUnit(), in.tag());
                        checkInput(w, in, v);
                    }
                    a = new Action(atS, line, text, Action.Type.SET, in, v, Double.NaN, null, null, null);
                }
                break;
            }
            case "ramp": {
                Action.Input in = input(w, w.next("what to ramp"));
                w.expect("to");
                double v = w.quantity(in.siUnit(), in.tag());
                checkInput(w, in, v);
                w.expect("over");
                double overS = w.timeS("ramp time");
                if (!(overS > 0)) {
                    throw w.error(w.last(), "ramp time must be above 0 s");
                }
                a = new Action(atS, line, text, Action.Type.RAMP, in, v, overS, null, null, null);
                break;
            }
            case "auto":
                a = new Action(atS, line, text, Action.Type.AUTO, null, Double.NaN, Double.NaN, null, null, null);
                break;
            case "manual":
                a = new Action(atS, line, text, Action.Type.MANUAL, null, Double.NaN, Double.NaN, null, null, null);
                break;
            case "output": {
                double v = w.quantity("1", "manual output");
                checkInput(w, Action.Input.OUTPUT, v);
                a = new Action(atS, line, text, Action.Type.SET, Action.Input.OUTPUT, v, Double.NaN, null, null,
                        null);
                break;
            }
            case "setpoint": {
                double v = w.quantity("m", "level setpoint");
                checkInput(w, Action.Input.SETPOINT, v);
                a = new Action(atS, line, text, Action.Type.SET, Action.Input.SETPOINT, v, Double.NaN, null, null,
                        null);
                break;
            }
            case "reset":
                a = new Action(atS, line, text, Action.Type.RESET, null, Double.NaN, Double.NaN, null, null, null);
                break;
            case "acknowledge": {
                String tag = w.hasMore() ? w.next("tag") : "all";
                a = new Action(atS, line, text, Action.Type.ACKNOWLEDGE, null, Double.NaN, Double.NaN, null, tag,
                        null);
                break;
            }
            case "bypass": {
                String tag = w.next("alarm or trip tag");
                w.expect("with");
                w.expect("reason");
                String reason = w.next("reason in quotes");
                if (reason.isBlank()) {
                    throw w.error("reason", "a bypass needs a reason");
                }
                w.expect("for");
                double durS = w.timeS("bypass duration");
                if (!(durS > 0)) {
                    throw w.error(w.last(), "bypass duration must be above 0 s");
                }
                a = new Action(atS, line, text, Action.Type.BYPASS, null, durS, Double.NaN, null, tag, reason);
                break;
            }
            case "fault":
                a = fault(w, atS, text);
                break;
            case "trip":
                a = trip(w, atS, text);
                break;
            case "clear":
                a = clear(w, atS, text);
                break;
            default:
                throw w.error(verb, "unknown action (set, ramp, auto, manual, output, setpoint, reset, acknowledge,"
                        + " bypass, fault, trip, clear)");
        }
        w.end();
        return a;
    }

    private static Action.Input input(Words w, String what) throws ConfigException {
        Action.Input in = Action.Input.byTag(what);
        if (in == null) {
            throw w.error(what, "cannot be set (inputs: " + Action.Input.tags() + ", mode, swell_comp)");
        }
        return in;
    }

    private static void checkInput(Words w, Action.Input in, double v) throws ConfigException {
        boolean ok;
        String range;
        switch (in) {
            case STEAM_DEMAND: ok = v >= 0 && v <= 1.2; range = "0..120 %"; break;
            case FIRING:
            case OUTPUT: ok = v >= 0 && v <= 1.0; range = "0..100 %"; break;
            case FEED_TEMP: ok = v >= 273.15 && v <= 573.15; range = "0..300 degC"; break;
            case PRESSURE_SETPOINT: ok = v > 101_325.0 && v <= 22.0e6; range = "above atmospheric, at most 220 bar"; break;
            case SETPOINT: ok = Math.abs(v) <= 1.0; range = "-1000..1000 mm"; break;
            default: ok = true; range = ""; break;
        }
        if (!ok) {
            throw w.error(w.last(), in.tag() + " out of range (" + range + ")");
        }
    }

    private static String mode(Words w) throws ConfigException {
        String m = w.next("mode").toLowerCase(Locale.ROOT);
        if (!MODES.contains(m)) {
            throw w.error(m, "unknown mode (" + String.join(", ", MODES) + ")");
        }
        return m;
    }

    private static Action fault(Words w, double atS, String text) throws ConfigException {
        String target = w.next("transmitter").toLowerCase(Locale.ROOT);
        String si = null;
        for (String[] t : TRANSMITTERS) {
            if (t[0].equals(target)) {
                si = t[1];
            }
        }
        if (si == null) {
            throw w.error(target, "unknown transmitter (" + transmitterTags() + ")");
        }
        String kind = w.next("fault kind").toLowerCase(Locale.ROOT);
        double mag = Double.NaN;
        double durS = Double.NaN;
        String k;
        switch (kind) {
            case "stuck": k = "STUCK"; break;
            case "fail-low": k = "FAIL_LOW"; break;
            case "fail-high": k = "FAIL_HIGH"; break;
            case "bias": k = "BIAS"; mag = w.deltaQuantity(si, "bias of " + target); break;
            case "drift": {
                k = "DRIFT";
                Words.Quantity q = w.rawQuantity("drift rate of " + target);
                if (!q.unit().endsWith("/s")) {
                    throw w.error(q.unit(), "drift rate needs a unit per second, e.g. " + ("K".equals(si) ? "degC/s"
                            : "Pa/s"));
                }
                mag = new Words.Quantity(q.word(), q.value(), q.unit().substring(0, q.unit().length() - 2))
                        .deltaToSi(w, si, "drift rate of " + target);
                break;
            }
            case "noise-burst":
                k = "NOISE_BURST";
                mag = w.quantity(si, "noise standard deviation of " + target);
                if (!(mag > 0)) {
                    throw w.error(w.last(), "noise standard deviation must be above 0");
                }
                w.expect("for");
                durS = w.timeS("noise burst duration");
                if (!(durS > 0)) {
                    throw w.error(w.last(), "noise burst duration must be above 0 s");
                }
                break;
            default:
                throw w.error(kind, "unknown fault (stuck, drift RATE, bias VALUE, fail-low, fail-high,"
                        + " noise-burst SIGMA for TIME)");
        }
        return new Action(atS, w.line(), text, Action.Type.FAULT, null, mag, durS, k, target, null);
    }

    private static Action trip(Words w, double atS, String text) throws ConfigException {
        String what = w.next("equipment").toLowerCase(Locale.ROOT);
        switch (what) {
            case "feed_pump_a":
            case "feed_pump_b":
                return new Action(atS, w.line(), text, Action.Type.FAULT, null, Double.NaN, Double.NaN, "PUMP_TRIP",
                        what, null);
            case "burner":
                return new Action(atS, w.line(), text, Action.Type.FAULT, null, Double.NaN, Double.NaN,
                        "BURNER_TRIP", "burner", null);
            case "feed_valve":
                w.expect("stuck");
                return new Action(atS, w.line(), text, Action.Type.FAULT, null, Double.NaN, Double.NaN,
                        "VALVE_STUCK", "feed_valve", null);
            case "steam": {
                w.expect("surge");
                double frac = w.quantity("1", "steam surge (extra demand)");
                if (!(frac > 0 && frac <= 1.0)) {
                    throw w.error(w.last(), "steam surge must be above 0 and at most 100 %");
                }
                double durS = Double.NaN;
                if (w.accept("for")) {
                    durS = w.timeS("surge duration");
                    if (!(durS > 0)) {
                        throw w.error(w.last(), "surge duration must be above 0 s");
                    }
                }
                return new Action(atS, w.line(), text, Action.Type.FAULT, null, frac, durS, "STEAM_SURGE", "steam",
                        null);
            }
            case "tube": {
                w.expect("leak");
                double kgS = w.quantity("kg/s", "tube leak flow");
                if (!(kgS > 0)) {
                    throw w.error(w.last(), "tube leak flow must be above 0");
                }
                return new Action(atS, w.line(), text, Action.Type.FAULT, null, kgS, Double.NaN, "TUBE_LEAK", "drum",
                        null);
            }
            default:
                throw w.error(what, "unknown equipment (feed_pump_a, feed_pump_b, burner, feed_valve stuck,"
                        + " steam surge VALUE, tube leak FLOW)");
        }
    }

    private static Action clear(Words w, double atS, String text) throws ConfigException {
        String what = w.next("what to clear").toLowerCase(Locale.ROOT);
        String kind = null;
        String target;
        switch (what) {
            case "all": target = "all"; break;
            case "feed_pump_a":
            case "feed_pump_b": target = what; kind = "PUMP_TRIP"; break;
            case "burner": target = what; kind = "BURNER_TRIP"; break;
            case "feed_valve": target = what; kind = "VALVE_STUCK"; break;
            case "steam": w.expect("surge"); target = "steam"; kind = "STEAM_SURGE"; break;
            case "tube": w.expect("leak"); target = "drum"; kind = "TUBE_LEAK"; break;
            default: {
                boolean known = false;
                for (String[] t : TRANSMITTERS) {
                    known |= t[0].equals(what);
                }
                if (!known) {
                    throw w.error(what, "nothing to clear by that name (all, a transmitter, feed_pump_a,"
                            + " feed_pump_b, burner, feed_valve, steam surge, tube leak)");
                }
                target = what; // every fault of the transmitter
                break;
            }
        }
        return new Action(atS, w.line(), text, Action.Type.CLEAR, null, Double.NaN, Double.NaN, kind, target, null);
    }

    static String transmitterTags() {
        StringBuilder sb = new StringBuilder();
        for (String[] t : TRANSMITTERS) {
            sb.append(sb.length() == 0 ? "" : ", ").append(t[0]);
        }
        return sb.toString();
    }

    // ------------------------------------------------------------------------------------------
    private static Expectation expectation(Words w, String text, double durationS) throws ConfigException {
        String file = w.file();
        int line = w.line();
        String first = w.next("what to expect").toLowerCase(Locale.ROOT);
        Expectation e;
        switch (first) {
            case "alarm":
            case "trip": {
                boolean trip = first.equals("trip");
                String tag = w.next("alarm or trip tag");
                if (w.accept("never")) {
                    double[] win = w.accept("during") ? window(w, durationS) : new double[] {0, durationS};
                    e = new InterlockExpectation(file, line, text, trip, tag, true, win[0], win[1]);
                } else if (w.accept("within")) {
                    double withinS = w.timeS("time allowed");
                    w.expect("after");
                    double afterS = instant(w, durationS);
                    e = new InterlockExpectation(file, line, text, trip, tag, false, afterS, afterS + withinS);
                } else {
                    throw w.error(w.hasMore() ? w.peek() : tag, "expected 'never' or 'within TIME after TIME'");
                }
                break;
            }
            case "mode": {
                String m = mode(w);
                if (w.accept("at")) {
                    double atS = instant(w, durationS);
                    e = new ModeExpectation(file, line, text, m, true, atS, atS);
                } else if (w.accept("within")) {
                    double withinS = w.timeS("time allowed");
                    w.expect("after");
                    double afterS = instant(w, durationS);
                    e = new ModeExpectation(file, line, text, m, false, afterS, afterS + withinS);
                } else {
                    throw w.error(w.hasMore() ? w.peek() : m, "expected 'at TIME' or 'within TIME after TIME'");
                }
                break;
            }
            case "iae": {
                Channel c = channel(w, w.next("signal"));
                Channel ref = c.reference();
                double refSi = Double.NaN;
                if (w.accept("about")) {
                    refSi = w.quantity(c.unit().siUnit(), "reference value");
                    ref = null;
                } else if (ref == null) {
                    throw w.error(c.tag(), "has no setpoint to compare with: say 'about VALUE UNIT'");
                }
                w.expect("below");
                Words.Quantity q = w.rawQuantity("IAE bound");
                String u = q.unit();
                String base = null;
                for (String suffix : new String[] {"*s", ".s", "\u00b7s"}) {
                    if (u.endsWith(suffix)) {
                        base = u.substring(0, u.length() - suffix.length());
                    }
                }
                if (base == null) {
                    throw w.error(u, "IAE bound needs a unit times seconds, e.g. " + c.unit().symbol() + "*s");
                }
                double bound = new Words.Quantity(q.word(), q.value(), base).toSi(w, c.unit().siUnit(), "IAE bound")
                        - new Words.Quantity(q.word(), 0.0, base).toSi(w, c.unit().siUnit(), "IAE bound");
                if (!(bound > 0)) {
                    throw w.error(q.word(), "IAE bound must be above 0");
                }
                double[] win = w.accept("during") ? window(w, durationS) : new double[] {0, durationS};
                e = new IaeExpectation(file, line, text, c, ref, refSi, bound, win[0], win[1]);
                break;
            }
            default: {
                Channel c = channel(w, first);
                String si = c.unit().siUnit();
                String how = w.next("between, below, above or settles").toLowerCase(Locale.ROOT);
                switch (how) {
                    case "between": {
                        double[] lohi = between(w, si, c);
                        double[] win = w.accept("during") ? window(w, durationS) : new double[] {0, durationS};
                        e = new BandExpectation(file, line, text, c, lohi[0], lohi[1], win[0], win[1]);
                        break;
                    }
                    case "below":
                    case "above": {
                        double v = w.quantity(si, c.tag() + " limit");
                        double[] win = w.accept("during") ? window(w, durationS) : new double[] {0, durationS};
                        e = how.equals("below")
                                ? new BandExpectation(file, line, text, c, Double.NEGATIVE_INFINITY, v, win[0], win[1])
                                : new BandExpectation(file, line, text, c, v, Double.POSITIVE_INFINITY, win[0], win[1]);
                        break;
                    }
                    case "settles": {
                        w.expect("to");
                        double target = w.quantity(si, "settling value");
                        String pm = w.next("+- BAND");
                        if (!pm.equals("+-") && !pm.equals("\u00b1")) {
                            throw w.error(pm, "expected '+-' and the band, e.g. 'settles to 0 mm +- 15 mm'");
                        }
                        Words.Quantity q = w.rawQuantity("settling band");
                        double band = q.toSi(w, si, "settling band") - new Words.Quantity(q.word(), 0.0, q.unit())
                                .toSi(w, si, "settling band");
                        if (!(band > 0)) {
                            throw w.error(q.word(), "settling band must be above 0");
                        }
                        w.expect("within");
                        double withinS = w.timeS("settling time");
                        w.expect("after");
                        double afterS = instant(w, durationS);
                        e = new SettleExpectation(file, line, text, c, target, band, withinS, afterS);
                        break;
                    }
                    default:
                        throw w.error(how, "expected between, below, above or settles");
                }
                break;
            }
        }
        w.end();
        return e;
    }

    private static Channel channel(Words w, String tag) throws ConfigException {
        Channel c = Channel.byTag(tag);
        if (c == null) {
            throw w.error(tag, "unknown signal (known: " + Channel.tags() + "; or alarm, trip, mode, iae)");
        }
        return c;
    }

    /** {@code LO and HI UNIT} or {@code LO UNIT and HI UNIT}. */
    private static double[] between(Words w, String si, Channel c) throws ConfigException {
        String loWord = w.next("lower limit");
        String unitOrAnd = w.peek();
        double lo;
        double hi;
        if (Words.numberPrefixLength(loWord) == loWord.length() && "and".equalsIgnoreCase(unitOrAnd)) {
            w.expect("and");
            Words.Quantity q = w.rawQuantity("upper limit");
            double loV;
            try {
                loV = Double.parseDouble(loWord);
            } catch (NumberFormatException e) {
                throw w.error(loWord, "not a number");
            }
            lo = new Words.Quantity(loWord, loV, q.unit()).toSi(w, si, c.tag() + " lower limit");
            hi = q.toSi(w, si, c.tag() + " upper limit");
        } else {
            Words again = new Words(w.file(), w.line(), loWord + (unitOrAnd != null
                    && Words.numberPrefixLength(loWord) == loWord.length() ? " " + w.next("unit") : ""));
            lo = again.quantity(si, c.tag() + " lower limit");
            w.expect("and");
            hi = w.quantity(si, c.tag() + " upper limit");
        }
        if (!(hi > lo)) {
            throw w.error(w.last(), "upper limit must be above the lower limit");
        }
        return new double[] {lo, hi};
    }

    private static double[] window(Words w, double durationS) throws ConfigException {
        double[] win = w.window("time window");
        if (win[1] > durationS + 1e-9) {
            throw w.error(w.last(), "window ends after the run (" + fmt(durationS) + " s)");
        }
        return win;
    }

    private static double instant(Words w, double durationS) throws ConfigException {
        double t = w.timeS("instant");
        if (t < 0 || t > durationS) {
            throw w.error(w.last(), "instant is outside the run (0.." + fmt(durationS) + " s)");
        }
        return t;
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.0f", v);
    }
}
