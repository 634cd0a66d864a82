package org.drumloop.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.List;

import javax.xml.parsers.DocumentBuilderFactory;

import org.drumloop.bench.ExitCode;
import org.drumloop.bench.Main;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;

/** The drumloop command's exit codes and its promise not to lose earlier records. */
class CommandLineTest {
    @TempDir
    Path tmp;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    private int drumloop(String... args) {
        return Main.execute(new PrintWriter(out), new PrintWriter(err), args);
    }

    private Path scenario(String name, String... lines) throws Exception {
        Path p = tmp.resolve(name);
        Files.write(p, List.of(lines), StandardCharsets.UTF_8);
        return p;
    }

    private Path passing() throws Exception {
        return scenario("short.scenario", "title Short steady run", "plant aux-boiler", "tuning default",
                "duration 20 s", "at 0 s set steam_demand 60 %", "expect trip LALL never",
                "expect drum_pressure between 7 and 9 barg");
    }

    @Test
    void aPassingRunExitsZeroAndWritesTheRecords() throws Exception {
        Path dir = tmp.resolve("rec");
        assertEquals(ExitCode.OK, drumloop("run", passing().toString(), "--out", dir.toString(), "--junit",
                tmp.resolve("junit.xml").toString()), err.toString());
        assertTrue(Files.size(dir.resolve("trend.csv")) > 0);
        assertTrue(Files.readString(dir.resolve("trend.csv")).startsWith("t[s],drum_level[mm],"));
        assertTrue(Files.readString(dir.resolve("events.csv")).startsWith("t[s],tag,kind,message"));
        assertTrue(Files.readString(dir.resolve("report.html")).contains("<svg"));
        // 20 s at the 100 ms scan: scans at 0.0 .. 20.0 s = 201 rows plus the header
        assertEquals(202, Files.readAllLines(dir.resolve("trend.csv")).size());
        Document junit = DocumentBuilderFactory.newInstance().newDocumentBuilder()
                .parse(tmp.resolve("junit.xml").toFile());
        assertEquals("2", junit.getDocumentElement().getAttribute("tests"));
        assertEquals("0", junit.getDocumentElement().getAttribute("failures"));
    }

    @Test
    void aFailedExpectationExitsOne() throws Exception {
        Path s = scenario("fails.scenario", "title Impossible", "duration 10 s", "expect drum_pressure above 50 barg");
        assertEquals(ExitCode.FAILED, drumloop("run", s.toString(), "--out", tmp.resolve("f").toString()));
        assertTrue(out.toString().contains("FAIL"), out.toString());
    }

    @Test
    void badInputExitsTwoWithFileLineAndWord() throws Exception {
        Path s = scenario("bad.scenario", "title Bad", "duration 10 s", "at 5 s set stem_demand 40 %");
        assertEquals(ExitCode.BAD_INPUT, drumloop("run", s.toString()));
        assertTrue(err.toString().contains(s + ":3: stem_demand: "), err.toString());
    }

    @Test
    void anUnknownPlantIsBadInputAtItsLine() throws Exception {
        Path s = scenario("plant.scenario", "title P", "plant no-such-boiler", "duration 10 s");
        assertEquals(ExitCode.BAD_INPUT, drumloop("run", s.toString()));
        assertTrue(err.toString().contains(s + ":2: no-such-boiler: "), err.toString());
    }

    @Test
    void badOptionsExitTwo() throws Exception {
        assertEquals(ExitCode.BAD_INPUT, drumloop("run", passing().toString(), "--speed", "fast"));
        assertEquals(ExitCode.BAD_INPUT, drumloop("run", passing().toString(), "--record-every", "0"));
        assertEquals(ExitCode.BAD_INPUT, drumloop("no-such-command"));
    }

    @Test
    void unwritableRecordsExitThree() throws Exception {
        Path file = tmp.resolve("not-a-folder");
        Files.writeString(file, "x");
        assertEquals(ExitCode.IO_ERROR, drumloop("run", passing().toString(), "--out", file.toString()));
    }

    @Test
    void aFailedParseLosesNothingWrittenEarlier() throws Exception {
        Path dir = tmp.resolve("keep");
        assertEquals(ExitCode.OK, drumloop("run", passing().toString(), "--out", dir.toString()));
        byte[] trend = Files.readAllBytes(dir.resolve("trend.csv"));
        byte[] report = Files.readAllBytes(dir.resolve("report.html"));
        Path bad = scenario("short.scenario", "title Short steady run", "duration 20 s", "expect nonsense");
        assertEquals(ExitCode.BAD_INPUT, drumloop("run", bad.toString(), "--out", dir.toString()));
        assertTrue(java.util.Arrays.equals(trend, Files.readAllBytes(dir.resolve("trend.csv"))));
        assertTrue(java.util.Arrays.equals(report, Files.readAllBytes(dir.resolve("report.html"))));
        try (var files = Files.list(dir)) {
            assertEquals(3, files.count(), "no temporary files left behind");
        }
    }

    @Test
    void checkValidatesEveryKindOfFile() throws Exception {
        Path config = Paths.get("..", "config");
        assertEquals(ExitCode.OK, drumloop("check", config.resolve("scenarios/demo.scenario").toString(),
                config.resolve("plants/aux-boiler.plant").toString(), config.resolve("tuning/default.tuning").toString(),
                config.resolve("tuning/default.interlocks").toString(), config.resolve("maps/aux-4-20ma.csv").toString()),
                err.toString());
        Path bad = scenario("bad.scenario", "title Bad", "duration 10 s", "expect trip LOWWATER never");
        Path badPlant = tmp.resolve("bad.plant");
        Files.writeString(badPlant, "flavour strawberry\n");
        assertEquals(ExitCode.BAD_INPUT, drumloop("check", bad.toString(), badPlant.toString()));
        assertTrue(err.toString().contains(bad + ":3: LOWWATER: "), err.toString());
        assertTrue(err.toString().contains(badPlant + ":1: "), err.toString());
    }

    @Test
    void interlocksPrintsTheCauseAndEffectTable() {
        assertEquals(ExitCode.OK, drumloop("interlocks"));
        assertTrue(out.toString().contains("LALL") && out.toString().contains("fuel_cutoff"), out.toString());
        assertTrue(out.toString().contains("not a safety system"));
    }

    @Test
    void bumpWritesTheOpenLoopResponse() throws Exception {
        assertEquals(ExitCode.OK, drumloop("bump", "--input", "steam", "--step", "10", "--duration", "60", "--out",
                tmp.toString()), err.toString());
        List<String> rows = Files.readAllLines(tmp.resolve("trend.csv"));
        assertTrue(rows.get(0).startsWith("t[s],drum_level[mm]"));
        // one row per 100 ms over 60 s: 601 rows plus the header (plant-sim's BumpTest contract)
        assertEquals(602, rows.size());
        // the summary counts the time of the peak from the step at 10 s: the trend's row of the
        // highest level is at 10 s plus that time
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("max ([+-][0-9.]+) mm ([0-9.]+) s after the step")
                .matcher(out.toString());
        assertTrue(m.find(), out.toString());
        double peakMm = Double.NEGATIVE_INFINITY;
        double peakAtS = 0;
        for (String row : rows.subList(1, rows.size())) {
            String[] f = row.split(",");
            if (Double.parseDouble(f[0]) >= 10.0 && Double.parseDouble(f[1]) > peakMm) {
                peakMm = Double.parseDouble(f[1]);
                peakAtS = Double.parseDouble(f[0]);
            }
        }
        assertEquals(peakMm, Double.parseDouble(m.group(1)), 0.05, "printed to 0.1 mm");
        assertEquals(peakAtS - 10.0, Double.parseDouble(m.group(2)), 0.05, "printed to 0.1 s");
        assertEquals(ExitCode.BAD_INPUT, drumloop("bump", "--input", "coal", "--step", "10", "--duration", "60",
                "--out", tmp.toString()));
    }

    @Test
    void demoRunsAndSaysWhereTheRecordsAre() {
        Path dir = tmp.resolve("demo");
        assertEquals(ExitCode.OK, drumloop("demo", "--out", dir.toString()), out + "\n" + err);
        assertTrue(out.toString().contains(dir.resolve("report.html").toString()), out.toString());
        assertTrue(Files.isRegularFile(dir.resolve("report.html")));
    }

    @Test
    void helpListsTheCommandsAndExitCodes() {
        assertEquals(0, drumloop("--help"));
        String help = out.toString();
        for (String c : new String[] {"demo", "run", "check", "interlocks", "bump", "Exit codes"}) {
            assertTrue(help.contains(c), c + " in\n" + help);
        }
        assertTrue(!help.contains("perf"), "perf is a hidden command");
    }
}
