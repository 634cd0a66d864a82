package org.drumloop.modbus.client;

import org.drumloop.modbus.map.Table;

/**
 * A Modbus client (master) connection as {@link RigClient} needs it: our own types only.
 * Registers are ints 0..0xFFFF, bits 0/1. Failures are {@link LinkException}s.
 */
public interface MasterLink extends AutoCloseable {
    void connect() throws LinkException;

    void disconnect();

    boolean isConnected();

    /** Read {@code qty} registers (input or holding) into {@code out[0..qty)}. */
    void readRegisters(Table table, int unitId, int address, int qty, int[] out) throws LinkException;

    /** Read {@code qty} bits (coils or discrete inputs) into {@code out[0..qty)}. */
    void readBits(Table table, int unitId, int address, int qty, int[] out) throws LinkException;

    /** Write holding registers {@code values[0..qty)} from {@code address}. */
    void writeRegisters(int unitId, int address, int qty, int[] values) throws LinkException;

    /** Write coils {@code bits[0..qty)} from {@code address}. */
    void writeCoils(int unitId, int address, int qty, int[] bits) throws LinkException;

    /** A short name for logs and statistics. */
    String describe();

    @Override
    default void close() { disconnect(); }
}
