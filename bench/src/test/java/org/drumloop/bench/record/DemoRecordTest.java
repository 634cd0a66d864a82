package org.drumloop.bench.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The demo's records are complete: the trend carries each level transmitter with its quality,
 * the first-out trip and the bypasses; the plots tag their markers and keep their axes within
 * the signals' physical limits; the key figures say which level a deviation is of.
 */
class DemoRecordTest {
    @TempDir
    static Path dir;
    static RunSummary demo;
    static List<String> trend;
    static List<String> head;
    static String report;

    @BeforeAll
    static void runDemo() throws Exception {
        Path f = ConfigResolver.resolve("demo", "scenarios", ".scenario", null);
        demo = ScenarioRunner.run(ScenarioParser.load(f, ConfigResolver.displayName(f)), ScenarioRunner.Options.fast(dir));
        trend = Files.readAllLines(dir.resolve("trend.csv"));
        head = List.of(trend.get(0).split(","));
        report = Files.readString(dir.resolve("report.html"));
    }

    private static String cell(double tS, String column) {
        // one row per 100 ms scan from t = 0 (config/tuning/default.tuning: scan_period 100 ms)
        String[] row = trend.get(1 + (int) Math.round(tS / 0.1)).split(",", -1);
        assertEquals(tS, Double.parseDouble(row[0]), 1e-9);
        return row[head.indexOf(column)];
    }

    @Test
    void theTrendCarriesEachTransmitterItsQualityTheFirstOutAndTheBypasses() {
        for (String c : new String[] {"level_tx_a[mm]", "level_tx_b[mm]", "level_tx_c[mm]", "level_tx_a_quality",
            "level_tx_b_quality", "level_tx_c_quality", "first_out", "LALL_bypassed[bool]"}) {
            assertTrue(head.contains(c), c + " in " + head);
        }
        assertEquals("good", cell(100, "level_tx_b_quality"));
        // demo.scenario: level_tx_b fails low (NE 43 failure current) at 150 s and is judged bad
        assertEquals("bad", cell(200, "level_tx_b_quality"));
        assertEquals("good", cell(200, "level_tx_a_quality"));
        assertEquals("", cell(100, "first_out"), "no trip yet");
        assertEquals("LALL", cell(900, "first_out"), "the low-water test trips LALL first");
        assertEquals("0", cell(900, "LALL_bypassed[bool]"));
        // at 100 s the three transmitters agree with the true level within their noise and resolution (a few mm)
        double a = Double.parseDouble(cell(100, "level_tx_a[mm]"));
        double truth = Double.parseDouble(cell(100, "drum_level[mm]"));
        assertEquals(truth, a, 15.0);
    }

    @Test
    void alarmAndTripMarkersCarryTheirTag() {
        String svg = svg("level");
        for (String tag : new String[] {"LDAH", "LAL", "LALL"}) {
            assertTrue(Pattern.compile("<text [^>]*class=\"mklab (alarm|trip)\"[^>]*>" + tag + "</text>").matcher(svg).find(),
                    tag + " marker labelled");
        }
    }

    @Test
    void theValveAxisStaysWithinZeroToHundredPercent() {
        Matcher m = Pattern.compile("class=\"ylab\">(-?[0-9.]+)</text>").matcher(svg("valve"));
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        while (m.find()) {
            double v = Double.parseDouble(m.group(1));
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        // a valve's position is 0..100 % of stroke: the axis is never drawn beyond
        assertEquals(0.0, lo, 0.0);
        assertEquals(100.0, hi, 0.0);
    }

    @Test
    void largestDeviationSaysTrueAndIndicatedLevel() {
        KeyFigures k = demo.figures();
        // the low-water test takes the true level below the transmitters' calibrated range
        // (config/tuning/default.tuning: range_low -300 mm), so the indicated deviation is the smaller one
        assertTrue(k.maxDeviationM() > 0.300, "true level beyond the range: " + k.maxDeviationM());
        assertTrue(k.maxIndicatedDeviationM() < k.maxDeviationM());
        assertTrue(report.contains("largest deviation of the true drum level from setpoint"));
        assertTrue(report.contains("largest deviation of the indicated level"));
        assertTrue(report.contains("differs from the true level"));
    }

    private static String svg(String id) {
        int a = report.indexOf("<svg class=\"plot\" id=\"svg-" + id + "\"");
        assertTrue(a >= 0, id);
        return report.substring(a, report.indexOf("</svg>", a));
    }
}
