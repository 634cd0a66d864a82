package org.drumloop.bench.hil;

import org.drumloop.modbus.server.ServerLimits;

import picocli.CommandLine.Option;

/** The resource limits of a Modbus TCP server, for every command that serves one. */
public final class ServerOptions {
    @Option(names = "--max-connections", paramLabel = "N", defaultValue = "" + ServerLimits.DEFAULT_MAX_CONNECTIONS,
            description = "Modbus TCP connections served at once; one more closes the connection idle longest"
                    + " (default ${DEFAULT-VALUE})")
    int maxConnections;

    @Option(names = "--idle-timeout", paramLabel = "S", defaultValue = "" + ServerLimits.DEFAULT_IDLE_TIMEOUT_S,
            description = "close a Modbus TCP connection that sends no request for this many seconds (default ${DEFAULT-VALUE})")
    double idleTimeoutS;

    /** Names of the options, for commands that refuse them in some modes. */
    public static final String[] NAMES = {"--max-connections", "--idle-timeout"};

    /** The limits, or an IllegalArgumentException naming the option out of range. */
    public ServerLimits limits() { return new ServerLimits(maxConnections, idleTimeoutS); }

    /** A message when a value is out of range, else null. */
    public String problem() {
        try {
            limits();
            return null;
        } catch (IllegalArgumentException e) {
            return e.getMessage();
        }
    }
}
