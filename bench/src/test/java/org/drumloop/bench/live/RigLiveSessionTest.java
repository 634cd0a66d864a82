package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.LockSupport;
import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.sim.PlantIo;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.server.ImageServer;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantFile;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The live page driving hardware: "the rig" is the bridge's own Modbus TCP slave on 127.0.0.1
 * (port 0) serving a fixed image of the demo plant at 70 % load, and the firmware is its client
 * in real time through a {@link RigLiveSession}. Everything is checked through the page's HTTP API,
 * and the banner and the confirmation once in a headless browser (waits are conditions polled by
 * the page or the API with a deadline, never sleeps used as timing).
 */
class RigLiveSessionTest {
    /** Scaling of feed_valve_demand in aux-4-20ma.csv: 0..27648 counts = 0..100 %. */
    static final double VALVE_COUNTS_FULL_SCALE = 27648;
    /** Longest wait for a command to cross loop, firmware and link (100 ms scan, 50 ms poll). */
    static final long REACH_TIMEOUT_S = 20;

    private final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
    private ImageServer rig;
    private RigLiveSession session;
    private LiveLoop loop;
    private LiveServer server;
    private Plant plant;

    @BeforeEach
    void start() throws Exception {
        Path mapPath = ConfigResolver.resolve("aux-4-20ma", "maps", ".csv", null);
        ChannelMap map = ChannelMap.load(mapPath);
        rig = ImageServer.tcp(map, new TcpEndpoint("127.0.0.1", 0));
        plant = new Plant(PlantFile.load(ConfigResolver.resolve("aux-boiler", "plants", ".plant", null)), 1);
        plant.initSteadyState(0.7);
        ProcessImage inputs = new ProcessImage();
        new PlantIo(plant).readInputs(inputs, 0.0);
        rig.publishInputs(inputs, 0.0);
        Path tuning = ConfigResolver.resolve("default", "tuning", ".tuning", null);
        RigClient client = RigClient.tcp(map, new TcpEndpoint("127.0.0.1", rig.port()), RigClient.Options.defaults());
        session = new RigLiveSession(client, FirmwareConfig.load(tuning), tuning,
                "Modbus TCP 127.0.0.1:" + rig.port() + ", map aux-4-20ma.csv");
        loop = new LiveLoop(session, 1.0);
        server = LiveServer.onLoopback(loop, 0);
        loop.start();
        server.start();
    }

    @AfterEach
    void stop() throws Exception {
        server.close();
        loop.stop();
        session.close();
        rig.close();
    }

    private HttpResponse<String> command(String json) throws Exception {
        HttpRequest r = HttpRequest.newBuilder(server.uri().resolve("api/command"))
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(json)).build();
        return http.send(r, HttpResponse.BodyHandlers.ofString());
    }

    private Map<String, Object> state() throws Exception {
        URI u = server.uri().resolve("api/state");
        HttpResponse<String> r = http.send(HttpRequest.newBuilder(u).build(), HttpResponse.BodyHandlers.ofString());
        assertEquals(200, r.statusCode());
        return MiniJson.obj(MiniJson.parse(r.body()));
    }

    private static Map<String, Object> values(Map<String, Object> state) {
        return MiniJson.obj(MiniJson.obj(state.get("message")).get("values"));
    }

    /** Poll the page's state until the firmware has scanned with fresh inputs from the rig. */
    private Map<String, Object> valuesOnceScanning() throws Exception {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(REACH_TIMEOUT_S);
        while (System.nanoTime() < end) {
            Map<String, Object> v = values(state());
            if (v.get("level_mm") != null && ((Double) v.get("scan")) > 5) {
                return v;
            }
            LockSupport.parkNanos(20_000_000L);
        }
        throw new AssertionError("the firmware never showed a level read from the rig: " + values(state()));
    }

    @Test
    void theInfoSaysRealHardwareAndTheValuesAreTheFirmwaresView() throws Exception {
        Map<String, Object> info = MiniJson.obj(state().get("info"));
        assertEquals(Boolean.TRUE, info.get("hardware"), "the page must show its hardware banner");
        assertTrue(((String) info.get("io")).startsWith("Modbus TCP 127.0.0.1:" + rig.port()), info.toString());
        assertEquals(List.of(), info.get("transmitters"), "no plant transmitters to fault");
        assertEquals(List.of(), info.get("trippable"), "no plant equipment to trip");

        Map<String, Object> v = valuesOnceScanning();
        assertNull(v.get("level_true_mm"), "the true level is not known on hardware and must not be invented");
        assertNull(v.get("valve_pct"), "no valve position feedback in this map");
        assertNull(v.get("firing_pct"), "plant internals are not available");
        assertNull(v.get("demand_pct"), "plant internals are not available");
        // The firmware's view against the plant that produced the served image. Level: three dp
        // transmitters through a 16-bit 4-20 mA card (0.02 mm per count over -300..300 mm,
        // default.tuning) and density compensation; 10 mm is a good drum level indication
        // (common practice) and covers the transmitter noise of aux-boiler.plant.
        assertEquals(plant.levelM() * 1e3, (Double) v.get("level_mm"), 10.0, "indicated level read over Modbus");
        // Steam flow: square-root dp element, range 15 t/h (default.tuning); 1 % of range is the
        // usual accuracy of an orifice flow measurement (common practice).
        assertEquals(plant.steamFlowKgS() * 3.6, (Double) v.get("steam_meas_th"), 0.15, "measured steam flow over Modbus");
        assertEquals(Boolean.TRUE, v.get("pump_a"), "pump A running feedback read from the rig (aux-boiler.plant duty pump)");
    }

    @Test
    void aPlantFaultIsRefusedAndChangesNothing() throws Exception {
        valuesOnceScanning();
        for (String cmd : List.of("{\"cmd\":\"fault\",\"target\":\"level_tx_a\",\"kind\":\"stuck\"}",
                "{\"cmd\":\"steam_demand\",\"percent\":50}", "{\"cmd\":\"trip\",\"target\":\"feed_pump_a\"}",
                "{\"cmd\":\"clear\",\"target\":\"all\"}", "{\"cmd\":\"pause\"}", "{\"cmd\":\"speed\",\"speed\":2}")) {
            HttpResponse<String> r = command(cmd);
            assertEquals(400, r.statusCode(), cmd + " -> " + r.body());
            String error = (String) MiniJson.obj(MiniJson.parse(r.body())).get("error");
            assertTrue(error.contains("not available on real hardware"), error);
        }
        assertEquals(0, loop.queued(), "a refused command must not be queued");
        assertTrue(loop.actionLog().isEmpty(), "a refused command must not reach the action log");
        assertEquals(Boolean.FALSE, state().get("paused"), "the firmware keeps scanning the rig");
    }

    @Test
    void aManualOutputReachesTheRig() throws Exception {
        valuesOnceScanning();
        assertEquals(200, command("{\"cmd\":\"mode\",\"mode\":\"manual\"}").statusCode());
        HttpResponse<String> r = command("{\"cmd\":\"manual_output\",\"percent\":40}");
        assertEquals(200, r.statusCode(), r.body());
        ProcessImage written = new ProcessImage();
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(REACH_TIMEOUT_S);
        double valve = Double.NaN;
        // one count of the map's 0..27648 scale is 0.0036 %; two counts cover the rounding both ways
        double tol = 2.0 / VALVE_COUNTS_FULL_SCALE;
        while (System.nanoTime() < end) {
            rig.collectOutputs(written, 0.0);
            valve = written.value(Signal.FEED_VALVE_DEMAND);
            if (Math.abs(valve - 0.40) <= tol) {
                break;
            }
            LockSupport.parkNanos(20_000_000L);
        }
        assertEquals(0.40, valve, tol, "the valve demand the rig received over Modbus");
        Map<String, Object> v = values(state());
        assertEquals("manual", v.get("mode"));
        // output_pct is the demand written to the rig, rounded to 0.01 % in the page's JSON
        assertEquals(40.0, (Double) v.get("output_pct"), 0.01);
        assertTrue(loop.actionLog().stream().anyMatch(l -> l.endsWith(" s output 40 %")), loop.actionLog().toString());
        assertTrue(server.scenarioText().lines().anyMatch(l -> l.startsWith("# at ") && l.endsWith(" s output 40 %")),
                "the saved session keeps the operator action");
    }

    @Test
    void inABrowserTheHardwareBannerStaysAndEveryWriteAsksFirst(@TempDir Path tmp) throws Exception {
        valuesOnceScanning();
        try (WebDriverClient web = new WebDriverClient(tmp.resolve("chromium-profile"), 1400, 1300)) {
            web.navigate(server.uri().toString());
            web.waitFor("document.getElementById('conn').textContent === 'connected'"
                    + " && document.getElementById('fp-mode').textContent === 'three-element'");
            assertEquals(Boolean.FALSE, web.script("return document.getElementById('hw-banner').hidden;", "[]"));
            assertTrue(web.text("#hw-banner").contains("CONNECTED TO HARDWARE"), web.text("#hw-banner"));
            assertEquals(0L, ((Double) web.script("return document.querySelectorAll('#hw-banner button').length;", "[]"))
                    .longValue(), "nothing on the banner closes it");
            assertTrue(web.text("#caution").contains("TEST BENCH"), "the page says plainly it is a test bench");
            assertEquals(Boolean.TRUE, web.script("return document.getElementById('fault-apply').disabled"
                    + " && document.getElementById('demand-apply').disabled && document.getElementById('pause').disabled;", "[]"),
                    "plant actions and pause are not offered on hardware");
            assertEquals(Boolean.FALSE, web.script("return document.getElementById('instructor-hw').hidden;", "[]"));
            web.click("#mode-manual");
            assertTrue(web.alertText().contains("Hardware is connected"));
            web.dismissAlert();
            web.waitFor("document.getElementById('cmd-msg').textContent === 'Not sent.'");
            assertTrue(loop.actionLog().isEmpty(), "a write the user did not confirm is never sent");
            web.click("#mode-manual");
            web.acceptAlert();
            web.waitFor("document.getElementById('fp-mode').textContent === 'manual'");
            assertEquals(1, loop.actionLog().size(), loop.actionLog().toString());
        }
    }
}
