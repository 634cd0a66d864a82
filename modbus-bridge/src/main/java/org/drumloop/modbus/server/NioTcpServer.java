package org.drumloop.modbus.server;

import java.io.IOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.StandardSocketOptions;
import java.nio.ByteBuffer;
import java.nio.channels.ClosedSelectorException;
import java.nio.channels.SelectionKey;
import java.nio.channels.Selector;
import java.nio.channels.ServerSocketChannel;
import java.nio.channels.SocketChannel;
import java.util.Iterator;
import java.util.concurrent.ConcurrentLinkedQueue;

import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.frame.Mbap;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.stats.LinkStatistics;
import org.drumloop.modbus.stats.ProblemLog;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.event.Level;

/**
 * Modbus TCP transport of an {@link ImageServer} on one thread: a selector serves every
 * connection (non-blocking channels), admits and evicts through {@link Connections}, and closes
 * idle connections. A peer that does not read its answers stops being read until they drain.
 */
final class NioTcpServer implements AutoCloseable {
    private static final Logger LOG = LoggerFactory.getLogger(NioTcpServer.class);

    private final ServedImage image;
    private final ServerSocketChannel listener;
    private final Selector selector;
    private final Connections connections;
    private final LinkStatistics stats;
    private final ProblemLog problems;
    private final ProblemLog.Kind badHeader;
    private final ConcurrentLinkedQueue<SelectionKey> toClose = new ConcurrentLinkedQueue<>();
    private final Thread loop;
    private final int port;
    private volatile boolean open = true;

    /** Per connection: its registry entry and buffers. */
    private static final class Link {
        final Connections.Conn conn;
        final ByteBuffer in = ByteBuffer.allocate(2 * Modbus.MAX_TCP_ADU);
        final ByteBuffer out = ByteBuffer.allocate(4 * Modbus.MAX_TCP_ADU);
        final byte[] req = new byte[Modbus.MAX_TCP_ADU];
        final byte[] resp = new byte[Modbus.MAX_TCP_ADU];

        Link(Connections.Conn conn) { this.conn = conn; }
    }

    NioTcpServer(ServedImage image, ServerLimits limits, String host, int port, ProblemLog problems)
            throws IOException {
        this.image = image;
        this.problems = problems;
        this.badHeader = problems.kind("connections closed for a bad header", Level.WARN);
        selector = Selector.open();
        listener = ServerSocketChannel.open();
        listener.setOption(StandardSocketOptions.SO_REUSEADDR, true);
        listener.bind(new InetSocketAddress(InetAddress.getByName(host), port), 50);
        listener.configureBlocking(false);
        listener.register(selector, SelectionKey.OP_ACCEPT);
        InetSocketAddress local = (InetSocketAddress) listener.getLocalAddress();
        this.port = local.getPort();
        String name = "server tcp " + new TcpEndpoint(local.getAddress().getHostAddress(), this.port);
        stats = new LinkStatistics(name);
        connections = new Connections(limits, stats, problems, name, System.nanoTime());
        loop = new Thread(this::run, "modbus-tcp-" + this.port);
        loop.setDaemon(true);
        loop.start();
    }

    LinkStatistics statistics() { return stats; }

    int port() { return port; }

    private void run() {
        long periodMs = Math.max(1, connections.checkPeriodNs() / 1_000_000);
        long nextCheckNs = System.nanoTime();
        try {
            while (open) {
                selector.select(periodMs);
                Iterator<SelectionKey> it = selector.selectedKeys().iterator();
                while (it.hasNext()) {
                    SelectionKey k = it.next();
                    it.remove();
                    if (!k.isValid()) {
                        continue;
                    }
                    if (k.isAcceptable()) {
                        accept();
                    } else {
                        service(k);
                    }
                }
                SelectionKey k;
                while ((k = toClose.poll()) != null) {
                    closeChannel(k);
                }
                long now = System.nanoTime();
                if (now - nextCheckNs >= 0) {
                    connections.closeIdle(now);
                    while ((k = toClose.poll()) != null) {
                        closeChannel(k);
                    }
                    problems.flushDue();
                    nextCheckNs = now + connections.checkPeriodNs();
                }
            }
        } catch (IOException | ClosedSelectorException e) {
            if (open) {
                LOG.warn("Modbus TCP server on port {} stopped: {}", port, e.toString());
            }
        }
    }

    private void accept() throws IOException {
        SocketChannel ch;
        while ((ch = listener.accept()) != null) {
            ch.configureBlocking(false);
            ch.setOption(StandardSocketOptions.TCP_NODELAY, true);
            SelectionKey key = ch.register(selector, SelectionKey.OP_READ);
            String peer = String.valueOf(ch.getRemoteAddress()).replaceFirst("^/", "");
            Connections.Conn c = connections.admit(peer, () -> toClose.add(key), System.nanoTime());
            key.attach(new Link(c));
            SelectionKey victim;
            while ((victim = toClose.poll()) != null) {
                closeChannel(victim);
            }
        }
    }

    private void service(SelectionKey k) {
        Link l = (Link) k.attachment();
        SocketChannel ch = (SocketChannel) k.channel();
        String how = null;
        try {
            if (k.isWritable()) {
                if (drain(k, ch, l)) {
                    how = process(k, ch, l);
                }
            } else if (k.isReadable()) {
                int n = ch.read(l.in);
                if (n < 0) {
                    how = l.in.position() == 0 ? "client closed" : truncated(l);
                } else {
                    how = process(k, ch, l);
                }
            }
        } catch (IOException e) {
            how = "I/O error";
            if (!l.conn.closedByServer()) {
                l.conn.stats.ioError();
                LOG.debug("{} ended: {}", l.conn.stats.name(), e.toString());
            }
        }
        if (how != null) {
            closeChannel(k);
            connections.ended(l.conn, System.nanoTime(), how);
        }
    }

    /**
     * Answer the whole requests in the input buffer and send the answers; when the peer does not
     * take them, stop reading until they drain. Returns why to close, or null to keep going.
     */
    private String process(SelectionKey k, SocketChannel ch, Link l) throws IOException {
        while (true) {
            int waiting = answerAll(l);
            if (waiting < 0) {
                return "bad header";
            }
            if (!drain(k, ch, l) || waiting == 0) {
                return null;
            }
        }
    }

    /**
     * Answer requests from the input buffer while the output buffer has room. Returns -1 after a
     * bad header, else the bytes of whole requests still waiting for room.
     */
    private int answerAll(Link l) {
        ByteBuffer in = l.in;
        in.flip();
        try {
            while (in.remaining() >= Modbus.MBAP_LENGTH) {
                in.get(in.position(), l.req, 0, Modbus.MBAP_LENGTH);
                if (!Mbap.plausible(l.req, 0)) {
                    l.conn.stats.badFrame();
                    badHeader.report("closing {} from {}: not a Modbus header {}", l.conn.stats.name(), l.conn.peer,
                            Mbap.decode(l.req, 0));
                    return -1;
                }
                int total = Modbus.MBAP_LENGTH + Mbap.pduLength(l.req, 0);
                if (in.remaining() < total) {
                    return 0;
                }
                if (l.out.remaining() < Modbus.MAX_TCP_ADU) {
                    return total;
                }
                in.get(l.req, 0, total);
                int n = TcpAdu.answer(image, l.req, l.resp, l.conn.stats);
                l.conn.lastRequestNs = System.nanoTime();
                l.out.put(l.resp, 0, n);
            }
            return 0;
        } finally {
            in.compact();
        }
    }

    /** Write what is pending; true when everything went out (then reading goes on). */
    private boolean drain(SelectionKey k, SocketChannel ch, Link l) throws IOException {
        if (l.out.position() == 0) {
            k.interestOps(SelectionKey.OP_READ);
            return true;
        }
        l.out.flip();
        ch.write(l.out);
        boolean done = !l.out.hasRemaining();
        l.out.compact();
        k.interestOps(done ? SelectionKey.OP_READ : SelectionKey.OP_WRITE);
        return done;
    }

    private static String truncated(Link l) {
        l.conn.stats.badFrame();
        return "client closed inside a frame";
    }

    private static void closeChannel(SelectionKey k) {
        k.cancel();
        try {
            k.channel().close();
        } catch (IOException e) {
            LOG.debug("close: {}", e.toString());
        }
    }

    @Override
    public void close() {
        open = false;
        selector.wakeup();
        try {
            loop.join(2000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        connections.closeAll(System.nanoTime());
        for (SelectionKey k : selector.keys()) {
            closeChannel(k);
        }
        try {
            listener.close();
            selector.close();
        } catch (IOException e) {
            LOG.debug("close: {}", e.toString());
        }
        problems.flush();
    }
}
