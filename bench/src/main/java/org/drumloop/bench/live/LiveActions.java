package org.drumloop.bench.live;

import java.util.ArrayList;
import java.util.List;
import org.drumloop.bench.scenario.Action;
import org.drumloop.bench.scenario.ScenarioParser;
import org.drumloop.core.Firmware;
import org.drumloop.core.Mode;
import org.drumloop.core.OperatorCommands;
import org.drumloop.core.config.ConfigException;
import org.drumloop.plant.Fault;
import org.drumloop.plant.Plant;

/**
 * Applies page actions and scripted scenario actions to a closed loop the way the bench's
 * scenario runner does: each page action is written as a scenario statement and read back with
 * {@link ScenarioParser}, then operator actions go through the firmware's queued
 * {@link OperatorCommands}, faults and inputs to the plant, and ramps are recomputed before every
 * scan ({@code from + (to − from)·min(1, (t − at)/over)}). Keeps the applied statements, in the
 * order applied, for the saved scenario. Loop thread only.
 */
final class LiveActions {
    /** The scenario runner applies an action when its time is within this of the scan time. */
    static final double TIME_EPS_S = 0.005;
    /** Statements are checked as part of a run this long (the parser's limit: 7 days). */
    static final double CHECK_DURATION_S = 7 * 86_400.0;
    private static final Fault.Kind[] TRANSMITTER_FAULTS = {
        Fault.Kind.STUCK, Fault.Kind.DRIFT, Fault.Kind.BIAS, Fault.Kind.FAIL_LOW, Fault.Kind.FAIL_HIGH,
        Fault.Kind.NOISE_BURST,
    };

    /** What the actions act on. */
    interface Loop {
        Plant plant();

        Firmware firmware();

        /** Time of the next scan [s]. */
        double timeS();

        void setSteamDemand(double frac);

        double steamDemandFrac();

        void setPressureSetpointPa(double pPa);

        double pressureSetpointPa();
    }

    private final Loop loop;
    private final List<Object[]> events;
    private final List<Action> scripted;
    private int nextScripted;
    /** One ramp at most per input, as in the runner (a new set or ramp cancels the old one). */
    private final Action[] ramp = new Action[Action.Input.values().length];
    private final double[] rampFrom = new double[Action.Input.values().length];
    private final List<String> applied = new ArrayList<>();

    /**
     * @param loop     the closed loop
     * @param scripted timed statements of a scenario to play (time order), may be empty
     * @param events   where to log {tS, tag, kind, message} entries (loop thread)
     */
    LiveActions(Loop loop, List<Action> scripted, List<Object[]> events) {
        this.loop = loop;
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
            events.add(new Object[] {t, "live", "INFO", "refused: " + e.getMessage()});
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
        for (int i = 0; i < ramp.length; i++) {
            Action a = ramp[i];
            if (a != null) {
                double x = Math.min(1.0, (t - a.atS()) / a.overS());
                set(a.input(), rampFrom[i] + (a.value() - rampFrom[i]) * x);
                if (x >= 1.0) {
                    ramp[i] = null;
                }
            }
        }
    }

    /** The statements applied so far, as written in a scenario file ({@code at T s ...}). */
    List<String> applied() {
        return applied;
    }

    private void run(Action a, double t) {
        applied.add(a.text());
        events.add(new Object[] {t, "scenario", "ACTION", a.text()});
        OperatorCommands op = loop.firmware().operator();
        Plant p = loop.plant();
        switch (a.type()) {
            case SET:
                ramp[a.input().ordinal()] = null;
                set(a.input(), a.value());
                break;
            case RAMP:
                ramp[a.input().ordinal()] = a;
                rampFrom[a.input().ordinal()] = current(a.input());
                break;
            case MODE:
                op.requestMode(Mode.byLabel(a.label()));
                break;
            case AUTO:
                op.requestAuto(true);
                break;
            case MANUAL:
                op.requestAuto(false);
                break;
            case RESET:
                op.reset();
                break;
            case ACKNOWLEDGE:
                op.acknowledge(a.target());
                break;
            case BYPASS:
                op.bypass(a.target(), a.reason(), a.value());
                break;
            case FAULT:
                p.inject(new Fault(Fault.Kind.valueOf(a.label()), a.target(), a.value(), a.overS()));
                break;
            case CLEAR:
                if ("all".equals(a.target())) {
                    p.clearAll();
                } else if (a.label() == null) {
                    for (Fault.Kind k : TRANSMITTER_FAULTS) {
                        p.clear(k, a.target());
                    }
                } else {
                    p.clear(Fault.Kind.valueOf(a.label()), a.target());
                }
                break;
            default:
                events.add(new Object[] {t, "live", "INFO", "not available on the live page: " + a.text()});
                break;
        }
    }

    private void set(Action.Input in, double v) {
        switch (in) {
            case STEAM_DEMAND: loop.setSteamDemand(v); break;
            case FEED_TEMP: loop.plant().setFeedTemperatureK(v); break;
            case PRESSURE_SETPOINT: loop.setPressureSetpointPa(v); break;
            case FIRING: loop.plant().setFiringManual(v); break;
            case SETPOINT: loop.firmware().operator().setLevelSetpoint(v); break;
            case OUTPUT: loop.firmware().operator().setManualOutput(v); break;
            default: break;
        }
    }

    private double current(Action.Input in) {
        switch (in) {
            case STEAM_DEMAND: return loop.steamDemandFrac();
            case FEED_TEMP: return loop.plant().feedTempK();
            case PRESSURE_SETPOINT: return loop.pressureSetpointPa();
            case FIRING: return loop.plant().firingFrac();
            case SETPOINT: return loop.firmware().status().levelSetpointM;
            case OUTPUT: return loop.firmware().status().valveDemandFrac;
            default: return 0.0;
        }
    }
}
