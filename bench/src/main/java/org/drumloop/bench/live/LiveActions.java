package org.drumloop.bench.live;

import java.util.ArrayList;
import java.util.List;
import org.drumloop.bench.scenario.Action;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.bench.sim.ActionApplier;
import org.drumloop.core.config.ConfigException;

/**
 * Applies page actions and scripted scenario actions to a closed loop with the scenario runner's
 * own {@link ActionApplier}: each page action is written as a scenario statement and read back with
 * {@link ScenarioParser}, then applied. Keeps the applied statements, in the order applied, for the
 * saved scenario. Loop thread only.
 */
final class LiveActions {
    /** The scenario runner applies an action when its time is within this of the scan time. */
    static final double TIME_EPS_S = 0.005;
    /** Statements are checked as part of a run this long (the parser's limit: 7 days). */
    static final double CHECK_DURATION_S = 7 * 86_400.0;

    /** What the actions act on. */
    interface Loop extends ActionApplier.Loop {
        /** Time of the next scan [s]. */
        double timeS();
    }

    private final Loop loop;
    private final PendingEvents events;
    private final List<Action> scripted;
    private int nextScripted;
    private final ActionApplier applier;
    private final List<String> applied = new ArrayList<>();

    /**
     * @param loop     the closed loop
     * @param scripted timed statements of a scenario to play (time order), may be empty
     * @param events   where to log {tS, tag, kind, message} entries (loop thread)
     */
    LiveActions(Loop loop, List<Action> scripted, PendingEvents events) {
        this.loop = loop;
        this.applier = new ActionApplier(loop);
        this.scripted = scripted;
        this.events = events;
    }

    /** Read one statement back with the bench's scenario parser, as a replay will. */
    static Action parse(double atS, String statement) {
        List<String> text = List.of("title live", "duration " + LiveAction.fmt(CHECK_DURATION_S) + " s",
                "at " + LiveAction.fmt(atS) + " s " + statement);
        try {
            return ScenarioParser.parse("live", null, text).actions().get(0);
        } catch (ConfigException e) {
            throw new IllegalArgumentException(statement + ": " + e.getMessage(), e);
        }
    }

    /** A page action, at the next scan. */
    void apply(LiveAction action) {
        double t = loop.timeS();
        Action a;
        try {
            a = parse(t, action.scenarioStatement());
        } catch (IllegalArgumentException e) {
            events.accept(t, "live", "INFO", "refused: " + e.getMessage());
            return;
        }
        run(a, t);
    }

    /** Before every scan: due scripted statements, then ramps. */
    void beforeScan() {
        double t = loop.timeS();
        while (nextScripted < scripted.size() && scripted.get(nextScripted).atS() <= t + TIME_EPS_S) {
            run(scripted.get(nextScripted++), t);
        }
        applier.updateRamps(t);
    }

    /** The statements applied so far, as written in a scenario file ({@code at T s ...}). */
    List<String> applied() {
        return applied;
    }

    private void run(Action a, double t) {
        applied.add(a.text());
        events.accept(t, "scenario", "ACTION", a.text());
        if (!applier.apply(a, null)) {
            events.accept(t, "live", "INFO", "not available on the live page: " + a.text());
        }
    }
}
