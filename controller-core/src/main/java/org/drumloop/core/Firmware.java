package org.drumloop.core;

import org.drumloop.core.control.FeedPumpControl;
import org.drumloop.core.control.LoadProgram;
import org.drumloop.core.control.Pid;
import org.drumloop.core.control.PidParams;
import org.drumloop.core.control.SwellCompensator;
import org.drumloop.core.control.ThreeElement;
import org.drumloop.core.exec.ScanBody;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.safety.InterlockInputs;
import org.drumloop.core.safety.InterlockOutputs;
import org.drumloop.core.safety.InterlockSet;
import org.drumloop.core.signal.AnalogInput;
import org.drumloop.core.signal.FlowCompensator;
import org.drumloop.core.signal.LevelCompensator;
import org.drumloop.core.signal.MedianSelect;
import org.drumloop.core.signal.Ne43;
import org.drumloop.core.signal.SteamTables;
import org.drumloop.core.soe.EventKind;
import org.drumloop.core.soe.SoeLog;

/**
 * The drum-level controller: one {@link #scan} runs, in this fixed order,
 * <ol>
 *   <li>operator requests queued since the last scan;</li>
 *   <li>validation and conditioning: NE 43, staleness, range and spike checks of every analogue
 *       input; density compensation of the three level transmitters at the measured drum pressure
 *       and median select; square-root extraction, density compensation and low-flow cut-off of
 *       steam flow (saturated steam at drum pressure) and feed flow (water at feed temperature and
 *       pressure);</li>
 *   <li>interlocks (alarms and trips, voting, latching, bypass; see {@link InterlockSet});</li>
 *   <li>control: mode selection, swell compensation and load program, single- or three-element
 *       control, feed pump duty/standby;</li>
 *   <li>outputs: valve demand, pump run commands, fuel cut-off, annunciators, indicated level;</li>
 *   <li>record: {@link #status()} and the sequence-of-events log (every mode change, auto/manual
 *       change, operator action, pump auto-start, signal quality change).</li>
 * </ol>
 *
 * <p>The first scan holds the valve at the tuning file's {@code manual_valve} while every controller
 * initialises on it, so a start in auto is bumpless.
 *
 * <p>Substitutions when an input is BAD: drum pressure - the design pressure (the compensated levels
 * and steam flow become UNCERTAIN); feed temperature - the design feed temperature; feed pressure -
 * the drum pressure. A BAD flow forces single-element; losing every level transmitter forces manual
 * with the valve held where it was. An interlock demand to close the feed valve drives the demand to 0
 * with every controller tracking it.
 *
 * <p>The scan allocates nothing and reads no clock; time comes in as {@code tS} and {@code dtS}.
 * This is a test bench controller, not a safety system: interlock settings come from the boiler
 * maker, classification rules and local codes.
 */
public final class Firmware implements ScanBody {
    private static final int TX = 3;
    private static final Signal[] LEVEL_SIGNALS = {Signal.LEVEL_DP_A, Signal.LEVEL_DP_B, Signal.LEVEL_DP_C};
    private static final String TAG_CONTROL = "level_control";
    private static final String TAG_PUMPS = "feed_pumps";
    private static final String[] PUMP_TAG = {"feed_pump_a", "feed_pump_b"};
    private static final String[] MODE_MSG = {"mode manual", "mode single-element", "mode three-element"};
    private static final String[] QUALITY_MSG = {"signal good", "signal uncertain", "signal bad"};
    private static final EventKind[] QUALITY_KIND = {EventKind.INFO, EventKind.INFO, EventKind.FAULT};

    private final FirmwareConfig cfg;
    private final SoeLog log;
    private final InterlockSet interlocks;
    private final OperatorCommands operator = new OperatorCommands();
    private final FirmwareStatus status = new FirmwareStatus();

    // conditioning
    private final AnalogInput pressureIn;
    private final AnalogInput[] levelIn = new AnalogInput[TX];
    private final AnalogInput steamDpIn;
    private final AnalogInput feedDpIn;
    private final AnalogInput feedTempIn;
    private final AnalogInput feedPressureIn;
    private final LevelCompensator levelComp;
    private final FlowCompensator steamComp;
    private final FlowCompensator feedComp;
    private final MedianSelect median = new MedianSelect();
    private final AnalogInput[] allInputs;
    private final Quality[] lastQuality;
    private final Quality[] lastLevelQuality = new Quality[TX];

    // control
    private final ModeSelector selector;
    private final SwellCompensator swell;
    private final LoadProgram program;
    private final ThreeElement control;
    private final FeedPumpControl pumps;

    // safety glue
    private final InterlockInputs ilIn = new InterlockInputs();
    private final InterlockOutputs ilOut = new InterlockOutputs();

    // operator state
    private boolean auto;
    private Mode strategy;
    private double manualValveFrac;
    private double levelSetpointM;
    private Mode lastMode;
    private boolean lastForcedSingle;
    private boolean lastForcedManual;
    private boolean lastLowLoad;
    private long scanCount;
    private double valveFrac;

    // drained operator requests (reused arrays)
    private final int[] opKind = new int[OperatorCommands.CAPACITY];
    private final double[] opNum = new double[OperatorCommands.CAPACITY];
    private final Mode[] opMode = new Mode[OperatorCommands.CAPACITY];
    private final String[] opTag = new String[OperatorCommands.CAPACITY];
    private final String[] opReason = new String[OperatorCommands.CAPACITY];
    private final PidParams[] opParams = new PidParams[OperatorCommands.CAPACITY];

    /** Firmware with a sequence-of-events log of 4096 entries. */
    public Firmware(FirmwareConfig cfg) {
        this(cfg, 4096);
    }

    public Firmware(FirmwareConfig cfg, int soeCapacity) {
        this.cfg = cfg;
        this.log = new SoeLog(soeCapacity);
        this.interlocks = new InterlockSet(cfg.interlocks(), log);
        pressureIn = new AnalogInput(Signal.DRUM_PRESSURE, cfg.drumPressureCal());
        for (int i = 0; i < TX; i++) {
            levelIn[i] = new AnalogInput(LEVEL_SIGNALS[i], cfg.levelCal());
            lastLevelQuality[i] = Quality.BAD;
        }
        steamDpIn = new AnalogInput(Signal.STEAM_FLOW_DP, cfg.steamFlowCal());
        feedDpIn = new AnalogInput(Signal.FEED_FLOW_DP, cfg.feedFlowCal());
        feedTempIn = new AnalogInput(Signal.FEED_TEMP, cfg.feedTempCal());
        feedPressureIn = new AnalogInput(Signal.FEED_PRESSURE, cfg.feedPressureCal());
        allInputs = new AnalogInput[] {levelIn[0], levelIn[1], levelIn[2], pressureIn, steamDpIn, feedDpIn, feedTempIn, feedPressureIn};
        lastQuality = new Quality[allInputs.length];
        for (int i = 0; i < lastQuality.length; i++) {
            lastQuality[i] = Quality.GOOD; // the first scan reports any input that is not GOOD
        }
        levelComp = cfg.levelCompensator();
        steamComp = new FlowCompensator(cfg.steamFlowRangeKgS(), cfg.steamFlowCal().highSi(), cfg.steamFlowDesignDensity(), cfg.steamFlowCutoffFrac());
        feedComp = new FlowCompensator(cfg.feedFlowRangeKgS(), cfg.feedFlowCal().highSi(), cfg.feedFlowDesignDensity(), cfg.feedFlowCutoffFrac());
        selector = new ModeSelector(cfg.autoSelect(), cfg.threeElementAboveFrac(), cfg.singleElementBelowFrac(), cfg.flowGoodDelayS());
        swell = new SwellCompensator(cfg.swellGainMPerKgS(), cfg.swellTauS());
        program = new LoadProgram(cfg.setpointProgram(), cfg.setpointOffsetAtZeroLoadM(), cfg.setpointOffsetAtRatedLoadM(), cfg.ratedSteamFlowKgS());
        control = new ThreeElement(new Pid(cfg.singleElement()), new Pid(cfg.levelMaster()), new Pid(cfg.feedSlave()),
                cfg.feedforwardGain(), cfg.feedforwardBiasKgS(), cfg.feedSetpointMaxKgS());
        pumps = new FeedPumpControl(cfg.dutyPumpB(), cfg.pumpStopStart(), cfg.pumpStartLevelM(), cfg.pumpStopLevelM(),
                cfg.pumpStartTimeoutS(), cfg.pumpLowPressurePa(), cfg.pumpLowPressureDelayS());
        Mode start = cfg.startMode();
        auto = start != Mode.MANUAL;
        strategy = start == Mode.MANUAL ? Mode.THREE_ELEMENT : start;
        manualValveFrac = cfg.manualValveFrac();
        valveFrac = manualValveFrac;
        levelSetpointM = cfg.levelSetpointM();
        lastMode = null;
    }

    public FirmwareConfig config() { return cfg; }

    public OperatorCommands operator() { return operator; }

    public FirmwareStatus status() { return status; }

    public SoeLog events() { return log; }

    public InterlockSet interlocks() { return interlocks; }

    /** The control blocks (for tests and trends). */
    public ThreeElement control() { return control; }

    public FeedPumpControl pumps() { return pumps; }

    @Override
    public void scan(ProcessImage in, ProcessImage out, double tS, double dtS) {
        long k = scanCount;
        applyOperator(tS, k);

        // ---- validate and condition ----------------------------------------------------------
        pressureIn.update(in, tS, dtS);
        boolean pOk = pressureIn.usable();
        double pDrumPa = pOk ? pressureIn.valueSi() : cfg.designPressurePa();
        Quality pQ = pOk ? pressureIn.quality() : Quality.UNCERTAIN;
        levelComp.setPressure(pDrumPa);
        for (int i = 0; i < TX; i++) {
            AnalogInput a = levelIn[i];
            a.update(in, tS, dtS);
            ilIn.levelM[i] = levelComp.levelM(a.valueSi());
            Quality q = a.quality();
            ilIn.levelQuality[i] = q == Quality.BAD ? Quality.BAD : Ne43.worst(q, pQ);
        }
        median.select(ilIn.levelM[0], ilIn.levelQuality[0], ilIn.levelM[1], ilIn.levelQuality[1],
                ilIn.levelM[2], ilIn.levelQuality[2]);
        double levelM = median.valueM();
        boolean levelOk = median.quality() != Quality.BAD;

        steamDpIn.update(in, tS, dtS);
        double steamKgS = steamComp.flowKgS(steamDpIn.valueSi(), levelComp.vapourDensity());
        Quality steamQ = steamDpIn.quality() == Quality.BAD ? Quality.BAD : Ne43.worst(steamDpIn.quality(), pQ);

        feedTempIn.update(in, tS, dtS);
        double feedTempK = feedTempIn.usable() ? feedTempIn.valueSi() : cfg.designFeedTempK();
        feedPressureIn.update(in, tS, dtS);
        double feedPPa = feedPressureIn.usable() ? feedPressureIn.valueSi() : pDrumPa;
        feedDpIn.update(in, tS, dtS);
        double feedKgS = feedComp.flowKgS(feedDpIn.valueSi(), SteamTables.liquidDensity(feedTempK, feedPPa));
        Quality feedQ = feedDpIn.quality() == Quality.BAD ? Quality.BAD
                : (feedTempIn.usable() ? feedDpIn.quality() : Ne43.worst(feedDpIn.quality(), Quality.UNCERTAIN));
        reportQualities(tS, k);

        // ---- interlocks ----------------------------------------------------------------------
        ilIn.levelSelectedM = levelM;
        ilIn.levelSelectedQuality = median.quality();
        ilIn.feedTempK = feedTempIn.valueSi();
        ilIn.feedTempQuality = feedTempIn.quality();
        ilIn.levelDeviationM = median.deviationM();
        ilIn.levelDeviationQuality = median.deviationQuality();
        interlocks.evaluate(ilIn, tS, k, dtS, ilOut);

        // ---- control -------------------------------------------------------------------------
        boolean steamOk = steamQ != Quality.BAD;
        boolean flowsOk = steamOk && feedQ != Quality.BAD;
        Mode mode = selector.select(auto, strategy, levelOk, flowsOk, steamKgS / cfg.ratedSteamFlowKgS(), dtS);
        if (mode == Mode.MANUAL && lastMode != null && lastMode != Mode.MANUAL && auto) {
            // forced to manual while in auto (no usable level): hold where control left off. An
            // operator's switch to manual took over in setAuto, before any output given with it.
            manualValveFrac = valveFrac;
        }
        reportMode(mode, tS, k);
        double swellM = swell.update(steamKgS, steamOk, dtS);
        double levelCtlM = levelM - swellM;
        double spM = levelSetpointM + program.offsetM(steamKgS, steamOk);
        int strat = mode == Mode.MANUAL ? ThreeElement.MANUAL : (mode == Mode.SINGLE_ELEMENT ? ThreeElement.SINGLE : ThreeElement.THREE);
        if (k == 0) {
            strat = ThreeElement.MANUAL; // the first scan seeds every controller at the start valve position
        }
        double forced = ilOut.feedValveClose ? 0.0 : Double.NaN;
        valveFrac = control.update(strat, spM, levelCtlM, steamKgS, feedKgS, manualValveFrac, forced, dtS);

        boolean runAKnown = in.quality(Signal.PUMP_A_RUNNING) != Quality.BAD;
        boolean runBKnown = in.quality(Signal.PUMP_B_RUNNING) != Quality.BAD;
        pumps.update(in.bool(Signal.PUMP_A_RUNNING), runAKnown, in.bool(Signal.PUMP_B_RUNNING), runBKnown,
                feedPPa, feedPressureIn.usable(), levelM, levelOk, ilOut.feedPumpsStop, dtS);
        reportPumps(tS, k);

        // ---- outputs -------------------------------------------------------------------------
        out.set(Signal.FEED_VALVE_DEMAND, valveFrac, Quality.GOOD, tS);
        out.setBool(Signal.PUMP_A_RUN, pumps.runA(), Quality.GOOD, tS);
        out.setBool(Signal.PUMP_B_RUN, pumps.runB(), Quality.GOOD, tS);
        out.setBool(Signal.FUEL_CUTOFF, ilOut.fuelCutoff, Quality.GOOD, tS);
        out.setBool(Signal.ALARM_LAL, ilOut.alarmLal, Quality.GOOD, tS);
        out.setBool(Signal.ALARM_LAH, ilOut.alarmLah, Quality.GOOD, tS);
        out.setBool(Signal.TRIP_LALL, ilOut.tripLall, Quality.GOOD, tS);
        out.setBool(Signal.TRIP_LAHH, ilOut.tripLahh, Quality.GOOD, tS);
        out.set(Signal.LEVEL_INDICATED, levelM, median.quality(), tS);

        // ---- record --------------------------------------------------------------------------
        FirmwareStatus st = status;
        st.scan = k;
        st.tS = tS;
        st.mode = mode;
        st.requestedMode = auto ? strategy : Mode.MANUAL;
        st.auto = auto;
        st.forcedSingleElement = auto && strategy == Mode.THREE_ELEMENT && selector.flowsForced();
        st.forcedManual = selector.levelForced();
        st.lowLoad = selector.lowLoad();
        st.levelM = levelM;
        st.levelQuality = median.quality();
        for (int i = 0; i < TX; i++) {
            st.levelTxM[i] = ilIn.levelM[i];
            st.levelTxQuality[i] = ilIn.levelQuality[i];
        }
        st.levelDeviationM = median.deviationM();
        st.levelSetpointM = spM;
        st.operatorSetpointM = levelSetpointM;
        st.levelForControlM = levelCtlM;
        st.swellEstimateM = swellM;
        st.steamFlowKgS = steamKgS;
        st.steamFlowQuality = steamQ;
        st.feedFlowKgS = feedKgS;
        st.feedFlowQuality = feedQ;
        st.feedforwardKgS = control.feedforwardKgS();
        st.masterOut = control.masterOut();
        st.feedFlowSetpointKgS = control.feedSetpointKgS();
        st.drumPressurePa = pDrumPa;
        st.drumPressureQuality = pressureIn.quality();
        st.feedTempK = feedTempK;
        st.feedTempQuality = feedTempIn.quality();
        st.feedPressurePa = feedPPa;
        st.feedPressureQuality = feedPressureIn.quality();
        st.valveDemandFrac = valveFrac;
        st.manualValveFrac = manualValveFrac;
        st.pumpARun = pumps.runA();
        st.pumpBRun = pumps.runB();
        st.dutyPump = pumps.duty();
        st.standbyRunning = pumps.standbyRunning();
        st.dutyPumpFailed = pumps.dutyFailed();
        st.fuelCutoff = ilOut.fuelCutoff;
        st.feedPumpsStop = ilOut.feedPumpsStop;
        st.feedValveClose = ilOut.feedValveClose;
        st.alarmLal = ilOut.alarmLal;
        st.alarmLah = ilOut.alarmLah;
        st.tripLall = ilOut.tripLall;
        st.tripLahh = ilOut.tripLahh;
        st.alarmTal = ilOut.alarmTal;
        st.alarmLdah = ilOut.alarmLdah;
        st.firstOut = ilOut.firstOut;
        scanCount = k + 1;
    }

    private void applyOperator(double tS, long k) {
        int n = operator.drain(opKind, opNum, opMode, opTag, opReason, opParams);
        for (int i = 0; i < n; i++) {
            switch (opKind[i]) {
                case OperatorCommands.MODE:
                    if (opMode[i] == Mode.MANUAL) {
                        setAuto(false, tS, k);
                    } else {
                        strategy = opMode[i];
                        log.record(tS, k, TAG_CONTROL, EventKind.OPERATOR,
                                opMode[i] == Mode.SINGLE_ELEMENT ? "operator selects single-element" : "operator selects three-element");
                        setAuto(true, tS, k);
                    }
                    break;
                case OperatorCommands.AUTO:
                    setAuto(opNum[i] > 0.5, tS, k);
                    break;
                case OperatorCommands.MANUAL_OUTPUT:
                    manualValveFrac = opNum[i];
                    log.record(tS, k, TAG_CONTROL, EventKind.OPERATOR, "manual valve position set");
                    break;
                case OperatorCommands.SETPOINT: {
                    double lo = -levelComp.nwlAboveLowerTapM();
                    double hi = levelComp.tapSpanM() + lo;
                    if (opNum[i] >= lo && opNum[i] <= hi) {
                        levelSetpointM = opNum[i];
                        log.record(tS, k, TAG_CONTROL, EventKind.OPERATOR, "level setpoint changed");
                    } else {
                        log.record(tS, k, TAG_CONTROL, EventKind.OPERATOR, "level setpoint refused: outside the tappings");
                    }
                    break;
                }
                case OperatorCommands.RESET:
                    interlocks.requestReset();
                    pumps.requestReset();
                    log.record(tS, k, TAG_CONTROL, EventKind.OPERATOR, "operator reset");
                    break;
                case OperatorCommands.ACK:
                    if (!interlocks.acknowledge(opTag[i])) {
                        log.record(tS, k, opTag[i], EventKind.OPERATOR, "acknowledge refused: unknown tag");
                    }
                    break;
                case OperatorCommands.BYPASS:
                    if (!interlocks.bypass(opTag[i], opReason[i], opNum[i], tS)) {
                        log.record(tS, k, opTag[i], EventKind.OPERATOR, "bypass refused: " + interlocks.lastRefusal());
                    }
                    break;
                case OperatorCommands.RETUNE: {
                    Pid pid = OperatorCommands.SINGLE_ELEMENT.equals(opTag[i]) ? control.single()
                            : OperatorCommands.LEVEL_MASTER.equals(opTag[i]) ? control.master() : control.slave();
                    if (opParams[i].reverse() == pid.params().reverse()) {
                        pid.setParams(opParams[i]);
                        log.record(tS, k, opTag[i], EventKind.OPERATOR, "tuning changed");
                    } else {
                        log.record(tS, k, opTag[i], EventKind.OPERATOR, "tuning refused: action cannot change in operation");
                    }
                    break;
                }
                default:
                    break;
            }
            opParams[i] = null;
            opMode[i] = null;
            opTag[i] = null;
            opReason[i] = null;
        }
    }

    private void setAuto(boolean on, double tS, long k) {
        if (on != auto) {
            auto = on;
            if (!on) {
                manualValveFrac = valveFrac;
            }
            log.record(tS, k, TAG_CONTROL, EventKind.OPERATOR, on ? "operator selects auto" : "operator selects manual");
        }
    }

    private void reportMode(Mode mode, double tS, long k) {
        if (mode != lastMode) {
            log.record(tS, k, TAG_CONTROL, EventKind.MODE, MODE_MSG[mode.ordinal()]);
            lastMode = mode;
        }
        boolean fs = selector.flowsForced() && auto && strategy == Mode.THREE_ELEMENT;
        if (fs != lastForcedSingle) {
            log.record(tS, k, TAG_CONTROL, fs ? EventKind.FAULT : EventKind.INFO,
                    fs ? "three-element blocked: flow signal bad, single-element forced" : "flow signals good, three-element released");
            lastForcedSingle = fs;
        }
        boolean fm = selector.levelForced();
        if (fm != lastForcedManual) {
            log.record(tS, k, TAG_CONTROL, fm ? EventKind.FAULT : EventKind.INFO,
                    fm ? "no usable level transmitter: manual forced, valve held" : "level measurement usable again");
            lastForcedManual = fm;
        }
        boolean ll = selector.lowLoad();
        if (selector.autoSelect() && ll != lastLowLoad) {
            log.record(tS, k, TAG_CONTROL, EventKind.INFO, ll ? "load low: single-element band" : "load high: three-element band");
        }
        lastLowLoad = ll;
    }

    private void reportQualities(double tS, long k) {
        for (int i = 0; i < allInputs.length; i++) {
            Quality q = allInputs[i].quality();
            if (q != lastQuality[i]) {
                log.record(tS, k, allInputs[i].signal().tag(), QUALITY_KIND[q.ordinal()], QUALITY_MSG[q.ordinal()]);
                lastQuality[i] = q;
            }
        }
    }

    private void reportPumps(double tS, long k) {
        int ev = pumps.events();
        if (ev == 0) {
            return;
        }
        if ((ev & FeedPumpControl.EV_RESET) != 0) {
            log.record(tS, k, TAG_PUMPS, EventKind.OPERATOR, pumps.duty() == 0 ? "pump reset: duty a" : "pump reset: duty b");
        }
        if ((ev & FeedPumpControl.EV_DUTY_TRIP) != 0) {
            log.record(tS, k, PUMP_TAG[pumps.duty()], EventKind.FAULT, "duty pump tripped: no running feedback");
        }
        if ((ev & FeedPumpControl.EV_STANDBY_START_TRIP) != 0) {
            log.record(tS, k, PUMP_TAG[1 - pumps.duty()], EventKind.INFO, "standby pump auto-started: duty pump trip");
        }
        if ((ev & FeedPumpControl.EV_STANDBY_START_LOW_PRESSURE) != 0) {
            log.record(tS, k, PUMP_TAG[1 - pumps.duty()], EventKind.INFO, "standby pump auto-started: low feed pressure");
        }
        if ((ev & FeedPumpControl.EV_LEVEL_START) != 0) {
            log.record(tS, k, PUMP_TAG[pumps.duty()], EventKind.INFO, "pump started on low level (stop/start)");
        }
        if ((ev & FeedPumpControl.EV_LEVEL_STOP) != 0) {
            log.record(tS, k, PUMP_TAG[pumps.duty()], EventKind.INFO, "pump stopped on high level (stop/start)");
        }
    }
}
