package org.drumloop.modbus.interop;

import java.util.Arrays;

import org.drumloop.core.exec.RealTimeClock;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.server.ImageServer;

/**
 * What serve-plant's plant loop does to a served image, on its own thread: every period, on
 * absolute deadlines of the real-time clock, collect the written outputs and publish the inputs.
 * Records how late each step woke, to show whether traffic on the server disturbs the loop.
 * Publishes LT-A at 12 mA (13824 counts, 0x3600, in the link maps' 0..27648 = 4..20 mA).
 */
final class PacedLoop implements AutoCloseable {
    /**
     * Guard against a server that blocks or starves the loop feeding the image: a lock held across
     * network I/O or threads without bound delay it by seconds. Not the 2 ms jitter target, whose
     * figure is measured on a quiet machine (modbus-bridge/README.md): on this 2-core machine
     * running other builds the p99 reached 40-140 ms at load averages of 12-18, mostly during the
     * connection flood, whose handshakes the kernel processes ahead of any thread.
     */
    static final double LATENESS_P99_LIMIT_MS = 250.0;
    /** The level transmitter current published [mA]. */
    static final double LEVEL_MA = 12.0;

    private final ImageServer server;
    private final double periodS;
    private final double[] latenessS;
    private final Thread thread;
    private volatile boolean stop;
    private volatile int steps;

    PacedLoop(ImageServer server, double periodS, double maxRunS) {
        this.server = server;
        this.periodS = periodS;
        this.latenessS = new double[(int) Math.ceil(maxRunS / periodS) + 1];
        ProcessImage first = image();
        server.publishInputs(first, 0.0);
        thread = new Thread(this::run, "paced-loop");
        thread.setDaemon(true);
        thread.start();
    }

    private static ProcessImage image() {
        ProcessImage in = new ProcessImage();
        in.setCurrentMa(Signal.LEVEL_DP_A, LEVEL_MA, Quality.GOOD, 0);
        in.setCurrentMa(Signal.LEVEL_DP_B, LEVEL_MA, Quality.GOOD, 0);
        in.set(Signal.DRUM_PRESSURE, 9e5, Quality.GOOD, 0);
        in.set(Signal.FEED_TEMP, 363.15, Quality.GOOD, 0);
        in.setBool(Signal.BURNER_ON, true, Quality.GOOD, 0);
        return in;
    }

    private void run() {
        ProcessImage in = image();
        ProcessImage out = new ProcessImage();
        RealTimeClock clock = new RealTimeClock();
        int k = 0;
        try {
            while (!stop && k < latenessS.length) {
                double deadlineS = (k + 1) * periodS;
                clock.waitUntil(deadlineS);
                latenessS[k] = clock.nowS() - deadlineS;
                server.collectOutputs(out, deadlineS);
                server.publishInputs(in, deadlineS);
                steps = ++k;
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /** Steps run so far. */
    int steps() { return steps; }

    /** Nearest-rank percentile of the lateness so far [ms]. */
    double latenessMs(double p) {
        int n = steps;
        double[] s = Arrays.copyOf(latenessS, n);
        Arrays.sort(s);
        return n == 0 ? Double.NaN : s[Math.max(0, Math.min(n - 1, (int) Math.ceil(p * n) - 1))] * 1e3;
    }

    @Override
    public void close() throws InterruptedException {
        stop = true;
        thread.join(2000);
    }
}
