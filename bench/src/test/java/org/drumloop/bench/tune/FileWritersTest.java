package org.drumloop.bench.tune;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.drumloop.core.FirmwareConfig;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantFile;
import org.drumloop.plant.PlantKey;
import org.junit.jupiter.api.Test;

/** Tuned and fitted files are the base files with only their changed lines edited, and read back as written. */
class FileWritersTest {
    private static final Path CONFIG = Path.of("..", "config");

    @Test
    void tunedSettingsReadBackThroughTheFirmwaresReaderInTheirUnits() throws Exception {
        Path base = CONFIG.resolve("tuning/default.tuning");
        List<String> lines = Files.readAllLines(base, StandardCharsets.UTF_8);
        FirmwareConfig baseCfg = FirmwareConfig.load(base);
        TuningDesign.Design d = new TuningDesign.Design(
                new TuningDesign.LoopTuning(TuningDesign.Loop.SLAVE, new Simc.Fopdt(1.5, 0.6, 0.1), 0.1,
                        new Simc.Pi(1.7880288, 0.631), "test"),
                new TuningDesign.LoopTuning(TuningDesign.Loop.MASTER, new Simc.Fopdt(2.8e-4, Double.POSITIVE_INFINITY, 250), 250,
                        new Simc.Pi(7.1784, 1992.17), "test"),
                null, new TuningDesign.SwellTuning(0.1444, 45.38, "test"), List.of());
        Map<String, String> changes = TuningFileWriter.changes(d);
        // unit arithmetic (EngUnit): 1.788 1/(kg/s) = 1.788 * 100 %/(1000/3600 kg/s)... = 49.67 %/(t/h)
        assertEquals("49.67 %/(t/h)", changes.get("feed_slave.gain"));
        List<String> out = TuningFileWriter.write(lines, changes, List.of("header"), null);
        FirmwareConfig tuned = FirmwareConfig.parse("tuned", out, baseCfg.interlocks());
        assertEquals(1.7880288, tuned.feedSlave().kc(), 1.7880288 * 1e-3);
        assertEquals(0.631, tuned.feedSlave().tiS(), 1e-9);
        assertEquals(0.631, tuned.feedSlave().ttS(), 1e-9);
        assertEquals(7.1784, tuned.levelMaster().kc(), 7.1784 * 1e-3);
        assertEquals(1992, tuned.levelMaster().tiS(), 1e-9);
        assertEquals(0.1444, tuned.swellGainMPerKgS(), 0.1444 * 1e-3);
        assertEquals(45.38, tuned.swellTauS(), 1e-9);
        // untouched: limits and every other setting, the single-element loop not designed here
        assertEquals(baseCfg.levelMaster().outMax(), tuned.levelMaster().outMax(), 1e-12);
        assertEquals(baseCfg.singleElement(), tuned.singleElement());
        assertEquals(baseCfg.feedforwardGain(), tuned.feedforwardGain(), 0);
        assertTrue(out.get(0).startsWith("# header"));
        assertTrue(out.stream().anyMatch(l -> l.startsWith("gain                   49.67 %/(t/h) # tuned (base: 2.5 %/(t/h))")),
                String.join("\n", out));
        assertEquals(lines.size() + 4, out.size(), "header, blank and note lines only are added");
    }

    @Test
    void fittedValuesAreWrittenInTheUnitOfTheirLine() throws Exception {
        List<String> lines = List.of("# start", "name x", "total_metal_mass   25 t   # steel", "bubble_residence_time 0.1 min");
        List<String> out = PlantFileWriter.write(lines, List.of(PlantKey.TOTAL_METAL_MASS, PlantKey.BUBBLE_RESIDENCE_TIME),
                new double[] {31_250, 7.5}, List.of("fitted"));
        assertEquals(List.of("# fitted", "# start", "name x",
                "total_metal_mass   31.25 t # fitted (start: 25 t)", "bubble_residence_time 0.125 min # fitted (start: 0.1 min)"),
                out);
    }

    @Test
    void aFittedShippedPlantFileReadsBackWithTheFittedValues() throws Exception {
        Path start = CONFIG.resolve("plants/ab160.plant");
        List<String> lines = Files.readAllLines(start, StandardCharsets.UTF_8);
        List<String> out = PlantFileWriter.write(lines, List.of(PlantKey.BUBBLE_RESIDENCE_TIME,
                PlantKey.STEAM_UNDER_SURFACE_VOLUME), new double[] {11.9997, 4.91599}, List.of("fitted"));
        PlantConfig c = PlantFile.parse("fitted", out);
        assertEquals(11.9997, c.value(PlantKey.BUBBLE_RESIDENCE_TIME), 1e-9);
        assertEquals(4.91599, c.value(PlantKey.STEAM_UNDER_SURFACE_VOLUME), 1e-9);
        assertEquals(lines.size() + 1, out.size());
    }
}
