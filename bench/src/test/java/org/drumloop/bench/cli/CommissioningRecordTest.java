package org.drumloop.bench.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

import org.drumloop.bench.ExitCode;
import org.drumloop.bench.Main;
import org.drumloop.bench.record.BuildInfo;
import org.drumloop.bench.record.Html;
import org.drumloop.bench.record.InputFile;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Records fit for a commissioning file: every input named by its SHA-256, the build and the
 * command line on the record, the settings in use, the verdict of a run without criteria, the
 * campaign cover sheet, and output folders checked before anything runs.
 */
class CommissioningRecordTest {
    static final Path CONFIG = Paths.get("..", "config");
    /** Limit for an outside command (sha256sum, git, pdftotext, a child JVM). */
    static final long COMMAND_TIMEOUT_S = 240;

    @TempDir
    Path tmp;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    private int drumloop(String... args) {
        return Main.execute(new PrintWriter(out), new PrintWriter(err), args);
    }

    private Path scenario(String name, String... lines) throws IOException {
        Path p = tmp.resolve(name);
        Files.write(p, List.of(lines), StandardCharsets.UTF_8);
        return p;
    }

    /** A short run on a copy of the shipped tuning and interlocks (so the test can change a file). */
    private Path shortRun(String name, String... extra) throws IOException {
        Files.copy(CONFIG.resolve("tuning/default.tuning"), tmp.resolve("default.tuning"),
                java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        Files.copy(CONFIG.resolve("tuning/default.interlocks"), tmp.resolve("default.interlocks"),
                java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        List<String> l = new ArrayList<>(List.of("title Short " + name, "plant " + CONFIG.resolve("plants/aux-boiler.plant").toAbsolutePath(),
                "tuning default.tuning", "duration 20 s", "seed 42", "at 5 s set steam_demand 70 %"));
        l.addAll(List.of(extra));
        return scenario(name + ".scenario", l.toArray(new String[0]));
    }

    /** Run an outside command; its standard output. */
    static String command(Path dir, String... cmd) throws Exception {
        Process p = new ProcessBuilder(cmd).directory(dir == null ? null : dir.toFile()).start();
        String o = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(COMMAND_TIMEOUT_S, TimeUnit.SECONDS), String.join(" ", cmd) + " finished");
        assertEquals(0, p.exitValue(), String.join(" ", cmd) + " failed");
        return o;
    }

    /** SHA-256 of a file as GNU coreutils' sha256sum computes it (an implementation outside the JDK). */
    static String sha256sum(Path f) throws Exception {
        return command(null, "sha256sum", f.toString()).split("\\s+")[0];
    }

    @Test
    void sha256MatchesTheStandardsExample() throws Exception {
        // FIPS 180-2, appendix B.1: SHA-256("abc")
        Path abc = tmp.resolve("abc.txt");
        Files.writeString(abc, "abc", StandardCharsets.US_ASCII);
        assertEquals("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", InputFile.sha256(abc));
    }

    @Test
    void everyInputIsNamedByItsSha256AndAChangeShows() throws Exception {
        Path sc = shortRun("hashes", "expect trip LALL never");
        Path dir = tmp.resolve("rec");
        assertEquals(ExitCode.OK, drumloop("run", sc.toString(), "--out", dir.toString()), err.toString());
        String report = Files.readString(dir.resolve("report.html"));
        for (Path input : new Path[] {sc, CONFIG.resolve("plants/aux-boiler.plant"), tmp.resolve("default.tuning"),
            tmp.resolve("default.interlocks")}) {
            assertTrue(report.contains(sha256sum(input)), input + " named by its SHA-256 (sha256sum)");
        }
        String before = sha256sum(tmp.resolve("default.interlocks"));
        Files.writeString(tmp.resolve("default.interlocks"), "# edited after the first run\n",
                java.nio.file.StandardOpenOption.APPEND);
        assertEquals(ExitCode.OK, drumloop("run", sc.toString(), "--out", dir.toString()), err.toString());
        String after = Files.readString(dir.resolve("report.html"));
        assertFalse(after.contains(before), "the edited interlocks file no longer has its old hash on the record");
        assertTrue(after.contains(sha256sum(tmp.resolve("default.interlocks"))));
    }

    @Test
    void theHeaderNamesBuildDateHostCommandAndSeed() throws Exception {
        Path sc = shortRun("header", "expect trip LALL never");
        Path dir = tmp.resolve("hdr");
        assertEquals(ExitCode.OK, drumloop("run", sc.toString(), "--out", dir.toString()), err.toString());
        String report = Files.readString(dir.resolve("report.html"));
        assertTrue(report.contains(Html.esc(BuildInfo.current().describe())), "build named as --version names it");
        String head;
        try {
            head = command(null, "git", "rev-parse", "--short", "HEAD").strip();
        } catch (IOException | AssertionError e) {
            head = null; // not a git checkout (source archive): the build names its version alone
        }
        if (head != null) {
            assertTrue(report.contains(head), "commit " + head + " (git rev-parse --short HEAD) on the record");
        }
        assertTrue(report.contains(LocalDate.now(ZoneOffset.UTC) + " "), "run date in UTC");
        assertTrue(report.contains(" UTC"));
        assertTrue(report.contains("drumloop run " + sc + " --out " + dir), "the command line as typed");
        assertTrue(report.contains(System.getProperty("java.version").split("[+-]")[0]), "Java version");
        assertTrue(report.contains("<th>seed</th><td>42</td>"), "seed");
        assertTrue(report.contains("id=\"sign-off\"") && report.contains("Witnessed by") && report.contains("Remarks"));
    }

    @Test
    void theSettingsShowTheTuningAndTheSameCauseAndEffectTableAsTheInterlocksCommand() throws Exception {
        Path sc = shortRun("settings", "expect trip LALL never");
        Path dir = tmp.resolve("set");
        assertEquals(ExitCode.OK, drumloop("run", sc.toString(), "--out", dir.toString()), err.toString());
        String report = Files.readString(dir.resolve("report.html"));
        // values and units as written in config/tuning/default.tuning
        assertTrue(report.contains("<tr><th>range_low</th><td class=\"num\">-300</td><td>mm</td></tr>"), "level range");
        assertTrue(report.contains("<tr><th>gain</th><td class=\"num\">0.03</td><td>(t/h)/mm</td></tr>"), "master gain");
        String table = report.substring(report.indexOf("id=\"cause-effect\""), report.indexOf("</table>",
                report.indexOf("id=\"cause-effect\"")));
        out.getBuffer().setLength(0);
        assertEquals(ExitCode.OK, drumloop("interlocks", "--tuning", tmp.resolve("default.tuning").toString()));
        int rows = 0;
        for (String line : out.toString().split("\n")) {
            String[] cells = line.split(" \\| ");
            if (cells.length < 10 || cells[0].strip().equals("tag") || cells[0].startsWith("---")) {
                continue;
            }
            StringBuilder row = new StringBuilder("<tr>");
            for (String c : cells) {
                row.append("<td>").append(Html.esc(c.strip())).append("</td>");
            }
            for (int i = cells.length; i < 12; i++) {
                row.append("<td></td>"); // trailing empty cells are trimmed in the text table
            }
            assertTrue(table.contains(row + "</tr>"), "row of the interlocks command in the report: " + line);
            rows++;
        }
        assertEquals(6, rows, "every interlock of default.interlocks");
    }

    @Test
    void aScenarioWithoutCriteriaSaysSoAndFailsOnlyWhenCriteriaAreRequired() throws Exception {
        Path sc = shortRun("none");
        Path dir = tmp.resolve("none");
        assertEquals(ExitCode.OK, drumloop("run", sc.toString(), "--out", dir.toString()));
        assertTrue(out.toString().contains("NO CRITERIA"), out.toString());
        assertFalse(out.toString().contains("PASS"), out.toString());
        assertTrue(err.toString().contains("warning: ") && err.toString().contains("NO CRITERIA"), err.toString());
        assertTrue(Files.readString(dir.resolve("report.html")).contains("id=\"verdict\">NO CRITERIA<"));
        assertEquals(ExitCode.FAILED, drumloop("run", sc.toString(), "--out", dir.toString(), "--require-criteria"));
        Path ok = shortRun("with", "expect trip LALL never");
        assertEquals(ExitCode.OK, drumloop("run", ok.toString(), "--out", tmp.resolve("w").toString(),
                "--require-criteria"));
    }

    @Test
    void severalScenariosGiveACampaignCoverSheet() throws Exception {
        Path a = shortRun("alpha", "expect trip LALL never");
        Path b = shortRun("bravo", "expect drum_pressure between 7 and 9 barg");
        Path dir = tmp.resolve("campaign");
        assertEquals(ExitCode.OK, drumloop("run", a.toString(), b.toString(), "--out", dir.toString()), err.toString());
        String index = Files.readString(dir.resolve("index.html"));
        for (String name : new String[] {"alpha", "bravo"}) {
            assertTrue(index.contains("Short " + name), name + " listed");
            assertTrue(index.contains("href=\"" + name + "/report.html\""), name + " linked");
            assertTrue(Files.isRegularFile(dir.resolve(name).resolve("report.html")));
            assertTrue(index.contains(sha256sum(tmp.resolve(name + ".scenario"))), name + " by hash");
        }
        assertTrue(index.contains("id=\"verdict\">PASS<") && index.contains("id=\"sign-off\"")
                && index.contains("id=\"record-header\""));
    }

    @Test
    void anOutputFolderThatCannotBeWrittenStopsTheRunBeforeItStarts() throws Exception {
        Path a = shortRun("first", "expect trip LALL never");
        Path b = shortRun("second", "expect trip LALL never");
        Path dir = tmp.resolve("camp");
        assertEquals(ExitCode.OK, drumloop("run", a.toString(), b.toString(), "--out", dir.toString()), err.toString());
        byte[] report = Files.readAllBytes(dir.resolve("first/report.html"));
        byte[] trend = Files.readAllBytes(dir.resolve("first/trend.csv"));
        // the second scenario's folder is now a file: nothing may run, the first's records stay as they were
        deleteTree(dir.resolve("second"));
        Files.writeString(dir.resolve("second"), "in the way");
        err.getBuffer().setLength(0);
        out.getBuffer().setLength(0);
        assertEquals(ExitCode.IO_ERROR, drumloop("run", a.toString(), b.toString(), "--out", dir.toString()));
        assertTrue(err.toString().contains("second") && err.toString().contains("cannot be written"), err.toString());
        assertEquals("", out.toString(), "no run started");
        assertArrayEquals(report, Files.readAllBytes(dir.resolve("first/report.html")));
        assertArrayEquals(trend, Files.readAllBytes(dir.resolve("first/trend.csv")));
        try (var files = Files.list(dir.resolve("first"))) {
            assertEquals(3, files.count(), "no temporary file left behind");
        }
    }

    @Test
    void pdfHoldsTheAcceptanceTableAsText() throws Exception {
        Path dir = tmp.resolve("demo");
        assertEquals(ExitCode.OK, drumloop("demo", "--out", dir.toString(), "--pdf"), out + "\n" + err);
        Path pdf = dir.resolve("report.pdf");
        assertTrue(Files.isRegularFile(pdf), "report.pdf beside report.html");
        // text extracted by poppler-utils' pdftotext (Debian package poppler-utils), not by our code
        String text = command(null, "pdftotext", "-layout", pdf.toString(), "-");
        assertTrue(text.contains("Acceptance criteria"), "acceptance table heading");
        assertTrue(text.contains("expect trip LALL within 600 s after 250 s"), "an expectation as text");
        assertTrue(text.contains("LALL") && text.contains("LDAH"), "tags");
        assertTrue(text.contains("not a safety system"), "caution");
        assertTrue(text.contains("page 1 of "), "page numbers");
        String info = command(null, "pdfinfo", pdf.toString());
        assertTrue(info.contains("(A4)"), "A4 by default: " + info);
    }

    @Test
    void pdfWithoutABrowserIsExitThreeBeforeTheRun() throws Exception {
        // a child JVM whose PATH holds no browser and no DRUMLOOP_BROWSER
        Path dir = tmp.resolve("nopdf");
        Path java = Paths.get(System.getProperty("java.home"), "bin", "java");
        ProcessBuilder pb = new ProcessBuilder(java.toString(), "-cp", System.getProperty("java.class.path"),
                Main.class.getName(), "demo", "--pdf", "--out", dir.toString()).redirectErrorStream(true);
        pb.environment().put("PATH", tmp.resolve("empty-bin").toString());
        pb.environment().remove("DRUMLOOP_BROWSER");
        Process p = pb.start();
        String o = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(COMMAND_TIMEOUT_S, TimeUnit.SECONDS));
        assertEquals(ExitCode.IO_ERROR, p.exitValue(), o);
        assertTrue(o.contains("--pdf: no means to print a PDF") && o.contains("apt-get install chromium"), o);
        assertFalse(Files.exists(dir.resolve("report.html")), "nothing ran");
    }

    static void deleteTree(Path d) throws IOException {
        try (var walk = Files.walk(d)) {
            for (Path p : (Iterable<Path>) walk.sorted(java.util.Comparator.reverseOrder())::iterator) {
                Files.delete(p);
            }
        }
    }
}
