package org.drumloop.bench.record;

import java.util.List;

import org.drumloop.bench.expect.Outcome;
import org.drumloop.bench.scenario.Scenario;

/**
 * Everything the records say about one finished run.
 *
 * @param scenario   what was run
 * @param plantName  plant as resolved (file name)
 * @param tuningName tuning as resolved (file name)
 * @param endS       plant time reached [s]
 * @param wallS      wall time of the run [s]
 * @param scans      scans executed
 * @param outcomes   verdict per expectation, in file order
 * @param figures    key figures
 * @param plot       decimated trends for the plots
 * @param events     events kept in memory (the file has all)
 * @param limits     level limits to draw (alarm and trip settings)
 * @param soeLost    SOE events lost because the ring overflowed
 * @param plantInvalid true when the plant left its valid range during the run
 * @param record     header and settings for the records (null until the runner adds them)
 */
public record RunSummary(Scenario scenario, String plantName, String tuningName, double endS, double wallS,
                         long scans, List<Outcome> outcomes, KeyFigures figures, PlotBuffer plot,
                         List<EventRecord> events, List<LevelLimit> limits, long soeLost, boolean plantInvalid,
                         RunRecord record) {

    /** The verdict of a run. */
    public enum Verdict {
        /** Every expectation held. */
        PASS("PASS"),
        /** At least one expectation failed. */
        FAIL("FAIL"),
        /** The scenario states no expectation: the run proves nothing by itself. */
        NO_CRITERIA("NO CRITERIA");

        private final String text;

        Verdict(String text) {
            this.text = text;
        }

        /** As printed and shown on reports. */
        public String text() { return text; }

        /** Style class of the verdict on records: pass, fail, none. */
        public String css() { return this == PASS ? "pass" : this == FAIL ? "fail" : "none"; }
    }

    /** A summary without the record (header and settings). */
    public RunSummary(Scenario scenario, String plantName, String tuningName, double endS, double wallS,
                      long scans, List<Outcome> outcomes, KeyFigures figures, PlotBuffer plot,
                      List<EventRecord> events, List<LevelLimit> limits, long soeLost, boolean plantInvalid) {
        this(scenario, plantName, tuningName, endS, wallS, scans, outcomes, figures, plot, events, limits, soeLost,
                plantInvalid, null);
    }

    /** The same summary with its record. */
    public RunSummary withRecord(RunRecord r) {
        return new RunSummary(scenario, plantName, tuningName, endS, wallS, scans, outcomes, figures, plot, events,
                limits, soeLost, plantInvalid, r);
    }

    /** PASS, FAIL, or NO CRITERIA when the scenario has no expectation. */
    public Verdict verdict() {
        if (outcomes.isEmpty()) {
            return Verdict.NO_CRITERIA;
        }
        return passed() ? Verdict.PASS : Verdict.FAIL;
    }

    /** True when no expectation failed (also true when there were none: see {@link #verdict()}). */
    public boolean passed() {
        for (Outcome o : outcomes) {
            if (!o.passed()) {
                return false;
            }
        }
        return true;
    }

    public int failures() {
        int n = 0;
        for (Outcome o : outcomes) {
            n += o.passed() ? 0 : 1;
        }
        return n;
    }

    /**
     * A level setting drawn on the level plot.
     *
     * @param tag    LAL, LALL, LAH, LAHH, ...
     * @param levelM level relative to NWL [m]
     * @param trip   true for a trip (drawn solid), false for an alarm (dashed)
     */
    public record LevelLimit(String tag, double levelM, boolean trip) {
    }
}
