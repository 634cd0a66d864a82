package org.drumloop.modbus.stats;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * Counters of one Modbus link (client or server side): requests, good answers, exception answers
 * by code, timeouts, I/O and CRC errors, reconnects, and round-trip (or service) times of the most
 * recent requests for percentiles. A server's statistics also count the connections it accepted,
 * closed for idling or evicted to admit a newer one, and frames it refused at the framing level;
 * each TCP connection has its own child statistics ({@link #connection}) that add into the
 * server's. Thread-safe; recording allocates nothing.
 */
public final class LinkStatistics {
    /** Number of recent round-trip samples kept for percentiles of a link. */
    public static final int WINDOW = 1 << 16;
    /** Samples kept per server connection: percentiles of its last 1024 requests. */
    public static final int CONNECTION_WINDOW = 1 << 10;
    /** Closed connections kept for the CSV, newest first out; older ones stay in the server's totals. */
    public static final int CLOSED_CONNECTIONS_KEPT = 100;
    /** Exception codes with their own CSV column; others are summed in ex_other. */
    private static final int[] CODES = {1, 2, 3, 4, 6, 11};

    private final String name;
    private final LinkStatistics parent;
    private final long[] rttNs;
    private long samples;
    private long maxNs;
    private long requests;
    private long ok;
    /** Event counters, indexed by the constants below. */
    private final long[] counts = new long[8];
    private static final int TIMEOUTS = 0;
    private static final int IO_ERRORS = 1;
    private static final int CRC_ERRORS = 2;
    private static final int RECONNECTS = 3;
    private static final int CONNECTIONS = 4;
    private static final int EVICTED = 5;
    private static final int IDLE_CLOSED = 6;
    private static final int BAD_FRAMES = 7;
    private final long[] exceptions = new long[256];
    // connection rows only
    private final String peer;
    private final double openedS;
    private double closedS = Double.NaN;
    private String end = "";
    // server side: open connections and the most recent closed ones
    private final Set<LinkStatistics> open = new LinkedHashSet<>();
    private final ArrayDeque<Snapshot> closed = new ArrayDeque<>();

    public LinkStatistics(String name) { this(name, WINDOW, null, "", Double.NaN); }

    private LinkStatistics(String name, int window, LinkStatistics parent, String peer, double openedS) {
        this.name = name;
        this.rttNs = new long[window];
        this.parent = parent;
        this.peer = peer;
        this.openedS = openedS;
    }

    public String name() { return name; }

    /**
     * Statistics of a new server connection from {@code peer}, opened {@code openedS} seconds after
     * the server started; counted here as an accepted connection until {@link #closeConnection}.
     */
    public LinkStatistics connection(String connectionName, String peerAddress, double openedAtS) {
        LinkStatistics c = new LinkStatistics(connectionName, CONNECTION_WINDOW, this, peerAddress, openedAtS);
        c.counts[CONNECTIONS] = 1;
        synchronized (this) {
            counts[CONNECTIONS]++;
            open.add(c);
        }
        return c;
    }

    /**
     * This connection ended {@code closedAtS} seconds after the server started, for the reason
     * {@code how} (for example "client closed", "idle timeout", "evicted", "bad header"). Its row
     * is kept for the CSV among the {@link #CLOSED_CONNECTIONS_KEPT} most recent.
     */
    public void closeConnection(double closedAtS, String how) {
        if (parent == null) {
            throw new IllegalStateException(name + " is not a connection");
        }
        Snapshot last;
        synchronized (this) {
            if (!Double.isNaN(closedS)) {
                return;
            }
            closedS = closedAtS;
            end = how;
            last = snapshot();
        }
        synchronized (parent) {
            parent.open.remove(this);
            parent.closed.addLast(last);
            if (parent.closed.size() > CLOSED_CONNECTIONS_KEPT) {
                parent.closed.removeFirst();
            }
        }
    }

    /** Snapshots of the open connections and of the most recent closed ones, oldest first. */
    public List<Snapshot> connections() {
        List<LinkStatistics> live;
        List<Snapshot> out;
        synchronized (this) {
            live = new ArrayList<>(open);
            out = new ArrayList<>(closed);
        }
        for (LinkStatistics c : live) {
            out.add(c.snapshot());
        }
        out.sort((a, b) -> Double.compare(a.openedS(), b.openedS()));
        return out;
    }

    public void request() {
        synchronized (this) {
            requests++;
        }
        if (parent != null) {
            parent.request();
        }
    }

    /** A good answer after {@code rttNs} nanoseconds. */
    public void ok(long roundTripNs) {
        synchronized (this) {
            ok++;
            rttNs[(int) (samples++ & (rttNs.length - 1))] = roundTripNs;
            if (roundTripNs > maxNs) {
                maxNs = roundTripNs;
            }
        }
        if (parent != null) {
            parent.ok(roundTripNs);
        }
    }

    /** An exception answer with its code (0..255). */
    public void exception(int code) {
        synchronized (this) {
            exceptions[code & 0xFF]++;
        }
        if (parent != null) {
            parent.exception(code);
        }
    }

    /**
     * One request served by a server: counted as a request and, when {@code exceptionCode} is 0, as
     * a good answer after {@code serviceNs}, else as an exception answer of that code.
     */
    public void served(int exceptionCode, long serviceNs) {
        synchronized (this) {
            requests++;
            if (exceptionCode == 0) {
                ok++;
                rttNs[(int) (samples++ & (rttNs.length - 1))] = serviceNs;
                if (serviceNs > maxNs) {
                    maxNs = serviceNs;
                }
            } else {
                exceptions[exceptionCode & 0xFF]++;
            }
        }
        if (parent != null) {
            parent.served(exceptionCode, serviceNs);
        }
    }

    public void timeout() { add(TIMEOUTS); }

    public void ioError() { add(IO_ERRORS); }

    public void crcError() { add(CRC_ERRORS); }

    public void reconnect() { add(RECONNECTS); }

    /** A frame refused at the framing level (a TCP header that cannot start a Modbus ADU; an RTU frame dropped or overlong). */
    public void badFrame() { add(BAD_FRAMES); }

    /** A server connection closed because it sent no whole request within the idle timeout. */
    public void idleClosed() { add(IDLE_CLOSED); }

    /** A server connection closed to admit a newer one while the server was full. */
    public void evicted() { add(EVICTED); }

    private void add(int counter) {
        synchronized (this) {
            counts[counter]++;
        }
        if (parent != null) {
            parent.add(counter);
        }
    }

    /** A consistent copy of the counters. */
    public synchronized Snapshot snapshot() {
        int n = (int) Math.min(samples, rttNs.length);
        long[] copy = Arrays.copyOf(rttNs, n);
        Arrays.sort(copy);
        long exOther = 0;
        long[] ex = new long[CODES.length];
        for (int c = 0; c < 256; c++) {
            int k = indexOf(c);
            if (k >= 0) {
                ex[k] = exceptions[c];
            } else {
                exOther += exceptions[c];
            }
        }
        return new Snapshot(name, requests, ok, counts[TIMEOUTS], counts[IO_ERRORS], counts[CRC_ERRORS], counts[RECONNECTS],
                ex, exOther, pct(copy, 0.50), pct(copy, 0.99), maxNs / 1e6, n, counts[CONNECTIONS], counts[EVICTED],
                counts[IDLE_CLOSED], counts[BAD_FRAMES],
                peer, openedS, closedS, parent == null ? "" : Double.isNaN(closedS) ? "open" : end);
    }

    private static int indexOf(int code) {
        for (int k = 0; k < CODES.length; k++) {
            if (CODES[k] == code) {
                return k;
            }
        }
        return -1;
    }

    /** Nearest-rank percentile of sorted samples [ms]; NaN without samples. */
    static double pct(long[] sorted, double p) {
        if (sorted.length == 0) {
            return Double.NaN;
        }
        int rank = (int) Math.ceil(p * sorted.length);
        return sorted[Math.max(0, Math.min(sorted.length - 1, rank - 1))] / 1e6;
    }

    /**
     * Counters at one moment. Times in milliseconds; {@code openedS}/{@code closedS} in seconds
     * after the server started (NaN when not a connection, or still open); {@code end} is how a
     * connection ended ("open" while it lasts, empty for a link).
     */
    public record Snapshot(String name, long requests, long ok, long timeouts, long ioErrors, long crcErrors,
                           long reconnects, long[] exceptionsByCode, long exceptionsOther,
                           double p50Ms, double p99Ms, double maxMs, int windowSamples,
                           long connections, long evicted, long idleClosed, long badFrames,
                           String peer, double openedS, double closedS, String end) {

        /** Exception answers of one code (1, 2, 3, 4, 6 or 11). */
        public long exceptions(int code) {
            int k = indexOf(code);
            return k >= 0 ? exceptionsByCode[k] : 0;
        }

        public long errors() {
            long e = timeouts + ioErrors + crcErrors + exceptionsOther;
            for (long x : exceptionsByCode) {
                e += x;
            }
            return e;
        }

        /** One line for the console. */
        @Override
        public String toString() {
            String s = String.format(Locale.ROOT,
                    "%s: %d requests, %d ok, %d timeouts, %d exceptions, %d io errors, %d crc errors, "
                            + "%d reconnects, rtt p50 %.3f ms p99 %.3f ms max %.3f ms",
                    name, requests, ok, timeouts, errors() - timeouts - ioErrors - crcErrors, ioErrors, crcErrors,
                    reconnects, p50Ms, p99Ms, maxMs);
            if (connections > 0 || badFrames > 0) {
                s += String.format(Locale.ROOT, "; %d connections, %d evicted, %d idle closed, %d bad frames",
                        connections, evicted, idleClosed, badFrames);
            }
            return s;
        }

        String csvRow() {
            StringBuilder sb = new StringBuilder();
            sb.append(name).append(',').append(requests).append(',').append(ok).append(',').append(timeouts)
                    .append(',').append(ioErrors).append(',').append(crcErrors).append(',').append(reconnects);
            for (long x : exceptionsByCode) {
                sb.append(',').append(x);
            }
            sb.append(',').append(exceptionsOther);
            sb.append(String.format(Locale.ROOT, ",%.4f,%.4f,%.4f,%d", p50Ms, p99Ms, maxMs, windowSamples));
            sb.append(',').append(connections).append(',').append(evicted).append(',').append(idleClosed)
                    .append(',').append(badFrames).append(',').append(peer)
                    .append(',').append(Double.isNaN(openedS) ? "" : String.format(Locale.ROOT, "%.3f", openedS))
                    .append(',').append(Double.isNaN(closedS) ? "" : String.format(Locale.ROOT, "%.3f", closedS))
                    .append(',').append(end);
            return sb.toString();
        }
    }

    /** CSV header matching {@link #writeCsv}. */
    public static String csvHeader() {
        StringBuilder sb = new StringBuilder("link,requests,ok,timeouts,io_errors,crc_errors,reconnects");
        for (int c : CODES) {
            sb.append(String.format(Locale.ROOT, ",ex_%02d", c));
        }
        return sb.append(",ex_other,rtt_p50_ms,rtt_p99_ms,rtt_max_ms,rtt_samples")
                .append(",connections,evicted,idle_closed,bad_frames,peer,opened_s,closed_s,end").toString();
    }

    /**
     * Write one CSV file (header, then per link one row followed by a row for each of its server
     * connections, open or recently closed), e.g. {@code link-stats.csv} of a run.
     */
    public static void writeCsv(Path file, LinkStatistics... links) throws IOException {
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(csvHeader());
            w.write('\n');
            for (LinkStatistics l : links) {
                w.write(l.snapshot().csvRow());
                w.write('\n');
                for (Snapshot c : l.connections()) {
                    w.write(c.csvRow());
                    w.write('\n');
                }
            }
        }
    }
}
