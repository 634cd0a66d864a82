package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.net.InetAddress;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The live page end to end in a real headless browser (Debian chromium driven over W3C
 * WebDriver): an operator switches to manual, changes the output, the instructor trips a feed
 * pump, the low-level alarm appears and is acknowledged, and the values on the page match the
 * loop's own per-scan record. Runs the loop at 10× real time to keep it short. Waits happen in
 * the browser (condition polled by the page's own event loop), never as sleeps in the test.
 */
class LivePageInBrowserTest {
    static final double SPEED = 10.0;

    @TempDir
    static Path tmp;

    /** One browser for the class: starting chromium costs seconds on a busy machine. */
    static WebDriverClient web;

    @BeforeAll
    static void startBrowser() throws Exception {
        web = new WebDriverClient(tmp.resolve("chromium-profile"), 1400, 1300);
    }

    @AfterAll
    static void stopBrowser() throws Exception {
        if (web != null) {
            web.close();
        }
    }

    static Path targetDir() throws Exception {
        String base = System.getProperty("basedir");
        Path t = (base != null ? Path.of(base) : Path.of("")).resolve("target");
        Files.createDirectories(t);
        return t;
    }

    /** All displayed values in one script run, so they come from one render of one message. */
    static final String READ_VALUES = "const g = (id) => document.getElementById(id).textContent;"
            + "return JSON.stringify({t: g('sim-time'), pv: g('fp-pv'), out: g('fp-out'), steam: g('dv-steam'),"
            + " feed: g('dv-feed'), mode: g('fp-mode'), auto: g('fp-auto')});";

    @Test
    void anOperatorRunsTheLoopFromThePageAndSeesWhatTheLoopComputed() throws Exception {
        FakeLiveSession session = new FakeLiveSession(false);
        LiveLoop loop = new LiveLoop(session, SPEED);
        try (LiveServer server = LiveServer.onLoopback(loop, 0)) {
            loop.start();
            server.start();
            web.navigate(server.uri().toString());
            web.waitFor("document.getElementById('conn').textContent === 'connected'"
                    + " && document.getElementById('sim-time').textContent !== '-'");
            assertTrue(web.text("#caution").contains("not a safety system"), "the page says it is a test bench");
            assertEquals(Boolean.TRUE, web.script("return document.getElementById('hw-banner').hidden;", "[]"),
                    "no hardware banner on the simulator");

            web.click("#mode-manual");
            web.waitFor("document.getElementById('fp-mode').textContent === 'manual'");
            web.type("#out-input", "70");
            web.click("#out-apply");
            web.waitFor("document.getElementById('fp-out').textContent === '70.0'");

            web.click("#trip-feed_pump_a");
            web.waitFor("document.getElementById('dv-pump-a').textContent === 'stopped'");
            // with no feed the drum drains at steam flow until LAL (-100 mm in the fake) alarms
            web.waitFor("document.getElementById('alarm-row-LAL').classList.contains('st-alarm')"
                    + " && document.getElementById('alarm-row-LAL').classList.contains('unacked')");
            assertEquals("ACTIVE", web.text("#alarm-row-LAL .state"));
            web.waitFor("[...document.querySelectorAll('#event-rows tr')].some(r => r.textContent.includes('LAL')"
                    + " && r.textContent.includes('ALARM'))");
            web.click("#ack-LAL");
            web.waitFor("!document.getElementById('alarm-row-LAL').classList.contains('unacked')");

            Map<String, Object> shown = MiniJson.obj(MiniJson.parse((String) web.script(READ_VALUES, "[]")));
            double tS = Double.parseDouble((String) shown.get("t"));
            double[] rec = session.recordAt(tS);
            assertNotNull(rec);
            // the time shown (1 decimal) names one scan of the loop's record (0.1 s scans)
            assertEquals(tS, rec[0], 0.05 + 1e-9, "display rounding of time: half of 0.1 s");
            // level shown to 0.1 mm: the record's level within half a display step (plus float noise)
            assertEquals(rec[1] * 1e3, Double.parseDouble((String) shown.get("pv")), 0.05 + 1e-6, "display rounding 0.1 mm");
            // output shown to 0.1 %: the manual output typed, as the loop applied it
            assertEquals(rec[5] * 100, Double.parseDouble((String) shown.get("out")), 0.05 + 1e-6, "display rounding 0.1 %");
            assertEquals(70.0, rec[5] * 100, 1e-9, "the loop applied exactly the 70 % typed (fraction 0.7)");
            // flows shown to 0.01 t/h; the record is kg/s (1 t/h = 1000/3600 kg/s, definition)
            assertEquals(rec[2] * 3.6, number((String) shown.get("steam")), 0.005 + 1e-6, "display rounding 0.01 t/h");
            assertEquals(rec[3] * 3.6, number((String) shown.get("feed")), 0.005 + 1e-6, "display rounding 0.01 t/h");
            assertEquals(0.0, rec[3], 0.0, "no feed after the only running pump tripped");
            assertEquals("MANUAL", shown.get("auto"));

            // trends: a 1 min window, then drag across the chart to zoom, then back to live
            web.click("[data-window='60']");
            web.waitFor("document.querySelector(\"[data-window='60']\").classList.contains('on')");
            web.script("const c = document.getElementById('trend'); const r = c.getBoundingClientRect();"
                    + "const ev = (type, x) => new MouseEvent(type, {bubbles: true, clientX: r.left + x, clientY: r.top + 40});"
                    + "c.dispatchEvent(ev('mousedown', 200)); c.dispatchEvent(ev('mousemove', 400)); window.dispatchEvent(ev('mouseup', 400));"
                    + "return true;", "[]");
            web.waitFor("document.getElementById('trend-range').textContent.startsWith('zoomed')");
            web.click("#trend-live");
            web.waitFor("document.getElementById('trend-range').textContent === ''");

            byte[] png = web.screenshotPng();
            Path shot = targetDir().resolve("live-page-test-drum.png");
            Files.write(shot, png);
            assertNonBlankPng(png);

            String scenario = HttpClient.newHttpClient().send(HttpRequest.newBuilder(server.uri().resolve("api/scenario")).build(),
                    HttpResponse.BodyHandlers.ofString()).body();
            assertTrue(scenario.contains("s set mode manual\n"), scenario);
            assertTrue(scenario.contains("s output 70 %\n"), scenario);
            assertTrue(scenario.contains("s trip feed_pump_a\n"), scenario);
            assertTrue(scenario.contains("s acknowledge LAL\n"), scenario);
        } finally {
            loop.stop();
        }
    }

    @Test
    void thePageReconnectsByItselfWhenTheServerRestarts() throws Exception {
        FakeLiveSession first = new FakeLiveSession(false);
        LiveLoop loop1 = new LiveLoop(first, SPEED);
        LiveServer server1 = LiveServer.onLoopback(loop1, 0);
        int port = server1.port();
        try {
            loop1.start();
            server1.start();
            web.navigate(server1.uri().toString());
            web.waitFor("document.getElementById('conn').textContent === 'connected'");
            web.click("#mode-manual");
            web.waitFor("document.getElementById('fp-mode').textContent === 'manual'");
            server1.close();
            loop1.stop();
            web.waitFor("document.getElementById('conn').textContent !== 'connected'");
            // a new bench on the same port: a fresh session in three-element mode
            LiveLoop loop2 = new LiveLoop(new FakeLiveSession(false), SPEED);
            try (LiveServer server2 = new LiveServer(loop2, InetAddress.getLoopbackAddress(), port, LiveServer.DEFAULT_BROADCAST_MS)) {
                loop2.start();
                server2.start();
                web.waitFor("document.getElementById('conn').textContent === 'connected'"
                        + " && document.getElementById('fp-mode').textContent === 'three-element'");
            } finally {
                loop2.stop();
            }
        } finally {
            server1.close();
            loop1.stop();
        }
    }

    @Test
    void onHardwareABannerThatCannotBeClosedShowsAndEveryWriteAsksFirst() throws Exception {
        FakeLiveSession session = new FakeLiveSession(true);
        LiveLoop loop = new LiveLoop(session, SPEED);
        try (LiveServer server = LiveServer.onLoopback(loop, 0)) {
            loop.start();
            server.start();
            web.navigate(server.uri().toString());
            web.waitFor("document.getElementById('conn').textContent === 'connected'");
            assertEquals(Boolean.FALSE, web.script("return document.getElementById('hw-banner').hidden;", "[]"));
            assertTrue(web.text("#hw-banner").contains("HARDWARE"));
            assertEquals(0L, ((Double) web.script("return document.querySelectorAll('#hw-banner button').length;", "[]")).longValue(),
                    "nothing on the banner closes it");
            web.click("#reset");
            assertTrue(web.alertText().contains("Hardware is connected"));
            web.dismissAlert();
            web.waitFor("document.getElementById('cmd-msg').textContent === 'Not sent.'");
            assertTrue(session.applied.isEmpty(), "a write the user did not confirm is never sent");
            web.click("#mode-manual");
            web.acceptAlert();
            web.waitFor("document.getElementById('fp-mode').textContent === 'manual'");
            assertEquals(1, session.applied.size());
        } finally {
            loop.stop();
        }
    }

    private static double number(String withUnit) {
        return Double.parseDouble(withUnit.split(" ")[0]);
    }

    private static void assertNonBlankPng(byte[] png) throws Exception {
        // PNG signature (ISO/IEC 15948, 5.2): 137 80 78 71 13 10 26 10
        assertEquals((byte) 0x89, png[0]);
        assertEquals('P', png[1]);
        BufferedImage img = ImageIO.read(new ByteArrayInputStream(png));
        assertNotNull(img);
        Set<Integer> colours = new HashSet<>();
        for (int y = 0; y < img.getHeight(); y += 7) {
            for (int x = 0; x < img.getWidth(); x += 7) {
                colours.add(img.getRGB(x, y));
            }
        }
        assertFalse(colours.size() < 8, "a rendered page has text, lines and panels, not one flat colour: " + colours.size());
    }
}
