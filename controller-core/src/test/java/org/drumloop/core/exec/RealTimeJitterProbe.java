package org.drumloop.core.exec;

import java.util.Locale;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;

/**
 * Measures the real-time executive's start jitter and overruns on this machine with an empty scan
 * body. Not a unit test (it takes wall time); run it by hand:
 *
 * <pre>
 * java -cp controller-core/target/classes:controller-core/target/test-classes \
 *     org.drumloop.core.exec.RealTimeJitterProbe [periodMs] [seconds]
 * </pre>
 */
public final class RealTimeJitterProbe {
    private RealTimeJitterProbe() {
    }

    public static void main(String[] args) throws InterruptedException {
        double periodS = (args.length > 0 ? Double.parseDouble(args[0]) : 10.0) * 1e-3;
        double seconds = args.length > 1 ? Double.parseDouble(args[1]) : 10.0;
        ProcessIo io = new ProcessIo() {
            @Override
            public void readInputs(ProcessImage in, double tS) {
                in.set(Signal.DRUM_PRESSURE, 1e6, Quality.GOOD, tS);
            }

            @Override
            public void writeOutputs(ProcessImage out, double tS) { }
        };
        ScanBody body = (in, out, tS, dtS) -> out.set(Signal.FEED_VALVE_DEMAND, 0.5, Quality.GOOD, tS);
        ScanExecutive ex = new ScanExecutive(new RealTimeClock(), io, body, periodS, FailSafe.defaults(), null);
        ex.runScans(Math.round(1.0 / periodS));       // one second of warm-up, not counted
        ex.statistics().reset();
        ex.runScans(Math.round(seconds / periodS));
        System.out.printf(Locale.ROOT, "period %.1f ms, %.0f s: %s%n", periodS * 1e3, seconds, ex.statistics().summary());
    }
}
