package org.drumloop.bench.record;

/** Writes doubles with a fixed number of decimals into a char buffer without allocating. */
public final class FixedFormat {
    private static final long[] POW10 = {1L, 10L, 100L, 1_000L, 10_000L, 100_000L, 1_000_000L};
    /** Above this magnitude the value is written as an integer part only would overflow a long: written as 9e18 capped. */
    private static final double MAX_ABS = 9.0e15;

    private FixedFormat() {
    }

    /**
     * Append {@code v} with {@code decimals} (0..6) decimals at {@code pos}; returns the new position.
     * NaN is written as {@code NaN}; values beyond ±9e15 are clipped to that bound.
     */
    public static int append(char[] buf, int pos, double v, int decimals) {
        if (Double.isNaN(v)) {
            buf[pos++] = 'N';
            buf[pos++] = 'a';
            buf[pos++] = 'N';
            return pos;
        }
        int d = Math.max(0, Math.min(decimals, 6));
        double x = Math.max(-MAX_ABS, Math.min(MAX_ABS, v));
        long scaled = Math.round(Math.abs(x) * POW10[d]);
        if (x < 0 && scaled != 0) {
            buf[pos++] = '-';
        }
        long intPart = scaled / POW10[d];
        long frac = scaled % POW10[d];
        pos = appendLong(buf, pos, intPart);
        if (d > 0) {
            buf[pos++] = '.';
            for (int i = d - 1; i >= 0; i--) {
                long digit = (frac / POW10[i]) % 10;
                buf[pos++] = (char) ('0' + digit);
            }
        }
        return pos;
    }

    /** Append to a StringBuilder (for report text; allocates nothing beyond the builder's growth). */
    public static StringBuilder append(StringBuilder sb, double v, int decimals) {
        char[] buf = SCRATCH.get();
        int n = append(buf, 0, v, decimals);
        return sb.append(buf, 0, n);
    }

    private static final ThreadLocal<char[]> SCRATCH = ThreadLocal.withInitial(() -> new char[48]);

    static int appendLong(char[] buf, int pos, long v) {
        if (v == 0) {
            buf[pos++] = '0';
            return pos;
        }
        int start = pos;
        while (v > 0) {
            buf[pos++] = (char) ('0' + (v % 10));
            v /= 10;
        }
        for (int i = start, j = pos - 1; i < j; i++, j--) {
            char t = buf[i];
            buf[i] = buf[j];
            buf[j] = t;
        }
        return pos;
    }
}
