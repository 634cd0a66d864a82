package org.drumloop.bench.tune;

import java.util.List;

/**
 * The signals {@code tune} and {@code fit-plant} read from a recorded trend, by the names drumloop
 * writes in its own {@code trend.csv} and {@code bump} output. A historian export with other
 * headers is mapped with {@code --column NAME=HEADER}. Each signal states the SI unit its header's
 * unit must convert to.
 */
public enum TrendSignal {
    /** Time; seconds (or ms, min, h), or date-time values (then the header needs no unit). */
    TIME("t", "s", "time"),
    DRUM_LEVEL("drum_level", "m"),
    /** Absolute drum pressure: bara, barg, Pa, kPa or MPa (a bare bar is refused: gauge or absolute?). */
    DRUM_PRESSURE("drum_pressure", "Pa"),
    STEAM_FLOW("steam_flow", "kg/s"),
    FEED_FLOW("feed_flow", "kg/s"),
    /** Feed valve position. */
    FEED_VALVE("feed_valve", "1"),
    /** Feed valve demand (controller output). */
    VALVE_DEMAND("valve_demand", "1"),
    FIRING("firing", "1"),
    HEAT("heat", "W"),
    FEED_TEMP("feed_temp", "K", "feed_temperature");

    private final String tag;
    private final String siUnit;
    private final List<String> aliases;

    TrendSignal(String tag, String siUnit, String... aliases) {
        this.tag = tag;
        this.siUnit = siUnit;
        this.aliases = List.of(aliases);
    }

    /** The name in drumloop's own records and in {@code --column NAME=HEADER}. */
    public String tag() { return tag; }

    /** SI unit of the values held in a {@link Trend}. */
    public String siUnit() { return siUnit; }

    /** Other header names drumloop writes for the same signal (the bump output's {@code feed_temperature}). */
    List<String> aliases() { return aliases; }

    /** The signal of a tag, or null. */
    public static TrendSignal byTag(String tag) {
        for (TrendSignal s : values()) {
            if (s.tag.equalsIgnoreCase(tag)) {
                return s;
            }
        }
        return null;
    }

    /** Every tag, for messages. */
    public static String tags() {
        StringBuilder sb = new StringBuilder();
        for (TrendSignal s : values()) {
            sb.append(sb.length() == 0 ? "" : ", ").append(s.tag);
        }
        return sb.toString();
    }
}
