package org.drumloop.bench.live;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.net.InetAddress;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicBoolean;
import org.drumloop.bench.ExitCode;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code drumloop live bench}: the live loop with the default plant and N event-stream clients at
 * once (Java clients in the same process, so their clock is the loop's). Prints the scan's
 * start-of-scan lateness against its absolute deadlines and how long each update took from the
 * loop publishing it to a client reading it. A measurement command, not a test.
 */
@Command(name = "bench", hidden = true, mixinStandardHelpOptions = true,
        description = "Measure scan jitter and update latency of the live page with N SSE clients.")
public final class LiveBenchCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--clients", defaultValue = "20", description = "event-stream clients (default 20)")
    int clients;

    @Option(names = "--seconds", defaultValue = "30", description = "measured wall time after 3 s warm-up (default 30)")
    double seconds;

    @Option(names = "--speed", defaultValue = "1", description = "N times real time (default 1)")
    double speed;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        if (clients < 0 || !(seconds > 0) || !(speed >= LiveServer.SPEED_MIN && speed <= LiveServer.SPEED_MAX)) {
            spec.commandLine().getErr().println("--clients >= 0, --seconds > 0, --speed 0.1..100");
            return ExitCode.BAD_INPUT;
        }
        SimLiveSession session = SimLiveSession.idle("aux-boiler", "default", 0.7, 1);
        LiveLoop loop = new LiveLoop(session, speed);
        AtomicBoolean measuring = new AtomicBoolean(false);
        List<long[]> latencies = new ArrayList<>();
        int[] counts = new int[clients];
        List<Thread> threads = new ArrayList<>();
        try (LiveServer server = LiveServer.onLoopback(loop, 0)) {
            loop.start();
            server.start();
            for (int c = 0; c < clients; c++) {
                long[] lat = new long[(int) (seconds * 1000 / LiveServer.DEFAULT_BROADCAST_MS * 2 + 100)];
                latencies.add(lat);
                int id = c;
                Thread t = new Thread(() -> read(server, lat, counts, id, measuring), "sse-client-" + c);
                t.setDaemon(true);
                t.start();
                threads.add(t);
            }
            Thread.sleep(3_000); // warm-up: JIT, connections
            loop.timing().clear();
            measuring.set(true);
            Thread.sleep((long) (seconds * 1000));
            measuring.set(false);
            ScanTiming st = loop.timing();
            out.printf("scan period %.1f ms (%.0f ms plant time at %sx), %d scans measured, %d clients connected%n",
                    session.info().scanPeriodS() * 1000 / speed, session.info().scanPeriodS() * 1000,
                    LiveAction.fmt(speed), st.count(), server.clients());
            out.printf("start-of-scan lateness: p50 %.2f ms  p99 %.2f ms  max %.2f ms  restarts %d%n",
                    st.quantileMs(0.50), st.quantileMs(0.99), st.maxMs(), st.overruns());
            long[] all = new long[0];
            int minCount = Integer.MAX_VALUE;
            int maxCount = 0;
            long worstClientMax = 0;
            for (int c = 0; c < clients; c++) {
                int n = Math.min(counts[c], latencies.get(c).length);
                long[] l = Arrays.copyOf(latencies.get(c), n);
                minCount = Math.min(minCount, counts[c]);
                maxCount = Math.max(maxCount, counts[c]);
                for (long v : l) {
                    worstClientMax = Math.max(worstClientMax, v);
                }
                long[] merged = Arrays.copyOf(all, all.length + l.length);
                System.arraycopy(l, 0, merged, all.length, l.length);
                all = merged;
            }
            Arrays.sort(all);
            if (clients > 0) {
                out.printf("updates per client: %d to %d in %.0f s (%.1f to %.1f per second)%n", minCount, maxCount,
                        seconds, minCount / seconds, maxCount / seconds);
            }
            if (all.length > 0) {
                out.printf("publish-to-client latency over %d updates: p50 %.1f ms  p99 %.1f ms  max %.1f ms%n", all.length,
                        all[(int) (0.50 * (all.length - 1))] / 1e6, all[(int) (0.99 * (all.length - 1))] / 1e6,
                        all[all.length - 1] / 1e6);
            }
        } finally {
            loop.stop();
        }
        return ExitCode.OK;
    }

    /**
     * One event-stream client on a plain socket with a reused buffer, so the clients (in this JVM)
     * add next to no garbage of their own to what the server does.
     */
    private static void read(LiveServer server, long[] lat, int[] counts, int id, AtomicBoolean measuring) {
        byte[] key = "\"published_ns\":".getBytes(StandardCharsets.US_ASCII);
        try (Socket sock = new Socket(InetAddress.getLoopbackAddress(), server.port())) {
            sock.getOutputStream().write(("GET /api/stream HTTP/1.1\r\nHost: 127.0.0.1:" + server.port()
                    + "\r\nAccept: text/event-stream\r\n\r\n").getBytes(StandardCharsets.US_ASCII));
            InputStream in = sock.getInputStream();
            byte[] buf = new byte[1 << 16];
            int match = 0;
            long value = -1;
            for (int n = in.read(buf); n > 0; n = in.read(buf)) {
                long now = System.nanoTime();
                for (int i = 0; i < n; i++) {
                    byte b = buf[i];
                    if (value >= 0) {
                        if (b >= '0' && b <= '9') {
                            value = value * 10 + (b - '0');
                            continue;
                        }
                        if (measuring.get()) {
                            synchronized (counts) {
                                if (counts[id] < lat.length) {
                                    lat[counts[id]] = now - value;
                                }
                                counts[id]++;
                            }
                        }
                        value = -1;
                    }
                    match = b == key[match] ? match + 1 : (b == key[0] ? 1 : 0);
                    if (match == key.length) {
                        value = 0;
                        match = 0;
                    }
                }
            }
        } catch (IOException e) {
            // stream closed at the end of the measurement
        }
    }
}
