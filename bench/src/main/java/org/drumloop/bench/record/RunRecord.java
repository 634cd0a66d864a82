package org.drumloop.bench.record;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.modbus.map.ChannelMap;

/**
 * What a run's records name besides its results: the header (when, what build, which inputs by
 * hash, seed, controller under test) and the settings in use (tuning, interlocks, channel map).
 *
 * @param header          the finished header
 * @param firmware        the firmware configuration in use (null when the run had none, e.g. a
 *                        controller under test without the bench's firmware)
 * @param tuningShown     tuning file as shown to the user
 * @param interlocksShown interlocks file as shown to the user
 * @param map             channel map of a run over Modbus, or null
 * @param mapShown        the channel map file as shown, or ""
 */
public record RunRecord(RecordHeader header, FirmwareConfig firmware, String tuningShown, String interlocksShown,
                        ChannelMap map, String mapShown) {

    /** The settings section of this run (nothing when there is no firmware configuration). */
    public void settingsHtml(StringBuilder sb) {
        if (firmware != null) {
            SettingsSection.html(sb, firmware, tuningShown, interlocksShown, map, mapShown);
        }
    }

    /**
     * Start the record of a scenario run now: hashes the scenario, plant, tuning and interlocks
     * files and notes the seed.
     */
    public static Builder begin(Scenario sc, Path plantFile, Path tuningFile, FirmwareConfig fc) throws IOException {
        Builder b = new Builder(RecordHeader.begin(sc.title()), fc);
        if (sc.path() != null) {
            b.header.input("scenario", sc.path(), shown(sc.path()));
        } else {
            b.header.input(new InputFile("scenario", sc.file() + " (text)", sha256(String.join("\n", sc.source()) + "\n")));
        }
        b.header.input("plant", plantFile, shown(plantFile));
        b.header.input("tuning", tuningFile, shown(tuningFile));
        b.tuningShown = shown(tuningFile);
        if (fc != null) {
            Path il = Path.of(fc.interlocks().fileName());
            b.interlocksShown = shown(il);
            b.header.input("interlocks", il, b.interlocksShown);
        }
        b.header.seed(sc.seed());
        return b;
    }

    /**
     * A file as the record names it: shipped files as {@code config/KIND/NAME}, files under the
     * working directory relative to it, others as given.
     */
    static String shown(Path p) {
        String d = ConfigResolver.displayName(p);
        Path dp = Path.of(d);
        if (dp.isAbsolute()) {
            Path cwd = Path.of("").toAbsolutePath();
            Path n = dp.normalize();
            if (n.startsWith(cwd)) {
                return cwd.relativize(n).toString().replace('\\', '/');
            }
        }
        return d;
    }

    static String sha256(String text) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(text.getBytes(StandardCharsets.UTF_8)));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform provides SHA-256", e);
        }
    }

    /** Collects a run's record while it runs. */
    public static final class Builder {
        private final RecordHeader.Builder header;
        private final FirmwareConfig firmware;
        private String tuningShown = "";
        private String interlocksShown = "";
        private ChannelMap map;
        private String mapShown = "";

        Builder(RecordHeader.Builder header, FirmwareConfig firmware) {
            this.header = header;
            this.firmware = firmware;
        }

        /** The header, to add inputs, the controller under test or further lines. */
        public RecordHeader.Builder header() { return header; }

        /** The channel map of a run over Modbus (listed in the settings and hashed as an input). */
        public Builder channelMap(ChannelMap m, Path file) throws IOException {
            this.map = m;
            this.mapShown = shown(file);
            header.input("channel map", file, mapShown);
            return this;
        }

        public RunRecord finish() {
            return new RunRecord(header.finish(), firmware, tuningShown, interlocksShown, map, mapShown);
        }
    }
}
