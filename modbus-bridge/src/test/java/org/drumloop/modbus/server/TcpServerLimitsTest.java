package org.drumloop.modbus.server;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.locks.LockSupport;

import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.stats.LinkStatistics;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The resource limits of the Modbus TCP server: connections at once, eviction of the connection
 * idle longest, the idle timeout, and logging that a misbehaving peer cannot flood. Sockets on
 * 127.0.0.1, port 0.
 */
class TcpServerLimitsTest {
    /** The FC 04 answer for one register: function, byte count 2, the register (AP-spec §6.4). */
    private static final int FC04_ONE_REGISTER_LENGTH = 4;

    @TempDir
    Path dir;

    private static ImageServer server(int max, double idleS) throws IOException {
        return ImageServer.tcp(ServedImageTest.map(), new TcpEndpoint("127.0.0.1", 0), new ServerLimits(max, idleS));
    }

    @Test
    void aConnectionWithoutRequestsIsClosedAfterTheIdleTimeoutWhileAPollingOneStays() throws Exception {
        try (ImageServer server = server(4, 0.3);
             RawClient silent = new RawClient(server.port());
             RawClient polling = new RawClient(server.port())) {
            long end = System.nanoTime() + 1_000_000_000L;
            while (System.nanoTime() < end) {
                assertEquals(FC04_ONE_REGISTER_LENGTH, polling.readInputRegisters(1).length);
                LockSupport.parkNanos(100_000_000L);
            }
            assertTrue(silent.closedByServer(), "the silent connection was still open after 1 s at a 0.3 s idle timeout");
            assertEquals(FC04_ONE_REGISTER_LENGTH, polling.readInputRegisters(1).length, "the polling one was closed");
            LinkStatistics.Snapshot s = server.statistics().snapshot();
            assertEquals(1, s.idleClosed(), s.toString());
            assertEquals(2, s.connections());
        }
    }

    @Test
    void aFullServerClosesTheConnectionIdleLongestToAdmitTheNextAndSilentOnesGoFirst() throws Exception {
        try (LogCapture log = new LogCapture();
             ImageServer server = server(2, 60);
             RawClient a = new RawClient(server.port());
             RawClient b = new RawClient(server.port())) {
            a.readInputRegisters(1);
            b.readInputRegisters(1);
            // a's last request is older than b's: the third connection pushes a out
            try (RawClient c = new RawClient(server.port())) {
                assertTrue(a.closedByServer(), "a stayed open on a full server");
                c.readInputRegisters(1);
                // now b's last request is the oldest: d pushes b out
                try (RawClient d = new RawClient(server.port())) {
                    assertTrue(b.closedByServer(), "b stayed open on a full server");
                    // d never sends a request; when e arrives d goes, although c has been idle longer
                    try (RawClient e = new RawClient(server.port())) {
                        assertTrue(d.closedByServer(), "the silent connection stayed");
                        assertEquals(FC04_ONE_REGISTER_LENGTH, c.readInputRegisters(1).length);
                        assertEquals(FC04_ONE_REGISTER_LENGTH, e.readInputRegisters(1).length);
                    }
                }
            }
            LinkStatistics.Snapshot s = server.statistics().snapshot();
            assertEquals(3, s.evicted(), s.toString());
            assertEquals(5, s.connections(), s.toString());
            assertTrue(log.count("all 2 connections in use; closed connection") >= 1, log.lines().toString());
        }
    }

    @Test
    void badHeadersCloseTheirConnectionAndAreLoggedAtMostOnceASecond() throws Exception {
        int n = 300;
        long t0 = System.nanoTime();
        try (LogCapture log = new LogCapture(); ImageServer server = server(8, 60)) {
            for (int k = 0; k < n; k++) {
                try (RawClient c = new RawClient(server.port())) {
                    // protocol id 1: not Modbus (TCP guide: the connection is closed)
                    c.send(new byte[] {0, 1, 0, 1, 0, 6, 1, 4, 0, 0, 0, 1});
                    assertTrue(c.closedByServer(), "frame " + k + " did not close the connection");
                }
            }
            assertEquals(FC04_ONE_REGISTER_LENGTH, new RawClient(server.port()).readInputRegisters(1).length);
            server.close();
            double seconds = (System.nanoTime() - t0) * 1e-9;
            assertEquals(n, server.statistics().snapshot().badFrames());
            long lines = log.count("not a Modbus header") + log.count("closed for a bad header not logged");
            // one line a second plus the summary at close: far fewer than one per bad header
            assertTrue(lines >= 1 && lines <= Math.ceil(seconds) + 2, lines + " lines in " + seconds + " s: " + log.lines());
            assertTrue(log.lines().stream().anyMatch(l -> l.contains("more connections closed for a bad header not logged")),
                    "the count of the lines not logged is missing: " + log.lines());
        }
    }

    @Test
    void linkStatsCsvHasARowPerConnectionWithItsPeerAndHowItEnded() throws Exception {
        Path f = dir.resolve("link-stats.csv");
        try (ImageServer server = server(1, 60)) {
            try (RawClient a = new RawClient(server.port())) {
                a.readInputRegisters(1);
                a.call(1, new byte[] {0x2B});
                try (RawClient b = new RawClient(server.port())) {
                    assertTrue(a.closedByServer());
                    b.readInputRegisters(2);
                    LinkStatistics.writeCsv(f, server.statistics());
                }
            }
        }
        List<String> rows = Files.readAllLines(f);
        assertEquals(4, rows.size(), "header, server, two connections: " + rows);
        List<String> header = List.of(rows.get(0).split(",", -1));
        String[] server = rows.get(1).split(",", -1);
        String[] a = rows.get(2).split(",", -1);
        String[] b = rows.get(3).split(",", -1);
        assertEquals("3", server[header.indexOf("requests")]);
        assertEquals("2", server[header.indexOf("connections")]);
        assertEquals("1", server[header.indexOf("ex_01")], "FC 0x2B is not served: exception 01");
        assertEquals("2", a[header.indexOf("requests")]);
        assertEquals("evicted", a[header.indexOf("end")]);
        assertTrue(a[header.indexOf("peer")].startsWith("127.0.0.1:"), a[header.indexOf("peer")]);
        assertFalse(a[header.indexOf("closed_s")].isEmpty());
        assertEquals("open", b[header.indexOf("end")]);
        assertEquals(header.size(), a.length);
    }

    @Test
    void limitsOutsideTheirRangeAreRefusedWithTheOptionName() {
        assertTrue(assertThrows(IllegalArgumentException.class, () -> new ServerLimits(0, 60)).getMessage()
                .contains("--max-connections"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> new ServerLimits(8, 0)).getMessage()
                .contains("--idle-timeout"));
        assertEquals(Modbus.MAX_TCP_ADU, 260, "MBAP 7 + PDU 253 (TCP guide §3.1.3)");
    }
}
