package org.drumloop.plant;

import java.util.Objects;

/**
 * A fault to inject into the plant.
 *
 * <p>Targets: transmitter tags ({@code level_tx_a}, {@code level_tx_b}, {@code level_tx_c},
 * {@code steam_flow_tx}, {@code feed_flow_tx}, {@code pressure_tx}, {@code feed_temp_tx},
 * {@code feed_pressure_tx}) for STUCK, DRIFT, BIAS, FAIL_LOW, FAIL_HIGH and NOISE_BURST;
 * {@code feed_pump_a}/{@code feed_pump_b} for PUMP_TRIP; {@code feed_valve} for VALVE_STUCK;
 * {@code steam} for STEAM_SURGE; {@code drum} for TUBE_LEAK; {@code burner} for BURNER_TRIP.
 *
 * <p>Magnitude, in SI: DRIFT rate [unit of the transmitter's value per s], BIAS offset [unit of the
 * value], NOISE_BURST extra standard deviation [unit of the value], STEAM_SURGE extra steam demand
 * [fraction of rated flow], TUBE_LEAK water lost [kg/s]; ignored by the other kinds.
 *
 * @param durationS the fault clears itself after this time [s]; NaN, infinite or 0 = until cleared
 */
public record Fault(Kind kind, String target, double magnitude, double durationS) {

    public enum Kind { STUCK, DRIFT, BIAS, FAIL_LOW, FAIL_HIGH, NOISE_BURST, PUMP_TRIP, VALVE_STUCK,
                       STEAM_SURGE, TUBE_LEAK, BURNER_TRIP }

    public Fault {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(target, "target");
    }

    /** A fault that stays until cleared. */
    public static Fault of(Kind kind, String target, double magnitude) {
        return new Fault(kind, target, magnitude, Double.NaN);
    }
}
