package org.drumloop.modbus.bench;

import java.nio.file.Path;
import java.util.concurrent.TimeUnit;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.server.ServedImage;
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
 * Cost and allocation of the server's work without the network: answering FC 03 for the 20
 * holding registers of the all-holding-register demo map, and the plant loop's hand-over
 * (publish inputs, collect outputs). Run with the GC profiler to back "allocates nothing".
 */
@State(Scope.Thread)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
public class ServedImageBenchmark {
    private ServedImage image;
    private final ProcessImage in = new ProcessImage();
    private final ProcessImage out = new ProcessImage();
    private final byte[] request = {Modbus.FC_READ_HOLDING_REGISTERS, 0, 0, 0, 20};
    private final byte[] response = new byte[Modbus.MAX_PDU];
    private double tS;

    @Setup
    public void setUp() throws Exception {
        Path map = Path.of("..", "config", "maps", "aux-holding.csv");
        if (!map.toFile().isFile()) {
            map = Path.of("config", "maps", "aux-holding.csv");
        }
        image = new ServedImage(ChannelMap.load(map));
        in.set(Signal.LEVEL_DP_A, 4200.0, Quality.GOOD, 0);
        in.set(Signal.DRUM_PRESSURE, 9e5, Quality.GOOD, 0);
        in.set(Signal.FEED_TEMP, 363.15, Quality.GOOD, 0);
    }

    @Benchmark
    public int readTwentyHoldingRegisters() {
        return image.handle(1, request, 0, request.length, response, 0);
    }

    @Benchmark
    public ProcessImage publishAndCollect() {
        tS += 0.1;
        image.publishInputs(in, tS);
        image.collectOutputs(out, tS);
        return out;
    }

    public static void main(String[] args) throws RunnerException {
        Options options = new OptionsBuilder().include(ServedImageBenchmark.class.getSimpleName())
                .addProfiler(GCProfiler.class).build();
        new Runner(options).run();
    }
}
