package org.drumloop.modbus.bench;

import java.nio.file.Path;
import java.util.concurrent.TimeUnit;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.client.MasterLink;
import org.drumloop.modbus.client.RigClient;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.map.Table;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.profile.GCProfiler;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * What the scan pays for the rig client: {@code readInputs} (snapshot copy, age check, scaling
 * into the image) and {@code writeOutputs} (copy and wake the poll thread), with a link that
 * answers at once so that no network is involved. Run with the GC profiler: the scan side must
 * allocate nothing.
 */
@State(Scope.Thread)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
public class RigClientBenchmark {
    private RigClient client;
    private final ProcessImage in = new ProcessImage();
    private final ProcessImage out = new ProcessImage();
    private double tS;

    /** A link that answers every request at once with 6912 counts (8 mA on 0..27648 = 4..20 mA). */
    static final class InstantLink implements MasterLink {
        private boolean up;

        @Override public void connect() { up = true; }

        @Override public void disconnect() { up = false; }

        @Override public boolean isConnected() { return up; }

        @Override
        public void readRegisters(Table table, int unitId, int address, int qty, int[] dst) {
            java.util.Arrays.fill(dst, 0, qty, 6912);
        }

        @Override
        public void readBits(Table table, int unitId, int address, int qty, int[] dst) {
            java.util.Arrays.fill(dst, 0, qty, 1);
        }

        @Override public void writeRegisters(int unitId, int address, int qty, int[] values) { }

        @Override public void writeCoils(int unitId, int address, int qty, int[] bits) { }

        @Override public String describe() { return "instant"; }
    }

    @Setup
    public void setUp() throws Exception {
        Path map = Path.of("..", "config", "maps", "aux-4-20ma.csv");
        if (!map.toFile().isFile()) {
            map = Path.of("config", "maps", "aux-4-20ma.csv");
        }
        client = new RigClient(ChannelMap.load(map), new InstantLink(), new RigClient.Options(1.0, 1.0, 0, 1.0, 1.0));
        client.pollOnce();
        out.set(Signal.FEED_VALVE_DEMAND, 0.5, Quality.GOOD, 0);
    }

    @Benchmark
    public ProcessImage readInputs() {
        tS += 0.1;
        client.readInputs(in, tS);
        return in;
    }

    @Benchmark
    public ProcessImage writeOutputs() {
        tS += 0.1;
        client.writeOutputs(out, tS);
        return out;
    }

    public static void main(String[] args) throws RunnerException {
        Options options = new OptionsBuilder().include(RigClientBenchmark.class.getSimpleName())
                .addProfiler(GCProfiler.class).build();
        new Runner(options).run();
    }
}
