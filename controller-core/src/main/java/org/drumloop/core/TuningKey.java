package org.drumloop.core;

/**
 * Every key of a {@code .tuning} file: its section, the quantity (SI dimension) it takes and its
 * allowed range in SI. All keys are required. Keys with {@link #choices} take one of those words
 * instead of a number; {@code integral_time} also takes {@code off}.
 */
enum TuningKey {
    // [general]
    SCAN_PERIOD("general", "scan_period", "s", 0.010, 1.000),
    INTERLOCKS("general", "interlocks", null, 0, 0, "*"),
    RATED_STEAM_FLOW("general", "rated_steam_flow", "kg/s", 1e-3, 1e4),
    DESIGN_PRESSURE("general", "design_pressure", "Pa", 1e5, 180e5),
    DESIGN_FEED_TEMP("general", "design_feed_temp", "K", 273.15, 613.15),
    START_MODE("general", "start_mode", null, 0, 0, "manual", "single-element", "three-element"),
    LEVEL_SETPOINT("general", "level_setpoint", "m", -2.0, 2.0),
    MANUAL_VALVE("general", "manual_valve", "1", 0.0, 1.0),

    // [level_transmitters] (A, B and C share one datasheet)
    TAP_LOW("level_transmitters", "tap_low", "m", -5.0, 0.0),
    TAP_HIGH("level_transmitters", "tap_high", "m", 0.0, 5.0),
    REF_LEG_TEMP("level_transmitters", "ref_leg_temp", "K", 273.15, 473.15),
    LEVEL_RANGE_LOW("level_transmitters", "range_low", "m", -5.0, 5.0),
    LEVEL_RANGE_HIGH("level_transmitters", "range_high", "m", -5.0, 5.0),
    CALIBRATION_PRESSURE("level_transmitters", "calibration_pressure", "Pa", 1e5, 180e5),
    LEVEL_RATE_LIMIT("level_transmitters", "rate_limit", "m/s", 1e-4, 100.0),
    LEVEL_STALE_AFTER("level_transmitters", "stale_after", "s", 1e-3, 3600.0),

    // [drum_pressure]
    DP_RANGE_LOW("drum_pressure", "range_low", "Pa", 0.0, 300e5),
    DP_RANGE_HIGH("drum_pressure", "range_high", "Pa", 0.0, 300e5),
    DP_RATE_LIMIT("drum_pressure", "rate_limit", "Pa/s", 1.0, 1e9),
    DP_STALE_AFTER("drum_pressure", "stale_after", "s", 1e-3, 3600.0),

    // [steam_flow]
    SF_RANGE("steam_flow", "range", "kg/s", 1e-3, 1e4),
    SF_DP_RANGE("steam_flow", "dp_range", "Pa", 1.0, 1e7),
    SF_DESIGN_DENSITY("steam_flow", "design_density", "kg/m3", 0.01, 1500.0),
    SF_CUTOFF("steam_flow", "low_flow_cutoff", "1", 0.0, 0.5),
    SF_RATE_LIMIT("steam_flow", "rate_limit", "Pa/s", 1.0, 1e9),
    SF_STALE_AFTER("steam_flow", "stale_after", "s", 1e-3, 3600.0),

    // [feed_flow]
    FF_RANGE("feed_flow", "range", "kg/s", 1e-3, 1e4),
    FF_DP_RANGE("feed_flow", "dp_range", "Pa", 1.0, 1e7),
    FF_DESIGN_DENSITY("feed_flow", "design_density", "kg/m3", 100.0, 1500.0),
    FF_CUTOFF("feed_flow", "low_flow_cutoff", "1", 0.0, 0.5),
    FF_RATE_LIMIT("feed_flow", "rate_limit", "Pa/s", 1.0, 1e9),
    FF_STALE_AFTER("feed_flow", "stale_after", "s", 1e-3, 3600.0),

    // [feed_temp]
    FT_RANGE_LOW("feed_temp", "range_low", "K", 173.15, 1273.15),
    FT_RANGE_HIGH("feed_temp", "range_high", "K", 173.15, 1273.15),
    FT_RATE_LIMIT("feed_temp", "rate_limit", "K/s", 1e-3, 1e4),
    FT_STALE_AFTER("feed_temp", "stale_after", "s", 1e-3, 3600.0),

    // [feed_pressure]
    FP_RANGE_LOW("feed_pressure", "range_low", "Pa", 0.0, 300e5),
    FP_RANGE_HIGH("feed_pressure", "range_high", "Pa", 0.0, 300e5),
    FP_RATE_LIMIT("feed_pressure", "rate_limit", "Pa/s", 1.0, 1e9),
    FP_STALE_AFTER("feed_pressure", "stale_after", "s", 1e-3, 3600.0),

    // [single_element]: level [m] -> valve [1]
    SE_GAIN("single_element", "gain", "1/m", 0.0, 1e4),
    SE_TI("single_element", "integral_time", "s", 0.1, 1e5),
    SE_TD("single_element", "derivative_time", "s", 0.0, 1e4),
    SE_N("single_element", "derivative_filter", "1", 1.0, 100.0),
    SE_B("single_element", "setpoint_weight", "1", 0.0, 1.0),
    SE_OUT_LOW("single_element", "output_low", "1", 0.0, 1.0),
    SE_OUT_HIGH("single_element", "output_high", "1", 0.0, 1.0),
    SE_RATE("single_element", "output_rate", "1/s", 1e-4, 100.0),
    SE_TT("single_element", "tracking_time", "s", 0.01, 1e5),

    // [level_master]: level [m] -> feed flow correction [kg/s]
    LM_GAIN("level_master", "gain", "(kg/s)/m", 0.0, 1e6),
    LM_TI("level_master", "integral_time", "s", 0.1, 1e5),
    LM_TD("level_master", "derivative_time", "s", 0.0, 1e4),
    LM_N("level_master", "derivative_filter", "1", 1.0, 100.0),
    LM_B("level_master", "setpoint_weight", "1", 0.0, 1.0),
    LM_OUT_LOW("level_master", "output_low", "kg/s", -1e4, 0.0),
    LM_OUT_HIGH("level_master", "output_high", "kg/s", 0.0, 1e4),
    LM_RATE("level_master", "output_rate", "(kg/s)/s", 1e-4, 1e4),
    LM_TT("level_master", "tracking_time", "s", 0.01, 1e5),

    // [feed_slave]: feed flow [kg/s] -> valve [1]
    FS_GAIN("feed_slave", "gain", "1/(kg/s)", 0.0, 1e3),
    FS_TI("feed_slave", "integral_time", "s", 0.1, 1e5),
    FS_TD("feed_slave", "derivative_time", "s", 0.0, 1e4),
    FS_N("feed_slave", "derivative_filter", "1", 1.0, 100.0),
    FS_B("feed_slave", "setpoint_weight", "1", 0.0, 1.0),
    FS_OUT_LOW("feed_slave", "output_low", "1", 0.0, 1.0),
    FS_OUT_HIGH("feed_slave", "output_high", "1", 0.0, 1.0),
    FS_RATE("feed_slave", "output_rate", "1/s", 1e-4, 100.0),
    FS_TT("feed_slave", "tracking_time", "s", 0.01, 1e5),

    // [three_element]
    FF_GAIN("three_element", "feedforward_gain", "1", 0.0, 2.0),
    FF_BIAS("three_element", "feedforward_bias", "kg/s", -1e3, 1e3),
    FEED_SP_MAX("three_element", "feed_setpoint_max", "kg/s", 1e-3, 1e4),
    AUTO_SELECT("three_element", "auto_select", null, 0, 0, "on", "off"),
    UP_LOAD("three_element", "three_element_above", "1", 0.0, 1.0),
    DOWN_LOAD("three_element", "single_element_below", "1", 0.0, 1.0),
    FLOW_RETURN_DELAY("three_element", "flow_good_delay", "s", 0.0, 3600.0),

    // [swell]
    SWELL_GAIN("swell", "gain", "m/(kg/s)", 0.0, 10.0),
    SWELL_TAU("swell", "time_constant", "s", 0.1, 1e4),

    // [setpoint_program]
    SP_PROGRAM("setpoint_program", "enabled", null, 0, 0, "on", "off"),
    SP_OFFSET_ZERO("setpoint_program", "offset_at_zero_load", "m", -1.0, 1.0),
    SP_OFFSET_RATED("setpoint_program", "offset_at_rated_load", "m", -1.0, 1.0),

    // [feed_pumps]
    PUMP_DUTY("feed_pumps", "duty", null, 0, 0, "a", "b"),
    PUMP_OPERATION("feed_pumps", "operation", null, 0, 0, "continuous", "stop_start"),
    PUMP_START_LEVEL("feed_pumps", "start_level", "m", -2.0, 2.0),
    PUMP_STOP_LEVEL("feed_pumps", "stop_level", "m", -2.0, 2.0),
    PUMP_START_TIMEOUT("feed_pumps", "start_timeout", "s", 0.1, 600.0),
    PUMP_LOW_PRESSURE("feed_pumps", "low_pressure", "Pa", 0.0, 300e5),
    PUMP_LOW_PRESSURE_DELAY("feed_pumps", "low_pressure_delay", "s", 0.0, 600.0);

    final String section;
    final String name;
    /** SI dimension, null for a word key. */
    final String dim;
    final double minSi;
    final double maxSi;
    /** Allowed words; {"*"} for any word (a file name). */
    final String[] choices;

    TuningKey(String section, String name, String dim, double minSi, double maxSi, String... choices) {
        this.section = section;
        this.name = name;
        this.dim = dim;
        this.minSi = minSi;
        this.maxSi = maxSi;
        this.choices = choices;
    }

    /** "section.key", as used in error messages. */
    String qualified() { return section + "." + name; }

    static TuningKey find(String section, String name) {
        for (TuningKey k : values()) {
            if (k.section.equals(section) && k.name.equals(name)) {
                return k;
            }
        }
        return null;
    }

    static boolean isSection(String section) {
        for (TuningKey k : values()) {
            if (k.section.equals(section)) {
                return true;
            }
        }
        return false;
    }
}
