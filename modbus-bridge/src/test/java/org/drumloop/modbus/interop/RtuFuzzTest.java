package org.drumloop.modbus.interop;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.locks.LockSupport;

import org.drumloop.modbus.SerialLine;
import org.drumloop.modbus.SerialSettings;
import org.drumloop.modbus.frame.Crc16;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.frame.RtuFrameParser;
import org.drumloop.modbus.frame.RtuFrames;
import org.drumloop.modbus.server.ImageServer;
import org.drumloop.modbus.server.LogCapture;
import org.drumloop.modbus.stats.LinkStatistics;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Abuse of the Modbus RTU server over a socat serial pair, bounded in count and time: bursts of
 * random bytes, frames with bad CRCs, frames cut short, overlong noise, frames for other
 * addresses and several requests merged without a gap. After every burst and a silence longer
 * than the frame gap, a valid request must get the right answer (serial guide §2.5.1.1: a silence
 * of t3.5 ends a frame); merged requests sent after a silence must each be answered. At the end
 * the 100 ms loop feeding the image has kept its schedule, the server has not added threads and
 * the log has stayed short. (socat ends the pair when one side closes, so the line stays with
 * this test's own master; the CRC routine that builds the expected answer is checked against the
 * serial guide's frames in Crc16Test.)
 */
class RtuFuzzTest {
    private static final long SEED = 16_002L;
    private static final int ROUNDS = 150;
    private static final double TIME_LIMIT_S = 45.0;
    private static final double PERIOD_S = 0.100;
    /** Silence after a burst: more than the server's 10 ms minimum frame gap, with room for a loaded machine. */
    private static final long SILENCE_NS = 30_000_000L;
    private static final int THREAD_SLACK = 4;
    /**
     * FC 04, one register from 0, unit 1: 01 04 00 00 00 01 31 CA, a frame common in Modbus RTU
     * examples (from memory); the answer 01 04 02 36 00 + CRC: 12 mA is 13824 = 0x3600 of 0..27648.
     */
    private static final byte[] PROBE = {1, 4, 0, 0, 0, 1, 0x31, (byte) 0xCA};
    private static final byte[] PROBE_ANSWER = RtuFrames.frame(1, new byte[] {4, 2, 0x36, 0x00});

    @TempDir
    Path dir;

    @Test
    void burstsOfNoiseAndBrokenFramesNeverStopTheServerAnsweringTheNextValidRequest() throws Exception {
        try (SerialPair pair = new SerialPair(dir)) {
            SerialSettings sa = pair.a();
            SerialSettings sb = pair.b();
            try (LogCapture log = new LogCapture();
                 ImageServer server = ImageServer.rtu(TestMaps.small(2.0), sa);
                 PacedLoop loop = new PacedLoop(server, PERIOD_S, TIME_LIMIT_S)) {
                ThreadWatch threads = new ThreadWatch();
                Random rnd = new Random(SEED);
                long t0 = System.nanoTime();
                long deadlineNs = t0 + (long) (TIME_LIMIT_S * 1e9);
                List<String> failures = new ArrayList<>();
                int[] kinds = new int[Item.values().length];
                int rounds = 0;
                long mergedAnswered = 0;
                int retries = 0;
                try (SerialLine line = SerialLine.open(sb, 5)) {
                    for (; rounds < ROUNDS && System.nanoTime() < deadlineNs && failures.size() < 5; rounds++) {
                        // a burst: merged requests first (their answers are counted), then 1..5 items of abuse
                        int merged = rnd.nextInt(3) == 0 ? 2 + rnd.nextInt(3) : 0;
                        if (merged > 0) {
                            kinds[Item.MERGED.ordinal()]++;
                            line.write(mergedRequests(merged), 0, merged * PROBE.length);
                        }
                        int items = 1 + rnd.nextInt(5);
                        for (int k = 0; k < items; k++) {
                            Item it = Item.values()[rnd.nextInt(Item.values().length - 1)];
                            kinds[it.ordinal()]++;
                            byte[] bytes = it.bytes(rnd);
                            line.write(bytes, 0, bytes.length);
                            if (rnd.nextBoolean()) {
                                // a pause shorter than the frame gap: still one burst
                                LockSupport.parkNanos(rnd.nextInt(3_000_000));
                            }
                        }
                        LockSupport.parkNanos(SILENCE_NS);
                        int answered = drainAnswers(line);
                        if (answered < merged) {
                            failures.add("round " + rounds + ": " + answered + " answers to " + merged + " merged requests");
                        }
                        mergedAnswered += answered;
                        line.write(PROBE, 0, PROBE.length);
                        if (!answeredWith(line, PROBE_ANSWER, 1_000_000_000L)) {
                            // the server's thread was not scheduled within the silence, so it read the
                            // burst and the request as one frame; after another silence it must answer
                            retries++;
                            LockSupport.parkNanos(SILENCE_NS);
                            drainAnswers(line);
                            line.write(PROBE, 0, PROBE.length);
                            if (!answeredWith(line, PROBE_ANSWER, 2_000_000_000L)) {
                                failures.add("round " + rounds + ": no right answer to a valid request after the burst");
                            }
                        }
                    }
                }
                double seconds = (System.nanoTime() - t0) * 1e-9;
                assertEquals(List.of(), failures, "seed " + SEED);
                assertEquals(ROUNDS, rounds, "rounds before the time limit");
                assertTrue(retries <= ROUNDS / 10, retries + " requests merged with their burst: the silences were not seen");
                int allowed = 1 + THREAD_SLACK;
                assertTrue(threads.peakAdded() <= allowed, "threads rose by " + threads.peakAdded());
                LinkStatistics.Snapshot s = server.statistics().snapshot();
                assertTrue(s.crcErrors() > 0 && s.badFrames() > 0, s.toString());

                assertTrue(loop.latenessMs(0.99) < PacedLoop.LATENESS_P99_LIMIT_MS, "loop p99 lateness " + loop.latenessMs(0.99) + " ms");
                int lines = log.lines().size();
                assertTrue(lines <= 4 * (Math.ceil(seconds) + 2), lines + " log lines in " + seconds + " s");
                System.out.printf(Locale.ROOT, "rtu fuzz: %d rounds in %.1f s, items %s, %d answers to merged requests, %d retries; %s; "
                                + "loop lateness p50 %.3f ms p99 %.3f ms max %.3f ms over %d steps; threads +%d; %d log lines%n",
                        rounds, seconds, Arrays.toString(kinds), mergedAnswered, retries, s, loop.latenessMs(0.5), loop.latenessMs(0.99),
                        loop.latenessMs(1.0), loop.steps(), threads.peakAdded(), lines);
            }
        }
    }

    /** The kinds of abuse in a burst. */
    private enum Item {
        NOISE {
            @Override byte[] bytes(Random r) { return Fuzz.random(r, 1 + r.nextInt(40)); }
        },
        BAD_CRC {
            @Override byte[] bytes(Random r) {
                byte[] f = RtuFrames.frame(1, Fuzz.wellFormed(r, 3 + r.nextInt(2), r.nextInt(6)));
                f[f.length - 1 - r.nextInt(2)] ^= (byte) (1 + r.nextInt(255));
                return f;
            }
        },
        CUT_SHORT {
            @Override byte[] bytes(Random r) {
                byte[] f = RtuFrames.frame(1, Fuzz.wellFormed(r, Modbus.FC_WRITE_MULTIPLE_REGISTERS, 0));
                return Arrays.copyOf(f, 1 + r.nextInt(f.length - 1));
            }
        },
        OVERLONG {
            @Override byte[] bytes(Random r) { return Fuzz.random(r, Modbus.MAX_RTU_ADU + 1 + r.nextInt(100)); }
        },
        OTHER_ADDRESS {
            @Override byte[] bytes(Random r) { return RtuFrames.frame(2 + r.nextInt(246), Fuzz.pdu(r)); }
        },
        MALFORMED_PDU {
            @Override byte[] bytes(Random r) { return RtuFrames.frame(1, Fuzz.pdu(r)); }
        },
        /** Counted separately: sent first in a burst. */
        MERGED {
            @Override byte[] bytes(Random r) { throw new UnsupportedOperationException(); }
        };

        abstract byte[] bytes(Random r);
    }

    private static byte[] mergedRequests(int n) {
        byte[] out = new byte[n * PROBE.length];
        for (int k = 0; k < n; k++) {
            System.arraycopy(PROBE, 0, out, k * PROBE.length, PROBE.length);
        }
        return out;
    }

    /** Read what has arrived until the line is quiet; returns the right answers to the probe request among it. */
    private static int drainAnswers(SerialLine line) {
        RtuFrameParser p = new RtuFrameParser(false);
        byte[] buf = new byte[512];
        int right = 0;
        int n;
        while ((n = line.read(buf, 0, buf.length)) > 0) {
            for (int k = 0; k < n; k++) {
                if (p.feed(buf[k]) == RtuFrameParser.Result.FRAME && isProbeAnswer(p)) {
                    right++;
                }
            }
        }
        return right;
    }

    /** Wait up to {@code limitNs} for {@code expected}, skipping other frames. */
    private static boolean answeredWith(SerialLine line, byte[] expected, long limitNs) {
        RtuFrameParser p = new RtuFrameParser(false);
        byte[] buf = new byte[512];
        long end = System.nanoTime() + limitNs;
        while (System.nanoTime() < end) {
            int n = line.read(buf, 0, buf.length);
            for (int k = 0; k < n; k++) {
                if (p.feed(buf[k]) == RtuFrameParser.Result.FRAME && isProbeAnswer(p)) {
                    return true;
                }
            }
        }
        return false;
    }

    private static boolean isProbeAnswer(RtuFrameParser p) {
        return p.length() == PROBE_ANSWER.length && Arrays.equals(p.buffer(), 0, p.length(), PROBE_ANSWER, 0, PROBE_ANSWER.length)
                && Crc16.check(p.buffer(), 0, p.length());
    }
}
