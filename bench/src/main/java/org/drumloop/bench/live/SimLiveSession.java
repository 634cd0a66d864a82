package org.drumloop.bench.live;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Frame;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.bench.sim.SimulationSession;
import org.drumloop.core.FirmwareStatus;
import org.drumloop.core.Mode;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.safety.InterlockSet;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;

/**
 * The live page over the bench's real closed loop: a {@link SimulationSession} (plant, plant I/O
 * adapter and firmware) set up from a scenario exactly as {@code drumloop run} sets it up.
 *
 * <p>Every page action is first written as a scenario statement and read back with the bench's
 * own {@link ScenarioParser}; the parsed action is then applied here the way the scenario runner
 * applies it (operator actions through {@link OperatorCommands}, the firmware's queued bumpless
 * paths; faults and inputs on the plant; ramps recomputed before every scan). The saved scenario
 * is therefore the same statements the runner reads, with the same numbers, applied at the same
 * scans, and {@code drumloop run saved.scenario} replays the run.
 *
 * <p>The timed statements of a scenario given with {@code --scenario} play as in a run;
 * its expectations are not evaluated live.
 */
public final class SimLiveSession implements LiveSession {
    private static final List<LiveInfo.Transmitter> TRANSMITTERS = List.of(
            new LiveInfo.Transmitter("level_tx_a", "level A (dp)", "Pa"),
            new LiveInfo.Transmitter("level_tx_b", "level B (dp)", "Pa"),
            new LiveInfo.Transmitter("level_tx_c", "level C (dp)", "Pa"),
            new LiveInfo.Transmitter("steam_flow_tx", "steam flow (dp)", "Pa"),
            new LiveInfo.Transmitter("feed_flow_tx", "feed flow (dp)", "Pa"),
            new LiveInfo.Transmitter("pressure_tx", "drum pressure", "Pa"),
            new LiveInfo.Transmitter("feed_temp_tx", "feed temperature", "K"),
            new LiveInfo.Transmitter("feed_pressure_tx", "feed pump discharge pressure", "Pa"));

    private final Scenario scenario;
    private final String[] refs;
    private final SimulationSession sim;
    private final InterlockSet interlocks;
    private final LiveInfo info;
    private final PendingEvents pending = new PendingEvents();
    private final LiveActions actions;

    /** Set up plant, tuning, seed and initial load as {@code drumloop run} does for {@code sc}. */
    public SimLiveSession(Scenario sc) throws ConfigException, IOException {
        this.scenario = sc;
        ScenarioRunner.Setup setup = ScenarioRunner.setup(sc);
        this.refs = references(sc, setup);
        this.sim = new SimulationSession(setup.plant(), setup.tuning(), sc.seed(), sc.initialLoadFrac());
        this.interlocks = sim.firmware().interlocks();
        ScenarioRunner.bind(sc, interlocks);
        this.actions = new LiveActions(new LiveActions.Loop() {
            @Override public Plant plant() { return sim.plant(); }
            @Override public org.drumloop.core.Firmware firmware() { return sim.firmware(); }
            @Override public double timeS() { return sim.timeS(); }
            @Override public void setSteamDemand(double frac) { sim.setSteamDemand(frac); }
            @Override public double steamDemandFrac() { return sim.steamDemandFrac(); }
            @Override public void setPressureSetpointPa(double pPa) { sim.setPressureSetpointPa(pPa); }
            @Override public double pressureSetpointPa() { return sim.pressureSetpointPa(); }
        }, sc.actions(), pending);
        sim.setEventSink((tS, tag, kind, message) -> pending.accept(tS, tag, kind, message));
        PlantConfig pc = setup.plant();
        List<LiveInfo.Line> lines = new ArrayList<>();
        for (RunSummary.LevelLimit l : ScenarioRunner.limits(interlocks)) {
            lines.add(new LiveInfo.Line(l.tag(), l.levelM(), l.trip()));
        }
        List<String> tags = new ArrayList<>();
        for (int i = 0; i < interlocks.size(); i++) {
            tags.add(interlocks.tag(i));
        }
        this.info = new LiveInfo(pc.name(), pc.description(), setup.tuningPath().getFileName().toString(), false,
                "simulated plant, in process", sim.scanPeriodS(), pc.levelRangeLowM(), pc.levelRangeHighM(), lines,
                pc.ratedSteamFlowKgS(), Math.max(pc.nominalPressurePa(), pc.pressureSetpointPa()) * 1.25,
                TRANSMITTERS, tags, List.of("feed_pump_a", "feed_pump_b", "burner"));
    }

    /** A live session with no script: the default plant and tuning at the given load. */
    public static SimLiveSession idle(String plant, String tuning, double loadFrac, long seed)
            throws ConfigException, IOException {
        return new SimLiveSession(idleScenario(plant, tuning, loadFrac, seed));
    }

    /** The scenario of a live session with no script. */
    public static Scenario idleScenario(String plant, String tuning, double loadFrac, long seed) throws ConfigException {
        List<String> text = List.of("title     Live session", "plant     " + plant, "tuning    " + tuning,
                "seed      " + seed, "load      " + LiveAction.fmt(loadFrac * 100) + " %",
                "duration  " + LiveAction.fmt(LiveActions.CHECK_DURATION_S) + " s");
        return ScenarioParser.parse("live", null, text);
    }

    public SimulationSession simulation() {
        return sim;
    }

    @Override
    public LiveInfo info() {
        return info;
    }

    @Override
    public double timeS() {
        return sim.timeS();
    }

    @Override
    public void check(LiveAction action) {
        LiveActions.parse(0.0, action.scenarioStatement());
    }

    @Override
    public void apply(LiveAction action) {
        actions.apply(action);
    }

    @Override
    public void scan() {
        actions.beforeScan();
        sim.scan();
    }

    @Override
    public void fill(LiveSnapshot s) {
        Frame f = sim.frame();
        FirmwareStatus st = sim.firmware().status();
        Plant p = sim.plant();
        s.tS = f.tS;
        s.levelM = f.get(Channel.DRUM_LEVEL);
        s.levelIndicatedM = f.get(Channel.MEASURED_LEVEL);
        s.levelSetpointM = f.get(Channel.SETPOINT);
        s.steamFlowKgS = f.get(Channel.STEAM_FLOW);
        s.feedFlowKgS = f.get(Channel.FEED_FLOW);
        s.steamFlowMeasuredKgS = f.get(Channel.STEAM_FLOW_MEASURED);
        s.feedFlowMeasuredKgS = f.get(Channel.FEED_FLOW_MEASURED);
        s.feedFlowSetpointKgS = st.mode == Mode.THREE_ELEMENT && st.auto ? f.get(Channel.FEED_FLOW_SETPOINT) : Double.NaN;
        s.valveDemandFrac = f.get(Channel.VALVE_DEMAND);
        s.valvePositionFrac = f.get(Channel.FEED_VALVE);
        s.drumPressurePa = f.get(Channel.DRUM_PRESSURE);
        s.feedTempK = f.get(Channel.FEED_TEMP);
        s.feedPressurePa = f.get(Channel.FEED_PRESSURE);
        s.firingFrac = f.get(Channel.FIRING);
        s.steamDemandFrac = f.get(Channel.STEAM_DEMAND);
        s.pumpARunning = f.get(Channel.PUMP_A_RUNNING) >= 0.5;
        s.pumpBRunning = f.get(Channel.PUMP_B_RUNNING) >= 0.5;
        s.burnerOn = f.get(Channel.BURNER_ON) >= 0.5;
        s.fuelCutoff = f.get(Channel.FUEL_CUTOFF) >= 0.5;
        s.plantInvalid = p.invalid();
        s.mode = f.modeLabel;
        s.auto = f.get(Channel.AUTO) >= 0.5;
        fillInterlocks(interlocks, s, f.tS);
    }

    /** Annunciator state of every interlock into the snapshot (no allocation). */
    static void fillInterlocks(InterlockSet interlocks, LiveSnapshot s, double tS) {
        for (int i = 0; i < s.active.length; i++) {
            s.active[i] = interlocks.active(i);
            s.latched[i] = interlocks.latched(i);
            s.acknowledged[i] = interlocks.acknowledged(i);
            s.bypassed[i] = interlocks.bypassed(i);
            s.trip[i] = interlocks.isTrip(i);
            s.bypassLeftS[i] = interlocks.bypassed(i) ? Math.max(0, interlocks.bypassEndS(i) - tS) : Double.NaN;
        }
        s.firstOut = interlocks.firstOut();
    }

    static List<LiveInfo.Transmitter> transmitters() {
        return TRANSMITTERS;
    }

    @Override
    public void drainEvents(Sink sink) {
        pending.drainTo(sink);
    }

    /** Plant and tuning as a saved scenario names them. */
    static String[] references(Scenario sc, ScenarioRunner.Setup setup) {
        return new String[] {reference(sc.plant(), ".plant", setup.plantPath()),
            reference(sc.tuning(), ".tuning", setup.tuningPath())};
    }

    /** A shipped name stays a name; a file path becomes absolute so the saved file works anywhere. */
    private static String reference(String asWritten, String ext, java.nio.file.Path resolved) {
        boolean pathLike = asWritten.contains("/") || asWritten.contains("\\") || asWritten.endsWith(ext);
        return pathLike ? resolved.toAbsolutePath().normalize().toString() : asWritten;
    }

    @Override
    public List<String> scenarioLines() {
        List<String> l = new ArrayList<>(head(scenario, refs, sim.timeS(), sim.scanPeriodS(), null));
        l.addAll(actions.applied());
        return l;
    }

    /**
     * Header of a saved session: plant, tuning, seed and load as the session started, and a
     * duration that covers every scan run so far ({@code timeS} is the time of the next scan).
     */
    static List<String> head(Scenario scenario, String[] refs, double timeS, double dtS, String note) {
        double dur = Math.max(1.0, Math.ceil(timeS - dtS + 1e-9));
        List<String> l = new ArrayList<>();
        l.add("# Saved from the drumloop live page at t = " + LiveAction.fmt(timeS) + " s.");
        l.add("# Replays the session: drumloop run FILE. Expectations of a scenario the session started");
        l.add("# from are not copied; add your own 'expect' lines.");
        if (note != null) {
            l.add("# Session " + note + ".");
        }
        l.add("title     " + ("Live session".equals(scenario.title()) ? "Live session" : "Live session from " + scenario.title()));
        l.add("plant     " + refs[0]);
        l.add("tuning    " + refs[1]);
        l.add("seed      " + scenario.seed());
        l.add("load      " + LiveAction.fmt(scenario.initialLoadFrac() * 100) + " %");
        l.add("duration  " + LiveAction.fmt(dur) + " s");
        return l;
    }
}
