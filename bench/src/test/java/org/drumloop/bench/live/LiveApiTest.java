package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Map;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The live page's HTTP API: bad commands get a clear 400 and change nothing; good ones are
 * queued for the next scan boundary; the event stream is a proper text/event-stream. The loop is
 * not started here, so whatever is queued stays visible to the test.
 */
class LiveApiTest {
    private final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
    private FakeLiveSession session;
    private LiveLoop loop;
    private LiveServer server;

    @BeforeEach
    void start() throws Exception {
        session = new FakeLiveSession(false);
        loop = new LiveLoop(session, 1.0);
        server = LiveServer.onLoopback(loop, 0);
        server.start();
    }

    @AfterEach
    void stop() {
        server.close();
    }

    private HttpResponse<String> post(String body, String contentType) throws Exception {
        HttpRequest r = HttpRequest.newBuilder(server.uri().resolve("api/command"))
                .header("Content-Type", contentType).POST(HttpRequest.BodyPublishers.ofString(body)).build();
        return http.send(r, HttpResponse.BodyHandlers.ofString());
    }

    private HttpResponse<String> get(String path) throws Exception {
        return http.send(HttpRequest.newBuilder(server.uri().resolve(path)).build(), HttpResponse.BodyHandlers.ofString());
    }

    private String error(HttpResponse<String> r) {
        return (String) MiniJson.obj(MiniJson.parse(r.body())).get("error");
    }

    private static Object values(String state) {
        return MiniJson.obj(MiniJson.obj(MiniJson.parse(state)).get("message")).get("values");
    }

    private void assertNothingChanged(String stateBefore) throws Exception {
        assertEquals(0, loop.queued(), "a refused command must not be queued");
        assertTrue(loop.actionLog().isEmpty(), "a refused command must not reach the action log");
        assertTrue(session.applied.isEmpty(), "a refused command must not reach the session");
        assertEquals(values(stateBefore), values(get("api/state").body()), "values must be unchanged");
    }

    @ParameterizedTest(name = "{0} -> 400 naming \"{1}\"")
    @CsvSource(delimiter = '|', value = {
        "{\"cmd\":\"auto\"}                                       | auto: missing",
        "not json at all                                          | malformed JSON",
        "{\"cmd\":\"mode\",\"mode\":\"manual\"                     | malformed JSON",
        "{\"cmd\":\"mode\",\"mode\":\"manual\"} trailing           | malformed JSON",
        "{\"cmd\":\"mode\",\"mode\":{\"x\":1}}                       | nested",
        "{\"cmd\":\"launch\"}                                     | cmd: unknown command",
        "{\"mode\":\"manual\"}                                    | cmd: missing",
        "{\"cmd\":\"mode\",\"mode\":\"automatic\"}                  | mode: \"automatic\" is not one of",
        "{\"cmd\":\"mode\",\"mode\":\"manual\",\"extra\":1}          | extra: unknown member",
        "{\"cmd\":\"auto\",\"auto\":\"yes\"}                        | auto: must be true or false",
        "{\"cmd\":\"manual_output\",\"percent\":101}              | percent: 101 % is out of range 0 to 100 %",
        "{\"cmd\":\"manual_output\",\"percent\":-0.5}             | percent: -0.5 % is out of range",
        "{\"cmd\":\"manual_output\",\"percent\":\"50\"}             | percent: must be a number",
        "{\"cmd\":\"setpoint\",\"mm\":150}                        | mm: 150 mm is out of range -100 to 100 mm",
        "{\"cmd\":\"ack\",\"tag\":\"LXYZ\"}                         | tag: \"LXYZ\" is not an alarm or trip",
        "{\"cmd\":\"bypass\",\"tag\":\"LALL\",\"reason\":\"  \",\"seconds\":60}       | reason: a bypass needs a reason",
        "{\"cmd\":\"bypass\",\"tag\":\"LALL\",\"reason\":\"test\",\"seconds\":7200}  | seconds: 7200 s is out of range 1 to 3600 s",
        "{\"cmd\":\"bypass\",\"tag\":\"LALL\",\"reason\":\"test\"}                   | seconds: missing",
        "{\"cmd\":\"steam_demand\",\"percent\":150}               | percent: 150 % is out of range 0 to 120 %",
        "{\"cmd\":\"steam_ramp\",\"percent\":80,\"seconds\":0}      | seconds: 0 s is out of range",
        "{\"cmd\":\"fault\",\"target\":\"level_tx_z\",\"kind\":\"stuck\"}               | target: \"level_tx_z\" is not a transmitter",
        "{\"cmd\":\"fault\",\"target\":\"level_tx_a\",\"kind\":\"melt\"}                | kind: \"melt\" is not one of",
        "{\"cmd\":\"fault\",\"target\":\"level_tx_a\",\"kind\":\"bias\",\"value\":2,\"unit\":\"t/h\"}   | unit: \"t/h\" is not a unit of Pa",
        "{\"cmd\":\"fault\",\"target\":\"level_tx_a\",\"kind\":\"drift\",\"value\":2,\"unit\":\"kPa\"}  | unit: a drift rate is per second",
        "{\"cmd\":\"fault\",\"target\":\"level_tx_a\",\"kind\":\"noise-burst\",\"value\":2,\"unit\":\"kPa\"} | seconds: missing",
        "{\"cmd\":\"trip\",\"target\":\"feed_pump_c\"}              | target: \"feed_pump_c\" cannot be tripped",
        "{\"cmd\":\"tube_leak\",\"value\":0,\"unit\":\"t/h\"}         | value: a tube leak must be more than 0",
        "{\"cmd\":\"tube_leak\",\"value\":50,\"unit\":\"t/h\"}        | value: 50 t/h is out of range 0 to 10 t/h",
        "{\"cmd\":\"clear\",\"target\":\"boiler\"}                  | target: \"boiler\" is not a fault target",
        "{\"cmd\":\"speed\",\"speed\":1000}                       | speed: 1000 is out of range 0.1 to 100",
        "{\"cmd\":\"pause\",\"now\":true}                         | takes no other members",
    })
    void badCommandsAreRefusedWith400AndAMessageAndChangeNothing(String body, String expected) throws Exception {
        String before = get("api/state").body();
        HttpResponse<String> r = post(body, "application/json");
        assertEquals(400, r.statusCode(), r.body());
        assertTrue(error(r).contains(expected), "message \"" + error(r) + "\" should contain \"" + expected + "\"");
        assertNothingChanged(before);
    }

    @Test
    void aCommandThatIsNotJsonContentIsRefusedSoOtherSitesCannotPostFormsToTheBench() throws Exception {
        String before = get("api/state").body();
        HttpResponse<String> r = post("{\"cmd\":\"reset\"}", "text/plain");
        assertEquals(415, r.statusCode());
        assertNothingChanged(before);
    }

    @Test
    void aCommandFromAnotherOriginIsRefused() throws Exception {
        String before = get("api/state").body();
        HttpRequest req = HttpRequest.newBuilder(server.uri().resolve("api/command"))
                .header("Content-Type", "application/json").header("Origin", "http://example.invalid")
                .POST(HttpRequest.BodyPublishers.ofString("{\"cmd\":\"reset\"}")).build();
        HttpResponse<String> r = http.send(req, HttpResponse.BodyHandlers.ofString());
        assertEquals(403, r.statusCode());
        assertNothingChanged(before);
    }

    @Test
    void aGoodCommandIsQueuedForTheNextScanAndEchoedAsAScenarioStatement() throws Exception {
        HttpResponse<String> r = post("{\"cmd\":\"manual_output\",\"percent\":42.5}", "application/json");
        assertEquals(200, r.statusCode(), r.body());
        Map<String, Object> m = MiniJson.obj(MiniJson.parse(r.body()));
        assertEquals("output 42.5 %", m.get("statement"));
        assertEquals(1, loop.queued());
        assertTrue(session.applied.isEmpty(), "applied only by the loop at a scan boundary");
    }

    @Test
    void theStateCarriesInfoLinesAndValuesInEngineeringUnits() throws Exception {
        Map<String, Object> st = MiniJson.obj(MiniJson.parse(get("api/state").body()));
        Map<String, Object> info = MiniJson.obj(st.get("info"));
        assertEquals("test-drum", info.get("plant"));
        assertEquals(4, MiniJson.list(info.get("lines")).size());
        Map<String, Object> values = MiniJson.obj(MiniJson.obj(st.get("message")).get("values"));
        // 60 % of 10 t/h rated steam (the fake's own definition), printed to 3 decimals
        assertEquals(6.0, (Double) values.get("steam_th"), 0.0005, "rounding to 3 decimals");
        // 9.0e5 Pa abs less one standard atmosphere 101325 Pa (ISO 2533) = 7.98675 bar gauge
        assertEquals(7.98675, (Double) values.get("pressure_barg"), 0.0005, "rounding to 3 decimals");
    }

    @Test
    void theEventStreamIsServerSentEventsWithRetryAndNumberedMessages() throws Exception {
        HttpRequest req = HttpRequest.newBuilder(server.uri().resolve("api/stream")).build();
        HttpResponse<InputStream> r = http.send(req, HttpResponse.BodyHandlers.ofInputStream());
        assertEquals(200, r.statusCode());
        assertTrue(r.headers().firstValue("Content-Type").orElse("").startsWith("text/event-stream"));
        try (BufferedReader in = new BufferedReader(new InputStreamReader(r.body(), StandardCharsets.UTF_8))) {
            assertEquals("retry: 1000", in.readLine());
            long last = -1;
            int messages = 0;
            for (String line = in.readLine(); line != null && messages < 3; line = in.readLine()) {
                if (line.startsWith("data: ")) {
                    Map<String, Object> m = MiniJson.obj(MiniJson.parse(line.substring(6)));
                    long seq = ((Double) m.get("seq")).longValue();
                    assertTrue(seq > last, "message numbers increase");
                    last = seq;
                    messages++;
                }
            }
            assertEquals(3, messages);
        }
    }

    @Test
    void thePageAndItsFilesAreServedFromTheClassPathAndNothingElse() throws Exception {
        HttpResponse<String> page = get("");
        assertEquals(200, page.statusCode());
        assertTrue(page.body().contains("not a safety system"), "the page says plainly it is a test bench");
        assertEquals(200, get("live.js").statusCode());
        assertEquals(200, get("live.css").statusCode());
        assertEquals(404, get("../pom.xml").statusCode());
    }

    @Test
    void thePageLoadsNothingFromTheNetworkSoItWorksOffline() throws Exception {
        for (String f : new String[] {"", "live.js", "live.css"}) {
            // the only absolute URL allowed is the SVG namespace name, an identifier never fetched
            String body = get(f).body().replace("http://www.w3.org/2000/svg", "");
            assertTrue(!body.contains("http://") && !body.contains("https://") && !body.contains("//cdn"),
                    (f.isEmpty() ? "index.html" : f) + " refers to the network");
        }
    }

    @Test
    void theServerBindsTheLoopbackAddressByDefault() {
        assertTrue(URI.create(server.uri().toString()).getHost().equals("127.0.0.1"));
    }
}
