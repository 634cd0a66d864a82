package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.Scenario;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A session operated from the page, saved as a scenario file, replays the same run under the
 * bench's own scenario runner ({@code drumloop run}): every action of the page, written as a
 * statement, read back and applied at the same scan, gives the same trend row for row. The
 * runner's trend.csv is the reference; the tolerance is its printing precision.
 */
class SimLiveReplayTest {
    /** 250 s of plant time at the 100 ms scan of the default tuning. */
    static final int SCANS = 2500;

    @TempDir
    Path tmp;

    /** Page commands (the JSON the page posts) by the scan before which they are applied. */
    static Map<Integer, String> schedule() {
        Map<Integer, String> m = new TreeMap<>();
        m.put(20, "{\"cmd\":\"mode\",\"mode\":\"single-element\"}");
        m.put(50, "{\"cmd\":\"setpoint\",\"mm\":12.5}");
        m.put(100, "{\"cmd\":\"steam_ramp\",\"percent\":90,\"seconds\":30}");
        m.put(300, "{\"cmd\":\"mode\",\"mode\":\"three-element\"}");
        m.put(400, "{\"cmd\":\"fault\",\"target\":\"level_tx_a\",\"kind\":\"bias\",\"value\":0.5,\"unit\":\"kPa\"}");
        m.put(500, "{\"cmd\":\"auto\",\"auto\":false}");
        m.put(510, "{\"cmd\":\"manual_output\",\"percent\":40}");
        m.put(700, "{\"cmd\":\"auto\",\"auto\":true}");
        m.put(800, "{\"cmd\":\"trip\",\"target\":\"feed_pump_a\"}");
        m.put(900, "{\"cmd\":\"clear\",\"target\":\"all\"}");
        m.put(950, "{\"cmd\":\"bypass\",\"tag\":\"LAL\",\"reason\":\"instructor demo\",\"seconds\":60}");
        m.put(1000, "{\"cmd\":\"ack\",\"tag\":\"all\"}");
        m.put(1100, "{\"cmd\":\"steam_demand\",\"percent\":50}");
        m.put(1200, "{\"cmd\":\"fault\",\"target\":\"steam_flow_tx\",\"kind\":\"noise-burst\",\"value\":100,\"unit\":\"Pa\",\"seconds\":20}");
        m.put(1300, "{\"cmd\":\"fault\",\"target\":\"level_tx_b\",\"kind\":\"drift\",\"value\":0.02,\"unit\":\"kPa/s\"}");
        m.put(1400, "{\"cmd\":\"steam_surge\",\"percent\":10}");
        m.put(1500, "{\"cmd\":\"tube_leak\",\"value\":0.3,\"unit\":\"t/h\"}");
        m.put(1600, "{\"cmd\":\"clear\",\"target\":\"drum\"}");
        m.put(1650, "{\"cmd\":\"clear\",\"target\":\"steam\"}");
        m.put(1700, "{\"cmd\":\"valve_stuck\"}");
        m.put(1800, "{\"cmd\":\"clear\",\"target\":\"feed_valve\"}");
        m.put(1850, "{\"cmd\":\"fault\",\"target\":\"level_tx_c\",\"kind\":\"fail-low\"}");
        m.put(1900, "{\"cmd\":\"clear\",\"target\":\"level_tx_c\"}");
        m.put(1950, "{\"cmd\":\"reset\"}");
        return m;
    }

    @Test
    void aSessionSavedFromThePageReplaysRowForRowUnderTheScenarioRunner() throws Exception {
        SimLiveSession live = SimLiveSession.idle("aux-boiler", "default", 0.7, 7);
        CommandParser parser = new CommandParser(live.info());
        Map<Integer, String> plan = schedule();
        List<double[]> record = new ArrayList<>();
        LiveSnapshot s = new LiveSnapshot(live.info().interlocks().size());
        for (int k = 0; k < SCANS; k++) {
            String cmd = plan.get(k);
            if (cmd != null) {
                LiveAction a = parser.parse(Json.parseObject(cmd));
                live.check(a);
                live.apply(a);
            }
            live.scan();
            live.fill(s);
            record.add(new double[] {s.tS, s.levelM, s.levelIndicatedM, s.steamFlowKgS, s.feedFlowKgS,
                s.valveDemandFrac, s.drumPressurePa});
        }
        List<String> lines = live.scenarioLines();
        long timed = lines.stream().filter(l -> l.startsWith("at ")).count();
        assertEquals(plan.size(), timed, "one timed statement per page action:\n" + String.join("\n", lines));

        Path file = tmp.resolve("saved.scenario");
        Files.write(file, lines, StandardCharsets.UTF_8);
        Scenario sc = ScenarioParser.load(file);
        Path out = tmp.resolve("out");
        RunSummary r = ScenarioRunner.run(sc, ScenarioRunner.Options.fast(out));
        assertTrue(r.scans() >= SCANS, "the replay covers the live run");

        List<String> csv = Files.readAllLines(out.resolve("trend.csv"), StandardCharsets.UTF_8);
        List<String> head = Arrays.asList(csv.get(0).split(","));
        int cT = head.indexOf("t[s]");
        int cLevel = head.indexOf("drum_level[mm]");
        int cMeasured = head.indexOf("measured_level[mm]");
        int cSteam = head.indexOf("steam_flow[t/h]");
        int cFeed = head.indexOf("feed_flow[t/h]");
        int cOut = head.indexOf("valve_demand[%]");
        int cP = head.indexOf("drum_pressure[barg]");
        assertTrue(cT >= 0 && cLevel > 0 && cMeasured > 0 && cSteam > 0 && cFeed > 0 && cOut > 0 && cP > 0, head.toString());
        for (int k = 0; k < SCANS; k++) {
            String[] row = csv.get(k + 1).split(",");
            double[] rec = record.get(k);
            String at = " at scan " + k + " (t = " + rec[0] + " s)";
            // tolerances: half a unit of the last printed digit of trend.csv (t 0.01 s, level 0.1 mm,
            // flows 0.001 t/h, valve 0.01 %, pressure 0.001 bar), plus float noise
            assertEquals(rec[0], Double.parseDouble(row[cT]), 0.005 + 1e-9, "time" + at);
            assertEquals(rec[1] * 1e3, Double.parseDouble(row[cLevel]), 0.05 + 1e-9, "true level" + at);
            assertEquals(rec[2] * 1e3, Double.parseDouble(row[cMeasured]), 0.05 + 1e-9, "measured level" + at);
            assertEquals(rec[3] * 3.6, Double.parseDouble(row[cSteam]), 0.0005 + 1e-9, "steam flow" + at);
            assertEquals(rec[4] * 3.6, Double.parseDouble(row[cFeed]), 0.0005 + 1e-9, "feed flow" + at);
            assertEquals(rec[5] * 100, Double.parseDouble(row[cOut]), 0.005 + 1e-9, "valve demand" + at);
            // gauge pressure: absolute less one standard atmosphere, 101325 Pa (ISO 2533)
            assertEquals((rec[6] - 101_325.0) / 1e5, Double.parseDouble(row[cP]), 0.0005 + 1e-9, "drum pressure" + at);
        }
    }

    @Test
    void aStatementTheScenarioLanguageRefusesIsRefusedBeforeItIsQueued() throws Exception {
        SimLiveSession live = SimLiveSession.idle("aux-boiler", "default", 0.7, 1);
        // a bypass of an interlock the firmware does not have: the parser's check passes the tag
        // list of the page, so build the action directly as a malformed one would arrive
        LiveAction bad = new LiveAction(LiveAction.Kind.FAULT, "level_tx_a", "bias", 0, Double.NaN, 0, "furlongs", "");
        IllegalArgumentException e = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> live.check(bad));
        assertTrue(e.getMessage().contains("furlongs"), e.getMessage());
    }
}
