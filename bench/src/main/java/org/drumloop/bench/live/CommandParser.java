package org.drumloop.bench.live;

import java.util.List;
import java.util.Map;
import java.util.Set;
import org.drumloop.core.io.EngUnit;

/**
 * Turns a JSON command from the page into a validated {@link LiveAction}, or says exactly what is
 * wrong. Nothing is queued unless every member is present, known and in range, so a bad request
 * changes nothing.
 *
 * <p>Wire format (one flat object, engineering units at this edge):
 * <pre>
 * {"cmd":"mode","mode":"manual|single-element|three-element"}
 * {"cmd":"auto","auto":true|false}
 * {"cmd":"manual_output","percent":0..100}
 * {"cmd":"setpoint","mm":N}                       within the LAL..LAH band
 * {"cmd":"ack","tag":"LAL|...|all"}   {"cmd":"reset"}
 * {"cmd":"bypass","tag":"LALL","reason":"text","seconds":1..3600}
 * {"cmd":"steam_demand","percent":0..120}
 * {"cmd":"steam_ramp","percent":0..120,"seconds":0.1..3600}
 * {"cmd":"fault","target":"level_tx_a","kind":"stuck|fail-low|fail-high"}
 * {"cmd":"fault","target":"level_tx_a","kind":"bias","value":N,"unit":"kPa"}
 * {"cmd":"fault","target":"level_tx_a","kind":"drift","value":N,"unit":"kPa/s"}
 * {"cmd":"fault","target":"level_tx_a","kind":"noise-burst","value":N,"unit":"kPa","seconds":S}
 * {"cmd":"trip","target":"feed_pump_a|feed_pump_b|burner"}
 * {"cmd":"valve_stuck"}  {"cmd":"steam_surge","percent":1..100}
 * {"cmd":"tube_leak","value":N,"unit":"t/h|kg/s"}
 * {"cmd":"clear","target":"all|level_tx_a|feed_pump_a|feed_valve|steam|drum|burner|..."}
 * </pre>
 * Loop control ({@code pause}, {@code resume}, {@code speed}) is handled by the server, not here.
 * When the session drives real hardware ({@link LiveInfo#hardware()}) the instructor commands are
 * refused before anything else is read: there is no plant to act on.
 */
final class CommandParser {
    /** Steam demand may exceed rating a little for overload tests (common practice: 110 % MCR). */
    static final double STEAM_DEMAND_MAX_PERCENT = 120.0;
    /** A bypass must expire; one hour is the longest this bench offers. */
    static final double BYPASS_MAX_S = 3600.0;
    static final double RAMP_MAX_S = 3600.0;
    static final int REASON_MAX_CHARS = 200;
    static final Set<String> MODES = Set.of("manual", "single-element", "three-element");
    static final Set<String> FAULT_KINDS = Set.of("stuck", "drift", "bias", "fail-low", "fail-high", "noise-burst");
    /** Plant targets a clear may name besides transmitters and trippable equipment. */
    static final List<String> CLEAR_EXTRA = List.of("all", "feed_valve", "steam", "drum");

    /** Instructor commands: they act on a simulated plant, so a session on hardware refuses them. */
    static final Set<String> PLANT_COMMANDS = Set.of("steam_demand", "steam_ramp", "fault", "trip", "valve_stuck",
            "steam_surge", "tube_leak", "clear");

    private final LiveInfo info;

    CommandParser(LiveInfo info) {
        this.info = info;
    }

    /** A request the server answers with 400 and this message. */
    static final class BadCommand extends Exception {
        BadCommand(String message) {
            super(message);
        }
    }

    LiveAction parse(Map<String, Object> m) throws BadCommand {
        String cmd = str(m, "cmd");
        if (info.hardware() && PLANT_COMMANDS.contains(cmd)) {
            throw new BadCommand(cmd + ": " + RigLiveSession.REFUSED);
        }
        switch (cmd) {
            case "mode": {
                only(m, "cmd", "mode");
                String mode = str(m, "mode");
                if (!MODES.contains(mode)) {
                    throw new BadCommand("mode: \"" + mode + "\" is not one of manual, single-element, three-element");
                }
                return action(LiveAction.Kind.MODE, mode);
            }
            case "auto": {
                only(m, "cmd", "auto");
                boolean auto = bool(m, "auto");
                return new LiveAction(LiveAction.Kind.AUTO, "", "", auto ? 1 : 0, Double.NaN, auto ? 1 : 0, "", "");
            }
            case "manual_output": {
                only(m, "cmd", "percent");
                double pct = num(m, "percent", 0, 100, "%");
                return new LiveAction(LiveAction.Kind.MANUAL_OUTPUT, "", "", EngUnit.PERCENT.toSi(pct), Double.NaN, pct, "%", "");
            }
            case "setpoint": {
                only(m, "cmd", "mm");
                double[] r = info.setpointRangeM();
                double mm = num(m, "mm", EngUnit.MM.fromSi(r[0]), EngUnit.MM.fromSi(r[1]), "mm");
                return new LiveAction(LiveAction.Kind.SETPOINT, "", "", EngUnit.MM.toSi(mm), Double.NaN, mm, "mm", "");
            }
            case "ack": {
                only(m, "cmd", "tag");
                String tag = str(m, "tag");
                if (!"all".equals(tag) && !info.interlocks().contains(tag)) {
                    throw new BadCommand("tag: \"" + tag + "\" is not an alarm or trip of this firmware " + info.interlocks() + " nor \"all\"");
                }
                return action(LiveAction.Kind.ACKNOWLEDGE, tag);
            }
            case "reset":
                only(m, "cmd");
                return action(LiveAction.Kind.RESET, "");
            case "bypass": {
                only(m, "cmd", "tag", "reason", "seconds");
                String tag = str(m, "tag");
                if (!info.interlocks().contains(tag)) {
                    throw new BadCommand("tag: \"" + tag + "\" is not an alarm or trip of this firmware " + info.interlocks());
                }
                String reason = str(m, "reason").strip();
                if (reason.isEmpty()) {
                    throw new BadCommand("reason: a bypass needs a reason");
                }
                if (reason.length() > REASON_MAX_CHARS || reason.indexOf('"') >= 0 || reason.chars().anyMatch(c -> c < 0x20)) {
                    throw new BadCommand("reason: at most " + REASON_MAX_CHARS + " characters, no double quotes or line breaks");
                }
                double s = num(m, "seconds", 1, BYPASS_MAX_S, "s");
                return new LiveAction(LiveAction.Kind.BYPASS, tag, "", Double.NaN, s, Double.NaN, "s", reason);
            }
            case "steam_demand": {
                only(m, "cmd", "percent");
                double pct = num(m, "percent", 0, STEAM_DEMAND_MAX_PERCENT, "%");
                return new LiveAction(LiveAction.Kind.STEAM_DEMAND, "", "", EngUnit.PERCENT.toSi(pct), Double.NaN, pct, "%", "");
            }
            case "steam_ramp": {
                only(m, "cmd", "percent", "seconds");
                double pct = num(m, "percent", 0, STEAM_DEMAND_MAX_PERCENT, "%");
                double s = num(m, "seconds", 0.1, RAMP_MAX_S, "s");
                return new LiveAction(LiveAction.Kind.STEAM_RAMP, "", "", EngUnit.PERCENT.toSi(pct), s, pct, "%", "");
            }
            case "fault":
                return fault(m);
            case "trip": {
                only(m, "cmd", "target");
                String target = str(m, "target");
                if (!info.trippable().contains(target)) {
                    throw new BadCommand("target: \"" + target + "\" cannot be tripped; choose one of " + info.trippable());
                }
                return action(LiveAction.Kind.TRIP, target);
            }
            case "valve_stuck":
                only(m, "cmd");
                return action(LiveAction.Kind.VALVE_STUCK, "feed_valve");
            case "steam_surge": {
                only(m, "cmd", "percent");
                double pct = num(m, "percent", 1, 100, "%");
                return new LiveAction(LiveAction.Kind.STEAM_SURGE, "steam", "", EngUnit.PERCENT.toSi(pct), Double.NaN, pct, "%", "");
            }
            case "tube_leak": {
                only(m, "cmd", "value", "unit");
                EngUnit u = unit(m, "unit", "kg/s");
                double maxEu = u.fromSi(info.steamRatedKgS());
                double v = num(m, "value", 0, maxEu, u.symbol());
                if (v == 0) {
                    throw new BadCommand("value: a tube leak must be more than 0 " + u.symbol());
                }
                return new LiveAction(LiveAction.Kind.TUBE_LEAK, "drum", "", u.toSi(v), Double.NaN, v, u.symbol(), "");
            }
            case "clear": {
                only(m, "cmd", "target");
                String target = str(m, "target");
                if (info.transmitter(target) == null && !info.trippable().contains(target) && !CLEAR_EXTRA.contains(target)) {
                    throw new BadCommand("target: \"" + target + "\" is not a fault target");
                }
                return action(LiveAction.Kind.CLEAR, target);
            }
            default:
                throw new BadCommand("cmd: unknown command \"" + cmd + "\"");
        }
    }

    private LiveAction fault(Map<String, Object> m) throws BadCommand {
        String target = str(m, "target");
        LiveInfo.Transmitter tx = info.transmitter(target);
        if (tx == null) {
            throw new BadCommand("target: \"" + target + "\" is not a transmitter of this plant");
        }
        String kind = str(m, "kind");
        if (!FAULT_KINDS.contains(kind)) {
            throw new BadCommand("kind: \"" + kind + "\" is not one of " + FAULT_KINDS);
        }
        switch (kind) {
            case "stuck":
            case "fail-low":
            case "fail-high":
                only(m, "cmd", "target", "kind");
                return new LiveAction(LiveAction.Kind.FAULT, target, kind, Double.NaN, Double.NaN, Double.NaN, "", "");
            case "bias": {
                only(m, "cmd", "target", "kind", "value", "unit");
                EngUnit u = unit(m, "unit", tx.siUnit());
                double v = num(m, "value", -1e9, 1e9, u.symbol());
                return new LiveAction(LiveAction.Kind.FAULT, target, kind, u.toSi(v) - u.toSi(0), Double.NaN, v, u.symbol(), "");
            }
            case "drift": {
                only(m, "cmd", "target", "kind", "value", "unit");
                String unitText = str(m, "unit");
                if (!unitText.endsWith("/s")) {
                    throw new BadCommand("unit: a drift rate is per second, e.g. \"kPa/s\"; got \"" + unitText + "\"");
                }
                EngUnit u = unitOf(unitText.substring(0, unitText.length() - 2), tx.siUnit(), "unit");
                double v = num(m, "value", -1e9, 1e9, unitText);
                return new LiveAction(LiveAction.Kind.FAULT, target, kind, u.toSi(v) - u.toSi(0), Double.NaN, v, unitText, "");
            }
            default: { // noise-burst
                only(m, "cmd", "target", "kind", "value", "unit", "seconds");
                EngUnit u = unit(m, "unit", tx.siUnit());
                double v = num(m, "value", 0, 1e9, u.symbol());
                double s = num(m, "seconds", 0.1, RAMP_MAX_S, "s");
                return new LiveAction(LiveAction.Kind.FAULT, target, kind, u.toSi(v) - u.toSi(0), s, v, u.symbol(), "");
            }
        }
    }

    private static LiveAction action(LiveAction.Kind kind, String target) {
        return new LiveAction(kind, target, "", Double.NaN, Double.NaN, Double.NaN, "", "");
    }

    private static void only(Map<String, Object> m, String... allowed) throws BadCommand {
        List<String> ok = List.of(allowed);
        for (String k : m.keySet()) {
            if (!ok.contains(k)) {
                throw new BadCommand(k + ": unknown member for \"" + m.get("cmd") + "\"; expected " + ok);
            }
        }
    }

    private static String str(Map<String, Object> m, String key) throws BadCommand {
        Object v = m.get(key);
        if (v == null) {
            throw new BadCommand(key + ": missing");
        }
        if (!(v instanceof String)) {
            throw new BadCommand(key + ": must be a string");
        }
        return (String) v;
    }

    private static boolean bool(Map<String, Object> m, String key) throws BadCommand {
        Object v = m.get(key);
        if (v == null) {
            throw new BadCommand(key + ": missing");
        }
        if (!(v instanceof Boolean)) {
            throw new BadCommand(key + ": must be true or false");
        }
        return (Boolean) v;
    }

    private static double num(Map<String, Object> m, String key, double lo, double hi, String unit) throws BadCommand {
        Object v = m.get(key);
        if (v == null) {
            throw new BadCommand(key + ": missing");
        }
        if (!(v instanceof Double)) {
            throw new BadCommand(key + ": must be a number");
        }
        double d = (Double) v;
        if (!(d >= lo && d <= hi)) {
            throw new BadCommand(key + ": " + LiveAction.fmt(d) + " " + unit + " is out of range "
                    + LiveAction.fmt(lo) + " to " + LiveAction.fmt(hi) + " " + unit);
        }
        return d;
    }

    private static EngUnit unit(Map<String, Object> m, String key, String siUnit) throws BadCommand {
        return unitOf(str(m, key), siUnit, key);
    }

    private static EngUnit unitOf(String symbol, String siUnit, String key) throws BadCommand {
        EngUnit u = EngUnit.bySymbol(symbol);
        if (u == null) {
            throw new BadCommand(key + ": unknown unit \"" + symbol + "\"");
        }
        if (!u.siUnit().equals(siUnit)) {
            throw new BadCommand(key + ": \"" + symbol + "\" is not a unit of " + siUnit);
        }
        return u;
    }
}
