package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** Each fault kind changes what it should, and clears. */
class PlantFaultTest {
    private static final double DT_S = 0.1;
    private Plant plant;
    private final List<String> events = new ArrayList<>();

    @BeforeEach
    void setUp() throws Exception {
        plant = new Plant(PlantFiles.aux(), 7);
        plant.setEventListener((t, tag, msg) -> events.add(tag));
    }

    private void run(double seconds) {
        int n = (int) Math.round(seconds / DT_S);
        for (int i = 0; i < n; i++) {
            plant.step(DT_S);
        }
    }

    @Test
    void stuckTransmitterFreezesItsOutput() {
        Transmitter t = plant.transmitter(TransmitterId.DRUM_PRESSURE);
        run(1);
        plant.inject(Fault.of(Fault.Kind.STUCK, "pressure_tx", 0));
        double frozen = t.value();
        plant.setSteamDemand(1.3);
        run(20);
        assertEquals(frozen, t.value(), 0.0, "no change while stuck");
        plant.clear(Fault.Kind.STUCK, "pressure_tx");
        run(1);
        assertTrue(Math.abs(t.value() - frozen) > 5_000, "follows the falling pressure again");
    }

    @Test
    void driftGrowsAtItsRateAndBiasOffsets() {
        Transmitter t = plant.transmitter(TransmitterId.FEED_TEMP);
        run(1);
        double before = t.value();
        plant.inject(Fault.of(Fault.Kind.DRIFT, "feed_temp_tx", 0.5));
        run(10);
        // 0.5 K/s for 10 s = 5 K; feed-temp noise 0.1 K (aux-boiler.plant): 1 K covers it
        assertEquals(before + 5, t.value(), 1.0);
        plant.clear(Fault.Kind.DRIFT, "feed_temp_tx");
        plant.inject(Fault.of(Fault.Kind.BIAS, "feed_temp_tx", -3));
        run(1);
        assertEquals(before - 3, t.value(), 1.0, "bias of -3 K");
    }

    @Test
    void failLowAndHighDriveNamurFailureCurrents() {
        Transmitter t = plant.transmitter(TransmitterId.LEVEL_B);
        plant.inject(Fault.of(Fault.Kind.FAIL_LOW, "level_tx_b", 0));
        run(0.2);
        // NAMUR NE 43: failure at <= 3.6 mA / >= 21 mA; this plant drives 3.5 / 21.5 mA exactly
        assertEquals(3.5, t.currentMa(), 0.0);
        assertTrue(t.failed());
        plant.clear(Fault.Kind.FAIL_LOW, "level_tx_b");
        plant.inject(Fault.of(Fault.Kind.FAIL_HIGH, "level_tx_b", 0));
        run(0.2);
        assertEquals(21.5, t.currentMa(), 0.0);
        plant.clearAll();
        run(0.2);
        assertFalse(t.failed());
        assertTrue(t.currentMa() >= 3.8 && t.currentMa() <= 20.5, "back inside the NE 43 measuring band");
    }

    @Test
    void measurementIsClippedToTheNamurBand() {
        Transmitter t = plant.transmitter(TransmitterId.FEED_FLOW);
        plant.inject(Fault.of(Fault.Kind.BIAS, "feed_flow_tx", 1e6));
        run(0.2);
        assertEquals(20.5, t.currentMa(), 0.0, "NE 43: measurement at most 20.5 mA");
        plant.inject(Fault.of(Fault.Kind.BIAS, "feed_flow_tx", -1e6));
        run(0.2);
        assertEquals(3.8, t.currentMa(), 0.0, "NE 43: measurement at least 3.8 mA");
    }

    @Test
    void noiseBurstRaisesScatterForItsDurationOnly() {
        Transmitter t = plant.transmitter(TransmitterId.LEVEL_A);
        plant.inject(new Fault(Fault.Kind.NOISE_BURST, "level_tx_a", 500, 5));
        double sum2 = 0;
        double mean = plant.transmitter(TransmitterId.LEVEL_B).value();
        for (int i = 0; i < 40; i++) {
            plant.step(DT_S);
            sum2 += Math.pow(t.value() - mean, 2);
        }
        double rms = Math.sqrt(sum2 / 40);
        // 500 Pa sigma, lagged by the 0.2 s transmitter time constant: well above the 10 Pa base
        assertTrue(rms > 100, "burst rms " + rms);
        run(2);
        double after = 0;
        for (int i = 0; i < 40; i++) {
            plant.step(DT_S);
            after += Math.pow(t.value() - plant.transmitter(TransmitterId.LEVEL_B).value(), 2);
        }
        assertTrue(Math.sqrt(after / 40) < 60, "burst over after 5 s");
    }

    @Test
    void pumpTripStopsFeedUntilStandbyStarts() {
        double qf0 = plant.feedFlowKgS();
        plant.inject(Fault.of(Fault.Kind.PUMP_TRIP, "feed_pump_a", 0));
        run(10);
        assertFalse(plant.pumpRunning(Plant.PUMP_A));
        assertEquals(0, plant.feedFlowKgS(), 1e-9, "no pump: no feed (check valve)");
        assertTrue(events.contains("feed_pump_a_trip"));
        plant.setPumpRunCommand(Plant.PUMP_B, true);
        run(10);
        assertTrue(plant.pumpRunning(Plant.PUMP_B));
        assertEquals(qf0, plant.feedFlowKgS(), 0.05 * qf0, "identical standby pump restores the flow");
        plant.clear(Fault.Kind.PUMP_TRIP, "feed_pump_a");
        run(1);
        assertFalse(plant.pumpRunning(Plant.PUMP_A), "a cleared trip needs a new run command");
        plant.setPumpRunCommand(Plant.PUMP_A, true);
        run(1);
        assertTrue(plant.pumpRunning(Plant.PUMP_A));
    }

    @Test
    void stuckValveIgnoresDemand() {
        double pos = plant.feedValvePositionFrac();
        plant.inject(Fault.of(Fault.Kind.VALVE_STUCK, "feed_valve", 0));
        plant.setFeedValveDemand(1.0);
        run(5);
        assertEquals(pos, plant.feedValvePositionFrac(), 0.0);
        plant.clear(Fault.Kind.VALVE_STUCK, "feed_valve");
        run(5);
        // stroke time 15 s (aux-boiler.plant): 5 s moves 1/3 of full travel at most
        assertEquals(Math.min(1, pos + 5.0 / 15), plant.feedValvePositionFrac(), 1e-9);
    }

    @Test
    void steamSurgeRaisesSteamFlowAndLeakDrainsWater() {
        double qs0 = plant.steamFlowKgS();
        plant.inject(new Fault(Fault.Kind.STEAM_SURGE, "steam", 0.2, 3));
        run(1);
        // +0.2 of rated demand at about nominal pressure: +20 % of rated flow, pressure sag < 5 %
        assertEquals(qs0 + 0.2 * plant.config().ratedSteamFlowKgS(), plant.steamFlowKgS(), 0.05 * qs0);
        run(3);
        assertEquals(qs0, plant.steamFlowKgS(), 0.05 * qs0, "surge over after its duration");
        plant.initSteadyState(1.0);
        double m0 = plant.totalMassKg();
        plant.inject(Fault.of(Fault.Kind.TUBE_LEAK, "drum", 0.5));
        plant.setFeedFlowOverrideKgS(plant.feedFlowKgS());
        plant.setSteamFlowOverrideKgS(plant.steamFlowKgS());
        run(10);
        // 0.5 kg/s for 10 s: 5 kg lost (mass balance, 1e-6 relative of inventory)
        assertEquals(m0 - 5, plant.totalMassKg(), 1e-6 * m0);
    }

    @Test
    void burnerTripCutsFuelThenPurgesAndRampsBack() {
        plant.inject(Fault.of(Fault.Kind.BURNER_TRIP, "burner", 0));
        plant.step(DT_S);
        assertEquals(0, plant.firingFrac(), 0.0, "fuel cut at once");
        assertFalse(plant.burnerOn());
        run(10);
        assertTrue(plant.heatW() < 0.2 * plant.config().maxHeatW(), "heat decays with the burner lag (5 s)");
        plant.clear(Fault.Kind.BURNER_TRIP, "burner");
        run(20);
        assertEquals(0, plant.firingFrac(), 0.0, "still purging (30 s)");
        run(15);
        assertTrue(plant.burnerOn() && plant.firingFrac() > 0, "relit and ramping");
        assertTrue(plant.firingFrac() <= 6.0 / 30 + 1e-9, "ramp limit: 30 s to full firing");
        assertTrue(events.contains("burner_trip") && events.contains("burner_restart"));
    }

    @Test
    void fuelCutoffInputActsLikeATrip() {
        plant.setFuelCutoff(true);
        plant.step(DT_S);
        assertEquals(0, plant.firingFrac(), 0.0);
        assertTrue(events.contains("fuel_cutoff"));
    }

    @Test
    void unknownTargetsAreRejected() {
        assertThrows(IllegalArgumentException.class, () -> plant.inject(Fault.of(Fault.Kind.BIAS, "nope", 1)));
        assertThrows(IllegalArgumentException.class, () -> plant.inject(Fault.of(Fault.Kind.PUMP_TRIP, "feed_pump_c", 0)));
    }

    @Test
    void feedStoppedAtFullSteamUncoversRisersWithoutNaN() {
        plant.inject(Fault.of(Fault.Kind.PUMP_TRIP, "feed_pump_a", 0));
        plant.setSteamDemand(1.4);
        for (int i = 0; i < 20_000 && !plant.invalid(); i++) {
            plant.step(DT_S);
        }
        assertTrue(plant.invalid(), "model left its valid range");
        assertTrue(events.contains("risers_uncovered"), events.toString());
        run(600);
        assertTrue(Double.isFinite(plant.levelM()) && Double.isFinite(plant.drumPressurePa()), "keeps stepping safely");
        assertTrue(plant.levelM() >= plant.config().drumBottomLevelM() - 1e-9, "level clamped to the drum");
        for (TransmitterId id : TransmitterId.values()) {
            assertTrue(Double.isFinite(plant.transmitter(id).currentMa()), id.tag());
        }
    }

    @Test
    void overfeedingFloodsTheDrumWithoutNaN() {
        plant.setSteamDemand(0.2);
        plant.setFeedValveDemand(1.0);
        for (int i = 0; i < 20_000 && !events.contains("drum_flooded"); i++) {
            plant.step(DT_S);
        }
        assertTrue(events.contains("drum_flooded"), events.toString());
        assertTrue(plant.invalid());
        run(300);
        assertTrue(Double.isFinite(plant.levelM()));
        assertTrue(plant.levelM() <= plant.config().drumTopLevelM() + 1e-9);
    }

    @Test
    void safetyValveLiftsAndReseats() {
        plant.setFiringManual(1.0);
        plant.setSteamDemand(0.3);
        for (int i = 0; i < 30_000 && !events.contains("safety_valve_lift"); i++) {
            plant.step(DT_S);
        }
        assertTrue(events.contains("safety_valve_lift"));
        assertTrue(plant.safetyValveFlowKgS() > 0);
        plant.setFiringManual(0.2);
        plant.setSteamDemand(1.0);
        for (int i = 0; i < 30_000 && !events.contains("safety_valve_reseat"); i++) {
            plant.step(DT_S);
        }
        assertTrue(events.contains("safety_valve_reseat"));
        assertEquals(0, plant.safetyValveFlowKgS(), 0.0);
    }
    @Test
    void pressureFallingToAtmosphericIsClampedAndReported() {
        plant.setFiringManual(0);
        plant.setSteamFlowOverrideKgS(plant.steamFlowKgS());
        plant.setFeedFlowOverrideKgS(plant.feedFlowKgS());
        for (int i = 0; i < 40_000 && !events.contains("pressure_low"); i++) {
            plant.step(DT_S);
        }
        assertTrue(events.contains("pressure_low"), events.toString());
        assertTrue(events.contains("drum_flooded"), "flashing swells the drum full on the way: " + events);
        run(60);
        assertEquals(Plant.MIN_PRESSURE_PA, plant.drumPressurePa(), 0.0, "clamped just above one atmosphere");
        assertTrue(plant.invalid() && Double.isFinite(plant.levelM()));
    }

    @Test
    void colderFeedShrinksTheLevel() {
        // a sudden drop in feed temperature collapses bubbles, so the level shrinks at first
        // (check-values §6, from memory, unverified; also what the model's condensation term gives)
        plant.setFeedFlowOverrideKgS(plant.feedFlowKgS());
        plant.setSteamFlowOverrideKgS(plant.steamFlowKgS());
        plant.setFiringManual(plant.firingFrac());
        double hf0 = plant.feedEnthalpyJKg();
        plant.setFeedTemperatureK(40 + 273.15);
        run(30);
        assertTrue(plant.feedEnthalpyJKg() < hf0 - 150e3, "feed enthalpy follows the temperature (IF97 region 1)");
        assertTrue(plant.levelM() < -0.02, "level shrinks: " + plant.levelM());
    }
}
