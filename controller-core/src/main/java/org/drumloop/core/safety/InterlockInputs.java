package org.drumloop.core.safety;

import java.util.Arrays;
import org.drumloop.core.io.Quality;

/**
 * What the interlocks see, filled by the firmware after signal conditioning, every scan. Levels are
 * density-compensated and relative to normal water level (NWL), positive up, in metres.
 *
 * <p>Level channels: transmitters A, B, C (indices 0, 1, 2) for voting, and the firmware's
 * selected (median) level for single-channel (1oo1) functions such as the LAL/LAH alarms.
 */
public final class InterlockInputs {
    /** Transmitters A, B, C, compensated [m] relative to NWL. */
    public final double[] levelM = new double[3];
    /** Quality of transmitters A, B, C after validation (NE 43, range, rate). */
    public final Quality[] levelQuality = new Quality[3];
    /** The firmware's selected (median-of-three) level [m] relative to NWL. */
    public double levelSelectedM;
    public Quality levelSelectedQuality = Quality.BAD;
    /** Feedwater temperature [K]. */
    public double feedTempK;
    public Quality feedTempQuality = Quality.BAD;
    /** Largest spread among the usable level transmitters [m] (non-negative). */
    public double levelDeviationM;
    public Quality levelDeviationQuality = Quality.BAD;

    public InterlockInputs() {
        Arrays.fill(levelQuality, Quality.BAD);
    }
}
