package org.drumloop.bench.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.drumloop.bench.expect.Channel;
import org.drumloop.bench.expect.Frame;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RecordsTest {
    @TempDir
    Path tmp;

    private static String fixed(double v, int d) {
        char[] b = new char[40];
        return new String(b, 0, FixedFormat.append(b, 0, v, d));
    }

    @Test
    void fixedFormatMatchesJavasRoundedFormatting() {
        // reference: java.util.Formatter "%.nf" (HALF_UP); values chosen away from binary ties
        double[] values = {0, 1, -1, 0.125, 12.3456, -0.004, 99.995001, 123456789.987, -7.9869, 1e-7};
        for (double v : values) {
            for (int d = 0; d <= 4; d++) {
                String expected = String.format(java.util.Locale.ROOT, "%." + d + "f", v);
                if (expected.matches("-0(\\.0*)?")) {
                    expected = expected.substring(1); // we write no sign on a value that rounds to zero
                }
                assertEquals(expected, fixed(v, d), v + " with " + d + " decimals");
            }
        }
        assertEquals("NaN", fixed(Double.NaN, 2));
    }

    @Test
    void csvFieldsAreQuotedPerRfc4180() {
        // RFC 4180 section 2: fields with commas, quotes or line breaks are quoted, quotes doubled
        assertEquals("plain", EventLog.csv("plain"));
        assertEquals("\"a, b\"", EventLog.csv("a, b"));
        assertEquals("\"say \"\"hi\"\"\"", EventLog.csv("say \"hi\""));
    }

    @Test
    void trendHeaderNamesEveryChannelWithItsUnitAndOneRowPerWrite() throws IOException {
        StringWriter w = new StringWriter();
        TrendWriter t = new TrendWriter(w, List.of("LAL", "LALL"));
        Frame f = new Frame(2);
        f.tS = 1.5;
        f.set(Channel.DRUM_LEVEL, -0.0425);
        f.set(Channel.DRUM_PRESSURE, 901_325.0);
        f.interlockActive[1] = true;
        f.interlockBypassed[0] = true;
        f.firstOut = 1;
        f.set(Channel.LEVEL_TX_B, -0.3);
        f.levelTxQuality[0] = org.drumloop.core.io.Quality.GOOD;
        f.levelTxQuality[1] = org.drumloop.core.io.Quality.UNCERTAIN;
        t.write(f);
        String[] lines = w.toString().split("\n");
        assertEquals(2, lines.length);
        String[] head = lines[0].split(",");
        assertEquals("t[s]", head[0]);
        assertEquals("drum_level[mm]", head[1]);
        assertEquals("drum_pressure[barg]", head[1 + Channel.DRUM_PRESSURE.ordinal()]);
        assertEquals("steam_flow[t/h]", head[1 + Channel.STEAM_FLOW.ordinal()]);
        List<String> h = List.of(head);
        String[] row = lines[1].split(",", -1);
        assertEquals(head.length, row.length);
        assertEquals("-300.0", row[h.indexOf("level_tx_b[mm]")]);
        assertEquals("good", row[h.indexOf("level_tx_a_quality")]);
        assertEquals("uncertain", row[h.indexOf("level_tx_b_quality")]);
        assertEquals("bad", row[h.indexOf("level_tx_c_quality")]);
        assertEquals("LALL", row[h.indexOf("first_out")]);
        assertEquals("1", row[h.indexOf("LAL_bypassed[bool]")]);
        assertEquals("0", row[h.indexOf("LALL_bypassed[bool]")]);
        assertEquals("1.50", row[0]);
        // -0.0425 m = -42.5 mm, one decimal, HALF_UP on the magnitude
        assertEquals("-42.5", row[1]);
        // 901325 Pa abs = 8.000 barg with the standard atmosphere 101325 Pa (ISO 2533)
        assertEquals("8.000", row[1 + Channel.DRUM_PRESSURE.ordinal()]);
        assertEquals("1", row[h.indexOf("LALL[bool]")]);
        assertEquals("0", row[h.indexOf("LAL[bool]")]);
    }

    @Test
    void anAbandonedOutputLeavesTheEarlierFileAlone() throws IOException {
        Path target = tmp.resolve("trend.csv");
        Files.writeString(target, "earlier run\n");
        try (AtomicOutput o = new AtomicOutput(target)) {
            o.writer().write("half a record");
            // no commit: as when a run fails
        }
        assertEquals("earlier run\n", Files.readString(target));
        try (var s = Files.list(tmp)) {
            assertEquals(1, s.count(), "temporary file removed");
        }
        AtomicOutput.write(target, "new run\n");
        assertEquals("new run\n", Files.readString(target));
    }

    @Test
    void plotBufferKeepsShortSpikes() {
        PlotBuffer p = new PlotBuffer(100, 10);
        Frame f = new Frame(0);
        for (int k = 0; k <= 1000; k++) {
            f.tS = k * 0.1;
            f.set(Channel.DRUM_LEVEL, k == 555 ? 0.2 : 0.0);
            p.add(f);
        }
        // the one-sample spike at 55.5 s lands in bucket 5 (50..60 s) as its maximum
        assertEquals(0.2, p.max(Channel.DRUM_LEVEL, 5), 0.0);
        assertEquals(0.0, p.max(Channel.DRUM_LEVEL, 4), 0.0);
        assertTrue(p.filled(9));
        assertFalse(Double.isNaN(p.min(Channel.DRUM_LEVEL, 0)));
    }

    @Test
    void niceTicksCoverTheRange() {
        double[] t = HtmlReport.ticks(-213, 87, 6);
        // 1-2-5 steps: a 300-wide range in about 6 steps gives 50
        assertEquals(50.0, t[1] - t[0], 1e-9);
        assertTrue(t[0] <= -213 && t[t.length - 1] >= 87);
    }
}
