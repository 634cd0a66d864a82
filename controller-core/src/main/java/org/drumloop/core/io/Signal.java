package org.drumloop.core.io;

/**
 * The named signals of the drum-level controller's process image: its I/O list.
 *
 * <p>Every value inside the image is in SI units ({@link #siUnit()}); engineering units (mm, barg,
 * t/h, %, degC) exist only at the edges (channel map, reports, screens). Analogue inputs fed from a
 * 4-20 mA loop may carry the loop current too (see {@link ProcessImage#currentMa(Signal)}); the
 * firmware then does NAMUR NE 43 checking and scaling itself with the transmitter calibration in
 * its tuning file.
 *
 * <p>The {@link #tag()} is the name used in channel maps, scenarios and trend headers. Tags are
 * never reused for another meaning: a retired signal stays here, marked retired.
 */
public enum Signal {
    // ---- inputs: field to controller -------------------------------------------------------
    /** Drum level transmitter A, differential pressure HP-LP across the taps [Pa] (reverse acting: falls as level rises). */
    LEVEL_DP_A("level_dp_a", Direction.TO_CONTROLLER, Kind.ANALOG, "Pa"),
    /** Drum level transmitter B [Pa]. */
    LEVEL_DP_B("level_dp_b", Direction.TO_CONTROLLER, Kind.ANALOG, "Pa"),
    /** Drum level transmitter C [Pa]. */
    LEVEL_DP_C("level_dp_c", Direction.TO_CONTROLLER, Kind.ANALOG, "Pa"),
    /** Steam flow element differential pressure [Pa]. */
    STEAM_FLOW_DP("steam_flow_dp", Direction.TO_CONTROLLER, Kind.ANALOG, "Pa"),
    /** Feedwater flow element differential pressure [Pa]. */
    FEED_FLOW_DP("feed_flow_dp", Direction.TO_CONTROLLER, Kind.ANALOG, "Pa"),
    /** Drum pressure, absolute [Pa]. */
    DRUM_PRESSURE("drum_pressure", Direction.TO_CONTROLLER, Kind.ANALOG, "Pa"),
    /** Feedwater temperature at the economiser/drum inlet [K]. */
    FEED_TEMP("feed_temp", Direction.TO_CONTROLLER, Kind.ANALOG, "K"),
    /** Feed pump discharge header pressure, absolute [Pa]. */
    FEED_PRESSURE("feed_pressure", Direction.TO_CONTROLLER, Kind.ANALOG, "Pa"),
    /** Feed pump A running feedback. */
    PUMP_A_RUNNING("pump_a_running", Direction.TO_CONTROLLER, Kind.BOOL, ""),
    /** Feed pump B running feedback. */
    PUMP_B_RUNNING("pump_b_running", Direction.TO_CONTROLLER, Kind.BOOL, ""),
    /** Burner firing (flame proven) feedback. */
    BURNER_ON("burner_on", Direction.TO_CONTROLLER, Kind.BOOL, ""),

    // ---- outputs: controller to field ------------------------------------------------------
    /** Feed control valve position demand, 0 = shut, 1 = fully open [1]. */
    FEED_VALVE_DEMAND("feed_valve_demand", Direction.FROM_CONTROLLER, Kind.ANALOG, "1"),
    /** Run command feed pump A (true = run). */
    PUMP_A_RUN("pump_a_run", Direction.FROM_CONTROLLER, Kind.BOOL, ""),
    /** Run command feed pump B (true = run). */
    PUMP_B_RUN("pump_b_run", Direction.FROM_CONTROLLER, Kind.BOOL, ""),
    /** Fuel cut-off to the burner management system (true = cut fuel; LALL action). */
    FUEL_CUTOFF("fuel_cutoff", Direction.FROM_CONTROLLER, Kind.BOOL, ""),
    /** Low drum level alarm (LAL) annunciator. */
    ALARM_LAL("alarm_lal", Direction.FROM_CONTROLLER, Kind.BOOL, ""),
    /** High drum level alarm (LAH) annunciator. */
    ALARM_LAH("alarm_lah", Direction.FROM_CONTROLLER, Kind.BOOL, ""),
    /** Low-low drum level trip (LALL) annunciator. */
    TRIP_LALL("trip_lall", Direction.FROM_CONTROLLER, Kind.BOOL, ""),
    /** High-high drum level trip (LAHH) annunciator. */
    TRIP_LAHH("trip_lahh", Direction.FROM_CONTROLLER, Kind.BOOL, ""),
    /** Controller's compensated (median-selected) drum level, relative to normal water level [m], for indication. */
    LEVEL_INDICATED("level_indicated", Direction.FROM_CONTROLLER, Kind.ANALOG, "m");

    /** Which side writes the signal. */
    public enum Direction { TO_CONTROLLER, FROM_CONTROLLER }

    /** Analogue (double) or binary. */
    public enum Kind { ANALOG, BOOL }

    private static final Signal[] VALUES = values();

    private final String tag;
    private final Direction direction;
    private final Kind kind;
    private final String siUnit;

    Signal(String tag, Direction direction, Kind kind, String siUnit) {
        this.tag = tag;
        this.direction = direction;
        this.kind = kind;
        this.siUnit = siUnit;
    }

    /** Name used in channel maps, scenarios and trend headers (lower case, underscores). */
    public String tag() { return tag; }

    public Direction direction() { return direction; }

    public Kind kind() { return kind; }

    /** SI unit of the value inside the image ("1" for a fraction, "" for a bool). */
    public String siUnit() { return siUnit; }

    public boolean isInput() { return direction == Direction.TO_CONTROLLER; }

    /** Number of signals; image arrays are this long. */
    public static int count() { return VALUES.length; }

    /** The signal with this ordinal, without allocating (unlike {@code values()}). */
    public static Signal of(int ordinal) { return VALUES[ordinal]; }

    /** Look a tag up, or null when unknown. */
    public static Signal byTag(String tag) {
        for (Signal s : VALUES) {
            if (s.tag.equals(tag)) {
                return s;
            }
        }
        return null;
    }
}
