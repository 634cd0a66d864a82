package org.drumloop.core.exec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Percentiles of the scan-time histogram on known samples. Expected values use the nearest-rank
 * definition (the p-th percentile is the smallest sample with at least p % of the data at or
 * below it; e.g. NIST/SEMATECH e-Handbook of Statistical Methods, §7.2.6.2, from memory), computed
 * here by sorting the samples; the histogram may report up to 1/64 of the value above it.
 */
class LatencyHistogramTest {
    private static final double RESOLUTION = 1.0 / 64.0;

    private static long nearestRank(long[] sorted, double p) {
        int rank = (int) Math.ceil(p / 100.0 * sorted.length);
        return sorted[Math.max(rank, 1) - 1];
    }

    @Test
    void oneToAHundredMicrosecondsGiveTheTextbookPercentiles() {
        LatencyHistogram h = new LatencyHistogram();
        for (int us = 1; us <= 100; us++) {
            h.record(us * 1000L);
        }
        // nearest rank over 1..100 us: p50 = 50 us, p99 = 99 us, p100 = 100 us (hand count)
        assertEquals(50_000, h.percentile(50), 50_000 * RESOLUTION);
        assertTrue(h.percentile(50) >= 50_000, "never below the true sample");
        assertEquals(99_000, h.percentile(99), 99_000 * RESOLUTION);
        assertEquals(100_000, h.percentile(100));
        assertEquals(100_000, h.max());
        assertEquals(1_000, h.min());
        // mean of 1..100 us = 50.5 us (arithmetic series), exact in double
        assertEquals(50_500.0, h.mean(), 1e-9);
    }

    @Test
    void smallValuesAreExact() {
        LatencyHistogram h = new LatencyHistogram();
        for (int v = 0; v < 128; v++) {
            h.record(v);
        }
        // 128 samples 0..127: rank ceil(0.5*128) = 64 -> 63; rank ceil(0.99*128) = 127 -> 126
        assertEquals(63, h.percentile(50));
        assertEquals(126, h.percentile(99));
    }

    @Test
    void randomSamplesAgreeWithSortingWithinTheResolution() {
        SplittableRandom rnd = new SplittableRandom(20_260_402L);
        long[] v = new long[10_000];
        LatencyHistogram h = new LatencyHistogram();
        for (int i = 0; i < v.length; i++) {
            // log-uniform from 100 ns to 100 ms, the range of scan times and jitter
            v[i] = (long) Math.pow(10, 2 + 6 * rnd.nextDouble());
            h.record(v[i]);
        }
        long[] sorted = v.clone();
        Arrays.sort(sorted);
        for (double p : new double[] {1, 10, 50, 90, 99, 99.9, 100}) {
            long exact = nearestRank(sorted, p);
            long got = h.percentile(p);
            assertTrue(got >= exact && got <= exact + exact * RESOLUTION + 1,
                    "p" + p + ": exact " + exact + ", histogram " + got);
        }
    }

    @Test
    void everyBucketHoldsItsValueWithinTheResolution() {
        SplittableRandom rnd = new SplittableRandom(7L);
        for (int i = 0; i < 100_000; i++) {
            long x = rnd.nextLong(1L, Long.MAX_VALUE >>> rnd.nextInt(0, 62));
            long top = LatencyHistogram.highestInBucket(LatencyHistogram.index(x));
            assertTrue(top >= x && top - x <= x / 64, "value " + x + " bucket top " + top);
        }
    }

    @Test
    void anEmptyHistogramReportsZero() {
        LatencyHistogram h = new LatencyHistogram();
        assertEquals(0, h.percentile(50));
        assertEquals(0, h.max());
        assertEquals(0.0, h.mean(), 0.0);
    }
}
