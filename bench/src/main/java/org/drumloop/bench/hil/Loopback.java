package org.drumloop.bench.hil;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import org.drumloop.core.Firmware;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.exec.HangMonitor;
import org.drumloop.core.exec.RealTimeClock;
import org.drumloop.core.exec.ScanExecutive;
import org.drumloop.core.exec.ScanStatistics;
import org.drumloop.core.exec.SimulatedClock;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.soe.SoeSink;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.server.ImageServer;
import org.drumloop.modbus.server.ServerLimits;
import org.drumloop.modbus.stats.LinkStatistics;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;

/**
 * The whole chain in one process over real Modbus TCP on 127.0.0.1: simulated plant → image
 * server → TCP → rig client → firmware → rig client → TCP → image server → plant.
 *
 * <p>Two pacings. Real time: the plant runs on its own thread at the scan period, the client polls
 * on its own thread, the firmware runs under the scan executive on the real-time clock; this is
 * how a rig behaves. Lockstep: one thread does, per scan, plant publish → client read round trips
 * → firmware scan → client write round trips → plant step, as fast as the link allows; every
 * value still crosses the socket, so the chain is tested end to end faster than real time.
 */
public final class Loopback {
    private Loopback() {}

    /**
     * @param durationS simulated run time [s]
     * @param loadFrac steam demand at the start [fraction of rating]
     * @param stepAtS time of the steam demand step [s] (infinite: none)
     * @param stepToFrac steam demand after the step
     * @param seed plant noise seed
     * @param lockstep true for the lockstep pacing, false for real time
     * @param out folder for trend.csv, events.csv and link-stats.csv, or null
     * @param limits connection limit and idle timeout of the plant's Modbus server
     */
    public record Options(double durationS, double loadFrac, double stepAtS, double stepToFrac, long seed,
                          boolean lockstep, Path out, ServerLimits limits) {
        /** With the server's default limits. */
        public Options(double durationS, double loadFrac, double stepAtS, double stepToFrac, long seed,
                       boolean lockstep, Path out) {
            this(durationS, loadFrac, stepAtS, stepToFrac, seed, lockstep, out, ServerLimits.DEFAULT);
        }
    }

    /**
     * @param scans firmware scans run
     * @param maxDeviationM largest |level - setpoint| over the run [m]
     * @param maxDeviationAfterStepM largest |level - setpoint| from the load step on [m]
     * @param client client link statistics at the end
     * @param server server link statistics at the end
     * @param scan scan timing of the firmware loop
     * @param events sequence-of-events entries raised
     */
    public record Result(long scans, double maxDeviationM, double maxDeviationAfterStepM,
                         LinkStatistics.Snapshot client, LinkStatistics.Snapshot server, ScanStatistics scan, int events) {}

    public static Result run(ChannelMap map, PlantConfig plantConfig, FirmwareConfig fwConfig, Options o,
                             PrintWriter progress) throws IOException, InterruptedException {
        return run(map, plantConfig, fwConfig, o, progress, port -> { });
    }

    /** As {@link #run(ChannelMap, PlantConfig, FirmwareConfig, Options, PrintWriter)}, telling {@code onPort} the served port first. */
    public static Result run(ChannelMap map, PlantConfig plantConfig, FirmwareConfig fwConfig, Options o,
                             PrintWriter progress, java.util.function.IntConsumer onPort) throws IOException, InterruptedException {
        Plant plant = new Plant(plantConfig, o.seed());
        plant.initSteadyState(o.loadFrac());
        Firmware firmware = new Firmware(fwConfig);
        // start bumpless from the plant's balanced valve position
        firmware.operator().setManualOutput(plant.feedValvePositionFrac());
        double dtS = fwConfig.scanPeriodS();
        if (o.out() != null) {
            Files.createDirectories(o.out());
        }
        RigClient.Options linkOpts = new RigClient.Options(Math.min(0.05, dtS / 2), 0.5, 1, 0.1, 2.0);
        try (ImageServer server = ImageServer.tcp(map, new TcpEndpoint("127.0.0.1", 0), o.limits());
             RigClient client = RigClient.tcp(map, new TcpEndpoint("127.0.0.1", server.port()), linkOpts);
             Trend trend = new Trend(o.out() == null ? null : o.out().resolve("trend.csv"), fwConfig.levelSetpointM(), o.stepAtS());
             Events events = new Events(o.out() == null ? null : o.out().resolve("events.csv"), progress)) {
            onPort.accept(server.port());
            PlantLoop loop = new PlantLoop(plant, server, o.loadFrac());
            loop.scheduleLoadStep(o.stepAtS(), o.stepToFrac());
            loop.publish(0.0);
            ScanExecutive ex;
            Thread plantThread = null;
            PlantThread pt = null;
            HangMonitor hang = null;
            Thread hangThread = null;
            if (o.lockstep()) {
                ProcessIo io = new ProcessIo() {
                    @Override
                    public void readInputs(ProcessImage in, double tS) {
                        client.pollOnce();
                        client.readInputs(in, tS);
                    }

                    @Override
                    public void writeOutputs(ProcessImage out, double tS) {
                        client.writeOutputs(out, tS);
                    }
                };
                ex = new ScanExecutive(SimulatedClock.asFastAsPossible(), io, firmware, dtS, fwConfig.interlocks().failSafe(), firmware.events());
                ex.setListener((k, tS, in, out) -> {
                    firmware.events().drainTo(events);
                    client.flushOutputs();
                    loop.step(tS, dtS);
                    try {
                        trend.record(tS + dtS, plant, loop.steamDemandFrac());
                    } catch (IOException e) {
                        throw new java.io.UncheckedIOException(e);
                    }
                });
            } else {
                client.start();
                pt = new PlantThread(loop, trend, dtS, o.durationS());
                plantThread = new Thread(pt, "plant");
                plantThread.setDaemon(true);
                plantThread.start();
                ex = new ScanExecutive(new RealTimeClock(), client, firmware, dtS, fwConfig.interlocks().failSafe(), firmware.events());
                ex.setListener((k, tS, in, out) -> firmware.events().drainTo(events));
                hang = new HangMonitor(ex);
                hangThread = hang.start();
            }
            ex.runUntil(o.durationS() - dtS);
            if (hang != null) {
                hang.stop();
                hangThread.join(5000);
            }
            if (plantThread != null) {
                pt.stop();
                plantThread.join(5000);
                if (pt.failure != null) {
                    throw pt.failure;
                }
            }
            if (o.out() != null) {
                LinkStatistics.writeCsv(o.out().resolve("link-stats.csv"), client.statistics(), server.statistics());
            }
            return new Result(ex.scanCount(), trend.maxDeviationM(), trend.maxDeviationAfterM(),
                    client.statistics().snapshot(), server.statistics().snapshot(), ex.statistics(), events.count);
        } catch (java.io.UncheckedIOException e) {
            throw e.getCause();
        }
    }

    /** The plant on its own real-time thread, stepping at the scan period. */
    private static final class PlantThread implements Runnable {
        private final PlantLoop loop;
        private final Trend trend;
        private final double dtS;
        private final double durationS;
        private volatile boolean stop;
        private volatile IOException failure;

        PlantThread(PlantLoop loop, Trend trend, double dtS, double durationS) {
            this.loop = loop;
            this.trend = trend;
            this.dtS = dtS;
            this.durationS = durationS;
        }

        void stop() { stop = true; }

        @Override
        public void run() {
            RealTimeClock clock = new RealTimeClock();
            double t0 = clock.nowS();
            long k = 0;
            try {
                while (!stop && k * dtS < durationS) {
                    clock.waitUntil(t0 + (k + 1) * dtS);
                    double tS = k * dtS;
                    loop.step(tS, dtS);
                    trend.record(tS + dtS, loop.plant(), loop.steamDemandFrac());
                    k++;
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            } catch (IOException e) {
                failure = e;
            }
        }
    }

    /** Sequence-of-events entries to events.csv and, for alarms and trips, to the console. */
    static final class Events implements SoeSink, AutoCloseable {
        private final BufferedWriter w;
        private final PrintWriter console;
        int count;

        Events(Path file, PrintWriter console) throws IOException {
            this.console = console;
            if (file != null) {
                w = Files.newBufferedWriter(file, StandardCharsets.UTF_8);
                w.write("t_s,scan,tag,kind,message\n");
            } else {
                w = null;
            }
        }

        @Override
        public void accept(double tS, long scan, String tag, org.drumloop.core.soe.EventKind kind, String message) {
            count++;
            String line = String.format(Locale.ROOT, "%.3f,%d,%s,%s,\"%s\"", tS, scan, tag, kind.name(), message.replace("\"", "\"\""));
            try {
                if (w != null) {
                    w.write(line);
                    w.write('\n');
                }
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
            if (console != null) {
                console.println(String.format(Locale.ROOT, "%9.1f s  %-10s %-8s %s", tS, tag, kind.name(), message));
            }
        }

        @Override
        public void close() throws IOException {
            if (w != null) {
                w.close();
            }
        }
    }
}
