package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.drumloop.core.soe.EventKind;
import org.junit.jupiter.api.Test;

/**
 * Latching, reset and acknowledgement. Expected behaviour: a low-water fuel cut-off causes safety
 * shutdown and lockout and needs a manual reset (ASME CSD-1-2009, CW-140); a reset is not accepted
 * while the cause is still present (common practice: non-storing reset); alarms without latch
 * return to normal by themselves but keep their unacknowledged state until acknowledged (alarm
 * sequence of ANSI/ISA-18.1, from memory). Tables worked by hand.
 */
class LatchResetTest {
    private static final double LOW_LOW_M = -0.250;
    private static final double NORMAL_M = 0.0;

    private static List<String> lines() {
        List<String> l = new ArrayList<>();
        l.addAll(Fixtures.block("LAL", "kind alarm", "variable level", "voting 1oo1", "direction low",
                "setpoint -75 mm", "hysteresis 10 mm", "on_delay 0 s", "bad_counts_as_tripped yes", "actions none"));
        l.addAll(Fixtures.block("LALL", "kind trip", "variable level", "voting 2oo3", "direction low",
                "setpoint -200 mm", "hysteresis 10 mm", "on_delay 2 s", "bad_counts_as_tripped yes",
                "actions fuel_cutoff"));
        return l;
    }

    /** One row: level for a number of scans, reset requested before the first of them, expected states after. */
    private record Row(double levelM, boolean resetFirst, int scans, boolean latched, boolean fuelCutoff, boolean lal) {
    }

    @Test
    void aTripLatchesUntilItsConditionIsClearAndAResetIsApplied() {
        Fixtures.Rig r = new Fixtures.Rig(lines());
        int lall = r.idx("LALL");
        Row[] table = {
            new Row(NORMAL_M, false, 5, false, false, false),
            new Row(LOW_LOW_M, false, 20, false, false, true),   // 20 scans = 0..1.9 s: not yet 2 s
            new Row(LOW_LOW_M, false, 1, true, true, true),      // 21st scan: 2.0 s after onset, trips
            new Row(LOW_LOW_M, true, 5, true, true, true),       // reset while low: refused
            new Row(NORMAL_M, false, 5, true, true, false),      // level back: still latched, LAL clears itself
            new Row(NORMAL_M, true, 1, false, false, false),     // reset with the condition clear: released
            new Row(LOW_LOW_M, false, 21, true, true, true),     // trips again after the full delay
        };
        for (int i = 0; i < table.length; i++) {
            Row row = table[i];
            if (row.resetFirst) {
                r.set.requestReset();
            }
            r.level(row.levelM).steps(row.scans);
            assertEquals(row.latched, r.set.latched(lall), "row " + i + " latched");
            assertEquals(row.fuelCutoff, r.out.fuelCutoff, "row " + i + " fuel cut-off");
            assertEquals(row.fuelCutoff, r.out.tripLall, "row " + i + " annunciator");
            assertEquals(row.lal, r.out.alarmLal, "row " + i + " LAL");
        }
        List<Fixtures.Event> trips = r.events(EventKind.TRIP);
        assertEquals(2, trips.size());
        assertEquals(25, trips.get(0).scan());
        assertEquals(1, r.events(EventKind.TRIP_CLEAR).size());
        assertEquals(36, r.events(EventKind.TRIP_CLEAR).get(0).scan());
        long refused = r.events(EventKind.RESET).stream().filter(e -> e.message().contains("refused")).count();
        assertEquals(1, refused);
        assertEquals(1, r.events(EventKind.INFO).size(), "condition-clear notice while latched");
    }

    @Test
    void aTripLatchedWhileItsConditionClearedBeforeTheResetStaysLatched() {
        Fixtures.Rig r = new Fixtures.Rig(lines());
        r.level(LOW_LOW_M).steps(21).level(NORMAL_M).steps(100);
        assertTrue(r.out.fuelCutoff, "no reset: stays tripped however long the level is normal");
    }

    @Test
    void alarmsAndTripsWaitForAcknowledgement() {
        Fixtures.Rig r = new Fixtures.Rig(lines());
        int lal = r.idx("LAL");
        int lall = r.idx("LALL");
        r.level(LOW_LOW_M).steps(21);
        assertFalse(r.set.acknowledged(lal));
        assertFalse(r.set.acknowledged(lall));
        assertTrue(r.out.unacknowledged);
        assertTrue(r.set.acknowledge("lal"));
        r.step();
        assertTrue(r.set.acknowledged(lal));
        assertFalse(r.set.acknowledged(lall));
        assertFalse(r.set.acknowledge("NO_SUCH_TAG"));
        assertTrue(r.set.acknowledge("all"));
        r.step();
        assertFalse(r.out.unacknowledged);
        assertEquals(List.of("LAL", "LALL"), r.events(EventKind.ACK).stream().map(Fixtures.Event::tag).toList());
        // an alarm that returns to normal unacknowledged stays unacknowledged
        r.set.requestReset();
        r.level(NORMAL_M).steps(2).level(-0.100).step().level(NORMAL_M).step();
        assertFalse(r.out.alarmLal);
        assertFalse(r.set.acknowledged(lal));
        assertTrue(r.out.unacknowledged);
    }
}
