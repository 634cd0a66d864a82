package org.drumloop.bench.hil;

import org.drumloop.bench.sim.PlantIo;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.server.ImageServer;
import org.drumloop.plant.Plant;

/**
 * One step of a plant served over Modbus: take the outputs the controller wrote, move the plant
 * on by one step, publish the new inputs. A controller output never written keeps the plant's
 * own actuator state from the start; one that goes stale keeps its last value (the actuator holds,
 * as a positioner does on a lost signal). Allocates nothing.
 */
final class PlantLoop {
    private final Plant plant;
    private final PlantIo io;
    private final ImageServer server;
    private final ProcessImage pin = new ProcessImage();
    private final ProcessImage pout = new ProcessImage();
    private double steamDemandFrac;
    private double stepAtS = Double.POSITIVE_INFINITY;
    private double stepToFrac;

    PlantLoop(Plant plant, ImageServer server, double loadFrac) {
        this.plant = plant;
        this.io = new PlantIo(plant);
        this.server = server;
        this.steamDemandFrac = loadFrac;
        pout.set(Signal.FEED_VALVE_DEMAND, plant.feedValvePositionFrac(), Quality.GOOD, 0.0);
        pout.setBool(Signal.PUMP_A_RUN, plant.pumpRunning(Plant.PUMP_A), Quality.GOOD, 0.0);
        pout.setBool(Signal.PUMP_B_RUN, plant.pumpRunning(Plant.PUMP_B), Quality.GOOD, 0.0);
        pout.setBool(Signal.FUEL_CUTOFF, false, Quality.GOOD, 0.0);
    }

    /** Change the steam demand to {@code frac} once the plant time reaches {@code atS}. */
    void scheduleLoadStep(double atS, double frac) {
        stepAtS = atS;
        stepToFrac = frac;
    }

    Plant plant() { return plant; }

    double steamDemandFrac() { return steamDemandFrac; }

    /** Publish the inputs at {@code tS} (call once before the first step). */
    void publish(double tS) {
        io.readInputs(pin, tS);
        server.publishInputs(pin, tS);
    }

    /** Apply the controller's outputs at {@code tS}, step the plant by {@code dtS}, publish at tS + dtS. */
    void step(double tS, double dtS) {
        if (tS >= stepAtS) {
            steamDemandFrac = stepToFrac;
            plant.setSteamDemand(stepToFrac);
            stepAtS = Double.POSITIVE_INFINITY;
        }
        server.collectOutputs(pout, tS);
        io.writeOutputs(pout, tS);
        plant.step(dtS);
        publish(tS + dtS);
    }
}
