package org.drumloop.modbus.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Counters and nearest-rank percentiles, checked against hand-computed values. */
class LinkStatisticsTest {
    /** Percentiles of whole microseconds printed in ms: exact up to double rounding. */
    private static final double MS_TOL = 1e-12;

    @TempDir
    Path dir;

    @Test
    void percentilesUseTheNearestRank() {
        LinkStatistics s = new LinkStatistics("t");
        for (int us = 1; us <= 100; us++) {
            s.request();
            s.ok(us * 1000L);
        }
        LinkStatistics.Snapshot snap = s.snapshot();
        // nearest rank: p50 of 1..100 is the 50th value, p99 the 99th (hand computed)
        assertEquals(0.050, snap.p50Ms(), MS_TOL);
        assertEquals(0.099, snap.p99Ms(), MS_TOL);
        assertEquals(0.100, snap.maxMs(), MS_TOL);
        assertEquals(100, snap.ok());
    }

    @Test
    void errorsAreCountedByKindAndWrittenAsCsv() throws Exception {
        LinkStatistics s = new LinkStatistics("client tcp 127.0.0.1:1502");
        s.exception(2);
        s.exception(2);
        s.exception(11);
        s.exception(99);
        s.timeout();
        s.reconnect();
        LinkStatistics.Snapshot snap = s.snapshot();
        assertEquals(2, snap.exceptions(2));
        assertEquals(1, snap.exceptions(11));
        assertEquals(1, snap.exceptionsOther());
        assertEquals(5, snap.errors());
        Path f = dir.resolve("link-stats.csv");
        LinkStatistics.writeCsv(f, s);
        List<String> lines = Files.readAllLines(f);
        assertEquals(LinkStatistics.csvHeader(), lines.get(0));
        assertTrue(lines.get(1).startsWith("client tcp 127.0.0.1:1502,0,0,1,0,0,1,0,2,0,0,0,1,1,"), lines.get(1));
        assertEquals(lines.get(0).split(",", -1).length, lines.get(1).split(",", -1).length);
    }

    @Test
    void connectionsAddIntoTheirServerAndTheMostRecentClosedOnesAreKept() {
        LinkStatistics server = new LinkStatistics("server tcp 127.0.0.1:1502");
        LinkStatistics first = server.connection("server tcp 127.0.0.1:1502 connection 1", "127.0.0.1:40000", 0.5);
        first.served(0, 20_000);
        first.served(2, 5_000);
        first.badFrame();
        first.closeConnection(1.5, "bad header");
        for (int k = 2; k <= LinkStatistics.CLOSED_CONNECTIONS_KEPT + 10; k++) {
            server.connection("c" + k, "127.0.0.1:" + (40000 + k), k).closeConnection(k + 0.25, "client closed");
        }
        LinkStatistics open = server.connection("open one", "127.0.0.1:50000", 500);
        open.served(0, 10_000);
        LinkStatistics.Snapshot s = server.snapshot();
        // the server's totals count every connection, kept or not
        assertEquals(3, s.requests());
        assertEquals(2, s.ok());
        assertEquals(1, s.exceptions(2));
        assertEquals(1, s.badFrames());
        assertEquals(LinkStatistics.CLOSED_CONNECTIONS_KEPT + 11, s.connections());
        List<LinkStatistics.Snapshot> rows = server.connections();
        assertEquals(LinkStatistics.CLOSED_CONNECTIONS_KEPT + 1, rows.size(), "the newest closed ones and the open one");
        assertEquals("c11", rows.get(0).name(), "the oldest ten were dropped from the rows");
        assertEquals("open", rows.get(rows.size() - 1).end());
        assertEquals("client closed", rows.get(0).end());
        assertEquals(11.25, rows.get(0).closedS(), 0.0);
    }
}
