package org.drumloop.core.control;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Duty/standby feed pumps and stop/start operation (common practice for boiler feed pumps). */
class FeedPumpControlTest {
    static final double H_S = 0.1;
    static final double P_OK = 12e5;
    static final double P_LOW = 9e5;

    @Test
    void aDutyPumpThatNeverRunsIsDeclaredTrippedAfterTheStartTimeout() {
        FeedPumpControl c = new FeedPumpControl(false, false, -0.1, 0.05, 5.0, 10e5, 3.0);
        int scans = 0;
        while (!c.standbyRunning() && scans < 1000) {
            c.update(false, true, false, true, P_OK, true, 0.0, true, false, H_S);
            scans++;
        }
        // the timer must exceed 5 s: 51 scans of 0.1 s (5.1 s) - exact to one scan
        assertEquals(51, scans);
        assertTrue(c.dutyFailed());
        assertFalse(c.runA());
        assertTrue(c.runB());
        assertEquals(FeedPumpControl.EV_DUTY_TRIP | FeedPumpControl.EV_STANDBY_START_TRIP, c.events());
    }

    @Test
    void unknownFeedbackNeverTripsThePump() {
        FeedPumpControl c = new FeedPumpControl(false, false, -0.1, 0.05, 5.0, 10e5, 3.0);
        for (int i = 0; i < 200; i++) {
            c.update(false, false, false, false, P_OK, true, 0.0, true, false, H_S);
        }
        assertFalse(c.dutyFailed());
        assertTrue(c.runA());
    }

    @Test
    void lowPressureStartsTheStandbyAfterItsDelayAndResetStopsIt() {
        FeedPumpControl c = new FeedPumpControl(true, false, -0.1, 0.05, 5.0, 10e5, 3.0);
        for (int i = 0; i < 29; i++) {
            c.update(false, true, true, true, P_LOW, true, 0.0, true, false, H_S);
        }
        assertFalse(c.runA(), "2.9 s < 3 s delay");
        c.update(false, true, true, true, P_LOW, true, 0.0, true, false, H_S);
        assertTrue(c.runA(), "30 scans = 3.0 s: standby A started");
        assertTrue(c.runB(), "duty B keeps running");
        c.requestReset();
        c.update(true, true, true, true, P_OK, true, 0.0, true, false, H_S);
        assertFalse(c.runA());
        assertEquals(1, c.duty());
    }

    @Test
    void stopAllOverridesEveryCommand() {
        FeedPumpControl c = new FeedPumpControl(false, false, -0.1, 0.05, 5.0, 10e5, 3.0);
        c.update(true, true, false, true, P_OK, true, 0.0, true, true, H_S);
        assertFalse(c.runA());
        assertFalse(c.runB());
        c.update(true, true, false, true, P_OK, true, 0.0, true, false, H_S);
        assertTrue(c.runA());
    }

    @Test
    void stopStartOperationFollowsTheLevelWithHysteresis() {
        FeedPumpControl c = new FeedPumpControl(false, true, -0.1, 0.05, 5.0, 10e5, 3.0);
        double[] level = {0.0, 0.04, 0.051, 0.0, -0.099, -0.101, 0.0, 0.051};
        boolean[] run = {true, true, false, false, false, true, true, false};
        for (int i = 0; i < level.length; i++) {
            c.update(run[Math.max(0, i - 1)], true, false, true, P_OK, true, level[i], true, false, H_S);
            assertEquals(run[i], c.runA(), "level " + level[i]);
        }
    }
}
