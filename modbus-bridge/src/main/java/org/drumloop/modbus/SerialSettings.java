package org.drumloop.modbus;

import java.util.Locale;

/**
 * A serial line for Modbus RTU: device, baud rate, parity and stop bits (8 data bits always).
 * The serial guide's default is even parity, 1 stop bit; with no parity use 2 stop bits to keep
 * 11-bit characters.
 *
 * @param device OS device name or path, e.g. /dev/ttyUSB0 or COM3
 * @param baud bits per second
 * @param parity none, even or odd
 * @param stopBits 1 or 2
 */
public record SerialSettings(String device, int baud, Parity parity, int stopBits) {
    public enum Parity { NONE, EVEN, ODD }

    public SerialSettings {
        if (device == null || device.isBlank()) {
            throw new IllegalArgumentException("serial device missing");
        }
        if (baud <= 0) {
            throw new IllegalArgumentException("baud rate must be positive: " + baud);
        }
        if (stopBits != 1 && stopBits != 2) {
            throw new IllegalArgumentException("stop bits must be 1 or 2: " + stopBits);
        }
    }

    /** Parse none/even/odd or N/E/O. */
    public static Parity parity(String s) {
        switch (s.toUpperCase(Locale.ROOT)) {
            case "N": case "NONE": return Parity.NONE;
            case "E": case "EVEN": return Parity.EVEN;
            case "O": case "ODD": return Parity.ODD;
            default: throw new IllegalArgumentException("parity must be none, even or odd: " + s);
        }
    }
}
