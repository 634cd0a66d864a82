package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;
import org.drumloop.core.exec.FailSafe;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Reading {@code .interlocks} files: the shipped files load with the settings of check-values §6
 * (common practice: alarms ±75 mm after 5 s, trips ±200 mm after 2 s voted 2oo3, TAL 60 °C,
 * LDAH 50 mm after 10 s), units convert to SI, and every mistake is reported as file:line: key.
 */
class InterlockFileTest {
    /** The project's shipped files, relative to the module directory the tests run in. */
    private static final Path DEFAULT_FILE = Path.of("..", "config", "tuning", "default.interlocks");
    private static final Path AB160_FILE = Path.of("..", "config", "tuning", "ab160.interlocks");
    /** mm -> m is a multiplication by 1e-3: exact to a few ulp of the value (1e-15 m). */
    private static final double TOL_M = 1e-15;
    /** degC -> K adds 273.15 (ITS-90 offset, by definition): exact to a few ulp of ~333 K. */
    private static final double TOL_K = 1e-12;

    @Test
    void theDefaultFileCarriesTheCommonPracticeSettings() throws ConfigException {
        InterlockConfig c = InterlockFile.load(DEFAULT_FILE);
        assertEquals(List.of("LAL", "LAH", "LALL", "LAHH", "TAL", "LDAH"),
                c.specs().stream().map(InterlockSpec::tag).toList());
        InterlockSpec lal = c.spec(0);
        assertEquals(-0.075, lal.setpointSi(), TOL_M);
        assertEquals(5.0, lal.onDelayS(), 0.0);
        assertEquals(InterlockSpec.CH_SELECTED, lal.channel(0));
        assertFalse(lal.isTrip());
        assertEquals(Annunciator.LAL, lal.annunciator());
        InterlockSpec lall = c.spec(2);
        assertTrue(lall.isTrip());
        assertTrue(lall.latch());
        assertEquals(Voting.TWO_OO_THREE, lall.voting());
        assertEquals(-0.200, lall.setpointSi(), TOL_M);
        assertEquals(2.0, lall.onDelayS(), 0.0);
        assertTrue(lall.has(Action.FUEL_CUTOFF));
        assertEquals(0.0, lall.bypassMaxS(), 0.0);
        InterlockSpec lahh = c.spec(3);
        assertEquals(0.200, lahh.setpointSi(), TOL_M);
        assertTrue(lahh.has(Action.FEED_PUMPS_STOP));
        assertFalse(lahh.has(Action.FEED_VALVE_CLOSE));
        InterlockSpec tal = c.spec(4);
        assertEquals(273.15 + 60.0, tal.setpointSi(), TOL_K);
        assertEquals(2.0, tal.hysteresisSi(), TOL_K);   // a temperature difference: 2 degC = 2 K, no offset
        InterlockSpec ldah = c.spec(5);
        assertEquals(0.050, ldah.setpointSi(), TOL_M);
        assertEquals(10.0, ldah.onDelayS(), 0.0);
        assertTrue(c.failSafe().valveHold());
        assertEquals(3, c.failSafe().missedScans());
    }

    @Test
    void theAb160FileClosesTheFeedValveOnHighHigh() throws ConfigException {
        InterlockConfig c = InterlockFile.load(AB160_FILE);
        InterlockSpec lahh = c.spec(3);
        assertTrue(lahh.has(Action.FEED_VALVE_CLOSE));
        assertFalse(lahh.has(Action.FEED_PUMPS_STOP));
        assertEquals(273.15 + 200.0, c.spec(4).setpointSi(), TOL_K);
        assertTrue(c.failSafe().valveHold());
    }

    @Test
    void aWatchdogBlockSetsTheFailSafeOutputs() {
        List<String> l = new ArrayList<>(List.of("watchdog", "missed_scans 5", "valve 25 %", "pump_a stop", "pump_b run"));
        l.addAll(Arrays.asList(GOOD_LALL));
        FailSafe fs = Fixtures.parse(l).failSafe();
        assertEquals(5, fs.missedScans());
        // 25 % -> 0.25 (EngUnit PERCENT factor 0.01): exact to rounding of one product.
        assertEquals(0.25, fs.valveFrac(), 1e-15);
        assertEquals(FailSafe.Pump.STOP, fs.pumpA());
        assertEquals(FailSafe.Pump.RUN, fs.pumpB());
    }

    @Test
    void minutesAndMetresAreAcceptedUnits() {
        InterlockConfig c = Fixtures.parse(Fixtures.block("X", "kind trip", "variable level", "voting 1oo2",
                "direction high", "setpoint 0.2 m", "hysteresis 0.01 m", "on_delay 0.5 min",
                "bad_counts_as_tripped no", "actions feed_valve_close feed_pumps_stop", "bypass_max 1 h"));
        InterlockSpec s = c.spec(0);
        assertEquals(30.0, s.onDelayS(), 1e-12);        // 0.5 min * 60 s/min
        assertEquals(3600.0, s.bypassMaxS(), 0.0);       // 1 h = 3600 s
        assertEquals(InterlockSpec.CH_A, s.channel(0));
        assertEquals(InterlockSpec.CH_B, s.channel(1));
        assertEquals(Annunciator.NONE, s.annunciator());
    }

    private static final String[] GOOD_LALL = {
        "interlock LALL", "kind trip", "variable level", "voting 2oo3", "direction low", "setpoint -200 mm",
        "hysteresis 10 mm", "on_delay 2 s", "bad_counts_as_tripped yes", "actions fuel_cutoff"};

    /**
     * GOOD_LALL with line {@code index} (0-based) replaced, removed when the replacement is "-", or
     * appended when the index is one past the end.
     */
    private static List<String> with(int index, String replacement) {
        List<String> l = new ArrayList<>(Arrays.asList(GOOD_LALL));
        if (index == l.size()) {
            l.add(replacement);
        } else if (replacement.equals("-")) {
            l.remove(index);
        } else {
            l.set(index, replacement);
        }
        return l;
    }

    @Test
    void theUnchangedFixtureIsValid() throws ConfigException {
        assertEquals(1, InterlockFile.parse("t.interlocks", Arrays.asList(GOOD_LALL)).size());
    }

    @ParameterizedTest(name = "line {0} as \"{1}\" -> {2}")
    @CsvSource(delimiter = '|', value = {
        // line index (10 = append) | replacement | expected message start
        "1 | kind shutdown                        | t.interlocks:2: kind: expected alarm or trip",
        "2 | variable pressure                    | t.interlocks:3: variable: expected level",
        "3 | voting 3oo3                          | t.interlocks:4: voting: expected 1oo1",
        "3 | -                                    | t.interlocks:1: voting: missing in interlock LALL",
        "4 | direction down                       | t.interlocks:5: direction: expected low or high",
        "5 | setpoint -200                        | t.interlocks:6: setpoint: expected a number and a unit",
        "5 | setpoint -200 degC                   | t.interlocks:6: setpoint: unit 'degC' is not a length",
        "5 | setpoint low mm                      | t.interlocks:6: setpoint: not a number: low",
        "5 | setpoint -200 furlong                | t.interlocks:6: setpoint: unit 'furlong'",
        "6 | hysteresis -1 mm                     | t.interlocks:7: hysteresis: must not be negative",
        "7 | on_delay 2 ms                        | t.interlocks:8: on_delay: unit 'ms' is not a time",
        "7 | on_delay -2 s                        | t.interlocks:8: on_delay: must not be negative",
        "7 | -                                    | t.interlocks:1: on_delay: missing in interlock LALL",
        "8 | bad_counts_as_tripped maybe          | t.interlocks:9: bad_counts_as_tripped: expected yes or no",
        "9 | actions fuel_cutoff horn             | t.interlocks:10: actions: unknown action 'horn'",
        "9 | actions fuel_cutoff fuel_cutoff      | t.interlocks:10: actions: action fuel_cutoff listed twice",
        "9 | colour red                           | t.interlocks:10: colour: unknown key in interlock block",
        "10 | latch no                            | t.interlocks:11: latch: a trip always latches",
        "10 | channels a b                        | t.interlocks:11: channels: 2oo3 votes over 3 channels, 2 given",
        "10 | channels a b b                      | t.interlocks:11: channels: channel b listed twice",
        "10 | channels a b d                      | t.interlocks:11: channels: unknown channel 'd'",
        "9 | kind alarm                           | t.interlocks:10: kind: given twice in this block (first on line 2)",
        "10 | bypass_max 5                        | t.interlocks:11: bypass_max: expected a number and a unit",
        "10 | annunciator siren                   | t.interlocks:11: annunciator: expected lal",
        "10 | description                         | t.interlocks:11: description: missing value",
        "0 | interlock                            | t.interlocks:1: interlock: expected one tag",
        "0 | kind trip                            | t.interlocks:1: kind: expected 'interlock TAG' or 'watchdog'",
    })
    void mistakesAreReportedWithFileLineAndKey(int index, String replacement, String expectedStart) {
        ConfigException e = assertThrows(ConfigException.class,
                () -> InterlockFile.parse("t.interlocks", with(index, replacement.strip())));
        // every problem of the file is reported at once; the one this row causes must be among them
        List<ConfigException> all = e instanceof ConfigProblems ? ((ConfigProblems) e).problems() : List.of(e);
        assertTrue(all.stream().anyMatch(p -> p.getMessage().startsWith(expectedStart)), e.getMessage());
    }

    @Test
    void everyProblemIsReportedOnceInFileOrder() {
        // each block reports its first problem; line-level problems are all reported
        List<String> l = new ArrayList<>(Arrays.asList(GOOD_LALL));
        l.set(1, "kind shutdown");                      // line 2, block LALL
        List<String> second = new ArrayList<>(Arrays.asList(GOOD_LALL));
        second.set(0, "interlock LAHH");                // line 11
        second.set(4, "direction down");                // line 15, block LAHH
        second.add("colour red");                       // line 21, a line of its own
        l.addAll(second);
        ConfigProblems e = assertThrows(ConfigProblems.class, () -> InterlockFile.parse("t.interlocks", l));
        assertEquals(3, e.problems().size(), e.getMessage());
        assertEquals(2, e.problems().get(0).line());
        assertEquals(15, e.problems().get(1).line());
        assertEquals(21, e.problems().get(2).line());
    }

    @Test
    void aDuplicateTagNamesBothLines() {
        List<String> l = new ArrayList<>(Arrays.asList(GOOD_LALL));
        l.addAll(Arrays.asList(GOOD_LALL));
        ConfigException e = assertThrows(ConfigException.class, () -> InterlockFile.parse("t.interlocks", l));
        assertEquals("t.interlocks:11: interlock: duplicate tag LALL (first defined on line 1)", e.getMessage());
        assertEquals(11, e.line());
        assertEquals("interlock", e.key());
    }

    @Test
    void singleChannelVariablesRefuseVotingAndChannels() {
        ConfigException e = assertThrows(ConfigException.class, () -> InterlockFile.parse("t.interlocks",
                List.of("interlock TAL", "kind alarm", "variable feed_temp", "voting 2oo3", "direction low",
                        "setpoint 60 degC", "hysteresis 2 degC", "on_delay 10 s", "bad_counts_as_tripped yes",
                        "actions none")));
        assertEquals("t.interlocks:4: voting: feed_temp has one channel; only 1oo1 is possible", e.getMessage());
    }

    @Test
    void anEmptyFileAndAMissingFileAreReported() {
        ConfigException empty = assertThrows(ConfigException.class,
                () -> InterlockFile.parse("e.interlocks", List.of("# nothing", "")));
        assertEquals("e.interlocks: interlock: no interlock defined", empty.getMessage());
        ConfigException missing = assertThrows(ConfigException.class,
                () -> InterlockFile.load(Path.of("no-such.interlocks")));
        assertTrue(missing.getMessage().startsWith("no-such.interlocks: cannot read"), missing.getMessage());
    }

    @ParameterizedTest(name = "watchdog \"{0}\" -> {1}")
    @CsvSource(delimiter = '|', value = {
        "missed_scans 0  | t.interlocks:2: missed_scans: must be at least 1",
        "missed_scans x  | t.interlocks:2: missed_scans: expected a whole number of scans",
        "valve 120 %     | t.interlocks:2: valve: position must be within 0..100 %",
        "valve 5 mm      | t.interlocks:2: valve: unit 'mm' is not a fraction",
        "pump_a maybe    | t.interlocks:2: pump_a: expected hold, run or stop",
        "horn on         | t.interlocks:2: horn: unknown key in watchdog block",
    })
    void watchdogMistakesAreReported(String setting, String expectedStart) {
        List<String> l = new ArrayList<>(List.of("watchdog", setting.strip()));
        l.addAll(Arrays.asList(GOOD_LALL));
        ConfigException e = assertThrows(ConfigException.class, () -> InterlockFile.parse("t.interlocks", l));
        assertTrue(e.getMessage().startsWith(expectedStart), e.getMessage());
    }
}
