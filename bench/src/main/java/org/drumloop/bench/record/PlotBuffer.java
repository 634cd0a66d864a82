package org.drumloop.bench.record;

import java.util.Arrays;

import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Frame;

/**
 * A decimated copy of a run for plots: the run is cut into a fixed number of time buckets and each
 * bucket keeps the minimum and maximum of every plotted channel, so a spike shorter than a bucket still
 * shows. Preallocated; {@link #add} does not allocate.
 */
public final class PlotBuffer {
    /** Channels kept (those the report plots); others are not stored. */
    static final Channel[] PLOTTED = {
        Channel.DRUM_LEVEL, Channel.MEASURED_LEVEL, Channel.SETPOINT, Channel.STEAM_FLOW, Channel.FEED_FLOW,
        Channel.FEED_FLOW_SETPOINT, Channel.FEED_VALVE, Channel.VALVE_DEMAND, Channel.FIRING, Channel.STEAM_DEMAND,
        Channel.DRUM_PRESSURE,
    };
    private static final int[] SLOT = new int[Channel.count()];
    private static final int[] SOURCE = new int[PLOTTED.length];

    static {
        java.util.Arrays.fill(SLOT, -1);
        for (int i = 0; i < PLOTTED.length; i++) {
            SLOT[PLOTTED[i].ordinal()] = i;
            SOURCE[i] = PLOTTED[i].ordinal();
        }
    }

    private final int buckets;
    private final double durationS;
    private final double[][] min;
    private final double[][] max;
    private final boolean[] filled;

    public PlotBuffer(double durationS, int buckets) {
        this.buckets = buckets;
        this.durationS = durationS;
        this.min = new double[PLOTTED.length][buckets];
        this.max = new double[PLOTTED.length][buckets];
        this.filled = new boolean[buckets];
        for (int c = 0; c < PLOTTED.length; c++) {
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
        for (int c = 0; c < SOURCE.length; c++) {
            double v = f.value[SOURCE[c]];
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

    /** Smallest value of a plotted channel in a bucket (NaN for a channel that is not plotted). */
    public double min(Channel c, int b) { return SLOT[c.ordinal()] < 0 ? Double.NaN : min[SLOT[c.ordinal()]][b]; }

    /** Largest value of a plotted channel in a bucket (NaN for a channel that is not plotted). */
    public double max(Channel c, int b) { return SLOT[c.ordinal()] < 0 ? Double.NaN : max[SLOT[c.ordinal()]][b]; }
}
