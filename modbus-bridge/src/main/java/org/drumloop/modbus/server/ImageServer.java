package org.drumloop.modbus.server;

import java.io.IOException;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.modbus.SerialSettings;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.stats.LinkStatistics;
import org.drumloop.modbus.stats.ProblemLog;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Serves a process image as a Modbus server (slave) over TCP or RTU, laid out by a channel map.
 * Signals the controller reads ({@code to_controller}) are readable; signals it writes
 * ({@code from_controller}) are writable. See {@link ServedImage} for the access rules and
 * exception codes.
 *
 * <p>The plant loop calls {@link #publishInputs} and {@link #collectOutputs} every step; both copy
 * under a short lock and never wait on the network.
 */
public final class ImageServer implements AutoCloseable {
    private static final Logger LOG = LoggerFactory.getLogger(ImageServer.class);
    private final ServedImage image;
    private final LinkStatistics stats;
    private final AutoCloseable transport;
    private final int port;

    private ImageServer(ServedImage image, LinkStatistics stats, AutoCloseable transport, int port) {
        this.image = image;
        this.stats = stats;
        this.transport = transport;
        this.port = port;
    }

    /**
     * Serve over Modbus TCP on {@code endpoint} (port 0 picks a free port; see {@link #port()}) with
     * the default limits.
     */
    public static ImageServer tcp(ChannelMap map, TcpEndpoint endpoint) throws IOException {
        return tcp(map, endpoint, ServerLimits.DEFAULT);
    }

    /** Serve over Modbus TCP on {@code endpoint} with at most {@code limits} connections and their idle timeout. */
    public static ImageServer tcp(ChannelMap map, TcpEndpoint endpoint, ServerLimits limits) throws IOException {
        ProblemLog problems = new ProblemLog(LOG);
        ServedImage img = new ServedImage(map, problems);
        TcpServer t = new TcpServer(img, limits, endpoint.host(), endpoint.port(), problems);
        return new ImageServer(img, t.statistics(), t, t.port());
    }

    /** Serve over Modbus RTU on a serial line. */
    public static ImageServer rtu(ChannelMap map, SerialSettings serial) throws IOException {
        ProblemLog problems = new ProblemLog(LOG);
        ServedImage img = new ServedImage(map, problems);
        LinkStatistics st = new LinkStatistics("server rtu " + serial.device());
        return new ImageServer(img, st, new RtuServer(img, st, serial, problems), -1);
    }

    /** Bound TCP port, or -1 for RTU. */
    public int port() { return port; }

    public void publishInputs(ProcessImage in, double tS) { image.publishInputs(in, tS); }

    public void collectOutputs(ProcessImage out, double tS) { image.collectOutputs(out, tS); }

    /** The served tables and request handler. */
    public ServedImage image() { return image; }

    public LinkStatistics statistics() { return stats; }

    @Override
    public void close() {
        try {
            transport.close();
        } catch (Exception e) {
            throw new IllegalStateException("closing the Modbus server failed", e);
        }
    }
}
