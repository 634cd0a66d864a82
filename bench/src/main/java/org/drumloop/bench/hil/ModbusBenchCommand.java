package org.drumloop.bench.hil;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicReference;

import org.drumloop.bench.ExitCode;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.client.LinkException;
import org.drumloop.modbus.client.TcpMasterLink;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.map.Table;
import org.drumloop.modbus.stats.LinkStatistics;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantFile;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code drumloop modbus-bench} (hidden): measures the Modbus figures on loopback. The plant is
 * served in real time with the firmware closing the loop through the rig client (a real-time
 * loopback run), while one extra client connection reads 20 holding registers back to back.
 * Reports that client's request rate and round-trip percentiles, and the firmware scan's start
 * jitter and overruns under that load.
 */
@Command(name = "modbus-bench", hidden = true, mixinStandardHelpOptions = true,
        description = "Measure Modbus TCP request rate and round trip against the served plant, and scan jitter under that load.")
public final class ModbusBenchCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = "--duration", paramLabel = "S", defaultValue = "30", description = "run time [s] (default ${DEFAULT-VALUE})")
    double durationS;

    @Option(names = "--map", paramLabel = "MAP", defaultValue = "aux-holding", description = "channel map with 20 holding registers from 0 (default ${DEFAULT-VALUE})")
    String map;

    @Option(names = "--registers", paramLabel = "N", defaultValue = "20", description = "holding registers per request (default ${DEFAULT-VALUE})")
    int registers;

    @Option(names = "--rate", paramLabel = "N", defaultValue = "10000",
            description = "load requests per second; 0 = back to back, as fast as the link goes (default ${DEFAULT-VALUE})")
    double rate;

    @Option(names = "--warmup", paramLabel = "S", defaultValue = "3", description = "seconds of load before counting (default ${DEFAULT-VALUE})")
    double warmupS;

    @Override
    public Integer call() throws Exception {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        ChannelMap m = HilFiles.map(map, HilFiles.CONTROL_SIGNALS, err);
        Path plantPath = HilFiles.find("aux-boiler", "plants", ".plant", err);
        Path tuningPath = HilFiles.find("default", "tuning", ".tuning", err);
        if (m == null || plantPath == null || tuningPath == null) {
            return ExitCode.BAD_INPUT;
        }
        PlantConfig pc = PlantFile.load(plantPath);
        FirmwareConfig fc = FirmwareConfig.load(tuningPath);
        LinkStatistics load = new LinkStatistics("load client, " + registers + " holding registers per request");
        AtomicBoolean stop = new AtomicBoolean();
        AtomicBoolean counting = new AtomicBoolean();
        AtomicReference<Thread> hammer = new AtomicReference<>();
        long[] counted = new long[2];
        Loopback.Result r = Loopback.run(m, pc, fc,
                new Loopback.Options(durationS, 0.6, Double.POSITIVE_INFINITY, 0.6, 1, false, null), null, port -> {
                    Thread t = new Thread(() -> hammer(port, load, stop, counting, counted), "load-client");
                    t.setDaemon(true);
                    hammer.set(t);
                    t.start();
                    Thread w = new Thread(() -> {
                        try {
                            Thread.sleep((long) (warmupS * 1000));
                        } catch (InterruptedException e) {
                            return;
                        }
                        counting.set(true);
                    }, "warmup");
                    w.setDaemon(true);
                    w.start();
                });
        stop.set(true);
        hammer.get().join(2000);
        double seconds = counted[1] * 1e-9;
        LinkStatistics.Snapshot s = load.snapshot();
        o.println(String.format(Locale.ROOT, "requests: %d in %.2f s = %.0f requests/s (one connection, FC03 x %d registers, %s)",
                counted[0], seconds, counted[0] / seconds, registers, rate > 0 ? "paced at " + (long) rate + "/s" : "back to back"));
        o.println(String.format(Locale.ROOT, "round trip: p50 %.3f ms, p99 %.3f ms, max %.3f ms (last %d requests)",
                s.p50Ms(), s.p99Ms(), s.maxMs(), s.windowSamples()));
        o.println(String.format(Locale.ROOT, "errors: %d", s.errors()));
        o.println(String.format(Locale.ROOT, "scan %.0f ms under load: %d scans, start jitter p50 %.3f ms p99 %.3f ms max %.3f ms, overruns %d",
                fc.scanPeriodS() * 1e3, r.scans(), r.scan().jitterP50S() * 1e3, r.scan().jitterP99S() * 1e3,
                r.scan().jitterMaxS() * 1e3, r.scan().overruns()));
        o.println(r.client());
        o.println(r.server());
        return ExitCode.OK;
    }

    private void hammer(int port, LinkStatistics load, AtomicBoolean stop, AtomicBoolean counting, long[] counted) {
        TcpMasterLink link = new TcpMasterLink(new TcpEndpoint("127.0.0.1", port), 1000);
        int[] regs = new int[registers];
        long startNs = 0;
        long n = 0;
        long intervalNs = rate > 0 ? (long) (1e9 / rate) : 0;
        long due = System.nanoTime();
        // stop a second before the run ends, so that the server closing is not counted as a link error
        long endNs = due + (long) ((durationS - 1.0) * 1e9);
        try {
            link.connect();
            while (!stop.get() && System.nanoTime() - endNs < 0) {
                if (intervalNs > 0) {
                    // paced load: keep to the schedule in bursts of about a millisecond, so the load
                    // generator wakes up a thousand times a second rather than once per request
                    due += intervalNs;
                    long ahead = due - System.nanoTime();
                    if (ahead > 1_000_000) {
                        java.util.concurrent.locks.LockSupport.parkNanos(ahead);
                    } else if (ahead < -100_000_000L) {
                        due = System.nanoTime();
                    }
                }
                long t0 = System.nanoTime();
                try {
                    link.readRegisters(Table.HOLDING_REGISTER, 1, 0, registers, regs);
                    if (counting.get()) {
                        if (startNs == 0) {
                            startNs = t0;
                        }
                        load.request();
                        load.ok(System.nanoTime() - t0);
                        n++;
                    }
                } catch (LinkException e) {
                    if (stop.get()) {
                        break;
                    }
                    load.request();
                    if (e.kind() == LinkException.Kind.EXCEPTION) {
                        load.exception(e.code());
                    } else {
                        load.ioError();
                        link.connect();
                    }
                }
            }
        } catch (LinkException e) {
            load.ioError();
        } finally {
            counted[0] = n;
            counted[1] = startNs == 0 ? 1 : Math.min(System.nanoTime(), endNs) - startNs;
            link.disconnect();
        }
    }
}
