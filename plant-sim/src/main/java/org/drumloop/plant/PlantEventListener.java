package org.drumloop.plant;

/**
 * Receives the plant's rare events (risers uncovered, safety valve lift and reseat, pump start, stop
 * and trip, burner trip and restart). Called from inside {@link Plant#step(double)}: tags and
 * messages are constant strings, so a listener that only records them allocates nothing.
 */
@FunctionalInterface
public interface PlantEventListener {
    /**
     * @param tS plant time of the event [s]
     * @param tag short machine-readable name, for example {@code safety_valve_lift}
     * @param message one sentence for a person
     */
    void onEvent(double tS, String tag, String message);
}
