package org.drumloop.modbus.server;

/**
 * Resource limits of a Modbus TCP server.
 *
 * @param maxConnections connections served at once; when one more arrives, the connection idle
 *                       longest is closed to admit it (1..{@value #MAX_CONNECTIONS})
 * @param idleTimeoutS a connection that sends no whole request for this long is closed [s]
 *                     (0.1 s..1 day)
 */
public record ServerLimits(int maxConnections, double idleTimeoutS) {
    /** Upper bound of {@code maxConnections}. */
    public static final int MAX_CONNECTIONS = 256;
    /** Default connections at once: as many as a PLC's Modbus TCP port typically allows, a handful (common practice). */
    public static final int DEFAULT_MAX_CONNECTIONS = 8;
    /** Default idle timeout [s]. */
    public static final int DEFAULT_IDLE_TIMEOUT_S = 60;
    /** The defaults. */
    public static final ServerLimits DEFAULT = new ServerLimits(DEFAULT_MAX_CONNECTIONS, DEFAULT_IDLE_TIMEOUT_S);

    public ServerLimits {
        if (maxConnections < 1 || maxConnections > MAX_CONNECTIONS) {
            throw new IllegalArgumentException("--max-connections must be 1.." + MAX_CONNECTIONS + ": " + maxConnections);
        }
        if (!(idleTimeoutS >= 0.1 && idleTimeoutS <= 86_400)) {
            throw new IllegalArgumentException("--idle-timeout must be 0.1..86400 s: " + idleTimeoutS);
        }
    }
}
