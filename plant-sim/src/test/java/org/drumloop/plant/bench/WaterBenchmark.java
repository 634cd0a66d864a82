package org.drumloop.plant.bench;

import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.drumloop.plant.water.Iapws97;
import org.drumloop.plant.water.SaturationState;
import org.drumloop.plant.water.SaturationTable;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Cost of one saturation-state evaluation: the interpolated table the plant step uses, and the
 * direct IF97 evaluation (region 4 backward equation, regions 1 and 2, differenced slopes) for
 * contrast. Pressures cycle through 1024 random drum pressures between 1 and 180 bar, so the
 * branch predictor and caches see a realistic spread rather than one repeated point.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class WaterBenchmark {

    private static final int MASK = 1023;

    private final double[] pressuresPa = new double[MASK + 1];
    private final SaturationState state = new SaturationState();
    private SaturationTable table;
    private int next;

    @Setup(Level.Trial)
    public void setUp() {
        table = SaturationTable.standard();
        SplittableRandom random = new SplittableRandom(7L);
        for (int i = 0; i < pressuresPa.length; i++) {
            pressuresPa[i] = 1e5 * Math.pow(180.0, random.nextDouble());
        }
    }

    private double nextPressure() {
        next = (next + 1) & MASK;
        return pressuresPa[next];
    }

    /** Table lookup: Ts, densities, enthalpies and their five pressure derivatives. */
    @Benchmark
    public double lookup() {
        table.lookup(nextPressure(), state);
        return state.rhoW + state.dHSDp;
    }

    /** Direct IF97 for the same quantities (three saturation evaluations for the slopes). */
    @Benchmark
    public double direct() {
        SaturationTable.direct(nextPressure(), state);
        return state.rhoW + state.dHSDp;
    }

    /** One region 1 enthalpy, the feed-water property the plant evaluates every step. */
    @Benchmark
    public double feedEnthalpy() {
        return Iapws97.enthalpy1(nextPressure(), 450.0);
    }

    /** Runs the benchmarks above with the short settings given in the annotations. */
    public static void main(String[] args) throws RunnerException {
        Options options = new OptionsBuilder()
                .include(WaterBenchmark.class.getSimpleName())
                .build();
        new Runner(options).run();
    }
}
