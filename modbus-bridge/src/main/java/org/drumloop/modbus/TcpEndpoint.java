package org.drumloop.modbus;

/**
 * A Modbus TCP address.
 *
 * @param host name or literal address
 * @param port 0..65535 (0 = any free port, for servers)
 */
public record TcpEndpoint(String host, int port) {
    public TcpEndpoint {
        if (port < 0 || port > 65535) {
            throw new IllegalArgumentException("port must be 0..65535: " + port);
        }
    }

    /** Parse {@code host:port}, {@code [v6]:port} or a bare port (host 127.0.0.1). */
    public static TcpEndpoint parse(String s) {
        int colon = s.lastIndexOf(':');
        try {
            if (colon < 0) {
                return new TcpEndpoint("127.0.0.1", Integer.parseInt(s));
            }
            String host = s.substring(0, colon);
            if (host.startsWith("[") && host.endsWith("]")) {
                host = host.substring(1, host.length() - 1);
            }
            return new TcpEndpoint(host.isEmpty() ? "127.0.0.1" : host, Integer.parseInt(s.substring(colon + 1)));
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("expected HOST:PORT, got '" + s + "'", e);
        }
    }

    @Override
    public String toString() { return (host.contains(":") ? "[" + host + "]" : host) + ":" + port; }
}
