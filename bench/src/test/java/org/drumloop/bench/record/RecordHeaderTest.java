package org.drumloop.bench.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Instant;
import java.time.ZoneId;
import java.util.List;

import org.junit.jupiter.api.Test;

/** The header every record carries: time in UTC and local, the controller under test, the inputs. */
class RecordHeaderTest {
    static final String HASH = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";

    private static RecordHeader header(RecordHeader.ControllerUnderTest dut) {
        return new RecordHeader("Trip test <LALL>", Instant.parse("2026-07-01T12:00:05Z"), ZoneId.of("Europe/Oslo"),
                3725.0, BuildInfo.of("1.2.0", "57d2d49ef0bd06a07e87e4a04901999b9ff59a1e", false), "bench-host",
                "Java 17", "drumloop run 'a b.scenario'", "/work", List.of(new InputFile("scenario", "a b.scenario", HASH)),
                7L, dut, List.<String[]>of(new String[] {"plant time", "900 s"}));
    }

    @Test
    void timeIsGivenInUtcAndWithTheLocalOffset() {
        RecordHeader h = header(null);
        assertEquals("2026-07-01 12:00:05 UTC", h.utcText());
        // IANA time zone database: Europe/Oslo keeps CEST (UTC+2) in July
        assertEquals("2026-07-01 14:00:05 +02:00", h.localText());
        // 3725 s = 1 h 2 min 5 s
        assertEquals("1:02:05 (3725 s)", RecordHeader.duration(3725.0));
        assertEquals("0.25 s", RecordHeader.duration(0.25));
    }

    @Test
    void theHtmlNamesBuildSeedControllerUnderTestAndInputs() {
        StringBuilder sb = new StringBuilder();
        header(new RecordHeader.ControllerUnderTest("PLC-7 <feed>", "v4.1", "Modbus TCP 127.0.0.1:1502 unit 1", "map.csv"))
                .html(sb);
        String html = sb.toString();
        assertTrue(html.contains("<th>controller under test</th><td>PLC-7 &lt;feed&gt;</td>"), html);
        assertTrue(html.contains("<th>its firmware</th><td>v4.1</td>"));
        assertTrue(html.contains("<th>link</th><td>Modbus TCP 127.0.0.1:1502 unit 1</td>"));
        assertTrue(html.contains("<th>seed</th><td>7</td>"));
        assertTrue(html.contains("<th>plant time</th><td>900 s</td>"));
        assertTrue(html.contains("drumloop 1.2.0, commit 57d2d49ef0bd06a07e87e4a04901999b9ff59a1e"));
        assertTrue(html.contains("<code>drumloop run &#39;a b.scenario&#39;</code>"));
        assertTrue(html.contains("<td>scenario</td><td><code>a b.scenario</code></td><td><code class=\"hash\">" + HASH));
        StringBuilder none = new StringBuilder();
        header(null).html(none);
        assertTrue(!none.toString().contains("controller under test"), "the bench's own firmware: no such lines");
    }

    @Test
    void theTitleGoesIntoThePrintedPagesSafely() {
        // CSS Syntax Level 3, 4.3.5: a string token ends at an unescaped quote; '<' escaped so no tag can close the style
        assertEquals("\"a \\\"b\\\" \\\\ \\3c /style>\"", ReportPage.cssString("a \"b\" \\ </style>"));
    }
}
