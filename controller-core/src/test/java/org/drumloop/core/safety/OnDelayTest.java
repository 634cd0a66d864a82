package org.drumloop.core.safety;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.drumloop.core.io.Quality;
import org.drumloop.core.soe.EventKind;
import org.drumloop.core.soe.SoeLog;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * On-delay exact to one scan. Expected behaviour is the on-delay timer (TON) of IEC 61131-3: the
 * output rises when the input has been true for the preset time PT. Sampled at a scan period dt,
 * with the condition first seen at scan k0, the first scan whose time is at least k0·dt + PT is
 * scan k0 + ceil(PT/dt) (hand-derived from that definition; the table's counts are worked by hand).
 */
class OnDelayTest {
    private static final double HIGH_SETPOINT_MM = 75.0;
    private static final double ABOVE_M = 0.100;
    private static final double BELOW_M = 0.0;
    private static final int ONSET_SCAN = 10;

    private static InterlockSet alarm(String delay, SoeLog log) {
        return new InterlockSet(Fixtures.parse(Fixtures.block("LAH",
                "kind alarm", "variable level", "voting 1oo1", "direction high",
                "setpoint " + HIGH_SETPOINT_MM + " mm", "hysteresis 0 mm", "on_delay " + delay,
                "bad_counts_as_tripped yes", "actions none")), log);
    }

    private static InterlockInputs inputs(double levelM) {
        InterlockInputs in = new InterlockInputs();
        Arrays.fill(in.levelQuality, Quality.GOOD);
        Arrays.fill(in.levelM, levelM);
        in.levelSelectedM = levelM;
        in.levelSelectedQuality = Quality.GOOD;
        return in;
    }

    @ParameterizedTest(name = "delay {0} at dt {1} s acts {2} scans after onset")
    @CsvSource({
        // delay,  dtS,  scans after onset = ceil(delay/dt) (hand-worked)
        "0 s,      0.1,  0",
        "0.05 s,   0.1,  1",
        "0.1 s,    0.1,  1",
        "0.15 s,   0.1,  2",
        "0.3 s,    0.1,  3",   // 0.3/0.1 is 2.9999999999999996 in binary: must still be 3, not 3 + 1 or 2
        "0.7 s,    0.1,  7",   // 0.7/0.1 is 6.999999999999999 in binary
        "2 s,      0.1,  20",
        "5 s,      0.1,  50",
        "10 s,     0.1,  100",
        "2 s,      0.03, 67",  // 66.67 rounds up
        "1 s,      0.25, 4",
        "0.5 s,    0.2,  3",
        "0.1 min,  0.5,  12",
    })
    void theFunctionActsAtTheFirstScanAtOrAfterOnsetPlusDelay(String delay, double dtS, int scansAfterOnset) {
        SoeLog log = new SoeLog(64);
        InterlockSet set = alarm(delay, log);
        InterlockOutputs out = new InterlockOutputs();
        InterlockInputs below = inputs(BELOW_M);
        InterlockInputs above = inputs(ABOVE_M);
        int firstActive = -1;
        for (int k = 0; k < ONSET_SCAN + scansAfterOnset + 5; k++) {
            set.evaluate(k < ONSET_SCAN ? below : above, k * dtS, k, dtS, out);
            if (out.alarmLah && firstActive < 0) {
                firstActive = k;
            }
        }
        assertEquals(ONSET_SCAN + scansAfterOnset, firstActive);
    }

    @Test
    void oneScanWithoutTheConditionRestartsTheCount() {
        // 2 s at 0.1 s = 20 scans (TON: a false input resets the elapsed time, IEC 61131-3).
        SoeLog log = new SoeLog(64);
        InterlockSet set = alarm("2 s", log);
        InterlockOutputs out = new InterlockOutputs();
        InterlockInputs below = inputs(BELOW_M);
        InterlockInputs above = inputs(ABOVE_M);
        int k = 0;
        for (; k < 19; k++) {
            set.evaluate(above, k * Fixtures.DT_S, k, Fixtures.DT_S, out);
        }
        assertFalse(out.alarmLah);
        set.evaluate(below, k * Fixtures.DT_S, k, Fixtures.DT_S, out);
        k++;
        int restart = k;
        for (; k < restart + 20; k++) {
            set.evaluate(above, k * Fixtures.DT_S, k, Fixtures.DT_S, out);
            assertFalse(out.alarmLah, "scan " + k);
        }
        set.evaluate(above, k * Fixtures.DT_S, k, Fixtures.DT_S, out);
        assertTrue(out.alarmLah);
        assertFalse(set.acknowledged(0), "a new alarm waits for acknowledgement");
    }

    @Test
    void aScanSpanningSkippedSlotsCountsThoseSlots() {
        // 2 s at 0.1 s = 20 slots after onset. Onset at slot 0; slots 1..15 one by one (15), then a
        // scan at slot 18 with dt = 0.3 s after an overrun (18): not yet; slot 19 (19) no; slot 20 acts,
        // 2.0 s after onset as TON requires (IEC 61131-3), although only 18 scans ran.
        SoeLog log = new SoeLog(64);
        InterlockSet set = alarm("2 s", log);
        InterlockOutputs out = new InterlockOutputs();
        InterlockInputs above = inputs(ABOVE_M);
        double dt = Fixtures.DT_S;
        for (int k = 0; k <= 15; k++) {
            set.evaluate(above, k * dt, k, dt, out);
        }
        set.evaluate(above, 18 * dt, 16, 3 * dt, out);
        assertFalse(out.alarmLah);
        set.evaluate(above, 19 * dt, 17, dt, out);
        assertFalse(out.alarmLah);
        set.evaluate(above, 20 * dt, 18, dt, out);
        assertTrue(out.alarmLah);
    }

    @Test
    void theAlarmIsLoggedInTheScanItActsWithThatScansTime() {
        SoeLog log = new SoeLog(64);
        InterlockSet set = alarm("2 s", log);
        InterlockOutputs out = new InterlockOutputs();
        InterlockInputs above = inputs(ABOVE_M);
        double[] when = {Double.NaN};
        long[] scanNo = {-1};
        for (int k = 0; k < 25; k++) {
            set.evaluate(above, k * Fixtures.DT_S, k, Fixtures.DT_S, out);
            log.drainTo((t, s, tag, kind, m) -> {
                if (kind == EventKind.ALARM) {
                    when[0] = t;
                    scanNo[0] = s;
                }
            });
        }
        assertEquals(20, scanNo[0]);
        // 20 scans of 0.1 s: 2.0 s up to the rounding of 20 * 0.1 in binary (1 ulp scale, 1e-12 s).
        assertEquals(2.0, when[0], 1e-12);
    }
}
