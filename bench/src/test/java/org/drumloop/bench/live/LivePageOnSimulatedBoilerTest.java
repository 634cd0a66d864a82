package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * End to end on the real closed loop (invented auxiliary boiler, default tuning) in headless
 * chromium: the operator takes the level controller to manual and sets the output, the instructor
 * trips the duty feed pump (the standby starts, as the firmware's pump logic should) and then the
 * standby, the drum drains to the low-level alarm, which the operator acknowledges. The values
 * the page shows are then checked against the simulation's own record: the session saved from the
 * page and replayed by the bench's scenario runner, whose trend.csv has every scan.
 */
class LivePageOnSimulatedBoilerTest {
    static final double SPEED = 10.0;

    @TempDir
    Path tmp;

    static final String READ_VALUES = "const g = (id) => document.getElementById(id).textContent;"
            + "return JSON.stringify({t: g('sim-time'), pv: g('fp-pv'), out: g('fp-out'), steam: g('dv-steam'),"
            + " pressure: g('dv-pressure'), mode: g('fp-mode')});";

    @Test
    void anOperatorAndAnInstructorWorkThePageAndItShowsWhatTheSimulationRecorded() throws Exception {
        SimLiveSession session = SimLiveSession.idle("aux-boiler", "default", 0.7, 1);
        LiveLoop loop = new LiveLoop(session, SPEED);
        try (LiveServer server = LiveServer.onLoopback(loop, 0);
             WebDriverClient web = new WebDriverClient(tmp.resolve("chromium-profile"), 1400, 1500)) {
            loop.start();
            server.start();
            web.navigate(server.uri().toString());
            web.waitFor("document.getElementById('conn').textContent === 'connected'"
                    + " && document.getElementById('fp-mode').textContent === 'three-element'");
            assertTrue(web.text("#plant-name").contains("invented"), "demo data is marked invented");

            web.click("#mode-manual");
            web.waitFor("document.getElementById('fp-mode').textContent === 'manual'"
                    + " && document.getElementById('fp-auto').textContent === 'MANUAL'");
            web.type("#out-input", "40");
            web.click("#out-apply");
            web.waitFor("document.getElementById('fp-out').textContent === '40.0'");

            web.click("#trip-feed_pump_a");
            // the firmware starts the standby pump on a duty pump trip, and logs it
            web.waitFor("document.getElementById('dv-pump-b').textContent === 'running'"
                    + " && [...document.querySelectorAll('#event-rows tr')].some(r => r.textContent.includes('standby'))");
            web.click("#trip-feed_pump_b");
            web.waitFor("document.getElementById('dv-pump-a').textContent === 'stopped'"
                    + " && document.getElementById('dv-pump-b').textContent === 'stopped'");
            // no feed: the drum drains; go faster to reach the low-level alarm sooner
            web.click("#speed-select option[value='50']");
            web.waitFor("document.getElementById('speed').textContent === '50'");
            web.waitFor("document.getElementById('alarm-row-LAL').classList.contains('st-alarm')"
                    + " && document.getElementById('alarm-row-LAL').classList.contains('unacked')");
            web.click("#ack-LAL");
            web.waitFor("!document.getElementById('alarm-row-LAL').classList.contains('unacked')");
            web.click("#pause");
            web.waitFor("document.getElementById('pause').textContent === 'Resume'");

            Map<String, Object> shown = MiniJson.obj(MiniJson.parse((String) web.script(READ_VALUES, "[]")));
            byte[] png = web.screenshotPng();
            Files.write(LivePageInBrowserTest.targetDir().resolve("live-page.png"), png);

            String text = HttpClient.newHttpClient().send(HttpRequest.newBuilder(server.uri().resolve("api/scenario")).build(),
                    HttpResponse.BodyHandlers.ofString()).body();
            assertTrue(text.contains(" s trip feed_pump_a\n") && text.contains(" s trip feed_pump_b\n")
                    && text.contains(" s output 40 %\n") && text.contains(" s acknowledge LAL\n"), text);
            Path saved = tmp.resolve("saved.scenario");
            Files.writeString(saved, text, StandardCharsets.UTF_8);
            Path out = tmp.resolve("replay");
            ScenarioRunner.run(ScenarioParser.load(saved), ScenarioRunner.Options.fast(out));
            List<String> csv = Files.readAllLines(out.resolve("trend.csv"), StandardCharsets.UTF_8);
            List<String> head = Arrays.asList(csv.get(0).split(","));
            double tS = Double.parseDouble((String) shown.get("t"));
            String[] row = null;
            for (String line : csv.subList(1, csv.size())) {
                String[] r = line.split(",");
                if (Math.abs(Double.parseDouble(r[0]) - tS) < 0.01) {
                    row = r;
                }
            }
            assertNotNull(row, "the replay has the scan shown on the page, t = " + tS + " s");
            String[] rec = row;
            java.util.function.ToDoubleFunction<String> col = h -> Double.parseDouble(rec[head.indexOf(h)]);
            // tolerances: half a display step plus half a trend.csv printing step
            assertEquals(col.applyAsDouble("measured_level[mm]"), Double.parseDouble((String) shown.get("pv")),
                    0.05 + 0.05 + 1e-9, "level: page 0.1 mm, trend 0.1 mm");
            assertEquals(col.applyAsDouble("valve_demand[%]"), Double.parseDouble((String) shown.get("out")),
                    0.05 + 0.005 + 1e-9, "output: page 0.1 %, trend 0.01 %");
            assertEquals(40.0, col.applyAsDouble("valve_demand[%]"), 0.005 + 1e-9, "the 40 % typed, in manual");
            assertEquals(col.applyAsDouble("steam_flow[t/h]"), number((String) shown.get("steam")),
                    0.005 + 0.0005 + 1e-9, "steam: page 0.01 t/h, trend 0.001 t/h");
            assertEquals(col.applyAsDouble("drum_pressure[barg]"), number((String) shown.get("pressure")),
                    0.005 + 0.0005 + 1e-9, "pressure: page 0.01 bar, trend 0.001 bar");
            assertTrue(col.applyAsDouble("measured_level[mm]") <= -75.0, "LAL is set at -75 mm in default.interlocks");
            assertEquals(0.0, col.applyAsDouble("feed_flow[t/h]"), 0.0005, "both feed pumps tripped");
        } finally {
            loop.stop();
        }
    }

    private static double number(String withUnit) {
        return Double.parseDouble(withUnit.split(" ")[0]);
    }
}
