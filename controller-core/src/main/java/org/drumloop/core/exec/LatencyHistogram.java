package org.drumloop.core.exec;

/**
 * A preallocated log-linear histogram of non-negative durations in nanoseconds, for scan-time and
 * jitter percentiles without allocation. Values below 128 ns are kept exactly; above, each power
 * of two is split into 64 equal buckets, so a reported percentile is at most 1/64 (1.6 %) above
 * the true sample (the same idea as an HDR histogram with two significant digits).
 *
 * <p>Percentiles use the nearest-rank definition: the p-th percentile is the smallest sample with
 * at least p % of the samples at or below it. The reported value is the top of that sample's
 * bucket, capped at the largest sample seen (so the 100th percentile is the exact maximum).
 */
public final class LatencyHistogram {
    private static final int SUB = 64;
    private static final int SUB_BITS = 6;
    /** Buckets: 128 exact values, then 64 per power of two from 2^7 to 2^62. */
    private static final int BUCKETS = 2 * SUB + (62 - SUB_BITS) * SUB;

    private final long[] counts = new long[BUCKETS];
    private long count;
    private long max;
    private long min = Long.MAX_VALUE;
    private double sum;

    /** Record one duration [ns]; negative values count as 0. Allocates nothing. */
    public void record(long nanos) {
        long v = nanos < 0 ? 0 : nanos;
        counts[index(v)]++;
        count++;
        sum += v;
        if (v > max) {
            max = v;
        }
        if (v < min) {
            min = v;
        }
    }

    static int index(long v) {
        if (v < 2 * SUB) {
            return (int) v;
        }
        int e = 63 - Long.numberOfLeadingZeros(v);   // 7..62
        int shift = e - SUB_BITS;
        int sub = (int) (v >>> shift);                // 64..127
        return 2 * SUB + (e - SUB_BITS - 1) * SUB + (sub - SUB);
    }

    /** Largest value that falls in bucket {@code idx}. */
    static long highestInBucket(int idx) {
        if (idx < 2 * SUB) {
            return idx;
        }
        int k = idx - 2 * SUB;
        int e = k / SUB + SUB_BITS + 1;
        int sub = k % SUB + SUB;
        int shift = e - SUB_BITS;
        return ((long) (sub + 1) << shift) - 1;
    }

    /** Nearest-rank percentile [ns], p in (0, 100]; 0 when empty. */
    public long percentile(double p) {
        if (count == 0) {
            return 0;
        }
        long rank = (long) Math.ceil(p / 100.0 * count);
        if (rank < 1) {
            rank = 1;
        }
        if (rank > count) {
            rank = count;
        }
        long seen = 0;
        for (int i = 0; i < BUCKETS; i++) {
            seen += counts[i];
            if (seen >= rank) {
                return Math.min(highestInBucket(i), max);
            }
        }
        return max;
    }

    public long count() { return count; }

    /** Largest sample [ns] (exact), 0 when empty. */
    public long max() { return max; }

    /** Smallest sample [ns] (exact), 0 when empty. */
    public long min() { return count == 0 ? 0 : min; }

    /** Mean [ns] (exact up to double rounding), 0 when empty. */
    public double mean() { return count == 0 ? 0.0 : sum / count; }

    public void reset() {
        java.util.Arrays.fill(counts, 0L);
        count = 0;
        max = 0;
        min = Long.MAX_VALUE;
        sum = 0.0;
    }
}
