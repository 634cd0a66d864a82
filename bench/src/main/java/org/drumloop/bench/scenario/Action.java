package org.drumloop.bench.scenario;

/**
 * One timed statement of a scenario ({@code at 60 s ramp steam_demand to 80 % over 20 s}). A flat
 * record so the runner can dispatch on {@link #type()} without allocating; fields not used by a
 * type are NaN or null.
 *
 * @param atS     when it applies [s]
 * @param line    line in the scenario file
 * @param text    the statement as written (for the events log)
 * @param type    what it does
 * @param input   the input set or ramped (SET, RAMP)
 * @param value   SI value: set/ramp target, fault magnitude, manual output, bypass duration
 * @param overS   ramp time, or duration of a fault (noise burst, steam surge) [s]
 * @param label   mode label or fault kind name (plant's Fault.Kind)
 * @param target  fault target (transmitter or equipment tag), interlock tag
 * @param reason  bypass reason
 */
public record Action(double atS, int line, String text, Type type, Input input, double value, double overS,
                     String label, String target, String reason) {

    /** What an action does. */
    public enum Type { SET, RAMP, MODE, AUTO, MANUAL, RESET, ACKNOWLEDGE, BYPASS, FAULT, CLEAR }

    /** Scenario inputs that {@code set} and {@code ramp} act on, with the SI unit their value needs. */
    public enum Input {
        STEAM_DEMAND("steam_demand", "1"),
        FEED_TEMP("feed_temp", "K"),
        PRESSURE_SETPOINT("pressure_setpoint", "Pa"),
        /** Burner firing in manual; NaN puts the plant's pressure controller back in auto. */
        FIRING("firing", "1"),
        /** Operator level setpoint relative to NWL. */
        SETPOINT("setpoint", "m"),
        /** Operator manual output (valve demand) of the level controller. */
        OUTPUT("output", "1");

        private final String tag;
        private final String siUnit;

        Input(String tag, String siUnit) {
            this.tag = tag;
            this.siUnit = siUnit;
        }

        public String tag() { return tag; }

        public String siUnit() { return siUnit; }

        public static Input byTag(String t) {
            for (Input i : values()) {
                if (i.tag.equalsIgnoreCase(t)) {
                    return i;
                }
            }
            return null;
        }

        static String tags() {
            StringBuilder sb = new StringBuilder();
            for (Input i : values()) {
                sb.append(sb.length() == 0 ? "" : ", ").append(i.tag);
            }
            return sb.toString();
        }
    }
}
