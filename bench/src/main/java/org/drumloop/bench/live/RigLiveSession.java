package org.drumloop.bench.live;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.core.Firmware;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.FirmwareStatus;
import org.drumloop.core.Mode;
import org.drumloop.core.OperatorCommands;
import org.drumloop.core.exec.HangMonitor;
import org.drumloop.core.exec.RealTimeClock;
import org.drumloop.core.exec.ScanExecutive;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.safety.InterlockSet;
import org.drumloop.core.soe.SoeSink;
import org.drumloop.modbus.client.RigClient;

/**
 * The live page on real hardware: the built-in firmware runs in real time against a PLC or test
 * rig over Modbus through a {@link RigClient} (its own poll thread, so reading and writing never
 * wait on the network). There is no plant in the process.
 *
 * <p>Each scan is run by a {@link ScanExecutive} on a real-time clock with the interlocks file's
 * fail-safe settings, as {@code drumloop drive-rig} runs it: read, firmware scan, watchdog
 * override, write. A {@link HangMonitor} on another thread writes the fail-safe outputs if a scan
 * never returns. The live loop's own pacing only hands the scan over; the executive keeps time.
 *
 * <p>The page sees the firmware's view only: indicated level, measured flows and pressures, the
 * valve demand written to the rig, pump and flame feedback read from it, and the annunciator.
 * Values the firmware cannot know (true level, valve position, firing, steam demand) are NaN,
 * which the page shows as not available; a measurement of BAD quality is NaN too, rather than the
 * substitute value the firmware computes with. Operator actions go through the firmware's
 * {@link OperatorCommands}; plant actions (faults, trips, load changes) are refused.
 */
public final class RigLiveSession implements LiveSession, AutoCloseable {
    /** Signals the firmware needs from a rig to control level (as drive-rig requires). */
    public static final Set<Signal> REQUIRED_SIGNALS = Set.of(Signal.LEVEL_DP_A, Signal.LEVEL_DP_B, Signal.LEVEL_DP_C,
            Signal.STEAM_FLOW_DP, Signal.FEED_FLOW_DP, Signal.DRUM_PRESSURE, Signal.FEED_VALVE_DEMAND);
    /** The answer to a plant action on hardware (HTTP 400 and the event log). */
    public static final String REFUSED = "not available on real hardware: there is no simulated plant to act on";
    /** Headroom of the pressure trend above the design pressure, as the simulated sessions use. */
    private static final double PRESSURE_TREND_HEADROOM = 1.25;

    private final RigClient client;
    private final Firmware firmware;
    private final InterlockSet interlocks;
    private final ScanExecutive executive;
    private final HangMonitor hang;
    private final Thread hangThread;
    private final String tuningRef;
    private final String link;
    private final LiveInfo info;
    private final PendingEvents pending = new PendingEvents();
    private final List<String> applied = new ArrayList<>();
    private final SoeSink soe;
    private boolean closed;

    /**
     * Start polling the rig and get the firmware ready; the first scan runs when the live loop
     * first calls {@link #scan()}. Nothing is written to the rig before that scan.
     *
     * @param client    a client for the rig, not yet started (this session starts and closes it)
     * @param fc        the firmware configuration (tuning and its interlocks file)
     * @param tuning    the tuning file, for the page's header and the saved session
     * @param link      the link as the user gave it, e.g. "Modbus TCP 192.0.2.10:502, map aux-4-20ma.csv"
     */
    public RigLiveSession(RigClient client, FirmwareConfig fc, Path tuning, String link) {
        this.client = client;
        this.link = link;
        this.tuningRef = tuning.toAbsolutePath().normalize().toString();
        this.firmware = new Firmware(fc);
        this.interlocks = firmware.interlocks();
        double dtS = fc.scanPeriodS();
        this.executive = new ScanExecutive(new RealTimeClock(), client, firmware, dtS, fc.interlocks().failSafe(),
                firmware.events());
        this.soe = (tS, scan, tag, kind, message) -> pending.accept(tS, tag, kind.name(), message);
        List<LiveInfo.Line> lines = new ArrayList<>();
        for (RunSummary.LevelLimit l : ScenarioRunner.limits(interlocks)) {
            lines.add(new LiveInfo.Line(l.tag(), l.levelM(), l.trip()));
        }
        List<String> tags = new ArrayList<>();
        for (int i = 0; i < interlocks.size(); i++) {
            tags.add(interlocks.tag(i));
        }
        // gauge: the level transmitters' calibrated range (tuning file, [level_transmitters])
        double[] gauge = levelRangeM(fc);
        this.info = new LiveInfo("hardware rig", "firmware's view only, no plant model in this process",
                tuning.getFileName().toString(), true, link, dtS, gauge[0], gauge[1], lines, fc.ratedSteamFlowKgS(),
                fc.designPressurePa() * PRESSURE_TREND_HEADROOM, List.of(), tags, List.of());
        client.start();
        this.hang = new HangMonitor(executive);
        this.hangThread = hang.start();
    }

    /**
     * The level span of the transmitters [m rel. NWL]: where the calibrated dp of 4 mA and 20 mA
     * sits, found from the tuning's own calibration function by bisection (it rises with level).
     */
    static double[] levelRangeM(FirmwareConfig fc) {
        double lowDp = fc.levelCal().lowSi();
        double highDp = fc.levelCal().highSi();
        return new double[] {levelAtDp(fc, lowDp), levelAtDp(fc, highDp)};
    }

    private static double levelAtDp(FirmwareConfig fc, double dpPa) {
        double lo = -10.0;
        double hi = 10.0;
        boolean rising = fc.levelCalibrationDpPa(hi) > fc.levelCalibrationDpPa(lo);
        for (int i = 0; i < 80; i++) {
            double mid = 0.5 * (lo + hi);
            boolean above = fc.levelCalibrationDpPa(mid) > dpPa;
            if (above == rising) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    /** The firmware (for tests and the console). */
    public Firmware firmware() {
        return firmware;
    }

    /** The scan executive (watchdog, statistics). */
    public ScanExecutive executive() {
        return executive;
    }

    /** The rig client (link statistics). */
    public RigClient client() {
        return client;
    }

    @Override
    public LiveInfo info() {
        return info;
    }

    @Override
    public double timeS() {
        return executive.nextScanTimeS();
    }

    @Override
    public void check(LiveAction action) {
        if (!action.kind().operator()) {
            throw new IllegalArgumentException(action.scenarioStatement() + ": " + REFUSED);
        }
        LiveActions.parse(0.0, action.scenarioStatement());
    }

    @Override
    public void apply(LiveAction a) {
        double tS = timeS();
        String statement = a.scenarioStatement();
        OperatorCommands op = firmware.operator();
        boolean queued;
        switch (a.kind()) {
            case MODE: queued = op.requestMode(Mode.byLabel(a.target())); break;
            case AUTO: queued = op.requestAuto(a.auto()); break;
            case MANUAL_OUTPUT: queued = op.setManualOutput(a.valueSi()); break;
            case SETPOINT: queued = op.setLevelSetpoint(a.valueSi()); break;
            case ACKNOWLEDGE: queued = op.acknowledge(a.target()); break;
            case RESET:
                // the operator's reset also clears a tripped watchdog; if its cause remains it trips again
                executive.watchdog().requestReset();
                queued = op.reset();
                break;
            case BYPASS: queued = op.bypass(a.target(), a.text(), a.durationS()); break;
            default:
                pending.accept(tS, "live", "INFO", "refused: " + statement + ": " + REFUSED);
                return;
        }
        if (!queued) {
            pending.accept(tS, "live", "INFO", "refused by the firmware's operator queue: " + statement);
            return;
        }
        applied.add("at " + LiveAction.fmt(tS) + " s " + statement);
        pending.accept(tS, "operator", "ACTION", statement);
    }

    @Override
    public void scan() {
        try {
            executive.scanOnce();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return;
        }
        firmware.events().drainTo(soe);
    }

    @Override
    public void fill(LiveSnapshot s) {
        FirmwareStatus st = firmware.status();
        ProcessImage in = executive.inputs();
        ProcessImage out = executive.outputs();
        boolean scanned = executive.scanCount() > 0;
        s.tS = scanned ? executive.nextScanTimeS() - executive.periodS() : 0.0;
        s.levelM = Double.NaN; // the true level: no plant here
        s.levelIndicatedM = known(st.levelM, st.levelQuality, scanned);
        s.levelSetpointM = scanned ? st.levelSetpointM : Double.NaN;
        s.steamFlowKgS = Double.NaN;
        s.feedFlowKgS = Double.NaN;
        s.steamFlowMeasuredKgS = known(st.steamFlowKgS, st.steamFlowQuality, scanned);
        s.feedFlowMeasuredKgS = known(st.feedFlowKgS, st.feedFlowQuality, scanned);
        s.feedFlowSetpointKgS = scanned && st.mode == Mode.THREE_ELEMENT && st.auto ? st.feedFlowSetpointKgS : Double.NaN;
        // what was written to the rig, fail-safe overrides included
        s.valveDemandFrac = scanned ? out.value(Signal.FEED_VALVE_DEMAND) : Double.NaN;
        s.valvePositionFrac = Double.NaN;
        s.drumPressurePa = known(st.drumPressurePa, st.drumPressureQuality, scanned);
        s.feedTempK = known(st.feedTempK, st.feedTempQuality, scanned);
        s.feedPressurePa = known(st.feedPressurePa, st.feedPressureQuality, scanned);
        s.firingFrac = Double.NaN;
        s.steamDemandFrac = Double.NaN;
        s.pumpARunning = feedback(in, Signal.PUMP_A_RUNNING, scanned);
        s.pumpBRunning = feedback(in, Signal.PUMP_B_RUNNING, scanned);
        s.burnerOn = feedback(in, Signal.BURNER_ON, scanned);
        s.fuelCutoff = scanned && out.bool(Signal.FUEL_CUTOFF);
        s.plantInvalid = false;
        s.mode = st.mode.label();
        s.auto = st.auto;
        SimLiveSession.fillInterlocks(interlocks, s, s.tS);
    }

    private static double known(double v, Quality q, boolean scanned) {
        return scanned && q != Quality.BAD ? v : Double.NaN;
    }

    /** A running or flame feedback as read from the rig; false when the map lacks it or it is BAD. */
    private static boolean feedback(ProcessImage in, Signal s, boolean scanned) {
        return scanned && in.quality(s) != Quality.BAD && in.bool(s);
    }

    @Override
    public void drainEvents(Sink sink) {
        pending.drainTo(sink);
    }

    /**
     * A session on hardware has no plant model, so it cannot be replayed: the saved file names
     * the tuning and keeps the operator actions as comments to copy into a scenario with a plant.
     */
    @Override
    public List<String> scenarioLines() {
        List<String> l = new ArrayList<>();
        l.add("# Saved from the drumloop live page at t = " + LiveAction.fmt(timeS()) + " s, firmware against");
        l.add("# hardware over " + link + ".");
        l.add("# There was no plant model in this session, so this file does not replay it. To try the same");
        l.add("# operator actions on a simulated plant, add a 'plant' line and remove the '#' before them.");
        l.add("title     Live session on hardware");
        l.add("tuning    " + tuningRef);
        l.add("duration  " + LiveAction.fmt(Math.max(1.0, Math.ceil(timeS()))) + " s");
        for (String a : applied) {
            l.add("# " + a);
        }
        return l;
    }

    /** Stop the hang monitor and the rig client (the live loop must be stopped first). */
    @Override
    public void close() {
        if (closed) {
            return;
        }
        closed = true;
        hang.stop();
        try {
            hangThread.join(5_000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        client.close();
    }
}
