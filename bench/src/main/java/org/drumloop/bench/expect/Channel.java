package org.drumloop.bench.expect;

import org.drumloop.core.io.EngUnit;

/**
 * The recorded signals of a bench run: plant truth, controller view and scenario inputs. Values are
 * held in SI (the {@link EngUnit}'s SI unit); {@link #unit()} is the unit shown in headers, reports
 * and expected in scenario files. The {@link #tag()} is the name a scenario uses.
 */
public enum Channel {
    DRUM_LEVEL("drum_level", EngUnit.MM, 1, "drum level (true, relative to NWL)"),
    MEASURED_LEVEL("measured_level", EngUnit.MM, 1, "controller level (selected, compensated)"),
    CONTROL_LEVEL("control_level", EngUnit.MM, 1, "level used by the controller (after swell compensation)"),
    SETPOINT("setpoint", EngUnit.MM, 1, "level setpoint"),
    DRUM_PRESSURE("drum_pressure", EngUnit.BARG, 3, "drum pressure"),
    STEAM_FLOW("steam_flow", EngUnit.T_PER_H, 3, "steam flow (true)"),
    FEED_FLOW("feed_flow", EngUnit.T_PER_H, 3, "feed flow (true)"),
    STEAM_FLOW_MEASURED("steam_flow_measured", EngUnit.T_PER_H, 3, "steam flow seen by the controller"),
    FEED_FLOW_MEASURED("feed_flow_measured", EngUnit.T_PER_H, 3, "feed flow seen by the controller"),
    FEED_FLOW_SETPOINT("feed_flow_setpoint", EngUnit.T_PER_H, 3, "feed flow setpoint (three-element)"),
    FEED_VALVE("feed_valve", EngUnit.PERCENT, 2, "feed valve position"),
    VALVE_DEMAND("valve_demand", EngUnit.PERCENT, 2, "feed valve demand"),
    FIRING("firing", EngUnit.PERCENT, 2, "burner firing rate"),
    HEAT("heat", EngUnit.MW, 4, "heat to the risers"),
    STEAM_DEMAND("steam_demand", EngUnit.PERCENT, 2, "steam demand"),
    FEED_TEMP("feed_temp", EngUnit.DEG_C, 2, "feed temperature"),
    FEED_PRESSURE("feed_pressure", EngUnit.BARG, 3, "feed pump discharge pressure"),
    SAFETY_VALVE_FLOW("safety_valve_flow", EngUnit.T_PER_H, 3, "safety valve flow"),
    PUMP_A_RUNNING("pump_a_running", EngUnit.BOOL, 0, "feed pump A running"),
    PUMP_B_RUNNING("pump_b_running", EngUnit.BOOL, 0, "feed pump B running"),
    BURNER_ON("burner_on", EngUnit.BOOL, 0, "burner firing"),
    FUEL_CUTOFF("fuel_cutoff", EngUnit.BOOL, 0, "fuel cut-off demanded by the controller"),
    AUTO("auto", EngUnit.BOOL, 0, "controller in automatic"),
    /** Mode code: 0 manual, 1 single-element, 2 three-element. */
    MODE("mode", EngUnit.FRACTION, 0, "control mode (0 manual, 1 single-element, 2 three-element)"),
    LEVEL_TX_A("level_tx_a", EngUnit.MM, 1, "level transmitter A as the controller reads it (compensated)"),
    LEVEL_TX_B("level_tx_b", EngUnit.MM, 1, "level transmitter B as the controller reads it (compensated)"),
    LEVEL_TX_C("level_tx_c", EngUnit.MM, 1, "level transmitter C as the controller reads it (compensated)");

    /** The level transmitters' channels, A, B, C. */
    public static final Channel[] LEVEL_TX = {LEVEL_TX_A, LEVEL_TX_B, LEVEL_TX_C};

    private static final Channel[] VALUES = values();

    private final String tag;
    private final EngUnit unit;
    private final int decimals;
    private final String description;

    Channel(String tag, EngUnit unit, int decimals, String description) {
        this.tag = tag;
        this.unit = unit;
        this.decimals = decimals;
        this.description = description;
    }

    public String tag() { return tag; }

    public EngUnit unit() { return unit; }

    /** Decimals written in the trend file (engineering units). */
    public int decimals() { return decimals; }

    public String description() { return description; }

    /** Column header: {@code drum_level[mm]}. */
    public String header() {
        return tag + "[" + (this == MODE ? "code" : unit.symbol()) + "]";
    }

    public boolean isBool() { return unit == EngUnit.BOOL; }

    /** The channel an error is measured against for IAE (setpoint for levels), or null. */
    public Channel reference() {
        switch (this) {
            case DRUM_LEVEL:
            case MEASURED_LEVEL:
            case CONTROL_LEVEL:
                return SETPOINT;
            case FEED_FLOW:
            case FEED_FLOW_MEASURED:
                return FEED_FLOW_SETPOINT;
            default:
                return null;
        }
    }

    public static int count() { return VALUES.length; }

    public static Channel of(int ordinal) { return VALUES[ordinal]; }

    public static Channel byTag(String tag) {
        for (Channel c : VALUES) {
            if (c.tag.equalsIgnoreCase(tag)) {
                return c;
            }
        }
        return null;
    }

    /** All tags, for error messages. */
    public static String tags() {
        StringBuilder sb = new StringBuilder();
        for (Channel c : VALUES) {
            if (sb.length() > 0) {
                sb.append(", ");
            }
            sb.append(c.tag);
        }
        return sb.toString();
    }
}
