package org.drumloop.core.bench;

import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.drumloop.core.Firmware;
import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.signal.LevelCompensator;
import org.drumloop.core.signal.SteamTables;
import org.drumloop.core.soe.SoeSink;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
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
 * Cost of one full firmware scan: validation and conditioning of eight analogue inputs (NE 43
 * bands, staleness, spike check, density-compensated level from three transmitters with median
 * select, compensated steam and feed flow), the interlock set of the tuning file, mode selection,
 * swell compensation, three-element control, pump logic, outputs and status. Each operation
 * refreshes every input (as the I/O would) with a steam flow and level that wander a little so the
 * controllers do real work, and drains the event log.
 *
 * <p>Run from the project root:
 * <pre>
 *   mvn -q -B -o -pl controller-core test-compile dependency:build-classpath \
 *       -Dmdep.outputFile=target/cp.txt -Dmdep.includeScope=test
 *   cd controller-core &amp;&amp; java -cp target/test-classes:target/classes:$(cat target/cp.txt) \
 *       org.openjdk.jmh.Main ScanBenchmark -prof gc
 * </pre>
 * {@code gc.alloc.rate.norm} shows the bytes allocated per scan (0 apart from JMH's own noise).
 */
@State(Scope.Thread)
@Fork(1)
@Warmup(iterations = 5, time = 1)
@Measurement(iterations = 5, time = 1)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
public class ScanBenchmark {
    private static final double DT_S = 0.1;
    private static final int MASK = 1023;

    @Param({"default.tuning", "ab160.tuning"})
    public String tuningFile;

    private Firmware fw;
    private final ProcessImage in = new ProcessImage();
    private final ProcessImage out = new ProcessImage();
    private final SoeSink sink = (tS, scan, tag, kind, message) -> { };
    private final double[] levelDpPa = new double[MASK + 1];
    private final double[] steamDpPa = new double[MASK + 1];
    private double feedDpPa;
    private double pressurePa;
    private double feedTempK;
    private double feedPressurePa;
    private double tS;
    private int k;

    @Setup
    public void setUp() throws Exception {
        FirmwareConfig cfg = FirmwareConfig.load(findTuning(tuningFile));
        fw = new Firmware(cfg);
        pressurePa = cfg.designPressurePa();
        feedTempK = cfg.designFeedTempK();
        feedPressurePa = pressurePa * 1.2;
        LevelCompensator lc = cfg.levelCompensator();
        double rhoL = SteamTables.saturatedLiquidDensity(pressurePa);
        double rhoV = SteamTables.saturatedVapourDensity(pressurePa);
        double rhoRef = SteamTables.liquidDensity(lc.refLegTempK(), pressurePa);
        double rated = cfg.ratedSteamFlowKgS();
        for (int i = 0; i <= MASK; i++) {
            double phase = 2 * Math.PI * i / (MASK + 1);
            double levelM = 0.01 * Math.sin(phase);
            levelDpPa[i] = LevelCompensator.dpPa(levelM + lc.nwlAboveLowerTapM(), lc.tapSpanM(), rhoRef, rhoL, rhoV);
            double q = rated * (0.6 + 0.05 * Math.sin(phase));
            steamDpPa[i] = cfg.steamFlowCal().highSi() * sq(q / cfg.steamFlowRangeKgS()) * cfg.steamFlowDesignDensity() / rhoV;
        }
        double rhoFeed = SteamTables.liquidDensity(feedTempK, feedPressurePa);
        feedDpPa = cfg.feedFlowCal().highSi() * sq(0.6 * rated / cfg.feedFlowRangeKgS()) * cfg.feedFlowDesignDensity() / rhoFeed;
        for (int i = 0; i < 100; i++) {
            scan();
        }
    }

    private static double sq(double x) { return x * x; }

    /** The tuning files live in the project's config folder; JMH may run from the module or the project root. */
    private static Path findTuning(String name) {
        Path p = Path.of("..", "config", "tuning", name);
        return p.toFile().isFile() ? p : Path.of("config", "tuning", name);
    }

    @Benchmark
    public double scan() {
        int i = k++ & MASK;
        double t = tS;
        in.set(Signal.LEVEL_DP_A, levelDpPa[i], Quality.GOOD, t);
        in.set(Signal.LEVEL_DP_B, levelDpPa[i] + 1.0, Quality.GOOD, t);
        in.set(Signal.LEVEL_DP_C, levelDpPa[i] - 1.0, Quality.GOOD, t);
        in.set(Signal.STEAM_FLOW_DP, steamDpPa[i], Quality.GOOD, t);
        in.set(Signal.FEED_FLOW_DP, feedDpPa, Quality.GOOD, t);
        in.set(Signal.DRUM_PRESSURE, pressurePa, Quality.GOOD, t);
        in.set(Signal.FEED_TEMP, feedTempK, Quality.GOOD, t);
        in.set(Signal.FEED_PRESSURE, feedPressurePa, Quality.GOOD, t);
        in.setBool(Signal.PUMP_A_RUNNING, out.bool(Signal.PUMP_A_RUN), Quality.GOOD, t);
        in.setBool(Signal.PUMP_B_RUNNING, out.bool(Signal.PUMP_B_RUN), Quality.GOOD, t);
        in.setBool(Signal.BURNER_ON, true, Quality.GOOD, t);
        fw.scan(in, out, t, DT_S);
        fw.events().drainTo(sink);
        tS = t + DT_S;
        return out.value(Signal.FEED_VALVE_DEMAND);
    }

    /** Runs the benchmark with the settings in the annotations; add "-prof gc" on the JMH command line to see allocation. */
    public static void main(String[] args) throws RunnerException {
        Options options = new OptionsBuilder().include(ScanBenchmark.class.getSimpleName()).build();
        new Runner(options).run();
    }
}
