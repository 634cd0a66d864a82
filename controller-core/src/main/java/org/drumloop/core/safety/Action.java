package org.drumloop.core.safety;

/** A named interlock action; the firmware applies it to its outputs. */
public enum Action {
    /** Cut the fuel to the burner (drum low-low level: the boiler must not fire without water). */
    FUEL_CUTOFF("fuel_cutoff"),
    /** Stop the feed pumps (one way to stop carry-over on drum high-high level). */
    FEED_PUMPS_STOP("feed_pumps_stop"),
    /** Drive the feed valve shut (the other way to answer high-high level). */
    FEED_VALVE_CLOSE("feed_valve_close");

    private final String text;

    Action(String text) { this.text = text; }

    /** Spelling in files and tables. */
    public String text() { return text; }

    public static Action byText(String s) {
        for (Action a : values()) {
            if (a.text.equals(s)) {
                return a;
            }
        }
        return null;
    }
}
