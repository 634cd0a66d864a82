package org.drumloop.modbus.stats;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;

/**
 * Counters of one Modbus link (client or server side): requests, good answers, exception answers
 * by code, timeouts, I/O and CRC errors, reconnects, and round-trip (or service) times of the most
 * recent {@link #WINDOW} requests for percentiles. Thread-safe; recording allocates nothing.
 */
public final class LinkStatistics {
    /** Number of recent round-trip samples kept for percentiles. */
    public static final int WINDOW = 1 << 16;
    /** Exception codes with their own CSV column; others are summed in ex_other. */
    private static final int[] CODES = {1, 2, 3, 4, 6, 11};

    private final String name;
    private final long[] rttNs = new long[WINDOW];
    private long samples;
    private long maxNs;
    private long requests;
    private long ok;
    private long timeouts;
    private long ioErrors;
    private long crcErrors;
    private long reconnects;
    private final long[] exceptions = new long[256];

    public LinkStatistics(String name) { this.name = name; }

    public String name() { return name; }

    public synchronized void request() { requests++; }

    /** A good answer after {@code rttNs} nanoseconds. */
    public synchronized void ok(long roundTripNs) {
        ok++;
        rttNs[(int) (samples++ & (WINDOW - 1))] = roundTripNs;
        if (roundTripNs > maxNs) {
            maxNs = roundTripNs;
        }
    }

    /** An exception answer with its code (0..255). */
    public synchronized void exception(int code) { exceptions[code & 0xFF]++; }

    public synchronized void timeout() { timeouts++; }

    public synchronized void ioError() { ioErrors++; }

    public synchronized void crcError() { crcErrors++; }

    public synchronized void reconnect() { reconnects++; }

    /** A consistent copy of the counters. */
    public synchronized Snapshot snapshot() {
        int n = (int) Math.min(samples, WINDOW);
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
        return new Snapshot(name, requests, ok, timeouts, ioErrors, crcErrors, reconnects, ex, exOther,
                pct(copy, 0.50), pct(copy, 0.99), maxNs / 1e6, n);
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

    /** Counters at one moment. Times in milliseconds. */
    public record Snapshot(String name, long requests, long ok, long timeouts, long ioErrors, long crcErrors,
                           long reconnects, long[] exceptionsByCode, long exceptionsOther,
                           double p50Ms, double p99Ms, double maxMs, int windowSamples) {

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
            return String.format(Locale.ROOT,
                    "%s: %d requests, %d ok, %d timeouts, %d exceptions, %d io errors, %d crc errors, "
                            + "%d reconnects, rtt p50 %.3f ms p99 %.3f ms max %.3f ms",
                    name, requests, ok, timeouts, errors() - timeouts - ioErrors - crcErrors, ioErrors, crcErrors,
                    reconnects, p50Ms, p99Ms, maxMs);
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
            return sb.toString();
        }
    }

    /** CSV header matching {@link #writeCsv}. */
    public static String csvHeader() {
        StringBuilder sb = new StringBuilder("link,requests,ok,timeouts,io_errors,crc_errors,reconnects");
        for (int c : CODES) {
            sb.append(String.format(Locale.ROOT, ",ex_%02d", c));
        }
        return sb.append(",ex_other,rtt_p50_ms,rtt_p99_ms,rtt_max_ms,rtt_samples").toString();
    }

    /** Write one CSV file (header + one row per link), e.g. {@code link-stats.csv} of a run. */
    public static void writeCsv(Path file, LinkStatistics... links) throws IOException {
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(csvHeader());
            w.write('\n');
            for (LinkStatistics l : links) {
                w.write(l.snapshot().csvRow());
                w.write('\n');
            }
        }
    }
}
