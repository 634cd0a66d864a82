package org.drumloop.core.control;

/**
 * Duty/standby control of two feed pumps, A and B.
 *
 * <p>Continuous operation: the duty pump is commanded to run. The standby pump is started
 * automatically when
 * <ul>
 *   <li>the duty pump trips: it is commanded but its running feedback is absent for longer than the
 *       start timeout (the failed pump's command is then removed), or</li>
 *   <li>the feed header pressure stays below its low limit for the low-pressure delay while the duty
 *       pump runs.</li>
 * </ul>
 * The auto-started standby pump keeps running until the operator resets. A reset after a duty trip
 * swaps duty and standby (the healthy running pump becomes duty); a reset after a low-pressure start
 * stops the standby pump (it starts again if the pressure is still low).
 *
 * <p>Stop/start operation (plants that run the feed pump intermittently): the duty pump starts when
 * the level falls below the start level and stops when it rises above the stop level; while the level
 * is unusable the pump keeps its last state. Standby starts work as above while the duty pump is
 * demanded.
 *
 * <p>An interlock demand "stop feed pumps" removes every run command while present. Feedback inputs
 * of BAD quality are treated as unknown (no trip is declared from them). Event bits of the last scan
 * ({@link #events()}) let the caller log what happened. Allocation-free.
 */
public final class FeedPumpControl {
    /** Event: the duty pump was declared tripped. */
    public static final int EV_DUTY_TRIP = 1;
    /** Event: the standby pump was auto-started after a duty trip. */
    public static final int EV_STANDBY_START_TRIP = 2;
    /** Event: the standby pump was auto-started on low feed pressure. */
    public static final int EV_STANDBY_START_LOW_PRESSURE = 4;
    /** Event: stop/start operation started the duty pump. */
    public static final int EV_LEVEL_START = 8;
    /** Event: stop/start operation stopped the duty pump. */
    public static final int EV_LEVEL_STOP = 16;
    /** Event: operator reset applied (changeover or standby stop). */
    public static final int EV_RESET = 32;

    private final boolean stopStart;
    private final double startLevelM;
    private final double stopLevelM;
    private final double startTimeoutS;
    private final double lowPressurePa;
    private final double lowPressureDelayS;

    private int duty;
    private boolean dutyFailed;
    private boolean standbyCmd;
    private boolean standbyOnLowPressure;
    private boolean levelDemand = true;
    private double dutyCmdForS;
    private double lowPressureForS;
    private boolean resetRequested;
    private final boolean[] cmd = new boolean[2];
    private int events;

    /**
     * @param dutyB             pump B is the initial duty pump (else A)
     * @param stopStart         stop/start operation on level (else continuous)
     * @param startLevelM       stop/start: start below this level [m rel. NWL]
     * @param stopLevelM        stop/start: stop above this level [m rel. NWL] (above startLevelM)
     * @param startTimeoutS     running feedback expected within this time after a run command [s]
     * @param lowPressurePa     low feed header pressure limit [Pa abs]
     * @param lowPressureDelayS the pressure must stay low this long before the standby starts [s]
     */
    public FeedPumpControl(boolean dutyB, boolean stopStart, double startLevelM, double stopLevelM,
                           double startTimeoutS, double lowPressurePa, double lowPressureDelayS) {
        if (stopStart && !(stopLevelM > startLevelM)) {
            throw new IllegalArgumentException("stop level must be above start level");
        }
        if (!(startTimeoutS > 0.0) || !(lowPressureDelayS >= 0.0)) {
            throw new IllegalArgumentException("start timeout must be positive and delay non-negative");
        }
        this.duty = dutyB ? 1 : 0;
        this.stopStart = stopStart;
        this.startLevelM = startLevelM;
        this.stopLevelM = stopLevelM;
        this.startTimeoutS = startTimeoutS;
        this.lowPressurePa = lowPressurePa;
        this.lowPressureDelayS = lowPressureDelayS;
    }

    /** Operator reset, applied in the next {@link #update}. */
    public void requestReset() {
        resetRequested = true;
    }

    /**
     * One scan.
     *
     * @param runningA        pump A running feedback
     * @param runningAKnown   the feedback's quality is not BAD
     * @param runningB        pump B running feedback
     * @param runningBKnown   the feedback's quality is not BAD
     * @param feedPressurePa  feed header pressure [Pa abs]
     * @param pressureUsable  its quality is not BAD
     * @param levelM          drum level [m rel. NWL] (stop/start operation)
     * @param levelUsable     its quality is not BAD
     * @param stopAll         interlock demand to stop the feed pumps
     * @param dtS             scan period [s]
     */
    public void update(boolean runningA, boolean runningAKnown, boolean runningB, boolean runningBKnown,
                       double feedPressurePa, boolean pressureUsable, double levelM, boolean levelUsable,
                       boolean stopAll, double dtS) {
        events = 0;
        int stby = 1 - duty;
        if (resetRequested) {
            resetRequested = false;
            if (dutyFailed) {
                duty = stby;
                stby = 1 - duty;
                dutyFailed = false;
                standbyCmd = false;
                standbyOnLowPressure = false;
                dutyCmdForS = startTimeoutS; // the new duty pump is already running
                events |= EV_RESET;
            } else if (standbyCmd) {
                standbyCmd = false;
                standbyOnLowPressure = false;
                lowPressureForS = 0.0;
                events |= EV_RESET;
            }
        }
        if (stopStart && levelUsable && Double.isFinite(levelM)) {
            if (levelDemand && levelM > stopLevelM) {
                levelDemand = false;
                events |= EV_LEVEL_STOP;
            } else if (!levelDemand && levelM < startLevelM) {
                levelDemand = true;
                events |= EV_LEVEL_START;
            }
        }
        boolean demanded = !stopAll && (!stopStart || levelDemand);
        boolean dutyRunning = duty == 0 ? runningA : runningB;
        boolean dutyKnown = duty == 0 ? runningAKnown : runningBKnown;
        if (demanded && !dutyFailed) {
            dutyCmdForS += dtS;
            if (dutyKnown && !dutyRunning && dutyCmdForS > startTimeoutS) {
                dutyFailed = true;
                events |= EV_DUTY_TRIP;
                if (!standbyCmd) {
                    standbyCmd = true;
                    events |= EV_STANDBY_START_TRIP;
                }
            }
        } else {
            dutyCmdForS = 0.0;
        }
        if (demanded && !dutyFailed && dutyRunning && pressureUsable && feedPressurePa < lowPressurePa) {
            lowPressureForS += dtS;
            if (lowPressureForS >= lowPressureDelayS && !standbyCmd) {
                standbyCmd = true;
                standbyOnLowPressure = true;
                events |= EV_STANDBY_START_LOW_PRESSURE;
            }
        } else {
            lowPressureForS = 0.0;
        }
        cmd[duty] = demanded && !dutyFailed;
        cmd[stby] = demanded && standbyCmd;
    }

    /** Run command for pump A. */
    public boolean runA() { return cmd[0]; }

    /** Run command for pump B. */
    public boolean runB() { return cmd[1]; }

    /** Duty pump: 0 = A, 1 = B. */
    public int duty() { return duty; }

    public boolean dutyFailed() { return dutyFailed; }

    public boolean standbyRunning() { return standbyCmd; }

    public boolean standbyOnLowPressure() { return standbyOnLowPressure; }

    /** Event bits of the last scan (EV_*). */
    public int events() { return events; }
}
