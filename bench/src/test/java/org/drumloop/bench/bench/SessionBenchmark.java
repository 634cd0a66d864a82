package org.drumloop.bench.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;

import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ScenarioRunner;
import org.drumloop.bench.sim.SimulationSession;
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
 * Cost of the closed loop on the bench: one scan of a {@link SimulationSession} (plant step with
 * its sub-steps, wiring, firmware scan, SOE drain, frame fill), and a 24 h scenario with a load
 * change every hour run by {@link ScenarioRunner} as fast as possible without records.
 */
@State(Scope.Thread)
@Fork(1)
public class SessionBenchmark {
    private SimulationSession session;

    @Setup(Level.Trial)
    public void setUp() throws Exception {
        ScenarioRunner.Setup s = ScenarioRunner.setup(ScenarioParser.parse("bench.scenario", null,
                List.of("title bench", "duration 1 s")));
        session = new SimulationSession(s.plant(), s.tuning(), 3, 0.7);
    }

    /** One 100 ms closed-loop scan. */
    @Benchmark
    @BenchmarkMode(Mode.AverageTime)
    @OutputTimeUnit(TimeUnit.NANOSECONDS)
    @Warmup(iterations = 3, time = 1)
    @Measurement(iterations = 5, time = 1)
    public double scan() {
        session.scan();
        return session.frame().value[0];
    }

    /** 24 h of plant time, load changes every hour, no records (864,001 scans). */
    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    @OutputTimeUnit(TimeUnit.MILLISECONDS)
    @Warmup(iterations = 1)
    @Measurement(iterations = 3)
    public double day24h() throws Exception {
        List<String> l = new ArrayList<>(List.of("title day", "duration 24 h"));
        for (int h = 0; h < 24; h++) {
            l.add(String.format(Locale.ROOT, "at %d h ramp steam_demand to %d %% over 120 s", h, h % 2 == 0 ? 90 : 40));
        }
        RunSummary r = ScenarioRunner.run(ScenarioParser.parse("day.scenario", null, l),
                ScenarioRunner.Options.fast(null));
        return r.figures().iaeMS();
    }

    /** Runs the benchmarks above with the settings given in the annotations. */
    public static void main(String[] args) throws RunnerException {
        Options options = new OptionsBuilder().include(SessionBenchmark.class.getSimpleName()).build();
        new Runner(options).run();
    }
}
