package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Reading plant files: units converted to SI, every mistake reported as file:line: key: message. */
class PlantFileTest {

    private static List<String> auxLines() throws Exception {
        return new ArrayList<>(Files.readAllLines(PlantFiles.path("aux-boiler.plant")));
    }

    private static int lineOf(List<String> lines, String key) {
        for (int i = 0; i < lines.size(); i++) {
            if (lines.get(i).startsWith(key + " ")) {
                return i;
            }
        }
        throw new AssertionError(key);
    }

    private static PlantConfigException failing(List<String> lines) {
        return assertThrows(PlantConfigException.class, () -> PlantFile.parse("x.plant", lines));
    }

    @Test
    void bothProjectPlantFilesLoad() throws Exception {
        PlantConfig aux = PlantFiles.aux();
        PlantConfig ab = PlantFiles.ab160();
        assertEquals("aux-boiler", aux.name());
        assertEquals("ab160", ab.name());
        // 9 bara = 9e5 Pa; 10 t/h = 2.7778 kg/s; 90 degC = 363.15 K (unit definitions; round-off)
        assertEquals(9e5, aux.nominalPressurePa(), 1e-6);
        assertEquals(10.0 / 3.6, aux.ratedSteamFlowKgS(), 1e-12);
        assertEquals(363.15, aux.value(PlantKey.FEED_TEMPERATURE), 1e-9);
        assertEquals(-0.3, aux.levelRangeLowM(), 1e-12);
        assertEquals(8.5e6, ab.nominalPressurePa(), 1e-6);
        assertTrue(aux.description().contains("invented"));
    }

    @Test
    void gaugePressureAddsOneAtmosphere() throws Exception {
        List<String> l = auxLines();
        l.set(lineOf(l, "pressure_setpoint"), "pressure_setpoint 8 barg");
        // barg = bara - 1.01325 bar (standard atmosphere, definition)
        assertEquals(9.01325e5, PlantFile.parse("x.plant", l).pressureSetpointPa(), 1e-6);
    }

    @Test
    void unknownKeyNamesFileLineAndKey() throws Exception {
        List<String> l = auxLines();
        l.add(3, "drum_colour 3 m");
        PlantConfigException e = failing(l);
        assertEquals("x.plant", e.file());
        assertEquals(4, e.line());
        assertEquals("drum_colour", e.key());
        assertEquals("x.plant:4: drum_colour: unknown key", e.getMessage());
    }

    @Test
    void everyProblemOfAFileIsReportedAtOnce() throws Exception {
        List<String> l = auxLines();
        l.add(3, "drum_colour 3 m");
        int i = lineOf(l, "drum_volume");
        l.set(i, "drum_volume 4.0 kg");
        l.remove(lineOf(l, "riser_volume"));
        PlantConfigException e = failing(l);
        assertEquals(3, e.problems().size(), e.getMessage());
        assertEquals("drum_colour", e.problems().get(0).key());
        assertEquals("drum_volume", e.problems().get(1).key());
        assertEquals("riser_volume", e.problems().get(2).key());
        assertEquals(3, e.getMessage().split("\\R").length, "one file:line: line per problem");
    }

    @Test
    void missingKeyIsReported() throws Exception {
        List<String> l = auxLines();
        l.remove(lineOf(l, "riser_volume"));
        PlantConfigException e = failing(l);
        assertEquals("riser_volume", e.key());
        assertTrue(e.getMessage().startsWith("x.plant: riser_volume: missing"), e.getMessage());
    }

    @Test
    void missingOrWrongUnitIsReported() throws Exception {
        List<String> l = auxLines();
        int i = lineOf(l, "drum_volume");
        l.set(i, "drum_volume 4.0");
        PlantConfigException e = failing(l);
        assertEquals(i + 1, e.line());
        assertTrue(e.problem().contains("unit is missing"), e.problem());
        l.set(i, "drum_volume 4.0 kg");
        e = failing(l);
        assertTrue(e.problem().contains("unit 'kg' is not allowed"), e.problem());
        l.set(i, "drum_volume 4.0 m3");
        l.set(lineOf(l, "feed_line_loss "), "feed_line_loss 0.5 barg");
        e = failing(l);
        assertEquals("feed_line_loss", e.key(), "a pressure difference has no gauge unit");
    }

    @Test
    void outOfRangeAndNonNumbersAreReported() throws Exception {
        List<String> l = auxLines();
        int i = lineOf(l, "bubble_residence_time");
        l.set(i, "bubble_residence_time -8 s");
        assertTrue(failing(l).problem().contains("out of range"));
        l.set(i, "bubble_residence_time eight s");
        assertTrue(failing(l).problem().contains("not a number"));
    }

    @Test
    void repeatedKeyAndBadChoiceAreReported() throws Exception {
        List<String> l = auxLines();
        l.add("drum_volume 4.0 m3");
        PlantConfigException e = failing(l);
        assertEquals("drum_volume", e.key());
        assertTrue(e.problem().contains("given twice"));
        l = auxLines();
        l.set(lineOf(l, "level_geometry"), "level_geometry sphere");
        assertTrue(failing(l).problem().contains("not one of"));
    }

    @Test
    void inconsistentValuesNameTheKey() throws Exception {
        List<String> l = auxLines();
        int i = lineOf(l, "safety_valve_reseat_pressure");
        l.set(i, "safety_valve_reseat_pressure 11 bara");
        PlantConfigException e = failing(l);
        assertEquals("safety_valve_reseat_pressure", e.key());
        assertEquals(i + 1, e.line());
        l = auxLines();
        l.set(lineOf(l, "drum_surface_area"), "drum_surface_area 8 m2");
        assertEquals("drum_surface_area", failing(l).key(), "disagrees with the cylinder");
    }

    @Test
    void commentsAndBlankLinesAreIgnored() throws Exception {
        List<String> l = auxLines();
        l.add("   # trailing comment");
        l.add("");
        assertEquals("aux-boiler", PlantFile.parse("x.plant", l).name());
    }
}
