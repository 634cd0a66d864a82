package org.drumloop.bench.record;

import java.util.Arrays;

import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Frame;

/**
 * A decimated copy of a run for plots: the run is cut into a fixed number of time buckets and each
 * bucket keeps the minimum and maximum of every channel, so a spike shorter than a bucket still
 * shows. Preallocated; {@link #add} does not allocate.
 */
public final class PlotBuffer {
    private final int buckets;
    private final double durationS;
    private final double[][] min;
    private final double[][] max;
    private final boolean[] filled;

    public PlotBuffer(double durationS, int buckets) {
        this.buckets = buckets;
        this.durationS = durationS;
        this.min = new double[Channel.count()][buckets];
        this.max = new double[Channel.count()][buckets];
        this.filled = new boolean[buckets];
        for (int c = 0; c < Channel.count(); c++) {
            Arrays.fill(min[c], Double.POSITIVE_INFINITY);
            Arrays.fill(max[c], Double.NEGATIVE_INFINITY);
        }
    }

    public void add(Frame f) {
        int b = (int) (f.tS / durationS * buckets);
        if (b < 0) {
            b = 0;
        } else if (b >= buckets) {
            b = buckets - 1;
        }
        filled[b] = true;
        for (int c = 0; c < min.length; c++) {
            double v = f.value[c];
            if (v < min[c][b]) {
                min[c][b] = v;
            }
            if (v > max[c][b]) {
                max[c][b] = v;
            }
        }
    }

    public int buckets() { return buckets; }

    public double durationS() { return durationS; }

    public boolean filled(int b) { return filled[b]; }

    /** Start time of a bucket [s]. */
    public double timeS(int b) { return durationS * b / buckets; }

    public double min(Channel c, int b) { return min[c.ordinal()][b]; }

    public double max(Channel c, int b) { return max[c.ordinal()][b]; }
}
