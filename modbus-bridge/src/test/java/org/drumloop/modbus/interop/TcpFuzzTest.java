package org.drumloop.modbus.interop;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;

import com.digitalpetri.modbus.client.ModbusTcpClient;
import com.digitalpetri.modbus.pdu.ReadHoldingRegistersRequest;
import com.digitalpetri.modbus.pdu.ReadInputRegistersRequest;
import com.digitalpetri.modbus.pdu.WriteMultipleRegistersRequest;
import com.digitalpetri.modbus.tcp.client.NettyTcpClientTransport;

import org.drumloop.core.io.Signal;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.frame.Mbap;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.server.ImageServer;
import org.drumloop.modbus.server.LogCapture;
import org.drumloop.modbus.server.ServerLimits;
import org.drumloop.modbus.stats.LinkStatistics;
import org.junit.jupiter.api.Test;

/**
 * Abuse of the Modbus TCP server on 127.0.0.1, bounded in count and time: 100,000 random and
 * malformed frames from several connections at once, and a flood of 1,000 connection attempts.
 * After each, an independent Modbus stack (digitalpetri modbus-tcp) must get correct answers, the
 * 100 ms loop that feeds the served image ({@link PacedLoop}) must have kept to its schedule, the
 * server's threads must have stayed within its connection limit, and the log must not have
 * grown with the abuse. Seeded: a failure names the seed that reproduces it.
 */
class TcpFuzzTest {
    private static final long SEED = 16_001L;
    private static final int FRAMES = 100_000;
    private static final int WORKERS = 2;
    private static final int FLOOD = 1_000;
    /** The whole run must end well inside this, or the test fails rather than hang [s]. */
    private static final double TIME_LIMIT_S = 45.0;
    private static final double PERIOD_S = 0.100;
    /** JVM threads that may come and go beside the server's (reference handler, attach listener, ...). */
    private static final int THREAD_SLACK = 4;
    /** Kinds of problem the server logs (ProblemLog kinds), with room: the log's bound is this many lines a second. */
    private static final int LOG_KINDS = 12;
    /** 12 mA on 0..27648 = 4..20 mA: 13824 = 0x3600 (check values §3, link maps' convention). */
    private static final byte[] LEVEL_12_MA = {0x36, 0x00};

    /**
     * The server under test with the loop feeding it and the log captured; on close, checks what
     * must hold after any abuse: the independent client is answered correctly, the loop kept its
     * schedule, the server's threads stayed within {@code allowedThreads}, the log stayed short.
     */
    private static final class Served implements AutoCloseable {
        final ServerLimits limits = ServerLimits.DEFAULT;
        final long t0 = System.nanoTime();
        final long deadlineNs = t0 + (long) (TIME_LIMIT_S * 1e9);
        final LogCapture log = new LogCapture();
        final ImageServer server;
        final PacedLoop loop;
        ThreadWatch threads;

        Served() throws IOException {
            server = ImageServer.tcp(TestMaps.small(2.0), new TcpEndpoint("127.0.0.1", 0), limits);
            loop = new PacedLoop(server, PERIOD_S, TIME_LIMIT_S);
        }

        /** Start counting threads: after the test's own long-lived threads have started. */
        void watchThreads() { threads = new ThreadWatch(); }

        double seconds() { return (System.nanoTime() - t0) * 1e-9; }

        /** The checks of every abuse; returns a line of figures for the build log. */
        String check(String what, int allowedThreads) throws Exception {
            double seconds = seconds();
            assertTrue(threads.peakAdded() <= allowedThreads, "threads rose by " + threads.peakAdded() + ", allowed " + allowedThreads);
            answeredCorrectlyByAnIndependentClient(server.port());
            assertTrue(loop.steps() >= 5, "the loop hardly ran during the " + what + ": " + loop.steps() + " steps");
            double p99 = loop.latenessMs(0.99);
            assertTrue(p99 < PacedLoop.LATENESS_P99_LIMIT_MS, String.format(Locale.ROOT, "100 ms loop p99 lateness %.3f ms during the %s", p99, what));
            // at most one line a second per kind of problem, and the counts at close
            int lines = log.lines().size();
            assertTrue(lines <= LOG_KINDS * (Math.ceil(seconds) + 2), lines + " log lines in " + seconds + " s: "
                    + log.lines().subList(0, Math.min(20, lines)));
            return String.format(Locale.ROOT, "%s in %.1f s; %s; loop lateness p50 %.3f ms p99 %.3f ms max %.3f ms over %d steps;"
                            + " threads +%d; %d log lines", what, seconds, server.statistics().snapshot(), loop.latenessMs(0.50),
                    p99, loop.latenessMs(1.0), loop.steps(), threads.peakAdded(), lines);
        }

        @Override
        public void close() throws InterruptedException {
            loop.close();
            server.close();
            log.close();
        }
    }

    @Test
    void oneHundredThousandMalformedFramesLeaveTheServerAnsweringAndTheLoopOnTime() throws Exception {
        try (Served t = new Served()) {
            t.watchThreads();
            List<Worker> workers = new ArrayList<>();
            for (int w = 0; w < WORKERS; w++) {
                workers.add(new Worker(t.server.port(), new Random(SEED + w), FRAMES / WORKERS, t.deadlineNs));
            }
            for (Worker w : workers) {
                w.thread.start();
            }
            long sent = 0;
            long answers = 0;
            long expected = 0;
            long connections = 0;
            List<String> wrong = new ArrayList<>();
            for (Worker w : workers) {
                w.thread.join((long) (TIME_LIMIT_S * 1000));
                sent += w.sent;
                answers += w.answers.get();
                expected += w.expected;
                connections += w.connections;
                wrong.addAll(w.wrong);
            }
            assertEquals(FRAMES, sent, "frames sent before the time limit (seed " + SEED + ")");
            assertEquals(List.of(), wrong, "malformed answers (seed " + SEED + ")");
            // every frame with a plausible header is answered: data, or an exception (01, 02, 03, 0B);
            // a breaking frame may be answered too when a short length leaves a request in front of it
            assertTrue(answers >= expected, answers + " answers to " + expected + " well-framed requests");
            LinkStatistics.Snapshot s = t.server.statistics().snapshot();
            assertTrue(s.badFrames() > 0 && s.exceptions(Modbus.EX_ILLEGAL_FUNCTION) > 0
                    && s.exceptions(Modbus.EX_ILLEGAL_DATA_VALUE) > 0 && s.exceptions(Modbus.EX_ILLEGAL_DATA_ADDRESS) > 0
                    && s.exceptions(Modbus.EX_GATEWAY_TARGET_NO_RESPONSE) > 0, "the fuzz missed a kind of problem: " + s);
            // each worker's own thread and at most one reader at a time, plus the server's pool and acceptor
            String figures = t.check("fuzz", 2 * WORKERS + t.limits.maxConnections() + 1 + THREAD_SLACK);
            System.out.printf(Locale.ROOT, "tcp %d frames on %d connections, %d answers: %s%n", sent, connections, answers, figures);
        }
    }

    @Test
    void aFloodOfOneThousandConnectionsKeepsTheThreadsBoundedAndAPollingClientServed() throws Exception {
        try (Served t = new Served();
             RigClient poller = RigClient.tcp(TestMaps.small(2.0), new TcpEndpoint("127.0.0.1", t.server.port()),
                     new RigClient.Options(0.05, 0.5, 1, 0.05, 0.2))) {
            poller.start();
            assertTrue(TestMaps.await(() -> poller.isFresh(Signal.LEVEL_DP_A), 10), "the poller never got an answer");
            t.watchThreads();
            // keep up to 64 flood sockets open on our side; the server closes what it must
            ArrayDeque<Socket> open = new ArrayDeque<>();
            int attempts = 0;
            int refused = 0;
            Random rnd = new Random(SEED);
            try {
                while (attempts < FLOOD && System.nanoTime() < t.deadlineNs) {
                    attempts++;
                    Socket s = new Socket();
                    try {
                        s.connect(new InetSocketAddress("127.0.0.1", t.server.port()), 2000);
                        if (rnd.nextBoolean()) {
                            // half of them start a header and stop
                            s.getOutputStream().write(new byte[] {0, 1, 0, 0});
                        }
                        open.add(s);
                    } catch (IOException e) {
                        refused++;
                        s.close();
                    }
                    if (open.size() > 64) {
                        open.removeFirst().close();
                    }
                }
            } finally {
                for (Socket s : open) {
                    s.close();
                }
            }
            assertEquals(FLOOD, attempts, "connection attempts before the time limit");
            // every attempt reaches the server (a loaded machine may still hold some in the backlog)
            // and a full server made room by closing the connection idle longest
            int accepted = FLOOD - refused + 1;
            assertTrue(TestMaps.await(() -> t.server.statistics().snapshot().connections() >= accepted, 10),
                    "connections accepted: " + t.server.statistics().snapshot());
            assertTrue(t.server.statistics().snapshot().evicted() > 0, t.server.statistics().snapshot().toString());
            // the poller sends a request every 50 ms, so the silent flood connections go before it
            long ok = poller.statistics().snapshot().ok();
            assertTrue(TestMaps.await(() -> poller.statistics().snapshot().ok() > ok + 5 && poller.isFresh(Signal.LEVEL_DP_A), 10),
                    "the poller was not served after the flood: " + poller.statistics().snapshot());
            String figures = t.check("flood", t.limits.maxConnections() + 1 + THREAD_SLACK);
            System.out.printf(Locale.ROOT, "tcp %d connection attempts (%d refused), poller %s: %s%n", attempts, refused,
                    poller.statistics().snapshot(), figures);
        }
    }

    /** digitalpetri's client reads LT-A and writes and reads back the valve demand. */
    private static void answeredCorrectlyByAnIndependentClient(int port) throws Exception {
        NettyTcpClientTransport transport = NettyTcpClientTransport.create(cfg -> {
            cfg.hostname = "127.0.0.1";
            cfg.port = port;
        });
        ModbusTcpClient client = ModbusTcpClient.create(transport);
        client.connect();
        try {
            byte[] regs = client.readInputRegisters(1, new ReadInputRegistersRequest(0, 1)).registers();
            assertArrayEquals(LEVEL_12_MA, regs, "LT-A after the abuse");
            // 42 % of 0..10000 = 4200 = 0x1068 (the link maps' valve scaling)
            client.writeMultipleRegisters(1, new WriteMultipleRegistersRequest(0, 1, new byte[] {0x10, 0x68}));
            assertArrayEquals(new byte[] {0x10, 0x68}, client.readHoldingRegisters(1, new ReadHoldingRegistersRequest(0, 1)).registers());
        } finally {
            client.disconnect();
            transport.disconnect().toCompletableFuture().get(5, TimeUnit.SECONDS);
        }
    }

    /**
     * Sends its share of fuzz frames. Frames with a plausible header go in batches of
     * {@link #BATCH}, each followed by a probe (FC 04 read of LT-A, transaction {@link #PROBE_TID})
     * whose answer shows the server has taken the whole batch: so every frame reaches the server's
     * parser, and every one of them must be answered. A frame that breaks the framing ends its
     * connection: it goes last, then the worker stops sending and waits for the server to close.
     * A reader thread per connection checks every answer is a well-formed Modbus TCP ADU.
     */
    private static final class Worker {
        static final int BATCH = 32;
        static final int PROBE_TID = 0xFFFF;
        final Thread thread;
        final int port;
        final Random rnd;
        final int frames;
        final long deadlineNs;
        final AtomicLong answers = new AtomicLong();
        final ConcurrentLinkedQueue<String> wrong = new ConcurrentLinkedQueue<>();
        final LinkedBlockingQueue<String> events = new LinkedBlockingQueue<>();
        int sent;
        long expected;
        int connections;

        Worker(int port, Random rnd, int frames, long deadlineNs) {
            this.port = port;
            this.rnd = rnd;
            this.frames = frames;
            this.deadlineNs = deadlineNs;
            this.thread = new Thread(this::run, "fuzz-writer");
            thread.setDaemon(true);
        }

        private void run() {
            try {
                while (sent < frames && System.nanoTime() < deadlineNs) {
                    connection();
                }
            } catch (IOException e) {
                wrong.add("link failed: " + e);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }

        /** One connection: batches until a frame breaks the framing (or the share is sent). */
        private void connection() throws IOException, InterruptedException {
            events.clear();
            try (Socket s = new Socket()) {
                s.connect(new InetSocketAddress("127.0.0.1", port), 2000);
                s.setTcpNoDelay(true);
                connections++;
                OutputStream out = s.getOutputStream();
                Thread reader = new Thread(() -> read(s), "fuzz-reader");
                reader.setDaemon(true);
                reader.start();
                byte[] probe = Mbap.frame(PROBE_TID, 1, new byte[] {Modbus.FC_READ_INPUT_REGISTERS, 0, 0, 0, 1});
                boolean open = true;
                while (open && sent < frames && System.nanoTime() < deadlineNs) {
                    java.io.ByteArrayOutputStream batch = new java.io.ByteArrayOutputStream();
                    Fuzz.Frame breaking = null;
                    for (int k = 0; k < BATCH && sent < frames; k++) {
                        Fuzz.Frame f = Fuzz.frame(rnd, rnd.nextInt(PROBE_TID));
                        sent++;
                        if (f.breaksFraming()) {
                            breaking = f;
                            break;
                        }
                        batch.write(f.bytes());
                        expected++;
                    }
                    batch.write(probe);
                    expected++;
                    out.write(batch.toByteArray());
                    String e = events.poll(5, TimeUnit.SECONDS);
                    if (!"probe".equals(e)) {
                        wrong.add("no answer to the probe after a batch: " + e);
                        return;
                    }
                    if (breaking != null) {
                        out.write(breaking.bytes());
                        s.shutdownOutput();
                        open = false;
                    }
                }
                if (open) {
                    s.shutdownOutput();
                }
                reader.join(5000);
            }
        }

        private void read(Socket s) {
            byte[] head = new byte[Modbus.MBAP_LENGTH];
            byte[] pdu = new byte[Modbus.MAX_PDU];
            try {
                s.setSoTimeout(5000);
                InputStream in = s.getInputStream();
                while (readFully(in, head, Modbus.MBAP_LENGTH)) {
                    Mbap h = Mbap.decode(head, 0);
                    if (!h.plausible()) {
                        wrong.add("answer header " + h);
                        return;
                    }
                    if (!readFully(in, pdu, h.pduLength())) {
                        wrong.add("answer cut short");
                        return;
                    }
                    String bad = Fuzz.checkAnswer(pdu, h.pduLength());
                    if (bad != null) {
                        wrong.add(bad);
                    }
                    answers.incrementAndGet();
                    if (h.transactionId() == PROBE_TID) {
                        if (pdu[0] != Modbus.FC_READ_INPUT_REGISTERS || pdu[2] != LEVEL_12_MA[0] || pdu[3] != LEVEL_12_MA[1]) {
                            wrong.add("probe answered wrongly");
                        }
                        events.add("probe");
                    }
                }
            } catch (IOException e) {
                // reset by the server closing while bytes were in flight: the connection is over
            } finally {
                events.add("closed");
            }
        }

        private static boolean readFully(InputStream in, byte[] b, int len) throws IOException {
            int done = 0;
            while (done < len) {
                int n = in.read(b, done, len - done);
                if (n < 0) {
                    return false;
                }
                done += n;
            }
            return true;
        }
    }
}
