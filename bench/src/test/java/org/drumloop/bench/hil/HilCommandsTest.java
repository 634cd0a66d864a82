package org.drumloop.bench.hil;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.drumloop.bench.ExitCode;
import org.drumloop.bench.Main;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The three Modbus run modes end to end through the {@code drumloop} command line, on loopback
 * with port 0: loopback (lockstep), serve-plant with drive-rig driving it in real time, and the
 * file checks that stop a run before it starts.
 */
class HilCommandsTest {
    private static final Path MAP = Path.of("..", "config", "maps", "aux-4-20ma.csv");
    private static final Path PLANT = Path.of("..", "config", "plants", "aux-boiler.plant");
    private static final Path TUNING = Path.of("..", "config", "tuning", "default.tuning");

    @TempDir
    Path dir;

    private static final class Run {
        final StringWriter out = new StringWriter();
        final StringWriter err = new StringWriter();

        int exec(String... args) {
            return Main.execute(new PrintWriter(out, true), new PrintWriter(err, true), args);
        }
    }

    @Test
    void theCommandsAreRegistered() {
        List<String> names = Main.subcommandNames();
        assertTrue(names.containsAll(List.of("serve-plant", "drive-rig", "loopback")), names.toString());
    }

    @Test
    void loopbackRunsTheWholeChainAndWritesItsRecords() throws Exception {
        Run r = new Run();
        int code = r.exec("loopback", "--speed", "max", "--duration", "20", "--map", MAP.toString(),
                "--plant", PLANT.toString(), "--tuning", TUNING.toString(), "--out", dir.toString(),
                "--max-connections", "2", "--idle-timeout", "30");
        assertEquals(ExitCode.OK, code, r.err.toString());
        // 20 s at the default tuning's 100 ms scan period = 200 scans (tuning file, scan_period)
        assertTrue(r.out.toString().contains("scans 200,"), r.out.toString());
        assertTrue(Files.exists(dir.resolve("trend.csv")));
        assertTrue(Files.exists(dir.resolve("events.csv")));
        // header, client, server, and the server's one connection (from the client)
        List<String> stats = Files.readAllLines(dir.resolve("link-stats.csv"));
        assertEquals(4, stats.size(), stats.toString());
        // the summary and the records name the port the server was bound to, not the 0 it was asked for
        Matcher m = Pattern.compile("server tcp 127\\.0\\.0\\.1:(\\d+):").matcher(r.out.toString());
        assertTrue(m.find(), r.out.toString());
        assertTrue(Integer.parseInt(m.group(1)) > 0, r.out.toString());
        assertTrue(stats.get(2).startsWith("server tcp 127.0.0.1:" + m.group(1) + ","), stats.get(2));
        assertTrue(stats.get(3).startsWith("server tcp 127.0.0.1:" + m.group(1) + " connection 1,"), stats.get(3));
    }

    @Test
    void serverLimitsOutOfRangeOrOnASerialLineAreRefused() {
        Run r = new Run();
        assertEquals(ExitCode.BAD_INPUT, r.exec("serve-plant", "--map", MAP.toString(), "--max-connections", "0"));
        assertTrue(r.err.toString().contains("--max-connections must be 1..256"), r.err.toString());
        Run idle = new Run();
        assertEquals(ExitCode.BAD_INPUT, idle.exec("loopback", "--idle-timeout", "0"));
        assertTrue(idle.err.toString().contains("--idle-timeout must be"), idle.err.toString());
        Run rtu = new Run();
        assertEquals(ExitCode.BAD_INPUT, rtu.exec("serve-plant", "--map", MAP.toString(), "--rtu", "/dev/null",
                "--max-connections", "4"));
        assertTrue(rtu.err.toString().contains("for Modbus TCP, not --rtu"), rtu.err.toString());
    }

    @Test
    void aBrokenMapStopsTheRunWithEveryProblemLocated() throws Exception {
        Path bad = dir.resolve("bad.csv");
        Files.write(bad, List.of("signal,direction,table,unit,address,type",
                "level_dp_a,to_controller,input_register,1,30001,int16",
                "nosuch,to_controller,input_register,1,1,int16"));
        Run r = new Run();
        int code = r.exec("loopback", "--speed", "max", "--duration", "1", "--map", bad.toString());
        assertEquals(ExitCode.BAD_INPUT, code);
        String err = r.err.toString();
        assertTrue(err.contains(bad + ":2: address: '30001' looks like a 1-based 3xxxx reference"), err);
        assertTrue(err.contains(bad + ":3: signal: unknown signal 'nosuch'"), err);
    }

    @Test
    void aMapWithoutTheSignalsTheModeNeedsIsRefused() throws Exception {
        Path thin = dir.resolve("thin.csv");
        Files.write(thin, List.of("signal,direction,table,unit,address,type,raw_lo,raw_hi,eng_lo,eng_hi,eng_unit",
                "level_dp_a,to_controller,input_register,1,0,int16,0,27648,4,20,mA"));
        Run r = new Run();
        int code = r.exec("drive-rig", "--map", thin.toString(), "--tcp", "127.0.0.1:1", "--duration", "1");
        assertEquals(ExitCode.BAD_INPUT, code);
        assertTrue(r.out.toString().contains("CAUTION"), "the banner comes first");
        assertTrue(r.err.toString().contains("feed_valve_demand: this mode needs the signal"), r.err.toString());
    }

    @Test
    void driveRigControlsAServedPlantInRealTime() throws Exception {
        Run served = new Run();
        CompletableFuture<Integer> plant = CompletableFuture.supplyAsync(() -> served.exec("serve-plant",
                "--map", MAP.toString(), "--plant", PLANT.toString(), "--tcp", "127.0.0.1:0", "--duration", "6",
                "--out", dir.resolve("plant").toString()));
        Pattern bound = Pattern.compile("on tcp 127\\.0\\.0\\.1:(\\d+)");
        int port = -1;
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(20);
        while (port < 0 && System.nanoTime() < end) {
            Matcher m = bound.matcher(served.out.toString());
            if (m.find()) {
                port = Integer.parseInt(m.group(1));
            } else {
                java.util.concurrent.locks.LockSupport.parkNanos(10_000_000L);
            }
        }
        assertTrue(port > 0, "serve-plant never said where it listens: " + served.out + served.err);

        Run rig = new Run();
        int code = rig.exec("drive-rig", "--map", MAP.toString(), "--tuning", TUNING.toString(),
                "--tcp", "127.0.0.1:" + port, "--duration", "3", "--out", dir.resolve("rig").toString());
        assertEquals(ExitCode.OK, code, rig.err.toString());
        String out = rig.out.toString();
        assertTrue(out.startsWith("*"), "the caution banner comes first");
        assertTrue(out.contains("never connect to a live boiler") || out.contains("Never connect to a live boiler"), out);
        List<String> stats = Files.readAllLines(dir.resolve("rig").resolve("link-stats.csv"));
        String[] row = stats.get(1).split(",");
        // columns: link,requests,ok,... (LinkStatistics.csvHeader); 3 s of polling at 50 ms gives tens of answers
        assertTrue(Long.parseLong(row[2]) > 10, stats.toString());

        assertEquals(ExitCode.OK, plant.get(30, TimeUnit.SECONDS).intValue(), served.err.toString());
        assertTrue(Files.exists(dir.resolve("plant").resolve("link-stats.csv")));
    }

    @Test
    void driveRigControlsAServedPlantOverRtuOnASerialLinePair() throws Exception {
        String socat = findOnPath("socat");
        Path a = dir.resolve("ttyPlant");
        Path b = dir.resolve("ttyRig");
        Process pair = new ProcessBuilder(socat, "-d", "-d", "pty,raw,echo=0,link=" + a, "pty,raw,echo=0,link=" + b)
                .redirectErrorStream(true).redirectOutput(dir.resolve("socat.log").toFile()).start();
        try {
            long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(15);
            while (!(Files.exists(a) && Files.exists(b)) && System.nanoTime() < end) {
                java.util.concurrent.locks.LockSupport.parkNanos(10_000_000L);
            }
            assertTrue(Files.exists(a) && Files.exists(b), "socat did not create the pty pair");
            Run served = new Run();
            CompletableFuture<Integer> plant = CompletableFuture.supplyAsync(() -> served.exec("serve-plant",
                    "--map", MAP.toString(), "--plant", PLANT.toString(), "--rtu", a.toString(), "--baud", "38400",
                    "--parity", "none", "--stop", "2", "--duration", "6", "--out", dir.resolve("plant").toString()));
            Run rig = new Run();
            int code = rig.exec("drive-rig", "--map", MAP.toString(), "--tuning", TUNING.toString(), "--rtu", b.toString(),
                    "--baud", "38400", "--parity", "none", "--stop", "2", "--poll", "100", "--duration", "4",
                    "--out", dir.resolve("rig").toString());
            assertEquals(ExitCode.OK, code, rig.err.toString());
            assertEquals(ExitCode.OK, plant.get(30, TimeUnit.SECONDS).intValue(), served.err.toString());
            String[] row = Files.readAllLines(dir.resolve("plant").resolve("link-stats.csv")).get(1).split(",");
            // the plant side answered requests over the serial pair (columns: link,requests,ok,...)
            assertTrue(Long.parseLong(row[2]) > 10, String.join(",", row));
        } finally {
            pair.destroy();
            pair.waitFor();
        }
    }

    /** A tool on PATH, or a failure naming the Debian package that provides it. */
    private static String findOnPath(String command) {
        for (String d : System.getenv().getOrDefault("PATH", "").split(java.io.File.pathSeparator)) {
            java.io.File f = new java.io.File(d, command);
            if (f.isFile() && f.canExecute()) {
                return f.getAbsolutePath();
            }
        }
        return org.junit.jupiter.api.Assertions.fail(command + " is not installed: install the Debian package '" + command + "'");
    }
}
