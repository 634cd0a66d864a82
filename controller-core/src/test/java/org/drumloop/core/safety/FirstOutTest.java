package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * First-out indication: of several trips, the one that latched first is shown until it is reset
 * (common practice for annunciators, first-out sequence of ANSI/ISA-18.1, from memory). Trips that
 * latch in the same scan are ranked in file order (our design).
 */
class FirstOutTest {
    private static List<String> lines() {
        List<String> l = new ArrayList<>();
        l.addAll(Fixtures.block("LALL", "kind trip", "variable level", "voting 2oo3", "direction low",
                "setpoint -200 mm", "hysteresis 10 mm", "on_delay 2 s", "bad_counts_as_tripped yes",
                "actions fuel_cutoff"));
        l.addAll(Fixtures.block("TLL", "kind trip", "variable feed_temp", "direction low",
                "setpoint 40 degC", "hysteresis 2 degC", "on_delay 0 s", "bad_counts_as_tripped yes",
                "actions fuel_cutoff"));
        l.addAll(Fixtures.block("LL2", "kind trip", "variable level", "voting 1oo1", "channels selected",
                "direction low", "setpoint -200 mm", "hysteresis 10 mm", "on_delay 2 s",
                "bad_counts_as_tripped yes", "actions fuel_cutoff"));
        return l;
    }

    @Test
    void theFirstTripToLatchIsShownUntilReset() {
        Fixtures.Rig r = new Fixtures.Rig(lines());
        r.level(0.0).steps(5);
        assertEquals(-1, r.out.firstOut);
        r.in.feedTempK = 273.15 + 30.0;          // TLL trips at once
        r.step();
        r.level(-0.300).steps(30);               // LALL and LL2 follow 2 s later
        assertEquals(r.idx("TLL"), r.out.firstOut);
        r.in.feedTempK = 273.15 + 90.0;
        r.level(0.0).step();
        r.set.requestReset();
        r.step();
        assertEquals(-1, r.out.firstOut);
        // same scan: file order decides
        r.level(-0.300).steps(21);
        assertEquals(r.idx("LALL"), r.out.firstOut);
    }

    @Test
    void aResetThatCannotReleaseTheFirstOutKeepsIt() {
        Fixtures.Rig r = new Fixtures.Rig(lines());
        r.in.feedTempK = 273.15 + 30.0;
        r.level(0.0).step();
        r.set.requestReset();
        r.step();
        assertEquals(r.idx("TLL"), r.out.firstOut);
    }
}
