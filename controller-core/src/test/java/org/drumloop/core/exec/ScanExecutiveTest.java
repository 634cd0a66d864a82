package org.drumloop.core.exec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.soe.EventKind;
import org.drumloop.core.soe.SoeLog;
import org.junit.jupiter.api.Test;

/**
 * The scan executive on a hand-moved clock: order of calls, absolute deadlines, overrun counting
 * and slot skipping, and the watchdog's fail-safe outputs. Expected schedules are worked by hand
 * from the rule deadline_k = t0 + k·dt (absolute deadlines, common practice for periodic control loops).
 */
class ScanExecutiveTest {
    private static final double DT_S = 0.1;
    /** Scan times are k·dt computed the same way on both sides: equal to rounding of one product. */
    private static final double TIME_TOL_S = 1e-12;
    private static final double BODY_VALVE = 0.7;

    /** Records calls and what was written. */
    private static final class Recorder implements ProcessIo, ScanBody, ScanListener {
        final FakeClock clock;
        final List<String> calls = new ArrayList<>();
        final List<Double> scanTimes = new ArrayList<>();
        final List<Double> dts = new ArrayList<>();
        final List<Boolean> writtenFuelCutoff = new ArrayList<>();
        final List<Double> writtenValve = new ArrayList<>();
        final List<Boolean> writtenPumpA = new ArrayList<>();
        /** Work per scan [s] by scan index; missing entries take 0.01 s. */
        double[] workS = new double[0];
        int throwAtScan = -1;
        int bodyCalls;

        Recorder(FakeClock clock) { this.clock = clock; }

        @Override
        public void readInputs(ProcessImage in, double tS) {
            calls.add("read");
            in.set(Signal.DRUM_PRESSURE, 1e6, Quality.GOOD, tS);
        }

        @Override
        public void scan(ProcessImage in, ProcessImage out, double tS, double dtS) {
            calls.add("body");
            scanTimes.add(tS);
            dts.add(dtS);
            int k = bodyCalls++;
            clock.advance(k < workS.length ? workS[k] : 0.01);
            out.set(Signal.FEED_VALVE_DEMAND, BODY_VALVE, Quality.GOOD, tS);
            out.setBool(Signal.PUMP_A_RUN, true, Quality.GOOD, tS);
            out.setBool(Signal.PUMP_B_RUN, false, Quality.GOOD, tS);
            out.setBool(Signal.FUEL_CUTOFF, false, Quality.GOOD, tS);
            if (k == throwAtScan) {
                throw new IllegalStateException("test failure in scan " + k);
            }
        }

        @Override
        public void writeOutputs(ProcessImage out, double tS) {
            calls.add("write");
            writtenFuelCutoff.add(out.bool(Signal.FUEL_CUTOFF));
            writtenValve.add(out.value(Signal.FEED_VALVE_DEMAND));
            writtenPumpA.add(out.bool(Signal.PUMP_A_RUN));
        }

        @Override
        public void afterScan(long scan, double tS, ProcessImage in, ProcessImage out) {
            calls.add("after");
        }
    }

    private static ScanExecutive executive(FakeClock clock, Recorder r, FailSafe fs, SoeLog soe) {
        ScanExecutive ex = new ScanExecutive(clock, r, r, DT_S, fs, soe);
        ex.setListener(r);
        return ex;
    }

    @Test
    void eachScanWaitsReadsRunsWritesThenReports() throws InterruptedException {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        ScanExecutive ex = executive(clock, r, FailSafe.defaults(), null);
        assertEquals(3, ex.runScans(3));
        assertEquals(List.of("read", "body", "write", "after", "read", "body", "write", "after",
                "read", "body", "write", "after"), r.calls);
        assertEquals(3, clock.waits);
        for (int k = 0; k < 3; k++) {
            assertEquals(k * DT_S, r.scanTimes.get(k), TIME_TOL_S);
            assertEquals(DT_S, r.dts.get(k), TIME_TOL_S);
        }
        assertEquals(0, ex.statistics().overruns());
        assertEquals(3, ex.statistics().scans());
    }

    @Test
    void deadlinesAreAbsoluteSoWorkTimeDoesNotShiftTheSchedule() throws InterruptedException {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        r.workS = new double[] {0.01, 0.09, 0.03, 0.099, 0.0};
        ScanExecutive ex = executive(clock, r, FailSafe.defaults(), null);
        ex.runScans(5);
        // scan k starts at k·dt whatever the previous one took (sleep-after-work would drift by the work).
        assertEquals(0.4 + 0.0, clock.nowS(), TIME_TOL_S);
        assertEquals(0, ex.statistics().overruns());
    }

    @Test
    void anOverrunIsCountedAndThePassedSlotsAreSkipped() throws InterruptedException {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        // scan 5 starts at 0.5 s and works 0.25 s: ends at 0.75 s, past the 0.6 s deadline.
        r.workS = new double[] {0.05, 0.05, 0.05, 0.05, 0.05, 0.25, 0.05};
        ScanExecutive ex = executive(clock, r, FailSafe.defaults(), null);
        ex.runScans(7);
        ScanStatistics st = ex.statistics();
        assertEquals(1, st.overruns());
        // slots 6 (0.6 s) and 7 (0.7 s) have passed at 0.75 s: skipped; the next scan is slot 8 at 0.8 s
        assertEquals(2, st.skippedSlots());
        assertEquals(0.8, r.scanTimes.get(6), TIME_TOL_S);
        assertEquals(3 * DT_S, r.dts.get(6), TIME_TOL_S);
        assertEquals(7, ex.scanCount());
        assertFalse(ex.watchdog().tripped(), "one miss is below the limit of three");
    }

    @Test
    void startJitterIsMeasuredFromTheDeadline() throws InterruptedException {
        FakeClock clock = new FakeClock();
        clock.lateWakeS = 250e-6;
        Recorder r = new Recorder(clock);
        ScanExecutive ex = executive(clock, r, FailSafe.defaults(), null);
        ex.runScans(10);
        // every wake-up 250 us late; histogram resolution 1/64 (LatencyHistogram), so 250 us +- 4 us
        assertEquals(250e-6, ex.statistics().jitterP50S(), 250e-6 / 64);
        assertEquals(250e-6, ex.statistics().jitterMaxS(), 1e-9);   // max is exact to the ns rounding
        // work 0.01 s per scan (the recorder's default), measured on the clock's work timer
        assertEquals(0.01, ex.statistics().execP99S(), 0.01 / 64);
    }

    @Test
    void theWatchdogForcesFailSafeOutputsAfterConsecutiveMisses() throws InterruptedException {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        SoeLog soe = new SoeLog(16);
        // three scans of 0.15 s at a 0.1 s period: each misses the next deadline
        r.workS = new double[] {0.15, 0.15, 0.15, 0.01, 0.01, 0.01};
        FailSafe fs = new FailSafe(3, 0.0, FailSafe.Pump.STOP, FailSafe.Pump.HOLD);
        ScanExecutive ex = executive(clock, r, fs, soe);
        ex.runScans(2);
        assertFalse(ex.watchdog().tripped());
        assertFalse(r.writtenFuelCutoff.get(1));
        ex.runScans(1);
        assertTrue(ex.watchdog().tripped());
        // the tripping scan writes twice: its own outputs, then the fail-safe ones at once
        assertEquals(4, r.writtenValve.size());
        assertTrue(r.writtenFuelCutoff.get(3));
        assertEquals(0.0, r.writtenValve.get(3), 0.0);
        assertFalse(r.writtenPumpA.get(3));
        // later scans are on time but stay fail-safe until a reset
        ex.runScans(2);
        assertTrue(r.writtenFuelCutoff.get(5));
        assertEquals(0.0, r.writtenValve.get(5), 0.0);
        ex.watchdog().requestReset();
        ex.runScans(1);
        assertFalse(ex.watchdog().tripped());
        assertFalse(r.writtenFuelCutoff.get(6));
        assertEquals(BODY_VALVE, r.writtenValve.get(6), 0.0);
        List<EventKind> kinds = new ArrayList<>();
        soe.drainTo((t, s, tag, k, m) -> kinds.add(k));
        assertEquals(List.of(EventKind.FAULT, EventKind.RESET), kinds);
        assertEquals(1, ex.watchdog().trips());
        assertEquals(3, ex.statistics().maxConsecutiveOverruns());
    }

    @Test
    void missesThatAreNotConsecutiveDoNotTripTheWatchdog() throws InterruptedException {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        r.workS = new double[] {0.15, 0.15, 0.01, 0.15, 0.15, 0.01, 0.15, 0.15};
        ScanExecutive ex = executive(clock, r, FailSafe.defaults(), null);
        ex.runScans(8);
        assertEquals(6, ex.statistics().overruns());
        assertFalse(ex.watchdog().tripped());
    }

    @Test
    void aFailingScanHoldsTheValveAndCutsFuelAtOnce() throws InterruptedException {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        r.throwAtScan = 2;
        SoeLog soe = new SoeLog(16);
        ScanExecutive ex = executive(clock, r, FailSafe.defaults(), soe);
        ex.runScans(4);
        assertFalse(r.writtenFuelCutoff.get(1));
        assertTrue(r.writtenFuelCutoff.get(2));
        // hold: the last good demand, from scan 1
        assertEquals(BODY_VALVE, r.writtenValve.get(2), 0.0);
        assertTrue(r.writtenPumpA.get(2), "pump A held running");
        assertEquals(1, ex.statistics().failures());
        assertTrue(ex.lastFailure() instanceof IllegalStateException);
        assertEquals(16, r.calls.size(), "the loop goes on after the failing scan");
        assertEquals(List.of("read", "body", "write", "after"), r.calls.subList(12, 16));
        String[] msg = new String[1];
        soe.drainTo((t, s, tag, k, m) -> msg[0] = tag + " " + k + " " + m);
        assertEquals("watchdog FAULT scan failed: fail-safe outputs", msg[0]);
    }

    @Test
    void runUntilStopsAtTheLastScanNotAfterTheEndTime() throws InterruptedException {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        ScanExecutive ex = executive(clock, r, FailSafe.defaults(), null);
        // scans at 0.0, 0.1, ..., 1.0 s: eleven (hand count)
        assertEquals(11, ex.runUntil(1.0));
        assertEquals(1.1, ex.nextScanTimeS(), TIME_TOL_S);
    }

    @Test
    void aStopRequestEndsTheLoopAfterTheCurrentScan() throws InterruptedException {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        ScanExecutive ex = executive(clock, r, FailSafe.defaults(), null);
        ex.setListener((scan, tS, in, out) -> {
            if (scan == 4) {
                ex.requestStop();
            }
        });
        ex.runUntilStopped();
        assertEquals(5, ex.scanCount());
        assertNull(ex.lastFailure());
    }

    @Test
    void thePeriodMustBeTenToAThousandMilliseconds() {
        FakeClock clock = new FakeClock();
        Recorder r = new Recorder(clock);
        assertThrows(IllegalArgumentException.class, () -> new ScanExecutive(clock, r, r, 0.005, FailSafe.defaults(), null));
        assertThrows(IllegalArgumentException.class, () -> new ScanExecutive(clock, r, r, 1.5, FailSafe.defaults(), null));
        assertEquals(0.010, new ScanExecutive(clock, r, r, 0.010, FailSafe.defaults(), null).periodS(), 0.0);
        assertEquals(1.000, new ScanExecutive(clock, r, r, 1.000, FailSafe.defaults(), null).periodS(), 0.0);
    }

    @Test
    void simulatedTimeAsFastAsPossibleNeverOverruns() throws InterruptedException {
        SimulatedClock clock = SimulatedClock.asFastAsPossible();
        List<Double> times = new ArrayList<>();
        ProcessIo io = new ProcessIo() {
            @Override
            public void readInputs(ProcessImage in, double tS) { }

            @Override
            public void writeOutputs(ProcessImage out, double tS) { }
        };
        ScanExecutive ex = new ScanExecutive(clock, io, (in, out, tS, dtS) -> times.add(tS), DT_S, FailSafe.defaults(), null);
        ex.runScans(1000);
        assertEquals(0, ex.statistics().overruns());
        assertEquals(0, ex.statistics().jitter().max());
        // simulated time stands at the last scan's deadline: 999 · 0.1 s
        assertEquals(99.9, clock.nowS(), 1e-9);
        assertEquals(99.9, times.get(999), 1e-9);
        assertFalse(clock.isPaced());
    }
}
