package org.drumloop.core.soe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The sequence-of-events ring: oldest first, nothing lost until full, newest dropped and counted
 * when full. Expected sequences are written out by hand from the definition of a FIFO ring.
 */
class SoeLogTest {
    private static final double DT_S = 0.1;
    /** Times are stored, not computed: they must come back bit for bit (tolerance 0). */
    private static final double EXACT = 0.0;

    private static final class Entry {
        final double tS;
        final long scan;
        final String tag;
        final EventKind kind;
        final String message;

        Entry(double tS, long scan, String tag, EventKind kind, String message) {
            this.tS = tS;
            this.scan = scan;
            this.tag = tag;
            this.kind = kind;
            this.message = message;
        }
    }

    private static List<Entry> drain(SoeLog log) {
        List<Entry> got = new ArrayList<>();
        int n = log.drainTo((t, s, tag, k, m) -> got.add(new Entry(t, s, tag, k, m)));
        assertEquals(got.size(), n);
        return got;
    }

    @Test
    void eventsComeOutOldestFirstWithTheirScanTimeAndNumber() {
        SoeLog log = new SoeLog(8);
        log.record(3 * DT_S, 3, "LAL", EventKind.ALARM, "alarm");
        log.record(3 * DT_S, 3, "LALL", EventKind.TRIP, "trip");
        log.record(7 * DT_S, 7, "LAL", EventKind.ACK, "acknowledged");
        List<Entry> got = drain(log);
        assertEquals(3, got.size());
        assertEquals("LAL", got.get(0).tag);
        assertEquals(EventKind.ALARM, got.get(0).kind);
        assertEquals("LALL", got.get(1).tag);
        assertEquals(EventKind.TRIP, got.get(1).kind);
        assertEquals(EventKind.ACK, got.get(2).kind);
        assertEquals("acknowledged", got.get(2).message);
        assertEquals(7, got.get(2).scan);
        assertEquals(7 * DT_S, got.get(2).tS, EXACT);
        assertEquals(0, log.size());
        assertEquals(0, drain(log).size());
    }

    @Test
    void aFullRingDropsTheNewestAndCountsThem() {
        SoeLog log = new SoeLog(3);
        for (int i = 0; i < 5; i++) {
            log.record(i * DT_S, i, "T" + i, EventKind.INFO, "m");
        }
        assertEquals(2, log.lost());
        List<Entry> got = drain(log);
        assertEquals(List.of("T0", "T1", "T2"), got.stream().map(e -> e.tag).toList());
        assertEquals(3, log.recorded());
    }

    @Test
    void theRingWrapsAroundAcrossDrains() {
        SoeLog log = new SoeLog(4);
        List<String> all = new ArrayList<>();
        int k = 0;
        for (int round = 0; round < 5; round++) {
            for (int j = 0; j < 3; j++, k++) {
                log.record(k * DT_S, k, "E" + k, EventKind.INFO, "m");
            }
            for (Entry e : drain(log)) {
                all.add(e.tag);
            }
        }
        List<String> expected = new ArrayList<>();
        for (int i = 0; i < 15; i++) {
            expected.add("E" + i);
        }
        assertEquals(expected, all);
        assertEquals(0, log.lost());
    }

    @Test
    void capacityBelowOneIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> new SoeLog(0));
    }
}
