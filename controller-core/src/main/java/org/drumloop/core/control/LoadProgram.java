package org.drumloop.core.control;

/**
 * Load-programmed level setpoint: an offset added to the operator's setpoint, linear in load between
 * the offset at zero load and the offset at rated load. Running the level a little higher at low load
 * and lower at high load leaves room for the larger swell at high firing rates (common practice).
 * Load is steam flow over rated steam flow, clamped to [0, 1].
 */
public final class LoadProgram {
    private final boolean enabled;
    private final double offsetAtZeroM;
    private final double offsetAtRatedM;
    private final double ratedSteamKgS;
    private double lastOffsetM;

    public LoadProgram(boolean enabled, double offsetAtZeroM, double offsetAtRatedM, double ratedSteamKgS) {
        if (!(ratedSteamKgS > 0.0)) {
            throw new IllegalArgumentException("rated steam flow must be positive");
        }
        this.enabled = enabled;
        this.offsetAtZeroM = offsetAtZeroM;
        this.offsetAtRatedM = offsetAtRatedM;
        this.ratedSteamKgS = ratedSteamKgS;
    }

    /** Setpoint offset [m] at this steam flow; 0 when disabled; held at its last value while the flow is unusable. */
    public double offsetM(double steamFlowKgS, boolean usable) {
        if (!enabled) {
            return 0.0;
        }
        if (!usable || !Double.isFinite(steamFlowKgS)) {
            return lastOffsetM;
        }
        double load = steamFlowKgS / ratedSteamKgS;
        if (load < 0.0) {
            load = 0.0;
        } else if (load > 1.0) {
            load = 1.0;
        }
        lastOffsetM = offsetAtZeroM + load * (offsetAtRatedM - offsetAtZeroM);
        return lastOffsetM;
    }

    public boolean enabled() { return enabled; }
}
