package org.drumloop.bench.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;

import org.drumloop.bench.expect.BandExpectation;
import org.drumloop.bench.expect.IaeExpectation;
import org.drumloop.bench.expect.InterlockExpectation;
import org.drumloop.bench.expect.ModeExpectation;
import org.drumloop.bench.expect.SettleExpectation;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ScenarioParserTest {
    /** Unit conversions are exact in binary up to rounding of the factor: 1e-12 relative is ample. */
    private static final double EXACT = 1e-12;
    private static final String FILE = "t.scenario";

    private static final List<String> EXAMPLE = List.of(
            "title     Load step 40 to 80 % with three-element control",
            "plant     aux-boiler",
            "tuning    default",
            "duration  900 s",
            "at 0 s      set steam_demand 40 %",
            "at 0 s      set mode three-element",
            "at 60 s     ramp steam_demand to 80 % over 20 s",
            "at 400 s    fault level_tx_a stuck",
            "at 600 s    trip feed_pump_a",
            "expect      drum_level between -80 and 80 mm during 0..900 s",
            "expect      trip LALL never",
            "expect      alarm LAL within 30 s after 600 s",
            "expect      mode single-element within 2 s after 400 s");

    private static Scenario parse(List<String> lines) throws ConfigException {
        return ScenarioParser.parse(FILE, null, lines);
    }

    /** A minimal valid scenario plus one extra line at line 4. */
    private static List<String> with(String line) {
        List<String> l = new ArrayList<>(List.of("title T", "duration 900 s", "# comment"));
        l.add(line);
        return l;
    }

    private static ConfigException error(String line) {
        return assertThrows(ConfigException.class, () -> parse(with(line)));
    }

    @Test
    void theExampleFromTheSpecificationParses() throws ConfigException {
        Scenario s = parse(EXAMPLE);
        assertEquals("Load step 40 to 80 % with three-element control", s.title());
        assertEquals(900.0, s.durationS(), EXACT);
        assertEquals(5, s.actions().size());
        assertEquals(4, s.expectations().size());
        // the initial load follows the set at 0 s: 40 % = 0.40 (definition of %)
        assertEquals(0.40, s.initialLoadFrac(), EXACT);
        Action ramp = s.actions().get(2);
        assertEquals(Action.Type.RAMP, ramp.type());
        assertEquals(0.80, ramp.value(), EXACT);
        assertEquals(20.0, ramp.overS(), EXACT);
        assertEquals("STUCK", s.actions().get(3).label());
        assertEquals("PUMP_TRIP", s.actions().get(4).label());
        assertEquals("feed_pump_a", s.actions().get(4).target());
        assertTrue(s.expectations().get(0) instanceof BandExpectation);
        assertTrue(s.expectations().get(1) instanceof InterlockExpectation);
        assertTrue(s.expectations().get(3) instanceof ModeExpectation);
    }

    @Test
    void everyNumberIsConvertedWithItsUnit() throws ConfigException {
        Scenario s = parse(List.of("title T", "duration 2 h",
                "at 1 min set feed_temp 105 degC",
                "at 90s set pressure_setpoint 7 barg",
                "at 100 s setpoint -20 mm",
                "at 110 s fault level_tx_b bias 50 mmH2O",
                "at 120 s fault level_tx_c drift 2 Pa/s",
                "at 130 s trip tube leak 1.8 t/h",
                "at 140 s fault steam_flow_tx noise-burst 0.5 kPa for 30 s"));
        // 2 h = 7200 s, 1 min = 60 s (SI brochure, units accepted for use with the SI)
        assertEquals(7200.0, s.durationS(), EXACT);
        assertEquals(60.0, s.actions().get(0).atS(), EXACT);
        // 105 degC = 378.15 K (ITS-90 offset 273.15)
        assertEquals(378.15, s.actions().get(0).value(), 1e-9);
        // 7 barg = 7e5 + 101325 Pa (standard atmosphere, ISO 2533)
        assertEquals(801_325.0, s.actions().get(1).value(), 1e-6);
        assertEquals(-0.020, s.actions().get(2).value(), EXACT);
        // 1 mmH2O = 9.80665 Pa (conventional, from memory)
        assertEquals(50 * 9.80665, s.actions().get(3).value(), 1e-9);
        assertEquals(2.0, s.actions().get(4).value(), EXACT);
        // 1 t/h = 1000/3600 kg/s (definition)
        assertEquals(0.5, s.actions().get(5).value(), 1e-12);
        assertEquals(500.0, s.actions().get(6).value(), EXACT);
        assertEquals(30.0, s.actions().get(6).overS(), EXACT);
    }

    @Test
    void biasesAndDriftRatesAreDifferencesSoTheUnitOffsetCancels() throws ConfigException {
        Scenario s = parse(List.of("title T", "duration 900 s",
                "at 10 s fault feed_temp_tx bias 5 degC",
                "at 20 s fault feed_temp_tx drift 0.5 degC/s",
                "at 30 s fault pressure_tx bias 0.2 barg"));
        // A temperature difference of 5 degC is 5 K (ITS-90: the scales differ by an offset only)
        assertEquals(5.0, s.actions().get(0).value(), 1e-12);
        assertEquals(0.5, s.actions().get(1).value(), 1e-12);
        // A gauge-pressure difference carries no atmosphere: 0.2 bar = 2e4 Pa (definition of the bar)
        assertEquals(2.0e4, s.actions().get(2).value(), 1e-9);
    }

    @Test
    void operatorActionsParse() throws ConfigException {
        Scenario s = parse(List.of("title T", "duration 900 s",
                "at 10 s manual", "at 20 s output 45 %", "at 30 s auto", "at 40 s reset", "at 50 s acknowledge",
                "at 60 s acknowledge LAL", "at 70 s bypass LALL with reason \"drain test, permit 17\" for 300 s",
                "at 80 s clear level_tx_a", "at 90 s clear all", "at 95 s clear steam surge",
                "at 96 s trip steam surge 20 % for 60 s", "at 97 s trip feed_valve stuck", "at 98 s trip burner",
                "at 99 s set firing auto", "at 99 s set firing 60 %"));
        List<Action> a = s.actions();
        assertEquals(Action.Type.MANUAL, a.get(0).type());
        assertEquals(Action.Input.OUTPUT, a.get(1).input());
        assertEquals("all", a.get(4).target());
        assertEquals("LAL", a.get(5).target());
        assertEquals("drain test, permit 17", a.get(6).reason());
        assertEquals(300.0, a.get(6).value(), EXACT);
        assertNull(a.get(7).label());
        assertEquals("STEAM_SURGE", a.get(9).label());
        assertEquals(0.20, a.get(10).value(), EXACT);
        assertTrue(Double.isNaN(a.get(13).value()), "firing auto is NaN");
    }

    @Test
    void expectationKindsParse() throws ConfigException {
        Scenario s = parse(List.of("title T", "duration 900 s",
                "expect drum_level settles to 0 mm +- 15 mm within 300 s after 60 s",
                "expect iae drum_level below 3000 mm*s during 60..900 s",
                "expect iae feed_valve about 50 % below 2000 %*s",
                "expect drum_pressure below 9 barg",
                "expect steam_flow above 2 t/h during 100..200 s",
                "expect drum_level between -50 mm and 50 mm",
                "expect mode three-element at 450 s",
                "expect alarm LAH never during 0..100 s"));
        assertTrue(s.expectations().get(0) instanceof SettleExpectation);
        assertTrue(s.expectations().get(1) instanceof IaeExpectation);
        assertTrue(s.expectations().get(2) instanceof IaeExpectation);
        assertEquals(8, s.expectations().size());
        assertTrue(s.swellComp());
    }

    @Test
    void swellCompensationIsChosenForTheRun() throws ConfigException {
        assertFalse(parse(with("swell_comp off")).swellComp());
        ConfigException e = error("at 10 s set swell_comp off");
        assertEquals("swell_comp", e.key());
    }

    /** Errors name file, line (the 4th line here) and the word that is wrong. */
    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource(delimiter = '|', value = {
        "at 10 s set steam_demand 40 bar      | bar",
        "at 10 s set steam_demand 40          | 40",
        "at 10 s set steam_demand 140 %       | %",
        "at 10 s set stem_demand 40 %         | stem_demand",
        "at 10 s jump steam_demand 40 %       | jump",
        "at 10 parsecs set steam_demand 40 %  | parsecs",
        "at 1000 s set steam_demand 40 %      | s",
        "at 10 s ramp steam_demand 80 % over 20 s | 80",
        "at 10 s fault level_tx_d stuck       | level_tx_d",
        "at 10 s fault level_tx_a wobble      | wobble",
        "at 10 s fault level_tx_a bias 5 mm   | mm",
        "at 10 s fault level_tx_a drift 5 Pa  | Pa",
        "at 10 s trip feed_pump_c             | feed_pump_c",
        "at 10 s set mode four-element        | four-element",
        "at 10 s bypass LALL for 30 s         | for",
        "at 10 s manual now                   | now",
        "expect drum_levl between -80 and 80 mm | drum_levl",
        "expect drum_level between 80 and -80 mm | mm",
        "expect drum_level within 80 mm       | within",
        "expect drum_level between -80 and 80 mm during 0..1000 s | s",
        "expect alarm LAL sometimes           | sometimes",
        "expect iae drum_level below 3000 mm  | mm",
        "expect iae steam_flow below 30 t/h*s | steam_flow",
        "expect mode manual by 30 s           | by",
        "expect drum_level settles to 0 mm 15 mm within 300 s after 60 s | 15",
        "flavour strawberry                   | flavour",
    })
    void errorsNameFileLineAndWord(String line, String word) {
        ConfigException e = error(line.trim());
        assertEquals(FILE, e.file());
        assertEquals(4, e.line(), e.getMessage());
        assertEquals(word.trim(), e.key(), e.getMessage());
        assertTrue(e.getMessage().startsWith(FILE + ":4: " + word.trim() + ": "), e.getMessage());
    }

    @Test
    void missingTitleOrDurationIsAnError() {
        ConfigException e = assertThrows(ConfigException.class, () -> parse(List.of("duration 10 s")));
        assertEquals("title", e.key());
        e = assertThrows(ConfigException.class, () -> parse(List.of("title x")));
        assertEquals("duration", e.key());
    }

    @Test
    void everyBadLineIsReportedAtOnceInFileOrder() {
        ConfigException e = assertThrows(ConfigException.class, () -> parse(List.of("title T", "duration 100 s",
                "at 10 s set stem_demand 50 %",
                "expect drum_level between -80 and 80 furlongs",
                "at 500 s reset")));
        ConfigProblems all = assertInstanceOf(ConfigProblems.class, e);
        assertEquals(3, all.problems().size(), e.getMessage());
        assertEquals(3, all.problems().get(0).line());
        assertEquals("stem_demand", all.problems().get(0).key());
        assertEquals(4, all.problems().get(1).line());
        assertEquals("furlongs", all.problems().get(1).key());
        assertEquals(5, all.problems().get(2).line());
        assertEquals(3, e.getMessage().split("\\R").length, "one file:line: line per problem");
    }

    @Test
    void commentsAndQuotedHashesAreHandled() throws ConfigException {
        Scenario s = parse(List.of("title T  # trailing comment", "duration 10 s",
                "at 1 s bypass LAL with reason \"work order #12\" for 5 s # why"));
        assertEquals("T", s.title());
        assertEquals("work order #12", s.actions().get(0).reason());
    }
}
