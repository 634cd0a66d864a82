package org.drumloop.bench.hil;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.map.ChannelMap;

/** Finding and checking the files of the Modbus run modes; problems go to stderr as file:line: key: message. */
final class HilFiles {
    private HilFiles() {}

    /** A user file by name or path, or null after printing where it was looked for. */
    static Path find(String ref, String kind, String ext, PrintWriter err) {
        Path p = ConfigResolver.resolve(ref, kind, ext, null);
        if (p == null) {
            err.println(ref + ": no such " + kind + " file (give a path, or a name from config/" + kind + "/)");
        }
        return p;
    }

    /**
     * Load a channel map and check it has every signal in {@code needed}; prints every problem and
     * returns null when there is any.
     */
    static ChannelMap map(String ref, Set<Signal> needed, PrintWriter err) {
        Path p = find(ref, "maps", ".csv", err);
        if (p == null) {
            return null;
        }
        List<ConfigException> problems = ChannelMap.validate(p);
        if (problems.isEmpty()) {
            try {
                ChannelMap m = ChannelMap.load(p);
                problems = m.requireSignals(needed);
                if (problems.isEmpty()) {
                    return m;
                }
            } catch (ConfigException e) {
                err.println(e.getMessage());
                return null;
            }
        }
        for (ConfigException e : problems) {
            err.println(e.getMessage());
        }
        return null;
    }

    /** Signals a controller needs from a rig: the level transmitters, flows, pressure and the valve demand. */
    static final Set<Signal> CONTROL_SIGNALS = Set.of(Signal.LEVEL_DP_A, Signal.LEVEL_DP_B, Signal.LEVEL_DP_C,
            Signal.STEAM_FLOW_DP, Signal.FEED_FLOW_DP, Signal.DRUM_PRESSURE, Signal.FEED_VALVE_DEMAND);
}
