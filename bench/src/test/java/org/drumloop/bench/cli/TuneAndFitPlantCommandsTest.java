package org.drumloop.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.EnumMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.drumloop.bench.ExitCode;
import org.drumloop.bench.Main;
import org.drumloop.bench.tune.Trend;
import org.drumloop.bench.tune.TrendCsv;
import org.drumloop.bench.tune.TrendSignal;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantFile;
import org.drumloop.plant.PlantKey;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code tune} and {@code fit-plant} end to end, through the command line. */
class TuneAndFitPlantCommandsTest {
    private static final Path PLANTS = Path.of("..", "config", "plants");

    @TempDir
    Path tmp;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    private int drumloop(String... args) {
        return Main.execute(new PrintWriter(out), new PrintWriter(err), args);
    }

    @Test
    void tuningTheDemoBoilerGivesAFileThatPassesCheckAndEveryScenarioTheDefaultPasses() throws Exception {
        Path dir = tmp.resolve("tune");
        assertEquals(ExitCode.OK, drumloop("tune", "--plant", "aux-boiler", "--out", dir.toString()), out + "\n" + err);
        Path tuned = dir.resolve("tuned.tuning");
        assertEquals(List.of(), CheckCommand.check(tuned));
        Matcher m = Pattern.compile("passed: base (\\d+) of (\\d+), tuned (\\d+) of (\\d+)").matcher(out.toString());
        assertTrue(m.find(), out.toString());
        assertTrue(Integer.parseInt(m.group(3)) >= Integer.parseInt(m.group(1)), m.group());
        assertTrue(Integer.parseInt(m.group(2)) >= 14, "the shipped library on the demo boiler: " + m.group());
        String text = Files.readString(tuned);
        assertTrue(text.contains("SIMC") && text.contains("# tuned (base:"), text);
        String report = Files.readString(dir.resolve("tune-report.html"));
        assertTrue(report.contains("<svg") && report.contains("not a safety system") && report.contains("Verification"));

        // the same bump tests as recorded trends, against a base that no shipped scenario uses
        Path base = tmp.resolve("base/my.tuning");
        Files.createDirectories(base.getParent());
        Files.writeString(base, "# my copy\n" + Files.readString(Path.of("..", "config", "tuning", "default.tuning")));
        Files.copy(Path.of("..", "config", "tuning", "default.interlocks"), base.resolveSibling("default.interlocks"));
        Path dir2 = tmp.resolve("tune2");
        out.getBuffer().setLength(0);
        assertEquals(ExitCode.OK, drumloop("tune", "--tuning", base.toString(), "--trend", dir.resolve("bump-valve.csv").toString(),
                "--trend", dir.resolve("bump-feed.csv").toString(), "--trend", dir.resolve("bump-steam.csv").toString(),
                "--out", dir2.toString()), out + "\n" + err);
        assertTrue(out.toString().contains("nothing to compare"), out.toString());
        assertEquals(List.of(), CheckCommand.check(dir2.resolve("tuned.tuning")));
        assertTrue(Files.readString(dir2.resolve("tuned.tuning")).contains("SHA-256"));
    }

    @Test
    void aLevelLoopTunedFarTighterThanTheRuleFailsScenariosAndExitsOneWithTheTable() throws Exception {
        // tauC = 5 s against an effective delay of about 250 s: far inside the SIMC recommendation tauC >= theta
        Path dir = tmp.resolve("tight");
        assertEquals(ExitCode.FAILED, drumloop("tune", "--plant", "aux-boiler", "--tau-c", "5", "--loops", "master,single",
                "--out", dir.toString()), out + "\n" + err);
        assertTrue(out.toString().contains("FAIL") && err.toString().contains("the tuned file passes"), out + "\n" + err);
        assertEquals(List.of(), CheckCommand.check(dir.resolve("tuned.tuning")), "written all the same, for the engineer to see");
    }

    @Test
    void aTrendWhoseTimeGoesBackIsBadInputNamingFileLineAndColumn() throws Exception {
        Path csv = tmp.resolve("bad.csv");
        Files.write(csv, List.of("t[s],feed_flow[t/h],drum_level[mm]", "0,10,0", "1,10,0", "2,11,0", "1.5,11,1",
                "3,11,2", "4,11,3", "5,11,4", "6,11,5", "7,11,6", "8,11,7", "9,11,8"));
        assertEquals(ExitCode.BAD_INPUT, drumloop("tune", "--trend", csv.toString(), "--out", tmp.resolve("o").toString()));
        assertTrue(err.toString().contains(csv + ":5: t[s]: time does not increase"), err.toString());
    }

    @Test
    void fittingTheReferencePlantRecoversBubbleTimeAndSteamVolumeOffByThirtyPercent() throws Exception {
        Path trend = tmp.resolve("ab160-trend.csv");
        record160(trend, 400);
        String text = Files.readString(PLANTS.resolve("ab160.plant"));
        // start file: bubble residence time 12 s -> 15.6 s (+30 %), steam under the surface 4.9 -> 3.43 m3 (-30 %)
        String start = text.replaceFirst("(?m)^bubble_residence_time\\s+12\\s+s", "bubble_residence_time       15.6    s")
                .replaceFirst("(?m)^steam_under_surface_volume\\s+4\\.9\\s+m3", "steam_under_surface_volume  3.43    m3");
        assertTrue(!start.equals(text));
        Path startFile = tmp.resolve("start.plant");
        Files.writeString(startFile, start);
        Path fitted = tmp.resolve("out/fitted.plant");
        assertEquals(ExitCode.OK, drumloop("fit-plant", "--plant", startFile.toString(), "--trend", trend.toString(),
                "--out", fitted.toString()), out + "\n" + err);
        PlantConfig c = PlantFile.load(fitted);
        // the truth is the shipped file's values (Åström & Bell 2000): Td = 12 s, Vsd = 4.9 m3; within 5 %
        assertEquals(12.0, c.value(PlantKey.BUBBLE_RESIDENCE_TIME), 0.05 * 12.0);
        assertEquals(4.9, c.value(PlantKey.STEAM_UNDER_SURFACE_VOLUME), 0.05 * 4.9);
        String written = Files.readString(fitted);
        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(trend)));
        assertTrue(written.contains("SHA-256 " + sha) && written.contains("RMS error: level"), written);
        assertTrue(written.contains("# fitted (start: 15.6 s)"), written);
        assertEquals(List.of(), CheckCommand.check(fitted));
        assertTrue(Files.readString(tmp.resolve("out/fitted-fit.html")).contains("<svg"));
        // every line but the fitted two and the header is the start file's
        List<String> a = Files.readAllLines(startFile);
        List<String> b = Files.readAllLines(fitted);
        assertEquals(a.size(), b.size() - (b.size() - a.size()));
        assertEquals(a.get(a.size() - 1), b.get(b.size() - 1));
    }

    @Test
    void aTrendWithoutTheHeatInputOrWithAnUnknownKeyIsBadInput() throws Exception {
        Path csv = tmp.resolve("noheat.csv");
        StringBuilder sb = new StringBuilder("t[s],drum_level[mm],drum_pressure[barg],steam_flow[t/h],feed_flow[t/h]\n");
        for (int i = 0; i < 20; i++) {
            sb.append(i).append(",0,8,10,10\n");
        }
        Files.writeString(csv, sb.toString());
        assertEquals(ExitCode.BAD_INPUT, drumloop("fit-plant", "--plant", "aux-boiler", "--trend", csv.toString(),
                "--out", tmp.resolve("f.plant").toString()));
        assertTrue(err.toString().contains(csv + ":1: firing: no firing or heat column"), err.toString());
        assertEquals(ExitCode.BAD_INPUT, drumloop("fit-plant", "--plant", "aux-boiler", "--trend", csv.toString(),
                "--fit", "level_geometry", "--out", tmp.resolve("f.plant").toString()));
        assertTrue(err.toString().contains("level_geometry: not a numeric key"), err.toString());
        assertTrue(!Files.exists(tmp.resolve("f.plant")));
    }

    @Test
    void helpListsBothCommands() {
        assertEquals(0, drumloop("--help"));
        assertTrue(out.toString().contains("tune") && out.toString().contains("fit-plant"), out.toString());
    }

    /**
     * A record of the reference plant in normal operation: valve and pumps working, its pressure control
     * in automatic; steam demand up at 20 s, feed valve opened at 150 s, steam demand down at 250 s.
     */
    static void record160(Path file, double durationS) throws Exception {
        PlantConfig cfg = PlantFile.load(PLANTS.resolve("ab160.plant"));
        Plant p = new Plant(cfg, 1);
        p.initSteadyState(0.8);
        int n = (int) Math.round(durationS / 0.1) + 1;
        double[] t = new double[n];
        Map<TrendSignal, double[]> v = new EnumMap<>(TrendSignal.class);
        for (TrendSignal s : new TrendSignal[] {TrendSignal.DRUM_LEVEL, TrendSignal.DRUM_PRESSURE, TrendSignal.STEAM_FLOW,
            TrendSignal.FEED_FLOW, TrendSignal.FIRING, TrendSignal.FEED_TEMP}) {
            v.put(s, new double[n]);
        }
        double u0 = p.feedValveDemandFrac();
        for (int i = 0; i < n; i++) {
            double now = i * 0.1;
            if (Math.abs(now - 20) < 0.05) {
                p.setSteamDemand(0.9);
            } else if (Math.abs(now - 150) < 0.05) {
                p.setFeedValveDemand(u0 + 0.05);
            } else if (Math.abs(now - 250) < 0.05) {
                p.setSteamDemand(0.75);
            }
            if (i > 0) {
                p.step(0.1);
            }
            t[i] = now;
            v.get(TrendSignal.DRUM_LEVEL)[i] = p.levelM();
            v.get(TrendSignal.DRUM_PRESSURE)[i] = p.drumPressurePa();
            v.get(TrendSignal.STEAM_FLOW)[i] = p.steamFlowKgS();
            v.get(TrendSignal.FEED_FLOW)[i] = p.feedFlowKgS();
            v.get(TrendSignal.FIRING)[i] = p.firingFrac();
            v.get(TrendSignal.FEED_TEMP)[i] = p.feedTempK();
        }
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            TrendCsv.write(Trend.of("ab160", t, v), w);
        }
    }
}
