package org.drumloop.bench.sim;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.List;
import java.util.stream.Collectors;
import java.util.stream.Stream;

import org.drumloop.bench.expect.Outcome;
import org.drumloop.bench.record.RunSummary;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.core.config.ConfigException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every shipped scenario runs on the real plant model and firmware and every one of its
 * expectations holds. The expectations themselves are the acceptance criteria (limits from the
 * interlocks file and common practice for drum-level control, written in each scenario).
 */
class ScenarioLibraryTest {
    /** The project's scenario folder, seen from the bench module. */
    static final Path LIBRARY = Paths.get("..", "config", "scenarios");

    static Stream<Path> scenarios() throws IOException {
        try (Stream<Path> s = Files.list(LIBRARY)) {
            List<Path> l = s.filter(p -> p.toString().endsWith(".scenario")).sorted().collect(Collectors.toList());
            return l.stream();
        }
    }

    @Test
    void theLibraryCoversTheRequiredCases() throws IOException {
        List<String> names = scenarios().map(p -> p.getFileName().toString()).collect(Collectors.toList());
        assertTrue(names.size() >= 8, "at least eight scenarios: " + names);
        for (String required : new String[] {"load-step-up", "load-step-down", "load-rejection", "pump-trip-standby",
            "tx-stuck", "tx-fail-low", "tx-drift", "low-water-trip", "high-water-trip", "feed-valve-stuck",
            "swell-comp-on", "swell-comp-off", "demo"}) {
            assertTrue(names.contains(required + ".scenario"), "missing " + required + ": " + names);
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("scenarios")
    void everyExpectationHolds(Path file) throws ConfigException, IOException {
        RunSummary r = ScenarioRunner.run(ScenarioParser.load(file), ScenarioRunner.Options.fast(null));
        StringBuilder failed = new StringBuilder();
        for (Outcome o : r.outcomes()) {
            if (!o.passed()) {
                failed.append("\n  ").append(file.getFileName()).append(':').append(o.line()).append(": ")
                        .append(o.text()).append(" -> ").append(o.measured());
            }
        }
        assertTrue(failed.length() == 0, "expectations failed:" + failed);
        assertTrue(!r.outcomes().isEmpty(), "a scenario without expectations checks nothing");
    }

    /**
     * The reason for swell compensation (Astrom and Bell 2000: the level first rises on a steam
     * increase although the inventory falls; a controller that acts on it cuts the feed): on the same
     * plant, seed and load change, the run with compensation must show a smaller peak level deviation
     * and a smaller IAE than the run without it. Both runs differ only in the swell gain.
     */
    @Test
    void swellCompensationReducesThePeakDeviationAfterAFastLoadIncrease() throws ConfigException, IOException {
        RunSummary on = ScenarioRunner.run(ScenarioParser.load(LIBRARY.resolve("swell-comp-on.scenario")),
                ScenarioRunner.Options.fast(null));
        RunSummary off = ScenarioRunner.run(ScenarioParser.load(LIBRARY.resolve("swell-comp-off.scenario")),
                ScenarioRunner.Options.fast(null));
        double peakOn = on.figures().maxDeviationM();
        double peakOff = off.figures().maxDeviationM();
        // a margin of 5 mm keeps the check meaningful, well above the transmitter noise of both runs
        assertTrue(peakOn < peakOff - 0.005, "peak with " + peakOn + " m, without " + peakOff + " m");
        assertTrue(on.figures().iaeMS() < off.figures().iaeMS(),
                "IAE with " + on.figures().iaeMS() + " m*s, without " + off.figures().iaeMS() + " m*s");
    }
}
