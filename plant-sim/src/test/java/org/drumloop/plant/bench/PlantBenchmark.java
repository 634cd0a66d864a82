package org.drumloop.plant.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.drumloop.plant.Plant;
import org.drumloop.plant.PlantConfig;
import org.drumloop.plant.PlantFile;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Cost of the plant: one 100 ms plant step (RK4 sub-steps, saturation look-ups, feed-train solve,
 * burner and pressure controller, eight transmitters), and 24 h of plant time open loop (no level
 * controller; pressure controller in auto, feed valve fixed at its balancing position). The steam
 * demand wanders a little so the step does real work.
 */
@State(Scope.Thread)
@Fork(1)
public class PlantBenchmark {
    private static final int MASK = 1023;

    @Param({"aux-boiler.plant", "ab160.plant"})
    public String plantFile;

    private Plant plant;
    private final double[] demand = new double[MASK + 1];
    private int next;
    private PlantConfig cfg;

    static Path plantPath(String name) {
        Path p = Path.of("config", "plants", name);
        return Files.exists(p) ? p : Path.of("..", "config", "plants", name);
    }

    @Setup(Level.Trial)
    public void setUp() throws Exception {
        cfg = PlantFile.load(plantPath(plantFile));
        plant = new Plant(cfg, 11);
        for (int i = 0; i < demand.length; i++) {
            demand[i] = cfg.nominalLoadFrac() * (1 + 0.02 * Math.sin(2 * Math.PI * i / demand.length));
        }
    }

    /** One 100 ms plant step. */
    @Benchmark
    @BenchmarkMode(Mode.AverageTime)
    @OutputTimeUnit(TimeUnit.NANOSECONDS)
    @Warmup(iterations = 3, time = 1)
    @Measurement(iterations = 5, time = 1)
    public double step100ms() {
        next = (next + 1) & MASK;
        plant.setSteamDemand(demand[next]);
        plant.step(0.1);
        return plant.levelM();
    }

    /** 24 h of plant time in 100 ms steps (864,000 steps), from steady state. */
    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    @OutputTimeUnit(TimeUnit.MILLISECONDS)
    @Warmup(iterations = 1)
    @Measurement(iterations = 3)
    public double day24h() {
        plant.initSteadyState(cfg.nominalLoadFrac());
        for (int i = 0; i < 864_000; i++) {
            plant.step(0.1);
        }
        return plant.levelM();
    }

    /** Runs the benchmarks above with the settings given in the annotations. */
    public static void main(String[] args) throws RunnerException {
        Options options = new OptionsBuilder()
                .include(PlantBenchmark.class.getSimpleName())
                .build();
        new Runner(options).run();
    }
}
