package org.drumloop.bench.sim;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.plant.Plant;
import org.drumloop.plant.Transmitter;
import org.drumloop.plant.TransmitterId;

/**
 * The simulated field wiring between a {@link Plant} and the firmware's process image.
 *
 * <p>Inputs: each analogue input gets both the transmitter's measured value in SI (ΔP in Pa for the
 * level and flow elements, absolute Pa for pressures, K for temperature) and its 4-20 mA loop
 * current, so a tuning that scales loop currents (with NAMUR NE 43 checking) and one that takes
 * engineering values both work; transport quality is GOOD (a wire does not go stale). Pump running
 * and burner-on feedback are bools. Outputs: feed valve demand, pump run commands and the fuel
 * cut-off go to the plant's actuators. Nothing here allocates.
 */
public final class PlantIo implements ProcessIo {
    private static final Signal[] ANALOG = {
        Signal.LEVEL_DP_A, Signal.LEVEL_DP_B, Signal.LEVEL_DP_C, Signal.STEAM_FLOW_DP, Signal.FEED_FLOW_DP,
        Signal.DRUM_PRESSURE, Signal.FEED_TEMP, Signal.FEED_PRESSURE,
    };
    private static final TransmitterId[] SOURCE = {
        TransmitterId.LEVEL_A, TransmitterId.LEVEL_B, TransmitterId.LEVEL_C, TransmitterId.STEAM_FLOW,
        TransmitterId.FEED_FLOW, TransmitterId.DRUM_PRESSURE, TransmitterId.FEED_TEMP, TransmitterId.FEED_PRESSURE,
    };

    private final Plant plant;
    private final Transmitter[] transmitters = new Transmitter[ANALOG.length];
    private boolean loopCurrents = true;

    public PlantIo(Plant plant) {
        this.plant = plant;
        for (int i = 0; i < ANALOG.length; i++) {
            transmitters[i] = plant.transmitter(SOURCE[i]);
        }
    }

    public Plant plant() { return plant; }

    /**
     * Deliver analogue inputs with their loop current (default) or as engineering values only
     * (as a float register would).
     */
    public void setLoopCurrents(boolean on) { loopCurrents = on; }

    @Override
    public void readInputs(ProcessImage in, double tS) {
        for (int i = 0; i < ANALOG.length; i++) {
            Transmitter t = transmitters[i];
            in.set(ANALOG[i], t.value(), Quality.GOOD, tS);
            if (loopCurrents) {
                in.setCurrentMa(ANALOG[i], t.currentMa(), Quality.GOOD, tS);
            }
        }
        in.setBool(Signal.PUMP_A_RUNNING, plant.pumpRunning(0), Quality.GOOD, tS);
        in.setBool(Signal.PUMP_B_RUNNING, plant.pumpRunning(1), Quality.GOOD, tS);
        in.setBool(Signal.BURNER_ON, plant.burnerOn(), Quality.GOOD, tS);
    }

    @Override
    public void writeOutputs(ProcessImage out, double tS) {
        double v = out.value(Signal.FEED_VALVE_DEMAND);
        if (v == v) { // not NaN: a NaN demand leaves the actuator where it was
            plant.setFeedValveDemand(v);
        }
        plant.setPumpRunCommand(0, out.bool(Signal.PUMP_A_RUN));
        plant.setPumpRunCommand(1, out.bool(Signal.PUMP_B_RUN));
        plant.setFuelCutoff(out.bool(Signal.FUEL_CUTOFF));
    }
}
