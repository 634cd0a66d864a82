package org.drumloop.modbus.server;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;

import org.drumloop.modbus.frame.Mbap;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.stats.LinkStatistics;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Modbus TCP transport of an {@link ImageServer}: plain sockets, one thread per connection, MBAP
 * framing. A header that cannot start a Modbus ADU (protocol id not 0, length out of 2..254)
 * closes the connection, as the TCP guide expects. A unit id without channels answers exception
 * 0x0B (gateway target failed to respond).
 */
final class TcpServer implements AutoCloseable {
    private static final Logger LOG = LoggerFactory.getLogger(TcpServer.class);

    private final ServedImage image;
    private final LinkStatistics stats;
    private final ServerSocket listener;
    private final Set<Socket> clients = ConcurrentHashMap.newKeySet();
    private final Thread acceptor;
    private volatile boolean open = true;

    TcpServer(ServedImage image, LinkStatistics stats, String host, int port) throws IOException {
        this.image = image;
        this.stats = stats;
        listener = new ServerSocket();
        listener.setReuseAddress(true);
        listener.bind(new InetSocketAddress(InetAddress.getByName(host), port), 50);
        acceptor = new Thread(this::acceptLoop, "modbus-tcp-accept-" + listener.getLocalPort());
        acceptor.setDaemon(true);
        acceptor.start();
    }

    int port() { return listener.getLocalPort(); }

    private void acceptLoop() {
        int n = 0;
        while (open) {
            try {
                Socket s = listener.accept();
                s.setTcpNoDelay(true);
                clients.add(s);
                Thread t = new Thread(() -> serve(s), "modbus-tcp-conn-" + (++n));
                t.setDaemon(true);
                t.start();
            } catch (IOException e) {
                if (open) {
                    LOG.warn("accept failed: {}", e.toString());
                }
            }
        }
    }

    private void serve(Socket s) {
        byte[] req = new byte[Modbus.MAX_TCP_ADU];
        byte[] resp = new byte[Modbus.MAX_TCP_ADU];
        try (s; InputStream in = new BufferedInputStream(s.getInputStream());
             OutputStream out = new BufferedOutputStream(s.getOutputStream())) {
            while (open) {
                readFully(in, req, 0, Modbus.MBAP_LENGTH);
                Mbap h = Mbap.decode(req, 0);
                if (!h.plausible()) {
                    LOG.warn("closing {}: not a Modbus header {}", s.getRemoteSocketAddress(), h);
                    return;
                }
                readFully(in, req, Modbus.MBAP_LENGTH, h.pduLength());
                long t0 = System.nanoTime();
                stats.request();
                int n = image.handle(h.unitId(), req, Modbus.MBAP_LENGTH, h.pduLength(), resp, Modbus.MBAP_LENGTH);
                if (n < 0) {
                    n = ServedImage.exception(resp, Modbus.MBAP_LENGTH, req[Modbus.MBAP_LENGTH] & 0xFF,
                            Modbus.EX_GATEWAY_TARGET_NO_RESPONSE);
                }
                if ((resp[Modbus.MBAP_LENGTH] & Modbus.EXCEPTION_FLAG) != 0) {
                    stats.exception(resp[Modbus.MBAP_LENGTH + 1]);
                } else {
                    stats.ok(System.nanoTime() - t0);
                }
                Mbap.encode(resp, 0, h.transactionId(), h.unitId(), n);
                out.write(resp, 0, Modbus.MBAP_LENGTH + n);
                out.flush();
            }
        } catch (EOFException e) {
            LOG.debug("client {} closed", s.getRemoteSocketAddress());
        } catch (IOException e) {
            if (open) {
                stats.ioError();
                LOG.debug("connection {} ended: {}", s.getRemoteSocketAddress(), e.toString());
            }
        } finally {
            clients.remove(s);
        }
    }

    private static void readFully(InputStream in, byte[] b, int off, int len) throws IOException {
        int done = 0;
        while (done < len) {
            int n = in.read(b, off + done, len - done);
            if (n < 0) {
                throw new EOFException();
            }
            done += n;
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
        for (Socket s : clients) {
            try {
                s.close();
            } catch (IOException e) {
                LOG.debug("close client: {}", e.toString());
            }
        }
        try {
            acceptor.join(2000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }
}
