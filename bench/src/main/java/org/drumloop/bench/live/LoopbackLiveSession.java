package org.drumloop.bench.live;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.sim.PlantIo;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.core.Firmware;
import org.drumloop.core.FirmwareStatus;
import org.drumloop.core.Mode;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.safety.InterlockSet;
import org.drumloop.core.soe.SoeSink;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.server.ImageServer;
import org.drumloop.modbus.server.ServerLimits;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;

/**
 * The live page over the whole chain in one process: the simulated plant is served as a Modbus
 * TCP slave on 127.0.0.1 (the bridge's image server, scaled by a channel map) and the firmware
 * reads and writes it as a master (the bridge's rig client), scan by scan in lockstep: plant
 * publishes at t → client reads → firmware scan → client writes → plant takes the outputs and
 * steps to t + dt. Every value crosses the socket, so the page shows what the Modbus path does to
 * the loop (scaling, quantisation, stale data).
 *
 * <p>Actions are applied as by the scenario runner. A saved session replays with
 * {@code drumloop run} in process, without Modbus, so its trend matches to the resolution of the
 * channel map's scaling, not bit for bit.
 */
public final class LoopbackLiveSession implements LiveSession, AutoCloseable {
    private final Scenario scenario;
    private final String[] refs;
    private final Plant plant;
    private final PlantIo plantIo;
    private final Firmware firmware;
    private final InterlockSet interlocks;
    private final ImageServer server;
    private final RigClient client;
    private final ProcessImage pin = new ProcessImage();
    private final ProcessImage pout = new ProcessImage();
    private final ProcessImage in = new ProcessImage();
    private final ProcessImage out = new ProcessImage();
    private final double dtS;
    private final LiveInfo info;
    private final PendingEvents pending = new PendingEvents();
    private final LiveActions actions;
    private final SoeSink soe;
    private final LiveSnapshot frame;
    private long scans;
    private double steamDemandFrac;
    private double pressureSetpointPa;

    public LoopbackLiveSession(Scenario sc, ChannelMap map) throws ConfigException, IOException {
        this(sc, map, ServerLimits.DEFAULT);
    }

    /** As above, the plant's Modbus server with {@code limits}. */
    public LoopbackLiveSession(Scenario sc, ChannelMap map, ServerLimits limits) throws ConfigException, IOException {
        this.scenario = sc;
        ScenarioRunner.Setup setup = ScenarioRunner.setup(sc);
        this.refs = SimLiveSession.references(sc, setup);
        PlantConfig pc = setup.plant();
        this.plant = new Plant(pc, sc.seed());
        plant.initSteadyState(sc.initialLoadFrac());
        this.steamDemandFrac = sc.initialLoadFrac();
        this.pressureSetpointPa = pc.pressureSetpointPa();
        this.firmware = new Firmware(setup.tuning());
        // start bumpless from the plant's balanced valve position, as the in-process session does
        firmware.operator().setManualOutput(plant.feedValvePositionFrac());
        this.interlocks = firmware.interlocks();
        ScenarioRunner.bind(sc, interlocks);
        this.plantIo = new PlantIo(plant);
        this.dtS = setup.tuning().scanPeriodS();
        this.server = ImageServer.tcp(map, new TcpEndpoint("127.0.0.1", 0), limits);
        RigClient c;
        try {
            c = RigClient.tcp(map, new TcpEndpoint("127.0.0.1", server.port()),
                    new RigClient.Options(Math.min(0.05, dtS / 2), 0.5, 1, 0.1, 2.0));
        } catch (RuntimeException e) {
            server.close();
            throw e;
        }
        this.client = c;
        pout.set(Signal.FEED_VALVE_DEMAND, plant.feedValvePositionFrac(), Quality.GOOD, 0.0);
        pout.setBool(Signal.PUMP_A_RUN, plant.pumpRunning(Plant.PUMP_A), Quality.GOOD, 0.0);
        pout.setBool(Signal.PUMP_B_RUN, plant.pumpRunning(Plant.PUMP_B), Quality.GOOD, 0.0);
        pout.setBool(Signal.FUEL_CUTOFF, false, Quality.GOOD, 0.0);
        plantIo.readInputs(pin, 0.0);
        server.publishInputs(pin, 0.0);
        this.soe = (tS, scan, tag, kind, message) -> pending.accept(tS, tag, kind.name(), message);
        plant.setEventListener((tS, tag, message) -> pending.accept(tS, tag, "PLANT", message));
        this.actions = new LiveActions(new LiveActions.Loop() {
            @Override public Plant plant() { return plant; }
            @Override public Firmware firmware() { return firmware; }
            @Override public double timeS() { return scans * dtS; }
            @Override public void setSteamDemand(double frac) { steamDemandFrac = frac; plant.setSteamDemand(frac); }
            @Override public double steamDemandFrac() { return steamDemandFrac; }
            @Override public void setPressureSetpointPa(double pPa) { pressureSetpointPa = pPa; plant.setPressureSetpointPa(pPa); }
            @Override public double pressureSetpointPa() { return pressureSetpointPa; }
        }, sc.actions(), pending);
        List<LiveInfo.Line> lines = new ArrayList<>();
        for (RunSummary.LevelLimit l : ScenarioRunner.limits(interlocks)) {
            lines.add(new LiveInfo.Line(l.tag(), l.levelM(), l.trip()));
        }
        List<String> tags = new ArrayList<>();
        for (int i = 0; i < interlocks.size(); i++) {
            tags.add(interlocks.tag(i));
        }
        this.info = new LiveInfo(pc.name(), pc.description(), setup.tuningPath().getFileName().toString(), false,
                "Modbus TCP loopback 127.0.0.1:" + server.port() + ", map " + map.file(), dtS, pc.levelRangeLowM(),
                pc.levelRangeHighM(), lines, pc.ratedSteamFlowKgS(),
                Math.max(pc.nominalPressurePa(), pc.pressureSetpointPa()) * 1.25,
                SimLiveSession.transmitters(), tags, List.of("feed_pump_a", "feed_pump_b", "burner"));
        this.frame = new LiveSnapshot(tags.size());
        capture(0.0);
    }

    /** Port of the served plant (for tests and the page's I/O line). */
    public int port() {
        return server.port();
    }

    @Override
    public LiveInfo info() {
        return info;
    }

    @Override
    public double timeS() {
        return scans * dtS;
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
        double tS = scans * dtS;
        client.pollOnce();
        client.readInputs(in, tS);
        firmware.scan(in, out, tS, dtS);
        client.writeOutputs(out, tS);
        client.flushOutputs();
        firmware.events().drainTo(soe);
        capture(tS);
        server.collectOutputs(pout, tS);
        plantIo.writeOutputs(pout, tS);
        plant.step(dtS);
        plantIo.readInputs(pin, tS + dtS);
        server.publishInputs(pin, tS + dtS);
        scans++;
    }

    /** Plant truth and controller view at {@code tS}, before the plant steps on. */
    private void capture(double tS) {
        FirmwareStatus st = firmware.status();
        LiveSnapshot s = frame;
        s.tS = tS;
        s.levelM = plant.levelM();
        s.levelIndicatedM = st.levelM;
        s.levelSetpointM = st.levelSetpointM;
        s.steamFlowKgS = plant.steamFlowKgS();
        s.feedFlowKgS = plant.feedFlowKgS();
        s.steamFlowMeasuredKgS = st.steamFlowKgS;
        s.feedFlowMeasuredKgS = st.feedFlowKgS;
        s.feedFlowSetpointKgS = st.mode == Mode.THREE_ELEMENT && st.auto ? st.feedFlowSetpointKgS : Double.NaN;
        s.valveDemandFrac = st.valveDemandFrac;
        s.valvePositionFrac = plant.feedValvePositionFrac();
        s.drumPressurePa = plant.drumPressurePa();
        s.feedTempK = plant.feedTempK();
        s.feedPressurePa = plant.feedPressurePa();
        s.firingFrac = plant.firingFrac();
        s.steamDemandFrac = steamDemandFrac;
        s.pumpARunning = plant.pumpRunning(Plant.PUMP_A);
        s.pumpBRunning = plant.pumpRunning(Plant.PUMP_B);
        s.burnerOn = plant.burnerOn();
        s.fuelCutoff = st.fuelCutoff;
        s.plantInvalid = plant.invalid();
        s.mode = st.mode.label();
        s.auto = st.auto;
        SimLiveSession.fillInterlocks(interlocks, s, tS);
    }

    @Override
    public void fill(LiveSnapshot s) {
        s.copyFrom(frame);
    }

    @Override
    public void drainEvents(Sink sink) {
        pending.drainTo(sink);
    }

    @Override
    public List<String> scenarioLines() {
        List<String> l = new ArrayList<>(SimLiveSession.head(scenario, refs, timeS(), dtS,
                "run over the Modbus TCP loopback; replays in process, equal to the channel map's resolution"));
        l.addAll(actions.applied());
        return l;
    }

    @Override
    public void close() {
        client.close();
        server.close();
    }
}
