package org.drumloop.modbus.server;

import java.util.ArrayList;
import java.util.List;

import org.drumloop.modbus.stats.LinkStatistics;
import org.drumloop.modbus.stats.ProblemLog;
import org.slf4j.event.Level;

/**
 * The open connections of a Modbus TCP server and the rules that bound them: at most
 * {@link ServerLimits#maxConnections()} at once, each closed after {@link ServerLimits#idleTimeoutS()}
 * without a whole request. When a new connection arrives at a full server, the connection idle
 * longest is closed to admit it; a connection that has not sent a whole request yet counts as
 * idle longer than any that has (the oldest of them first), so a burst of silent connections
 * pushes out its own members before a controller that is polling. Thread-safe.
 */
final class Connections {
    /** How a transport closes one connection from outside its own loop. */
    interface Closer {
        void close();
    }

    /** One open connection. */
    static final class Conn {
        final int id;
        final String peer;
        final LinkStatistics stats;
        final long openedNs;
        private final Closer closer;
        /** Time of the last whole request, or 0 before the first. */
        volatile long lastRequestNs;
        private volatile String end;

        Conn(int id, String peer, LinkStatistics stats, long openedNs, Closer closer) {
            this.id = id;
            this.peer = peer;
            this.stats = stats;
            this.openedNs = openedNs;
            this.closer = closer;
        }

        /** True once the server closed it (evicted, idle, shutting down). */
        boolean closedByServer() { return end != null; }

        long idleSinceNs() {
            long r = lastRequestNs;
            return r == 0 ? openedNs : r;
        }
    }

    private final ServerLimits limits;
    private final LinkStatistics stats;
    final String name;
    private final long startNs;
    private final long idleNs;
    private final List<Conn> open = new ArrayList<>();
    private int next;
    private final ProblemLog.Kind evictedLog;
    private final ProblemLog.Kind idleLog;

    Connections(ServerLimits limits, LinkStatistics stats, ProblemLog problems, String name, long startNs) {
        this.limits = limits;
        this.stats = stats;
        this.name = name;
        this.startNs = startNs;
        this.idleNs = (long) (limits.idleTimeoutS() * 1e9);
        this.evictedLog = problems.kind("connections evicted", Level.WARN);
        this.idleLog = problems.kind("idle connections closed", Level.INFO);
    }

    /**
     * Register a new connection from {@code peer}; when the server is full, first close the
     * connection idle longest and log it.
     */
    Conn admit(String peer, Closer closer, long nowNs) {
        Conn victim = null;
        Conn c;
        synchronized (this) {
            if (open.size() >= limits.maxConnections()) {
                victim = idleLongest();
                open.remove(victim);
                victim.end = "evicted";
            }
            int id = ++next;
            c = new Conn(id, peer, stats.connection(name + " connection " + id, peer, secondsSinceStart(nowNs)), nowNs, closer);
            open.add(c);
        }
        if (victim != null) {
            victim.stats.evicted();
            evictedLog.report("{}: all {} connections in use; closed connection {} from {}, idle {} s, to admit {}", name,
                    limits.maxConnections(), victim.id, victim.peer, seconds(nowNs - victim.idleSinceNs()), peer);
            victim.closer.close();
            finish(victim, nowNs, "evicted");
        }
        return c;
    }

    private Conn idleLongest() {
        Conn best = null;
        for (Conn c : open) {
            if (best == null || evictsBefore(c, best)) {
                best = c;
            }
        }
        return best;
    }

    /** Never-used connections go first, the oldest of them first; then the one with the oldest last request. */
    private static boolean evictsBefore(Conn a, Conn b) {
        boolean aUsed = a.lastRequestNs != 0;
        boolean bUsed = b.lastRequestNs != 0;
        if (aUsed != bUsed) {
            return !aUsed;
        }
        return a.idleSinceNs() - b.idleSinceNs() < 0;
    }

    /** Close every connection without a whole request for the idle timeout. */
    void closeIdle(long nowNs) {
        List<Conn> idle = null;
        synchronized (this) {
            for (int k = open.size() - 1; k >= 0; k--) {
                Conn c = open.get(k);
                if (nowNs - c.idleSinceNs() >= idleNs) {
                    open.remove(k);
                    c.end = "idle timeout";
                    if (idle == null) {
                        idle = new ArrayList<>();
                    }
                    idle.add(c);
                }
            }
        }
        if (idle != null) {
            for (Conn c : idle) {
                c.stats.idleClosed();
                idleLog.report("{}: closed connection {} from {} after {} s without a request", name, c.id, c.peer,
                        seconds(nowNs - c.idleSinceNs()));
                c.closer.close();
                finish(c, nowNs, "idle timeout");
            }
        }
    }

    /**
     * The transport's loop for {@code c} ended; {@code how} says why from its side ("client
     * closed", "bad header", "I/O error") unless the server closed it first (evicted, idle).
     */
    void ended(Conn c, long nowNs, String how) {
        String why;
        synchronized (this) {
            open.remove(c);
            why = c.end != null ? c.end : how;
            c.end = why;
        }
        finish(c, nowNs, why);
    }

    private void finish(Conn c, long nowNs, String how) {
        c.stats.closeConnection(secondsSinceStart(nowNs), how);
    }

    /** Close every connection (server shutting down). */
    void closeAll(long nowNs) {
        List<Conn> all;
        synchronized (this) {
            all = new ArrayList<>(open);
            open.clear();
            for (Conn c : all) {
                c.end = "server closed";
            }
        }
        for (Conn c : all) {
            c.closer.close();
            finish(c, nowNs, "server closed");
        }
    }

    synchronized int size() { return open.size(); }

    /** Period of the idle check: a quarter of the timeout, 10 ms..1 s. */
    long checkPeriodNs() { return Math.max(10_000_000L, Math.min(1_000_000_000L, idleNs / 4)); }

    double secondsSinceStart(long nowNs) { return (nowNs - startNs) * 1e-9; }

    private static String seconds(long ns) { return String.format(java.util.Locale.ROOT, "%.1f", ns * 1e-9); }
}
