package org.drumloop.bench.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import javax.imageio.ImageIO;

import org.drumloop.bench.ConfigResolver;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The demo's report opens in a real headless browser (Debian's chromium): the DOM holds the SVG
 * plots and one row per expectation, and a screenshot is a picture, not a blank page. Screenshots
 * are kept under {@code bench/target/report-browser/}.
 */
class ReportInBrowserTest {
    static final Path CHROMIUM = Paths.get("/usr/bin/chromium");
    static final Path DIR = Paths.get("target", "report-browser");
    /** Browser run limit; a headless page load takes a few seconds. */
    static final long TIMEOUT_S = 120;

    static RunSummary demo;

    @BeforeAll
    static void runDemo() throws Exception {
        Files.createDirectories(DIR);
        Path demoFile = ConfigResolver.resolve("demo", "scenarios", ".scenario", null);
        demo = ScenarioRunner.run(ScenarioParser.load(demoFile, ConfigResolver.displayName(demoFile)),
                ScenarioRunner.Options.fast(DIR));
        AtomicOutput.write(DIR.resolve("plots.html"), HtmlReport.renderPlots(demo));
    }

    static String chromium(Path profile, String... args) throws IOException, InterruptedException {
        if (!Files.isExecutable(CHROMIUM)) {
            fail("headless browser missing: install the Debian package 'chromium' (apt-get install chromium)");
        }
        List<String> cmd = new ArrayList<>(List.of(CHROMIUM.toString(), "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--user-data-dir=" + profile.toAbsolutePath()));
        cmd.addAll(List.of(args));
        Path log = Files.createTempFile(DIR.toAbsolutePath(), "chromium", ".log");
        Path stdout = Files.createTempFile(DIR.toAbsolutePath(), "chromium", ".out");
        Process p = new ProcessBuilder(cmd).redirectError(log.toFile()).redirectOutput(stdout.toFile()).start();
        if (!p.waitFor(TIMEOUT_S, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            fail("chromium did not finish within " + TIMEOUT_S + " s");
        }
        String text = Files.readString(stdout, StandardCharsets.UTF_8);
        Files.deleteIfExists(stdout);
        Files.deleteIfExists(log);
        deleteTree(profile);
        return text;
    }

    /** Remove a browser profile folder (best effort: a file still held open is left for the next clean). */
    static void deleteTree(Path dir) throws IOException {
        try (java.util.stream.Stream<Path> walk = Files.walk(dir)) {
            for (Path p : (Iterable<Path>) walk.sorted(java.util.Comparator.reverseOrder())::iterator) {
                try {
                    Files.deleteIfExists(p);
                } catch (IOException e) {
                    // left behind under target/
                }
            }
        }
    }

    @Test
    void theDomHasThePlotsAndOneRowPerExpectation() throws Exception {
        Path profile = Files.createTempDirectory(DIR.toAbsolutePath(), "profile-");
        String dom = chromium(profile, "--dump-dom", DIR.resolve("report.html").toAbsolutePath().toUri().toString());
        for (String id : new String[] {"svg-level", "svg-flow", "svg-valve", "svg-pressure"}) {
            assertTrue(dom.contains("id=\"" + id + "\""), "plot " + id + " in the DOM");
        }
        Matcher m = Pattern.compile("<tr class=\"expectation (pass|fail)\"").matcher(dom);
        int rows = 0;
        while (m.find()) {
            rows++;
        }
        assertEquals(demo.outcomes().size(), rows, "one row per expectation");
        // the level plot draws the alarm and trip settings (LAL, LAH, LALL, LAHH) as lines
        assertTrue(dom.contains("class=\"limit trip\"") && dom.contains("class=\"limit alarm\""));
        assertTrue(dom.contains("not a safety system"), "caution text");
        assertTrue(!dom.contains("http://") || dom.indexOf("http://") == dom.indexOf("http://www.w3.org/2000/svg"),
                "no network references apart from the SVG namespace");
    }

    @Test
    void aScreenshotIsNotBlank() throws Exception {
        for (String page : new String[] {"report.html", "plots.html"}) {
            Path profile = Files.createTempDirectory(DIR.toAbsolutePath(), "profile-");
            Path png = DIR.resolve(page.replace(".html", ".png")).toAbsolutePath();
            Files.deleteIfExists(png);
            chromium(profile, "--hide-scrollbars", "--screenshot=" + png, "--window-size=1200,"
                    + (page.startsWith("plots") ? "1300" : "2000"), DIR.resolve(page).toAbsolutePath().toUri().toString());
            assertTrue(Files.isRegularFile(png), "screenshot written: " + png);
            BufferedImage img = ImageIO.read(png.toFile());
            assertEquals(1200, img.getWidth());
            Set<Integer> colours = new HashSet<>();
            long dark = 0;
            for (int y = 0; y < img.getHeight(); y += 3) {
                for (int x = 0; x < img.getWidth(); x += 3) {
                    int rgb = img.getRGB(x, y) & 0xFFFFFF;
                    colours.add(rgb);
                    int lum = ((rgb >> 16) & 0xFF) + ((rgb >> 8) & 0xFF) + (rgb & 0xFF);
                    if (lum < 300) {
                        dark++;
                    }
                }
            }
            // a blank page has one colour; text, lines and plots give hundreds (anti-aliasing)
            assertTrue(colours.size() > 50, page + ": only " + colours.size() + " colours");
            assertTrue(dark > 500, page + ": hardly any dark pixels (" + dark + ")");
        }
    }
}
