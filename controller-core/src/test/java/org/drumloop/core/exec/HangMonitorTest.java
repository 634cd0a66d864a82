package org.drumloop.core.exec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.soe.EventKind;
import org.drumloop.core.soe.SoeLog;
import org.junit.jupiter.api.Test;

/**
 * A scan body that does not return is caught from another thread and the fail-safe outputs are
 * written (fuel cut off, valve and pumps held at the last good values). The stall is staged with
 * latches and a hand-moved clock: no real time is waited on. The limit is missed_scans × period =
 * 3 × 0.1 s = 0.3 s (FailSafe.defaults()).
 */
class HangMonitorTest {
    private static final double DT_S = 0.1;
    private static final double BODY_VALVE = 0.42;
    private static final int STALL_AT = 2;

    /** A scan executive whose body stalls at scan STALL_AT after moving the clock by stallS. */
    private static final class Stage {
        final FakeClock clock = new FakeClock();
        final CountDownLatch inside = new CountDownLatch(1);
        final CountDownLatch release = new CountDownLatch(1);
        final List<String> writes = Collections.synchronizedList(new ArrayList<>());
        final SoeLog soe = new SoeLog(16);
        final ScanExecutive ex;
        final HangMonitor monitor;
        final Thread scanThread;
        int calls;

        Stage(double stallS, int scans) {
            ProcessIo io = new ProcessIo() {
                @Override
                public void readInputs(ProcessImage in, double tS) { }

                @Override
                public void writeOutputs(ProcessImage out, double tS) {
                    writes.add(out.value(Signal.FEED_VALVE_DEMAND) + " " + out.bool(Signal.PUMP_A_RUN) + " "
                            + out.bool(Signal.FUEL_CUTOFF));
                }
            };
            ScanBody body = (in, out, tS, dtS) -> {
                out.set(Signal.FEED_VALVE_DEMAND, calls == STALL_AT ? 0.99 : BODY_VALVE, Quality.GOOD, tS);
                out.setBool(Signal.PUMP_A_RUN, true, Quality.GOOD, tS);
                out.setBool(Signal.FUEL_CUTOFF, false, Quality.GOOD, tS);
                if (calls++ == STALL_AT) {
                    clock.advance(stallS);
                    inside.countDown();
                    try {
                        release.await();
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                    }
                } else {
                    clock.advance(0.01);
                }
            };
            ex = new ScanExecutive(clock, io, body, DT_S, FailSafe.defaults(), soe);
            monitor = new HangMonitor(ex);
            scanThread = new Thread(() -> {
                try {
                    ex.runScans(scans);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            });
        }
    }

    @Test
    void aSlowScanWithinTheLimitIsNotAHang() throws InterruptedException {
        Stage s = new Stage(0.25, 4);
        s.scanThread.start();
        s.inside.await();
        assertFalse(s.monitor.check(), "0.25 s of work is within the 0.3 s limit");
        s.release.countDown();
        s.scanThread.join();
        assertFalse(s.ex.watchdog().tripped());
        assertEquals(4, s.writes.size());
    }

    @Test
    void aScanThatDoesNotCompleteIsCaughtFromAnotherThread() throws InterruptedException {
        Stage s = new Stage(1.0, 4);
        s.scanThread.start();
        s.inside.await();
        assertTrue(s.monitor.check(), "1 s of work is past the 0.3 s limit");
        assertFalse(s.monitor.check(), "written once per stalled scan");
        assertTrue(s.ex.watchdog().tripped());
        // written from the monitor while the body still stalls: held valve and pump from scan 1, fuel cut
        assertEquals(List.of(BODY_VALVE + " true false", BODY_VALVE + " true false", BODY_VALVE + " true true"),
                new ArrayList<>(s.writes));
        s.release.countDown();
        s.scanThread.join();
        // the stalled scan and the ones after it stay fail-safe until a reset
        assertEquals(BODY_VALVE + " true true", s.writes.get(3));
        assertEquals(BODY_VALVE + " true true", s.writes.get(s.writes.size() - 1));
        List<String> faults = new ArrayList<>();
        s.soe.drainTo((t, scan, tag, k, m) -> {
            if (k == EventKind.FAULT) {
                faults.add(scan + " " + m);
            }
        });
        assertEquals(List.of(STALL_AT + " scan did not complete in time: fail-safe outputs"), faults);
        assertEquals(1, s.monitor.detections());
    }
}
