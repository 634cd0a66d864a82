package org.drumloop.bench.sim;

import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Frame;
import org.drumloop.core.Firmware;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.FirmwareStatus;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.safety.InterlockSet;
import org.drumloop.core.soe.SoeSink;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;

/**
 * The closed loop in simulated time: a {@link Plant}, the {@link PlantIo} wiring and the
 * {@link Firmware}, stepped together at the firmware's scan period. One {@link #scan()}:
 * read inputs at t → firmware scan → write outputs → drain the sequence-of-events log → fill the
 * {@link #frame()} with the state at t → advance the plant to t + dt. Nothing in {@link #scan()}
 * allocates except what an event sink does with the (rare) events.
 *
 * <p>Not thread-safe: drive it from one thread (a paced runner, a live page's loop).
 */
public final class SimulationSession implements ActionApplier.Loop {
    /** Receives sequence-of-events entries ({@code kind} = the SOE kind) and plant events ({@code kind} = PLANT). */
    @FunctionalInterface
    public interface EventSink {
        void event(double tS, String tag, String kind, String message);
    }

    private final PlantConfig plantConfig;
    private final FirmwareConfig firmwareConfig;
    private final Plant plant;
    private final Firmware firmware;
    private final PlantIo io;
    private final ProcessImage in = new ProcessImage();
    private final ProcessImage out = new ProcessImage();
    private final double dtS;
    private final Frame frame;
    private final InterlockSet interlocks;
    private final SoeSink soeSink;
    private EventSink sink = (t, tag, kind, msg) -> { };
    private long scans;
    private double steamDemandFrac;
    private double pressureSetpointPa;

    /**
     * @param plantConfig    the plant
     * @param firmwareConfig the tuning (and its interlocks)
     * @param seed           plant noise seed
     * @param loadFrac       steam demand the plant starts balanced at [fraction of rating]
     */
    public SimulationSession(PlantConfig plantConfig, FirmwareConfig firmwareConfig, long seed, double loadFrac) {
        this.plantConfig = plantConfig;
        this.firmwareConfig = firmwareConfig;
        this.plant = new Plant(plantConfig, seed);
        this.plant.initSteadyState(loadFrac);
        this.steamDemandFrac = loadFrac;
        this.pressureSetpointPa = plantConfig.pressureSetpointPa();
        this.firmware = new Firmware(firmwareConfig);
        this.io = new PlantIo(plant);
        this.dtS = firmwareConfig.scanPeriodS();
        this.interlocks = firmware.interlocks();
        this.frame = new Frame(interlocks.size());
        this.soeSink = (tS, scan, tag, kind, message) -> sink.event(tS, tag, kind.name(), message);
        plant.setEventListener((tS, tag, message) -> sink.event(tS, tag, "PLANT", message));
        // Start bumpless from the plant's balanced state: the controller's manual output (which the
        // automatic blocks initialise from) is the valve position the plant settled at.
        firmware.operator().setManualOutput(plant.feedValvePositionFrac());
    }

    public void setEventSink(EventSink s) { this.sink = s == null ? (t, tag, kind, msg) -> { } : s; }

    @Override
    public Plant plant() { return plant; }

    @Override
    public Firmware firmware() { return firmware; }

    public PlantIo io() { return io; }

    public PlantConfig plantConfig() { return plantConfig; }

    public FirmwareConfig firmwareConfig() { return firmwareConfig; }

    /** Scan period [s]. */
    public double scanPeriodS() { return dtS; }

    /** Time of the next scan [s]. */
    public double timeS() { return scans * dtS; }

    public long scans() { return scans; }

    /** State at the last scan (plant truth and controller view), SI. */
    public Frame frame() { return frame; }

    /** The input image of the last scan (what the firmware saw). */
    public ProcessImage inputs() { return in; }

    /** The output image of the last scan (what the firmware commanded). */
    public ProcessImage outputs() { return out; }

    /** Consumer steam demand [fraction of rating]; recorded as the steam_demand channel. */
    @Override
    public void setSteamDemand(double frac) {
        steamDemandFrac = frac;
        plant.setSteamDemand(frac);
    }

    @Override
    public double steamDemandFrac() { return steamDemandFrac; }

    /** Plant pressure controller setpoint as last set through the session [Pa abs]. */
    @Override
    public double pressureSetpointPa() { return pressureSetpointPa; }

    /** Set the plant's pressure controller setpoint [Pa abs]. */
    @Override
    public void setPressureSetpointPa(double pPa) {
        pressureSetpointPa = pPa;
        plant.setPressureSetpointPa(pPa);
    }

    /** One scan. */
    public void scan() {
        double tS = scans * dtS;
        io.readInputs(in, tS);
        firmware.scan(in, out, tS, dtS);
        io.writeOutputs(out, tS);
        firmware.events().drainTo(soeSink);
        fill(tS);
        plant.step(dtS);
        scans++;
    }

    private void fill(double tS) {
        Frame f = frame;
        FirmwareStatus st = firmware.status();
        f.tS = tS;
        double[] v = f.value;
        v[Channel.DRUM_LEVEL.ordinal()] = plant.levelM();
        v[Channel.MEASURED_LEVEL.ordinal()] = st.levelM;
        v[Channel.CONTROL_LEVEL.ordinal()] = st.levelForControlM;
        v[Channel.SETPOINT.ordinal()] = st.levelSetpointM;
        v[Channel.DRUM_PRESSURE.ordinal()] = plant.drumPressurePa();
        v[Channel.STEAM_FLOW.ordinal()] = plant.steamFlowKgS();
        v[Channel.FEED_FLOW.ordinal()] = plant.feedFlowKgS();
        v[Channel.STEAM_FLOW_MEASURED.ordinal()] = st.steamFlowKgS;
        v[Channel.FEED_FLOW_MEASURED.ordinal()] = st.feedFlowKgS;
        v[Channel.FEED_FLOW_SETPOINT.ordinal()] = st.feedFlowSetpointKgS;
        v[Channel.FEED_VALVE.ordinal()] = plant.feedValvePositionFrac();
        v[Channel.VALVE_DEMAND.ordinal()] = st.valveDemandFrac;
        v[Channel.FIRING.ordinal()] = plant.firingFrac();
        v[Channel.HEAT.ordinal()] = plant.heatW();
        v[Channel.STEAM_DEMAND.ordinal()] = steamDemandFrac;
        v[Channel.FEED_TEMP.ordinal()] = plant.feedTempK();
        v[Channel.FEED_PRESSURE.ordinal()] = plant.feedPressurePa();
        v[Channel.SAFETY_VALVE_FLOW.ordinal()] = plant.safetyValveFlowKgS();
        v[Channel.PUMP_A_RUNNING.ordinal()] = plant.pumpRunning(0) ? 1.0 : 0.0;
        v[Channel.PUMP_B_RUNNING.ordinal()] = plant.pumpRunning(1) ? 1.0 : 0.0;
        v[Channel.BURNER_ON.ordinal()] = plant.burnerOn() ? 1.0 : 0.0;
        v[Channel.FUEL_CUTOFF.ordinal()] = st.fuelCutoff ? 1.0 : 0.0;
        v[Channel.AUTO.ordinal()] = st.auto ? 1.0 : 0.0;
        v[Channel.MODE.ordinal()] = st.mode.ordinal();
        f.modeLabel = st.mode.label();
        for (int i = 0; i < f.interlockActive.length; i++) {
            f.interlockActive[i] = interlocks.effective(i);
            f.interlockBypassed[i] = interlocks.bypassed(i);
        }
        for (int i = 0; i < Channel.LEVEL_TX.length; i++) {
            v[Channel.LEVEL_TX[i].ordinal()] = st.levelTxM[i];
            f.levelTxQuality[i] = st.levelTxQuality[i];
        }
        f.firstOut = st.firstOut;
    }
}
