package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.drumloop.core.soe.EventKind;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Bypass rules (IEC 61511-1 asks that bypasses be authorised, recorded and limited in time; the
 * rules below are our design within that, common practice): a reason is required, the duration may
 * not exceed the interlock's bypass_max (0 forbids bypassing), the bypass ends by itself, start and
 * end are logged, and a bypassed interlock neither annunciates nor acts while its condition is
 * still shown.
 */
class BypassTest {
    private static final double HIGH_HIGH_M = 0.250;

    private static List<String> lines() {
        List<String> l = new ArrayList<>();
        l.addAll(Fixtures.block("LALL", "kind trip", "variable level", "voting 2oo3", "direction low",
                "setpoint -200 mm", "hysteresis 10 mm", "on_delay 2 s", "bad_counts_as_tripped yes",
                "actions fuel_cutoff", "bypass_max 0 s"));
        l.addAll(Fixtures.block("LAHH", "kind trip", "variable level", "voting 2oo3", "direction high",
                "setpoint 200 mm", "hysteresis 10 mm", "on_delay 2 s", "bad_counts_as_tripped yes",
                "actions feed_pumps_stop", "bypass_max 600 s"));
        return l;
    }

    @ParameterizedTest(name = "bypass {0} reason \"{1}\" for {2} s is refused")
    @CsvSource(nullValues = "NULL", value = {
        "LAHH, NULL,                 60,   a bypass needs a reason",
        "LAHH, '',                   60,   a bypass needs a reason",
        "LAHH, '   ',                60,   a bypass needs a reason",
        "NOPE, transmitter check,    60,   unknown interlock",
        "LALL, transmitter check,    60,   this interlock may not be bypassed",
        "LAHH, transmitter check,    601,  bypass duration exceeds bypass_max",
        "LAHH, transmitter check,    0,    bypass duration must be positive",
        "LAHH, transmitter check,    -5,   bypass duration must be positive",
    })
    void aBypassIsRefusedWithoutAReasonOrBeyondItsLimit(String tag, String reason, double durationS, String why) {
        Fixtures.Rig r = new Fixtures.Rig(lines());
        assertFalse(r.set.bypass(tag, reason, durationS, 0.0));
        assertEquals(why, r.set.lastRefusal());
        r.step();
        assertTrue(r.events(EventKind.BYPASS).isEmpty());
        for (int i = 0; i < r.set.size(); i++) {
            assertFalse(r.set.bypassed(i));
        }
    }

    @Test
    void aBypassSuppressesActionsShowsTheRawStateAndExpiresByItself() {
        Fixtures.Rig r = new Fixtures.Rig(lines());
        int lahh = r.idx("LAHH");
        r.level(0.0).steps(10);                                       // scans 0..9
        assertTrue(r.set.bypass("LAHH", "transmitter B calibration", 60.0, r.tS()));  // at t = 1.0 s
        r.level(HIGH_HIGH_M).steps(100);                              // scans 10..109
        assertTrue(r.set.bypassed(lahh));
        assertTrue(r.set.active(lahh), "the raw state is still shown");
        assertFalse(r.set.latched(lahh));
        assertFalse(r.out.feedPumpsStop, "bypassed: no action");
        assertFalse(r.out.tripLahh, "bypassed: no annunciation");
        assertTrue(r.out.anyBypassed);
        List<Fixtures.Event> starts = r.events(EventKind.BYPASS);
        assertEquals(1, starts.size());
        assertEquals(10, starts.get(0).scan());
        assertTrue(starts.get(0).message().contains("transmitter B calibration"));
        // expiry at t = 1.0 + 60 = 61.0 s, i.e. scan 610 at 0.1 s (hand-worked)
        r.steps(610 - 110);
        assertTrue(r.set.bypassed(lahh));
        r.step();
        assertFalse(r.set.bypassed(lahh));
        List<Fixtures.Event> ends = r.events(EventKind.BYPASS_END);
        assertEquals(1, ends.size());
        assertEquals(610, ends.get(0).scan());
        // the condition held through the bypass, so the trip latches in the scan the bypass ends
        assertTrue(r.out.feedPumpsStop);
        assertEquals(610, r.events(EventKind.TRIP).get(0).scan());
        int endAt = r.events.indexOf(ends.get(0));
        int tripAt = r.events.indexOf(r.events(EventKind.TRIP).get(0));
        assertTrue(endAt < tripAt, "bypass end is logged before the trip it releases");
    }

    @Test
    void anOperatorCanEndABypassEarly() {
        Fixtures.Rig r = new Fixtures.Rig(lines());
        assertTrue(r.set.bypass("lahh", "valve stroke test", 600.0, 0.0));
        r.steps(5);
        assertTrue(r.set.endBypass("LAHH"));
        r.step();
        assertFalse(r.set.bypassed(r.idx("LAHH")));
        assertEquals(5, r.events(EventKind.BYPASS_END).get(0).scan());
        assertEquals("bypass removed by operator", r.events(EventKind.BYPASS_END).get(0).message());
    }
}
