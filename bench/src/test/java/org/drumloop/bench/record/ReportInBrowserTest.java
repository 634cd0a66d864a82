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

    /** Paper sizes the print stylesheet is laid out for [cm]: ISO 216 A4 and ANSI Letter (8.5 x 11 in). */
    static final double[][] PAPERS = {{21.0, 29.7}, {21.59, 27.94}};
    /** The plots' captions (above each SVG); every plot ends with its time-axis label at the bottom. */
    static final String[] PLOT_TOPS = {"Drum level relative to normal water level", "Steam and feed flow",
        "Feed valve and firing", "Drum pressure [barg]"};
    static final String PLOT_BOTTOM = "t [s]";

    /** Run a poppler-utils command (Debian package poppler-utils) and return its standard output. */
    static String poppler(String... cmd) throws IOException, InterruptedException {
        Process p;
        try {
            p = new ProcessBuilder(cmd).redirectErrorStream(false).start();
        } catch (IOException e) {
            throw new AssertionError("the PDF checks need poppler-utils (" + cmd[0] + "): apt-get install poppler-utils", e);
        }
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(TIMEOUT_S, TimeUnit.SECONDS), cmd[0] + " finished");
        assertEquals(0, p.exitValue(), String.join(" ", cmd) + " failed");
        return out;
    }

    static int pages(Path pdf) throws Exception {
        Matcher m = Pattern.compile("(?m)^Pages:\\s+(\\d+)").matcher(poppler("pdfinfo", pdf.toString()));
        assertTrue(m.find(), "pdfinfo names the page count");
        return Integer.parseInt(m.group(1));
    }

    /**
     * Each plot on one page: the plots follow the "Trends" heading in order; on the page where a
     * plot's top (its caption) is printed, its bottom (the time-axis label) follows on the
     * same page. A plot cut by a page break would carry its lower part, and with it the axis label,
     * to the next page.
     */
    static void assertNoPlotSplit(Path pdf) throws Exception {
        int n = pages(pdf);
        assertTrue(n > 0, "at least one page");
        List<String> text = new ArrayList<>();
        for (int page = 1; page <= n; page++) {
            text.add(poppler("pdftotext", "-layout", "-f", Integer.toString(page), "-l", Integer.toString(page),
                    pdf.toString(), "-"));
        }
        int page = 0;
        int at = -1;
        while (page < n && (at = text.get(page).indexOf("Trends")) < 0) {
            page++;
        }
        assertTrue(page < n, pdf.getFileName() + ": the Trends section is printed");
        for (String top : PLOT_TOPS) {
            int from = at;
            while (page < n && (at = text.get(page).indexOf(top, from)) < 0) {
                page++;
                from = 0;
            }
            assertTrue(page < n, pdf.getFileName() + ": the plot starting with '" + top + "' is printed");
            int bottom = text.get(page).indexOf(PLOT_BOTTOM, at);
            assertTrue(bottom > at, pdf.getFileName() + ": the plot that starts with '" + top + "' on page "
                    + (page + 1) + " of " + n + " is cut by the page break");
            at = bottom + PLOT_BOTTOM.length();
        }
    }

    @Test
    void printedOnA4AndLetterNoPlotIsCutAcrossPages() throws Exception {
        Path profile = Files.createTempDirectory(DIR.toAbsolutePath(), "profile-");
        try (org.drumloop.bench.live.WebDriverClient b = new org.drumloop.bench.live.WebDriverClient(profile, 1200, 900)) {
            b.navigate(DIR.resolve("report.html").toAbsolutePath().toUri().toString());
            for (double[] paper : PAPERS) {
                Path pdf = DIR.resolve(String.format(java.util.Locale.ROOT, "print-%.0fx%.0fmm.pdf", paper[0] * 10,
                        paper[1] * 10));
                Files.write(pdf, b.printPdf(paper[0], paper[1]));
                assertNoPlotSplit(pdf);
                String all = poppler("pdftotext", pdf.toString(), "-");
                assertTrue(all.contains("Sign-off") && all.contains("Witnessed by"), "sign-off block printed");
            }
        } finally {
            deleteTree(profile);
        }
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
