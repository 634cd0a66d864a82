package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Alarm deadband: an alarm raised at the setpoint returns to normal only when the value has moved
 * back past the setpoint by the deadband (the alarm deadband of ANSI/ISA-18.2-2016, from memory);
 * in between it keeps its state. Sequences worked by hand; boundary points on the clear side are
 * kept 0.5 mm off the threshold so binary rounding of (setpoint - hysteresis) cannot decide them.
 */
class HysteresisTest {

    private static Fixtures.Rig rig(String direction, double setpointMm) {
        return new Fixtures.Rig(Fixtures.block("LX",
                "kind alarm", "variable level", "voting 1oo1", "direction " + direction,
                "setpoint " + setpointMm + " mm", "hysteresis 10 mm", "on_delay 0 s",
                "bad_counts_as_tripped yes", "actions none"));
    }

    @ParameterizedTest(name = "high alarm at 75 mm, deadband 10 mm: {0}")
    @CsvSource(delimiter = ';', value = {
        // levels in mm, one scan each; expected state after each scan (1 = alarm)
        "0 74.9 75 70 65.5 64.5 70 74.9 75; 0 0 1 1 1 0 0 0 1",
        "80 100 66 64 80; 1 1 1 0 1",
    })
    void aHighAlarmClearsOnlyBelowSetpointMinusDeadband(String levelsMm, String expected) {
        run(rig("high", 75.0), levelsMm, expected);
    }

    @ParameterizedTest(name = "low alarm at -75 mm, deadband 10 mm: {0}")
    @CsvSource(delimiter = ';', value = {
        "0 -74.9 -75 -70 -65.5 -64.5 -70 -75; 0 0 1 1 1 0 0 1",
        "-200 -66 -64 -76; 1 1 0 1",
    })
    void aLowAlarmClearsOnlyAboveSetpointPlusDeadband(String levelsMm, String expected) {
        run(rig("low", -75.0), levelsMm, expected);
    }

    private static void run(Fixtures.Rig r, String levelsMm, String expected) {
        String[] lv = levelsMm.trim().split("\\s+");
        String[] ex = expected.trim().split("\\s+");
        assertEquals(lv.length, ex.length, "table row");
        StringBuilder got = new StringBuilder();
        for (String l : lv) {
            r.level(Double.parseDouble(l) * 1e-3).step();
            got.append(r.set.effective(0) ? '1' : '0').append(' ');
        }
        assertEquals(String.join(" ", ex), got.toString().trim());
    }
}
