package org.drumloop.core.signal;

import org.drumloop.core.io.Quality;

/**
 * NAMUR NE 43 signal levels for 4-20 mA transmitters.
 *
 * <p>Measurement information may be carried from 3.8 to 20.5 mA; at or below 3.6 mA and at or above
 * 21.0 mA the transmitter signals a device failure (source: NAMUR NE 43). The bands 3.6-3.8 mA and
 * 20.5-21.0 mA are neither a valid measurement nor a failure and are treated as UNCERTAIN (common
 * practice).
 */
public final class Ne43 {
    private Ne43() { }

    /** Lower and upper failure limits [mA]: at or beyond these the signal is a failure. */
    public static final double FAIL_LOW_MA = 3.6;
    public static final double FAIL_HIGH_MA = 21.0;
    /** Limits of measurement information [mA]. */
    public static final double MEAS_LOW_MA = 3.8;
    public static final double MEAS_HIGH_MA = 20.5;

    /** Quality of a loop current; NaN and infinities are BAD. */
    public static Quality classify(double mA) {
        if (!(mA > FAIL_LOW_MA && mA < FAIL_HIGH_MA)) {
            return Quality.BAD;
        }
        if (mA < MEAS_LOW_MA || mA > MEAS_HIGH_MA) {
            return Quality.UNCERTAIN;
        }
        return Quality.GOOD;
    }

    /** Linear 4-20 mA scaling: value at 4 mA {@code lo}, at 20 mA {@code hi} (either order). */
    public static double scale(double mA, double lo, double hi) {
        return lo + (mA - 4.0) / 16.0 * (hi - lo);
    }

    /** Inverse of {@link #scale}: the loop current that would carry {@code value}. */
    public static double currentFor(double value, double lo, double hi) {
        return 4.0 + 16.0 * (value - lo) / (hi - lo);
    }

    /** The worse of two qualities (BAD over UNCERTAIN over GOOD). */
    public static Quality worst(Quality a, Quality b) {
        return a.ordinal() >= b.ordinal() ? a : b;
    }
}
