package org.drumloop.modbus.server;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.net.SocketTimeoutException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.locks.LockSupport;

import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.frame.Mbap;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.stats.LinkStatistics;
import org.drumloop.modbus.stats.ProblemLog;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.event.Level;

/**
 * Modbus TCP transport of an {@link ImageServer}: blocking sockets served by a pool of at most
 * {@link ServerLimits#maxConnections()} threads, one per open connection, MBAP framing. The
 * acceptor thread admits connections ({@link Connections}: the limit, eviction of the connection
 * idle longest) and closes idle ones. A header that cannot start a Modbus ADU (protocol id not 0,
 * length out of 2..254) closes the connection, as the TCP guide expects.
 */
final class TcpServer implements AutoCloseable {
    private static final Logger LOG = LoggerFactory.getLogger(TcpServer.class);
    /** Pause after a failed accept [ns]. */
    private static final long ACCEPT_BACKOFF_NS = 50_000_000L;

    private final ServedImage image;
    private final ServerSocket listener;
    private final Connections connections;
    private final LinkStatistics stats;
    private final ProblemLog problems;
    private final ProblemLog.Kind badHeader;
    private final ProblemLog.Kind acceptFailed;
    private final ExecutorService pool;
    private final Thread acceptor;
    private volatile boolean open = true;

    TcpServer(ServedImage image, ServerLimits limits, String host, int port, ProblemLog problems)
            throws IOException {
        this.image = image;
        this.problems = problems;
        this.badHeader = problems.kind("connections closed for a bad header", Level.WARN);
        this.acceptFailed = problems.kind("failed accepts", Level.WARN);
        listener = new ServerSocket();
        listener.setReuseAddress(true);
        listener.bind(new InetSocketAddress(InetAddress.getByName(host), port), 256);
        String name = "server tcp " + new TcpEndpoint(listener.getInetAddress().getHostAddress(), listener.getLocalPort());
        stats = new LinkStatistics(name);
        connections = new Connections(limits, stats, problems, name, System.nanoTime());
        listener.setSoTimeout((int) Math.max(1, connections.checkPeriodNs() / 1_000_000));
        AtomicInteger n = new AtomicInteger();
        ThreadPoolExecutor p = new ThreadPoolExecutor(limits.maxConnections(), limits.maxConnections(), 30, TimeUnit.SECONDS,
                new LinkedBlockingQueue<>(), r -> {
                    Thread t = new Thread(r, "modbus-tcp-" + listener.getLocalPort() + "-conn-" + n.incrementAndGet());
                    t.setDaemon(true);
                    return t;
                });
        p.allowCoreThreadTimeOut(true);
        pool = p;
        acceptor = new Thread(this::acceptLoop, "modbus-tcp-accept-" + listener.getLocalPort());
        acceptor.setDaemon(true);
        acceptor.start();
    }

    LinkStatistics statistics() { return stats; }

    int port() { return listener.getLocalPort(); }

    private void acceptLoop() {
        long nextCheckNs = System.nanoTime();
        while (open) {
            Socket s = null;
            try {
                s = listener.accept();
            } catch (SocketTimeoutException e) {
                // housekeeping below
            } catch (IOException e) {
                if (open) {
                    // out of file descriptors, say: report it and give the system a moment, rather than spin
                    acceptFailed.report("accept failed: {}", e.toString());
                    LockSupport.parkNanos(ACCEPT_BACKOFF_NS);
                }
            }
            long now = System.nanoTime();
            if (now - nextCheckNs >= 0) {
                connections.closeIdle(now);
                problems.flushDue();
                nextCheckNs = now + connections.checkPeriodNs();
            }
            if (s != null) {
                admit(s, now);
            }
        }
    }

    private void admit(Socket s, long now) {
        try {
            s.setTcpNoDelay(true);
        } catch (IOException e) {
            LOG.debug("no TCP_NODELAY: {}", e.toString());
        }
        Connections.Conn c = connections.admit(String.valueOf(s.getRemoteSocketAddress()).replaceFirst("^/", ""),
                () -> closeQuietly(s), now);
        pool.execute(() -> serve(s, c));
    }

    private void serve(Socket s, Connections.Conn c) {
        byte[] req = new byte[Modbus.MAX_TCP_ADU];
        byte[] resp = new byte[Modbus.MAX_TCP_ADU];
        String how = "server closed";
        try (s; InputStream in = new BufferedInputStream(s.getInputStream());
             OutputStream out = new BufferedOutputStream(s.getOutputStream())) {
            while (open) {
                int got = readFully(in, req, 0, Modbus.MBAP_LENGTH);
                if (got < Modbus.MBAP_LENGTH) {
                    how = got == 0 ? "client closed" : truncated(c);
                    break;
                }
                if (!Mbap.plausible(req, 0)) {
                    how = "bad header";
                    c.stats.badFrame();
                    Mbap h = Mbap.decode(req, 0);
                    badHeader.report("{}: closed connection {} from {}: not a Modbus header (protocol id {}, length {})",
                            connections.name, c.id, c.peer, h.protocolId(), h.length());
                    break;
                }
                int len = Mbap.pduLength(req, 0);
                if (readFully(in, req, Modbus.MBAP_LENGTH, len) < len) {
                    how = truncated(c);
                    break;
                }
                int n = TcpAdu.answer(image, req, resp, c.stats);
                c.lastRequestNs = System.nanoTime();
                out.write(resp, 0, n);
                out.flush();
            }
        } catch (IOException e) {
            how = "I/O error";
            if (open && !c.closedByServer()) {
                c.stats.ioError();
                LOG.debug("{} ended: {}", c.stats.name(), e.toString());
            }
        }
        connections.ended(c, System.nanoTime(), how);
    }

    /** The client closed after part of a frame: a bad frame. */
    private static String truncated(Connections.Conn c) {
        c.stats.badFrame();
        return "client closed inside a frame";
    }

    /** Read up to {@code len} bytes, stopping early only at the end of the stream; returns the count read. */
    private static int readFully(InputStream in, byte[] b, int off, int len) throws IOException {
        int done = 0;
        while (done < len) {
            int n = in.read(b, off + done, len - done);
            if (n < 0) {
                return done;
            }
            done += n;
        }
        return done;
    }

    private static void closeQuietly(Socket s) {
        try {
            s.close();
        } catch (IOException e) {
            LOG.debug("close: {}", e.toString());
        }
    }

    @Override
    public void close() {
        open = false;
        try {
            listener.close();
        } catch (IOException e) {
            LOG.debug("close listener: {}", e.toString());
        }
        try {
            acceptor.join(2000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        connections.closeAll(System.nanoTime());
        pool.shutdown();
        try {
            pool.awaitTermination(2, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        problems.flush();
    }
}
