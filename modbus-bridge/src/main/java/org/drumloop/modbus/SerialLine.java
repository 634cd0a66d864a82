package org.drumloop.modbus;

import java.io.IOException;

import com.fazecast.jSerialComm.SerialPort;

/**
 * An open serial port (jSerialComm kept inside this class): 8 data bits, the given parity and stop
 * bits, reads that wait at most {@code readTimeoutMs} for the first byte.
 */
public final class SerialLine implements AutoCloseable {
    private final SerialPort port;
    private final SerialSettings settings;

    private SerialLine(SerialPort port, SerialSettings settings) {
        this.port = port;
        this.settings = settings;
    }

    /** Open the device or throw an IOException naming it. */
    public static SerialLine open(SerialSettings s, int readTimeoutMs) throws IOException {
        SerialPort p;
        try {
            p = SerialPort.getCommPort(s.device());
        } catch (RuntimeException e) {
            throw new IOException("no serial device " + s.device() + ": " + e.getMessage(), e);
        }
        int parity = switch (s.parity()) {
            case NONE -> SerialPort.NO_PARITY;
            case EVEN -> SerialPort.EVEN_PARITY;
            case ODD -> SerialPort.ODD_PARITY;
        };
        p.setComPortParameters(s.baud(), 8, s.stopBits() == 2 ? SerialPort.TWO_STOP_BITS : SerialPort.ONE_STOP_BIT, parity);
        p.setComPortTimeouts(SerialPort.TIMEOUT_READ_SEMI_BLOCKING | SerialPort.TIMEOUT_WRITE_BLOCKING,
                Math.max(1, readTimeoutMs), 1000);
        if (!p.openPort()) {
            throw new IOException("cannot open serial device " + s.device());
        }
        return new SerialLine(p, s);
    }

    public SerialSettings settings() { return settings; }

    /** Read what is there, waiting up to the read timeout for the first byte; 0 on timeout, -1 on error. */
    public int read(byte[] buf, int off, int len) { return port.readBytes(buf, len, off); }

    /** Write all bytes; false when the port failed. */
    public boolean write(byte[] buf, int off, int len) { return port.writeBytes(buf, len, off) == len; }

    @Override
    public void close() { port.closePort(); }
}
