package org.drumloop.core.safety;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.Quality;
import org.drumloop.core.soe.EventKind;
import org.drumloop.core.soe.SoeLog;

/** Builds interlock sets from file text and records what they log. */
final class Fixtures {
    /** Scan period used by the interlock tests [s]: the firmware default of 100 ms. */
    static final double DT_S = 0.1;

    private Fixtures() {
    }

    /** One interlock block with the given settings lines. */
    static List<String> block(String tag, String... settings) {
        List<String> lines = new ArrayList<>();
        lines.add("interlock " + tag);
        lines.addAll(Arrays.asList(settings));
        return lines;
    }

    static InterlockConfig parse(List<String> lines) {
        try {
            return InterlockFile.parse("test.interlocks", lines);
        } catch (ConfigException e) {
            throw new AssertionError(e.getMessage(), e);
        }
    }

    /** A logged event, for assertions. */
    record Event(double tS, long scan, String tag, EventKind kind, String message) {
    }

    /** An interlock set with its log, inputs and outputs, stepped scan by scan. */
    static final class Rig {
        final SoeLog log = new SoeLog(1024);
        final InterlockSet set;
        final InterlockInputs in = new InterlockInputs();
        final InterlockOutputs out = new InterlockOutputs();
        final List<Event> events = new ArrayList<>();
        long scan;

        Rig(List<String> lines) {
            set = new InterlockSet(parse(lines), log);
            Arrays.fill(in.levelQuality, Quality.GOOD);
            in.levelSelectedQuality = Quality.GOOD;
            in.feedTempQuality = Quality.GOOD;
            in.levelDeviationQuality = Quality.GOOD;
            in.feedTempK = 363.15;
        }

        double tS() { return scan * DT_S; }

        /** Set all three transmitters and the selected level to {@code levelM}. */
        Rig level(double levelM) {
            Arrays.fill(in.levelM, levelM);
            in.levelSelectedM = levelM;
            return this;
        }

        /** Run one scan at the current scan number and advance. */
        Rig step() {
            set.evaluate(in, tS(), scan, DT_S, out);
            log.drainTo((t, s, tag, k, m) -> events.add(new Event(t, s, tag, k, m)));
            scan++;
            return this;
        }

        Rig steps(int n) {
            for (int i = 0; i < n; i++) {
                step();
            }
            return this;
        }

        List<Event> events(EventKind kind) {
            return events.stream().filter(e -> e.kind() == kind).toList();
        }

        int idx(String tag) { return set.indexOf(tag); }
    }
}
