package org.drumloop.plant;

/**
 * Every key of a plant file, with the quantity it measures and its allowed range in SI. All keys
 * are required. Heights and levels are in metres; levels and tap heights relative to the normal
 * water level (NWL), geometry heights from the bottom of the drum shell.
 */
public enum PlantKey {
    NAME("name", Dim.TEXT, 0, 0),
    DESCRIPTION("description", Dim.TEXT, 0, 0),
    SOURCE("source", Dim.TEXT, 0, 0),

    // Åström–Bell drum, risers and downcomers
    DRUM_VOLUME("drum_volume", Dim.VOLUME, 1e-3, 1e3),
    RISER_VOLUME("riser_volume", Dim.VOLUME, 1e-3, 1e3),
    DOWNCOMER_VOLUME("downcomer_volume", Dim.VOLUME, 1e-3, 1e3),
    DRUM_SURFACE_AREA("drum_surface_area", Dim.AREA, 1e-3, 1e3),
    DOWNCOMER_AREA("downcomer_area", Dim.AREA, 1e-5, 100),
    TOTAL_METAL_MASS("total_metal_mass", Dim.MASS, 0, 1e7),
    RISER_METAL_MASS("riser_metal_mass", Dim.MASS, 0, 1e7),
    DRUM_METAL_MASS("drum_metal_mass", Dim.MASS, 0, 1e7),
    METAL_SPECIFIC_HEAT("metal_specific_heat", Dim.SPECIFIC_HEAT, 100, 2000),
    LOOP_FRICTION("loop_friction", Dim.NUMBER, 1e-3, 1e6),
    BUBBLE_FACTOR("bubble_factor", Dim.NUMBER, 0, 10),
    BUBBLE_RESIDENCE_TIME("bubble_residence_time", Dim.TIME, 0.1, 1000),
    GRAVITY("gravity", Dim.ACCELERATION, 9.7, 9.9),
    STEAM_UNDER_SURFACE_VOLUME("steam_under_surface_volume", Dim.VOLUME, 0, 1e3),
    LEVEL_GEOMETRY("level_geometry", Dim.CHOICE, 0, 0, "cylinder", "constant_area"),
    DRUM_DIAMETER("drum_diameter", Dim.LENGTH, 0.1, 10),
    DRUM_LENGTH("drum_length", Dim.LENGTH, 0.1, 100),
    NWL_HEIGHT("nwl_height", Dim.LENGTH, 0.01, 10),
    RISER_TOP_HEIGHT("riser_top_height", Dim.LENGTH, 0, 10),

    // operating point and steam side
    RATED_STEAM_FLOW("rated_steam_flow", Dim.MASS_FLOW, 1e-3, 1e4),
    NOMINAL_PRESSURE("nominal_pressure", Dim.PRESSURE, 1.5e5, 16e6),
    NOMINAL_LOAD("nominal_load", Dim.FRACTION, 0.05, 1),
    STEAM_VALVE_RATED_OPENING("steam_valve_rated_opening", Dim.FRACTION, 0.05, 1),
    FEED_TEMPERATURE("feed_temperature", Dim.TEMPERATURE, 274, 600),
    SAFETY_VALVE_SET_PRESSURE("safety_valve_set_pressure", Dim.PRESSURE, 1.5e5, 16.5e6),
    SAFETY_VALVE_RESEAT_PRESSURE("safety_valve_reseat_pressure", Dim.PRESSURE, 1.2e5, 16.5e6),
    SAFETY_VALVE_CAPACITY("safety_valve_capacity", Dim.MASS_FLOW, 0, 1e4),

    // feed train
    FEED_PUMP_SHUTOFF_HEAD("feed_pump_shutoff_head", Dim.LENGTH, 1, 5000),
    FEED_PUMP_RATED_HEAD("feed_pump_rated_head", Dim.LENGTH, 1, 5000),
    FEED_PUMP_RATED_FLOW("feed_pump_rated_flow", Dim.VOLUME_FLOW, 1e-6, 10),
    FEED_PUMP_SUCTION_PRESSURE("feed_pump_suction_pressure", Dim.PRESSURE, 1e4, 5e6),
    FEED_PUMP_START_TIME("feed_pump_start_time", Dim.TIME, 0.1, 600),
    FEED_PUMP_STOP_TIME("feed_pump_stop_time", Dim.TIME, 0.1, 600),
    FEED_RECIRC_FLOW_AT_SHUTOFF("feed_recirc_flow_at_shutoff", Dim.VOLUME_FLOW, 0, 10),
    FEED_STATIC_LIFT("feed_static_lift", Dim.LENGTH, -100, 500),
    FEED_LINE_LOSS("feed_line_loss", Dim.DIFF_PRESSURE, 0, 1e7),
    FEED_LINE_LOSS_FLOW("feed_line_loss_flow", Dim.VOLUME_FLOW, 1e-6, 10),
    FEED_VALVE_KVS("feed_valve_kvs", Dim.KV, 0.01, 1e5),
    FEED_VALVE_CHARACTERISTIC("feed_valve_characteristic", Dim.CHOICE, 0, 0, "linear", "equal_percentage"),
    FEED_VALVE_RANGEABILITY("feed_valve_rangeability", Dim.NUMBER, 2, 1000),
    FEED_VALVE_STROKE_TIME("feed_valve_stroke_time", Dim.TIME, 0, 600),
    FEED_VALVE_DEADBAND("feed_valve_deadband", Dim.FRACTION, 0, 0.2),

    // firing
    MAX_HEAT("max_heat", Dim.POWER, 1e3, 1e10),
    BURNER_TIME_CONSTANT("burner_time_constant", Dim.TIME, 0.1, 1000),
    PRESSURE_SETPOINT("pressure_setpoint", Dim.PRESSURE, 1.5e5, 16e6),
    PRESSURE_CONTROLLER_GAIN("pressure_controller_gain", Dim.INV_PRESSURE, 0, 1e-3),
    PRESSURE_CONTROLLER_INTEGRAL_TIME("pressure_controller_integral_time", Dim.TIME, 0.1, 1e5),
    PURGE_TIME("purge_time", Dim.TIME, 0, 3600),
    FIRING_RAMP_TIME("firing_ramp_time", Dim.TIME, 0, 3600),

    // transmitters
    LEVEL_TAP_LOW("level_tap_low", Dim.LENGTH, -5, 0),
    LEVEL_TAP_HIGH("level_tap_high", Dim.LENGTH, 0, 5),
    LEVEL_REF_LEG_TEMPERATURE("level_ref_leg_temperature", Dim.TEMPERATURE, 274, 600),
    LEVEL_RANGE_LOW("level_range_low", Dim.LENGTH, -5, 0),
    LEVEL_RANGE_HIGH("level_range_high", Dim.LENGTH, 0, 5),
    LEVEL_TX_TIME_CONSTANT("level_tx_time_constant", Dim.TIME, 0, 100),
    LEVEL_TX_NOISE("level_tx_noise", Dim.DIFF_PRESSURE, 0, 1e5),
    LEVEL_TX_RESOLUTION("level_tx_resolution", Dim.DIFF_PRESSURE, 0, 1e5),
    STEAM_FLOW_TX_RANGE("steam_flow_tx_range", Dim.MASS_FLOW, 1e-3, 1e4),
    STEAM_FLOW_TX_DP_RANGE("steam_flow_tx_dp_range", Dim.DIFF_PRESSURE, 1, 1e7),
    STEAM_FLOW_TX_DESIGN_DENSITY("steam_flow_tx_design_density", Dim.DENSITY, 0.01, 1500),
    STEAM_FLOW_TX_TIME_CONSTANT("steam_flow_tx_time_constant", Dim.TIME, 0, 100),
    STEAM_FLOW_TX_NOISE("steam_flow_tx_noise", Dim.DIFF_PRESSURE, 0, 1e6),
    STEAM_FLOW_TX_RESOLUTION("steam_flow_tx_resolution", Dim.DIFF_PRESSURE, 0, 1e6),
    FEED_FLOW_TX_RANGE("feed_flow_tx_range", Dim.MASS_FLOW, 1e-3, 1e4),
    FEED_FLOW_TX_DP_RANGE("feed_flow_tx_dp_range", Dim.DIFF_PRESSURE, 1, 1e7),
    FEED_FLOW_TX_DESIGN_DENSITY("feed_flow_tx_design_density", Dim.DENSITY, 0.01, 1500),
    FEED_FLOW_TX_TIME_CONSTANT("feed_flow_tx_time_constant", Dim.TIME, 0, 100),
    FEED_FLOW_TX_NOISE("feed_flow_tx_noise", Dim.DIFF_PRESSURE, 0, 1e6),
    FEED_FLOW_TX_RESOLUTION("feed_flow_tx_resolution", Dim.DIFF_PRESSURE, 0, 1e6),
    PRESSURE_TX_RANGE_LOW("pressure_tx_range_low", Dim.PRESSURE, 0, 1e8),
    PRESSURE_TX_RANGE_HIGH("pressure_tx_range_high", Dim.PRESSURE, 0, 1e8),
    PRESSURE_TX_TIME_CONSTANT("pressure_tx_time_constant", Dim.TIME, 0, 100),
    PRESSURE_TX_NOISE("pressure_tx_noise", Dim.DIFF_PRESSURE, 0, 1e6),
    PRESSURE_TX_RESOLUTION("pressure_tx_resolution", Dim.DIFF_PRESSURE, 0, 1e6),
    FEED_TEMP_TX_RANGE_LOW("feed_temp_tx_range_low", Dim.TEMPERATURE, 1, 1000),
    FEED_TEMP_TX_RANGE_HIGH("feed_temp_tx_range_high", Dim.TEMPERATURE, 1, 1000),
    FEED_TEMP_TX_TIME_CONSTANT("feed_temp_tx_time_constant", Dim.TIME, 0, 1000),
    FEED_TEMP_TX_NOISE("feed_temp_tx_noise", Dim.TEMP_DIFF, 0, 100),
    FEED_TEMP_TX_RESOLUTION("feed_temp_tx_resolution", Dim.TEMP_DIFF, 0, 100),
    FEED_PRESSURE_TX_RANGE_LOW("feed_pressure_tx_range_low", Dim.PRESSURE, 0, 1e8),
    FEED_PRESSURE_TX_RANGE_HIGH("feed_pressure_tx_range_high", Dim.PRESSURE, 0, 1e8),
    FEED_PRESSURE_TX_TIME_CONSTANT("feed_pressure_tx_time_constant", Dim.TIME, 0, 100),
    FEED_PRESSURE_TX_NOISE("feed_pressure_tx_noise", Dim.DIFF_PRESSURE, 0, 1e6),
    FEED_PRESSURE_TX_RESOLUTION("feed_pressure_tx_resolution", Dim.DIFF_PRESSURE, 0, 1e6),

    // numerics
    MAX_SUBSTEP("max_substep", Dim.TIME, 1e-3, 10);

    private final String key;
    final Dim dim;
    final double minSi;
    final double maxSi;
    final String[] choices;

    PlantKey(String key, Dim dim, double minSi, double maxSi, String... choices) {
        this.key = key;
        this.dim = dim;
        this.minSi = minSi;
        this.maxSi = maxSi;
        this.choices = choices;
    }

    /** @return the key as written in a plant file */
    public String key() { return key; }

    /** True for a key that takes a number with a unit (not a text or a choice). */
    public boolean numeric() { return dim != Dim.TEXT && dim != Dim.CHOICE; }

    /** Smallest value the file accepts, SI. */
    public double minSi() { return minSi; }

    /** Largest value the file accepts, SI. */
    public double maxSi() { return maxSi; }

    /**
     * A value written in one of this key's units, in SI; NaN when the unit does not belong to the key.
     * Used to write a value back in the unit its line already has.
     */
    public double toSi(double value, String unit) {
        int u = numeric() ? dim.unitIndex(unit) : -1;
        return u < 0 ? Double.NaN : dim.toSi(value, u);
    }

    /** The key of a plant-file word, or null. */
    public static PlantKey of(String word) { return byKey(word); }

    static PlantKey byKey(String key) {
        for (PlantKey k : values()) {
            if (k.key.equals(key)) {
                return k;
            }
        }
        return null;
    }
}
