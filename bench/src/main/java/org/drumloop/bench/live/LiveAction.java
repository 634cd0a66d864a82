package org.drumloop.bench.live;

import java.util.Locale;

/**
 * One validated action from the page, applied by the loop at the next scan boundary.
 *
 * <p>Operator actions go to the firmware's own queued paths; instructor actions go to the plant.
 * Values are SI ({@code valueSi}); the engineering value and unit the user typed are kept so the
 * action can be written back as a scenario statement ({@link #scenarioStatement()}) that the
 * bench's scenario runner replays.
 *
 * @param kind      what to do
 * @param target    mode label, interlock tag, transmitter tag, equipment name or "all"; "" if none
 * @param faultKind for {@link Kind#FAULT}: stuck, drift, bias, fail-low, fail-high, noise-burst
 * @param valueSi   main value in SI (fraction, m, kg/s, Pa, K, ...), NaN when none
 * @param durationS ramp time, bypass time or burst duration [s], NaN when none
 * @param valueEu   the value as the user gave it, for the scenario statement
 * @param unit      unit symbol of {@code valueEu} (e.g. "%", "mm", "kPa", "kPa/s", "t/h")
 * @param text      bypass reason; "" otherwise
 */
public record LiveAction(Kind kind, String target, String faultKind, double valueSi, double durationS,
                         double valueEu, String unit, String text) {

    /** The actions the page can send. */
    public enum Kind {
        // operator (firmware)
        MODE(true), AUTO(true), MANUAL_OUTPUT(true), SETPOINT(true), ACKNOWLEDGE(true), RESET(true), BYPASS(true),
        // instructor (plant)
        STEAM_DEMAND(false), STEAM_RAMP(false), FAULT(false), TRIP(false), VALVE_STUCK(false),
        STEAM_SURGE(false), TUBE_LEAK(false), CLEAR(false);

        private final boolean operator;

        Kind(boolean operator) {
            this.operator = operator;
        }

        /** True for actions that go through the firmware's operator interface. */
        public boolean operator() {
            return operator;
        }
    }

    /** Auto/manual as a boolean in {@link #valueSi()}: 1 = auto. */
    public boolean auto() {
        return valueSi >= 0.5;
    }

    /**
     * The statement that replays this action in a scenario file (without the {@code at N s}
     * prefix), in the bench's scenario language.
     */
    public String scenarioStatement() {
        switch (kind) {
            case MODE: return "set mode " + target;
            case AUTO: return auto() ? "auto" : "manual";
            case MANUAL_OUTPUT: return "output " + fmt(valueEu) + " %";
            case SETPOINT: return "setpoint " + fmt(valueEu) + " mm";
            case ACKNOWLEDGE: return "acknowledge" + ("all".equals(target) ? "" : " " + target);
            case RESET: return "reset";
            case BYPASS: return "bypass " + target + " with reason \"" + text + "\" for " + fmt(durationS) + " s";
            case STEAM_DEMAND: return "set steam_demand " + fmt(valueEu) + " %";
            case STEAM_RAMP: return "ramp steam_demand to " + fmt(valueEu) + " % over " + fmt(durationS) + " s";
            case FAULT: {
                StringBuilder b = new StringBuilder("fault ").append(target).append(' ').append(faultKind);
                if ("drift".equals(faultKind) || "bias".equals(faultKind) || "noise-burst".equals(faultKind)) {
                    b.append(' ').append(fmt(valueEu)).append(' ').append(unit);
                }
                if ("noise-burst".equals(faultKind)) {
                    b.append(" for ").append(fmt(durationS)).append(" s");
                }
                return b.toString();
            }
            case TRIP: return "trip " + target;
            case VALVE_STUCK: return "trip feed_valve stuck";
            case STEAM_SURGE: return "trip steam surge " + fmt(valueEu) + " %";
            case TUBE_LEAK: return "trip tube leak " + fmt(valueEu) + " " + unit;
            case CLEAR:
                return "clear " + ("steam".equals(target) ? "steam surge" : "drum".equals(target) ? "tube leak" : target);
            default: throw new IllegalStateException(kind.name());
        }
    }

    /** Shortest plain decimal, no exponent, at most 6 decimals. */
    static String fmt(double v) {
        String s = String.format(Locale.ROOT, "%.6f", v);
        s = s.replaceAll("0+$", "");
        if (s.endsWith(".")) {
            s = s.substring(0, s.length() - 1);
        }
        return "-0".equals(s) ? "0" : s;
    }
}
