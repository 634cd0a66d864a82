package org.drumloop.bench.live;

/**
 * Start-of-scan lateness of the paced loop against its absolute deadlines, as a histogram in
 * 10 µs bins up to 100 ms (later starts land in the last bin). Written by the loop thread;
 * readers get a consistent enough view for figures (counters are only ever incremented).
 */
public final class ScanTiming {
    static final long BIN_NS = 10_000;
    static final int BINS = 10_000;
    private final long[] bins = new long[BINS];
    private volatile long count;
    private volatile long overruns;
    private volatile long maxNs;

    void record(long latenessNs) {
        long l = Math.max(0, latenessNs);
        int i = (int) Math.min(BINS - 1, l / BIN_NS);
        bins[i]++;
        if (l > maxNs) {
            maxNs = l;
        }
        count = count + 1;
    }

    void overrun() {
        overruns = overruns + 1;
    }

    /** Number of scans timed. */
    public long count() {
        return count;
    }

    /** Times the loop fell more than five periods behind and restarted its schedule. */
    public long overruns() {
        return overruns;
    }

    public double maxMs() {
        return maxNs / 1e6;
    }

    /** Upper edge of the bin holding quantile {@code q} of the lateness [ms]. */
    public double quantileMs(double q) {
        long n = count;
        if (n == 0) {
            return 0;
        }
        long target = (long) Math.ceil(q * n);
        long seen = 0;
        for (int i = 0; i < BINS; i++) {
            seen += bins[i];
            if (seen >= target) {
                return (i + 1) * BIN_NS / 1e6;
            }
        }
        return BINS * BIN_NS / 1e6;
    }

    /** Forget everything measured so far (between benchmark phases; call from the loop's owner). */
    void clear() {
        java.util.Arrays.fill(bins, 0);
        count = 0;
        overruns = 0;
        maxNs = 0;
    }
}
