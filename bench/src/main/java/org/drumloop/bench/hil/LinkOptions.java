package org.drumloop.bench.hil;

import org.drumloop.modbus.SerialSettings;
import org.drumloop.modbus.TcpEndpoint;

import picocli.CommandLine.Option;

/**
 * Where the Modbus link runs: TCP host:port, or an RTU serial line with its character format.
 * Shared by the commands that talk to a rig (drive-rig, live --rig).
 */
public final class LinkOptions {
    @Option(names = "--tcp", paramLabel = "HOST:PORT", description = "Modbus TCP address")
    String tcp;

    @Option(names = "--rtu", paramLabel = "DEVICE", description = "Modbus RTU on this serial device (e.g. /dev/ttyUSB0)")
    String rtu;

    @Option(names = "--baud", paramLabel = "N", defaultValue = "19200", description = "RTU baud rate (default ${DEFAULT-VALUE})")
    int baud;

    @Option(names = "--parity", paramLabel = "P", defaultValue = "even", description = "RTU parity none|even|odd (default ${DEFAULT-VALUE})")
    String parity;

    @Option(names = "--stop", paramLabel = "S", defaultValue = "1", description = "RTU stop bits 1|2 (default ${DEFAULT-VALUE})")
    int stop;

    @Option(names = "--unit", paramLabel = "ID", description = "Modbus unit id for every channel (default: as in the map)")
    Integer unit;

    /** Check the combination; returns a message or null when fine. */
    public String problem(String defaultTcp) {
        if (tcp != null && rtu != null) {
            return "give --tcp or --rtu, not both";
        }
        if (tcp == null && rtu == null && defaultTcp == null) {
            return "give --tcp HOST:PORT or --rtu DEVICE";
        }
        try {
            if (rtu != null) {
                serial();
            } else {
                tcp(defaultTcp);
            }
        } catch (IllegalArgumentException e) {
            return e.getMessage();
        }
        if (unit != null && (unit < 0 || unit > 255 || (rtu != null && (unit < 1 || unit > 247)))) {
            return "--unit: must be 1..247 on a serial line, 0..255 on TCP";
        }
        return null;
    }

    public boolean isRtu() { return rtu != null; }

    public TcpEndpoint tcp(String defaultTcp) { return TcpEndpoint.parse(tcp != null ? tcp : defaultTcp); }

    public SerialSettings serial() { return new SerialSettings(rtu, baud, SerialSettings.parity(parity), stop); }

    /** The unit id given with --unit, or null to keep the map's. */
    public Integer unit() { return unit; }
}
