package org.drumloop.core;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;

/** The settings in use, as records show them: every key, grouped by section, in the file's own units. */
class FirmwareSettingsTest {
    static final Path DEFAULT_TUNING = Path.of("..", "config", "tuning", "default.tuning");

    private static FirmwareConfig.Setting find(List<FirmwareConfig.Setting> all, String section, String key) {
        for (FirmwareConfig.Setting s : all) {
            if (s.section().equals(section) && s.key().equals(key)) {
                return s;
            }
        }
        throw new AssertionError(section + "." + key + " not listed");
    }

    @Test
    void everyKeyIsListedInTheUnitTheFileUsed() throws Exception {
        FirmwareConfig fc = FirmwareConfig.load(DEFAULT_TUNING);
        List<FirmwareConfig.Setting> all = fc.settings();
        assertEquals(TuningKey.values().length, all.size(), "one line per key");
        // values as written in config/tuning/default.tuning, read back through the SI conversion
        assertEquals(new FirmwareConfig.Setting("level_transmitters", "range_low", "-300", "mm"),
                find(all, "level_transmitters", "range_low"));
        assertEquals(new FirmwareConfig.Setting("level_master", "gain", "0.03", "(t/h)/mm"),
                find(all, "level_master", "gain"));
        assertEquals(new FirmwareConfig.Setting("general", "design_feed_temp", "90", "degC"),
                find(all, "general", "design_feed_temp"));
        assertEquals(new FirmwareConfig.Setting("general", "start_mode", "three-element", ""),
                find(all, "general", "start_mode"));
        // sections stay together, in the order of the format
        String last = "";
        java.util.Set<String> closed = new java.util.HashSet<>();
        for (FirmwareConfig.Setting s : all) {
            if (!s.section().equals(last)) {
                assertTrue(closed.add(s.section()), "section " + s.section() + " listed in one block");
                last = s.section();
            }
        }
    }

    @Test
    void aValueTheBenchChangedIsShownAsInUse() throws Exception {
        FirmwareConfig off = FirmwareConfig.load(DEFAULT_TUNING).withoutSwellCompensation();
        assertEquals("0", find(off.settings(), "swell", "gain").value());
        assertEquals("mm/(t/h)", find(off.settings(), "swell", "gain").unit());
    }
}
