package org.drumloop.core.io;

/**
 * The firmware's only view of the field. Whoever sits behind it (simulated plant, Modbus rig)
 * fills inputs and takes outputs; the scan never knows which.
 *
 * <p>Implementations must not block the scan: a lost connection shows up as BAD/stale quality,
 * never as a thrown exception or a wait.
 */
public interface ProcessIo {
    /** Fill the {@link Signal.Direction#TO_CONTROLLER} signals of {@code in} for the scan at {@code tS}. */
    void readInputs(ProcessImage in, double tS);

    /** Take the {@link Signal.Direction#FROM_CONTROLLER} signals of {@code out} computed at {@code tS}. */
    void writeOutputs(ProcessImage out, double tS);
}
