package org.drumloop.core.control;

/**
 * Drum-level control strategies and their bumpless changes.
 *
 * <p>Three-element: the level master (PI, slow) output {@code m} is added to the steam-flow feedforward
 * to give the feed-flow setpoint; the feed-flow slave (PI, fast) drives the feed valve:
 * <pre>
 *   feedSp = m + ffGain * q_steam + ffBias          (clamped to [0, feedSpMax])
 *   valve  = slave(feedSp, q_feed)
 * </pre>
 * so that at steady state feed flow equals steam flow plus blowdown and the master only trims
 * (cascade with feedforward as described for drum-type feedwater control in ANSI/ISA-77.42.01-1999;
 * that the standard says so is from memory, not checked against its text). Single-element: a
 * level PI positions the valve directly. Manual: the operator's valve position.
 *
 * <p>Bumpless changes: the blocks that are not in the loop track every scan. In single-element and
 * manual the master tracks {@code q_feed - feedforward}, so the feed setpoint equals the measured feed
 * flow, and the slave tracks the valve position; in three-element and manual the single-element
 * controller tracks the valve position. While the slave output or the feed setpoint is at a limit the
 * master does not integrate further that way (conditional integration), so a saturated valve does
 * not wind up the level master. A forced valve position (interlock "close feed valve") makes
 * every block track it. Allocation-free.
 */
public final class ThreeElement {
    private final Pid single;
    private final Pid master;
    private final Pid slave;
    private final double ffGain;
    private final double ffBiasKgS;
    private final double feedSpMaxKgS;

    private double valveFrac;
    private double feedSpKgS;
    private double feedforwardKgS;
    private double masterOut;

    /**
     * @param single       single-element level controller: level [m] to valve fraction (reverse)
     * @param master       level master: level [m] to feed-flow correction [kg/s] (reverse)
     * @param slave        feed-flow slave: feed flow [kg/s] to valve fraction (reverse)
     * @param ffGain       feedforward gain, feed flow per steam flow [1] (usually 1)
     * @param ffBiasKgS    feedforward bias [kg/s] (e.g. continuous blowdown)
     * @param feedSpMaxKgS largest feed-flow setpoint [kg/s]
     */
    public ThreeElement(Pid single, Pid master, Pid slave, double ffGain, double ffBiasKgS, double feedSpMaxKgS) {
        if (!Double.isFinite(ffGain) || !Double.isFinite(ffBiasKgS) || !(feedSpMaxKgS > 0.0)) {
            throw new IllegalArgumentException("feedforward gain, bias and feed setpoint limit must be finite (limit positive)");
        }
        this.single = single;
        this.master = master;
        this.slave = slave;
        this.ffGain = ffGain;
        this.ffBiasKgS = ffBiasKgS;
        this.feedSpMaxKgS = feedSpMaxKgS;
    }

    /** Strategy for {@link #update}. */
    public static final int MANUAL = 0;
    public static final int SINGLE = 1;
    public static final int THREE = 2;

    /**
     * One scan.
     *
     * @param strategy        {@link #MANUAL}, {@link #SINGLE} or {@link #THREE}
     * @param levelSpM        level setpoint relative to NWL [m]
     * @param levelM          level for control (compensated, after swell compensation) [m]
     * @param steamKgS        compensated steam flow [kg/s]
     * @param feedKgS         compensated feed flow [kg/s]
     * @param manualValveFrac operator's valve position, used in MANUAL [0..1]
     * @param forcedValveFrac a position forced by an interlock, or NaN for none
     * @param dtS             scan period [s]
     * @return the feed valve demand [0..1]
     */
    public double update(int strategy, double levelSpM, double levelM, double steamKgS, double feedKgS,
                         double manualValveFrac, double forcedValveFrac, double dtS) {
        feedforwardKgS = ffGain * steamKgS + ffBiasKgS;
        boolean forced = !Double.isNaN(forcedValveFrac);
        if (forced || strategy == MANUAL) {
            double u = forced ? forcedValveFrac : manualValveFrac;
            valveFrac = u;
            single.track(levelSpM, levelM, 0.0, u, dtS);
            trackCascade(levelSpM, levelM, feedKgS, u, dtS);
        } else if (strategy == SINGLE) {
            valveFrac = single.update(levelSpM, levelM, 0.0, dtS);
            trackCascade(levelSpM, levelM, feedKgS, valveFrac, dtS);
        } else {
            // cascade anti-windup: while the slave (or the feed setpoint) sits at a limit the master
            // may not integrate further in that direction (conditional integration)
            PidParams sp = slave.params();
            boolean slaveHigh = slave.out() >= sp.outMax() || feedSpKgS >= feedSpMaxKgS;
            boolean slaveLow = slave.out() <= sp.outMin() || feedSpKgS <= 0.0;
            master.inhibitIntegration(slaveHigh, slaveLow);
            masterOut = master.update(levelSpM, levelM, 0.0, dtS);
            feedSpKgS = clampFeed(masterOut + feedforwardKgS);
            valveFrac = slave.update(feedSpKgS, feedKgS, 0.0, dtS);
            single.track(levelSpM, levelM, 0.0, valveFrac, dtS);
        }
        return valveFrac;
    }

    private void trackCascade(double levelSpM, double levelM, double feedKgS, double valve, double dtS) {
        PidParams mp = master.params();
        double m = feedKgS - feedforwardKgS;
        if (m > mp.outMax()) {
            m = mp.outMax();
        } else if (m < mp.outMin()) {
            m = mp.outMin();
        }
        masterOut = master.track(levelSpM, levelM, 0.0, m, dtS);
        feedSpKgS = clampFeed(masterOut + feedforwardKgS);
        slave.track(feedSpKgS, feedKgS, 0.0, valve, dtS);
    }

    private double clampFeed(double q) {
        if (q > feedSpMaxKgS) {
            return feedSpMaxKgS;
        }
        return q < 0.0 ? 0.0 : q;
    }

    public double valveFrac() { return valveFrac; }

    public double feedSetpointKgS() { return feedSpKgS; }

    public double feedforwardKgS() { return feedforwardKgS; }

    public double masterOut() { return masterOut; }

    public Pid single() { return single; }

    public Pid master() { return master; }

    public Pid slave() { return slave; }
}
