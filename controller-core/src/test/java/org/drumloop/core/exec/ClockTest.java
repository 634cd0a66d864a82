package org.drumloop.core.exec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The two clocks keep the one promise the executive relies on: {@code waitUntil} never returns
 * before the deadline (absolute-deadline waiting, common practice). No assertion is made on how
 * soon after it returns.
 */
class ClockTest {

    @Test
    void theRealTimeClockNeverWakesBeforeTheDeadline() throws InterruptedException {
        RealTimeClock c = new RealTimeClock();
        for (int i = 1; i <= 5; i++) {
            double deadline = c.nowS() + 0.001;
            c.waitUntil(deadline);
            assertTrue(c.nowS() >= deadline, "woke at " + c.nowS() + " for " + deadline);
        }
    }

    @Test
    void aPastDeadlineReturnsWithoutWaitingForAnything() throws InterruptedException {
        RealTimeClock c = new RealTimeClock();
        double before = c.nowS();
        c.waitUntil(before - 1.0);
        assertTrue(c.nowS() >= before);
    }

    @Test
    void anInterruptEndsTheWait() {
        RealTimeClock c = new RealTimeClock();
        Thread.currentThread().interrupt();
        assertThrows(InterruptedException.class, () -> c.waitUntil(c.nowS() + 10.0));
        assertTrue(!Thread.interrupted(), "the interrupt flag is consumed");
    }

    @Test
    void simulatedTimeJumpsToEachDeadline() throws InterruptedException {
        SimulatedClock c = SimulatedClock.asFastAsPossible();
        c.waitUntil(12.5);
        assertEquals(12.5, c.nowS(), 0.0);
        c.waitUntil(3.0);
        assertEquals(12.5, c.nowS(), 0.0, "time never runs backwards");
    }

    @Test
    void pacedSimulatedTimeLetsWallTimeCatchUp() throws InterruptedException {
        // 1000x real time: 10 scans of 0.1 s simulated take at least 1 ms of wall time
        SimulatedClock c = SimulatedClock.paced(1000.0);
        double wall0 = c.workTimerS();
        for (int k = 1; k <= 10; k++) {
            c.waitUntil(k * 0.1);
        }
        assertEquals(1.0, c.nowS(), 1e-12);
        assertTrue(c.workTimerS() - wall0 >= 1.0 / 1000.0 - 0.1 / 1000.0, "wall time paced");
        assertTrue(c.lagS() >= 0);
    }

    @Test
    void badClockSettingsAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> SimulatedClock.paced(0));
        assertThrows(IllegalArgumentException.class, () -> new RealTimeClock(0.5));
    }
}
