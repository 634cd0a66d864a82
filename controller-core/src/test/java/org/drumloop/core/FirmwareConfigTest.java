package org.drumloop.core;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;
import org.drumloop.core.safety.InterlockConfig;
import org.junit.jupiter.api.Test;

class FirmwareConfigTest {
    /** The project's user files (tests run in the module folder). */
    static final Path DEFAULT_TUNING = Path.of("..", "config", "tuning", "default.tuning");
    static final Path AB160_TUNING = Path.of("..", "config", "tuning", "ab160.tuning");
    /** Unit conversions are exact definitions, so only floating-point rounding remains. */
    static final double EXACT = 1e-12;

    static List<String> defaultLines() throws Exception {
        return Files.readAllLines(DEFAULT_TUNING, StandardCharsets.UTF_8);
    }

    static InterlockConfig emptyInterlocks() {
        return new InterlockConfig("none.interlocks", List.of(), null);
    }

    /** Replace the first line whose first word is {@code key} (inside the given section). */
    static List<String> with(List<String> lines, String section, String key, String replacement) {
        List<String> out = new ArrayList<>(lines);
        String sec = null;
        for (int i = 0; i < out.size(); i++) {
            String t = out.get(i).strip();
            if (t.startsWith("[")) {
                sec = t.substring(1, t.indexOf(']'));
            } else if (section.equals(sec) && (t.startsWith(key + " ") || t.equals(key))) {
                if (replacement == null) {
                    out.remove(i);
                } else {
                    out.set(i, replacement);
                }
                return out;
            }
        }
        throw new IllegalArgumentException("no " + section + "." + key);
    }

    static int lineOf(List<String> lines, String start) {
        for (int i = 0; i < lines.size(); i++) {
            if (lines.get(i).strip().startsWith(start)) {
                return i + 1;
            }
        }
        return -1;
    }

    @Test
    void everyProblemOfATuningFileIsReportedAtOnce() throws Exception {
        List<String> l = with(defaultLines(), "single_element", "gain", "gain 0.2 furlong");
        l = with(l, "single_element", "integral_time", "integral_time -5 s");
        l.add("bogus_key 5 s");
        List<String> lines = l;
        ConfigException e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", lines, emptyInterlocks()));
        ConfigProblems all = assertInstanceOf(ConfigProblems.class, e);
        assertEquals(3, all.problems().size(), e.getMessage());
        assertEquals("single_element.gain", all.problems().get(0).key());
        assertEquals("single_element.integral_time", all.problems().get(1).key());
        assertEquals(lines.size(), all.problems().get(2).line());
        assertEquals(3, e.getMessage().split("\\R").length, "one file:line: line per problem");
    }

    @Test
    void theDefaultAndReferenceTuningFilesLoadWithTheirInterlocks() throws Exception {
        FirmwareConfig d = FirmwareConfig.load(DEFAULT_TUNING);
        assertEquals(0.100, d.scanPeriodS(), EXACT, "100 ms");
        // 10 t/h = 10000/3600 kg/s (definition of the tonne per hour)
        assertEquals(10_000.0 / 3600.0, d.ratedSteamFlowKgS(), EXACT);
        assertTrue(d.interlocks().size() > 0, "default.interlocks is read");
        assertEquals(Mode.THREE_ELEMENT, d.startMode());
        // 0.03 (t/h)/mm = 0.03 * (1000/3600) / 1e-3 (kg/s)/m by definition of the units
        assertEquals(0.03 * 1000.0 / 3600.0 / 1e-3, d.levelMaster().kc(), 1e-9);
        // 2.5 %/(t/h) = 0.025 / (1000/3600) per kg/s
        assertEquals(0.025 * 3.6, d.feedSlave().kc(), 1e-12);
        FirmwareConfig ab = FirmwareConfig.load(AB160_TUNING);
        assertEquals(181.3 * 1000.0 / 3600.0, ab.ratedSteamFlowKgS(), EXACT);
        // 85 bara absolute = 8.5e6 Pa (definition)
        assertEquals(8.5e6, ab.designPressurePa(), 1e-6);
    }

    @Test
    void unknownKeyIsReportedWithFileLineAndKey() throws Exception {
        List<String> lines = with(defaultLines(), "swell", "gain", "gian 25 mm/(t/h)");
        ConfigException e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", lines, emptyInterlocks()));
        assertEquals(lineOf(lines, "gian"), e.line());
        assertEquals("swell.gian", e.key());
        assertTrue(e.getMessage().startsWith("x.tuning:" + e.line() + ": swell.gian: unknown key"), e.getMessage());
    }

    @Test
    void missingKeyIsReported() throws Exception {
        List<String> lines = with(defaultLines(), "feed_slave", "tracking_time", null);
        ConfigException e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", lines, emptyInterlocks()));
        assertEquals("feed_slave.tracking_time", e.key());
        assertTrue(e.problem().contains("missing"), e.getMessage());
    }

    @Test
    void aUnitOfTheWrongQuantityIsRefused() throws Exception {
        List<String> lines = with(defaultLines(), "level_master", "gain", "gain 0.3 %/mm");
        ConfigException e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", lines, emptyInterlocks()));
        assertEquals("level_master.gain", e.key());
        assertEquals(lineOf(lines, "gain 0.3 %/mm"), e.line());
        assertTrue(e.problem().contains("expected (kg/s)/m"), e.getMessage());
    }

    @Test
    void aMissingOrUnknownUnitIsRefused() throws Exception {
        List<String> noUnit = with(defaultLines(), "general", "rated_steam_flow", "rated_steam_flow 10");
        ConfigException e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", noUnit, emptyInterlocks()));
        assertTrue(e.problem().contains("unit is missing"), e.getMessage());
        List<String> badUnit = with(defaultLines(), "general", "rated_steam_flow", "rated_steam_flow 10 tph");
        e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", badUnit, emptyInterlocks()));
        assertTrue(e.problem().contains("unknown unit 'tph'"), e.getMessage());
    }

    @Test
    void scanPeriodOutside10To1000MsIsOutOfRange() throws Exception {
        for (String v : new String[] {"5 ms", "1.5 s"}) {
            List<String> lines = with(defaultLines(), "general", "scan_period", "scan_period " + v);
            ConfigException e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", lines, emptyInterlocks()));
            assertEquals("general.scan_period", e.key());
            assertTrue(e.problem().startsWith("out of range"), e.getMessage());
        }
        for (String v : new String[] {"10 ms", "1000 ms", "0.25 s"}) {
            List<String> lines = with(defaultLines(), "general", "scan_period", "scan_period " + v);
            FirmwareConfig.parse("x.tuning", lines, emptyInterlocks());
        }
    }

    @Test
    void orderedPairsAndDuplicatesAreChecked() throws Exception {
        List<String> lines = with(defaultLines(), "single_element", "output_high", "output_high 0 %");
        ConfigException e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", lines, emptyInterlocks()));
        assertEquals("single_element.output_high", e.key());
        List<String> dup = new ArrayList<>(defaultLines());
        dup.add("scan_period 100 ms");
        dup.add(lineOf(dup, "[general]"), "scan_period 200 ms");
        e = assertThrows(ConfigException.class, () -> FirmwareConfig.parse("x.tuning", dup, emptyInterlocks()));
        assertTrue(e.problem().contains("given twice"), e.getMessage());
    }

    @Test
    void integralTimeMayBeOff() throws Exception {
        List<String> lines = with(defaultLines(), "single_element", "integral_time", "integral_time off");
        FirmwareConfig c = FirmwareConfig.parse("x.tuning", lines, emptyInterlocks());
        assertFalse(Double.isFinite(c.singleElement().tiS()));
    }

    @Test
    void aMissingInterlocksFileIsReportedOnItsLine(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        List<String> lines = with(defaultLines(), "general", "interlocks", "interlocks nowhere.interlocks");
        Path f = dir.resolve("t.tuning");
        Files.write(f, lines, StandardCharsets.UTF_8);
        ConfigException e = assertThrows(ConfigException.class, () -> FirmwareConfig.load(f));
        assertEquals("general.interlocks", e.key());
        assertEquals(lineOf(lines, "interlocks nowhere"), e.line());
    }
}
