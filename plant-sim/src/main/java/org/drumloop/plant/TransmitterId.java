package org.drumloop.plant;

/** The plant's field transmitters. {@link #tag()} is the name faults use as their target. */
public enum TransmitterId {
    LEVEL_A("level_tx_a"),
    LEVEL_B("level_tx_b"),
    LEVEL_C("level_tx_c"),
    STEAM_FLOW("steam_flow_tx"),
    FEED_FLOW("feed_flow_tx"),
    DRUM_PRESSURE("pressure_tx"),
    FEED_TEMP("feed_temp_tx"),
    FEED_PRESSURE("feed_pressure_tx");

    private final String tag;

    TransmitterId(String tag) { this.tag = tag; }

    public String tag() { return tag; }

    /** @return the transmitter with this tag, or null */
    public static TransmitterId byTag(String tag) {
        for (TransmitterId id : values()) {
            if (id.tag.equals(tag)) {
                return id;
            }
        }
        return null;
    }
}
