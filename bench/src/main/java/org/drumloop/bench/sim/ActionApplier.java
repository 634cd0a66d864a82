package org.drumloop.bench.sim;

import org.drumloop.bench.scenario.Action;
import org.drumloop.core.Firmware;
import org.drumloop.core.Mode;
import org.drumloop.core.OperatorCommands;
import org.drumloop.plant.Fault;
import org.drumloop.plant.Plant;

/**
 * Applies timed scenario statements to a closed loop: operator actions through the firmware's own
 * queued {@link OperatorCommands} (so they take its bumpless paths and reach its event log), plant
 * inputs and faults to the plant, and ramps recomputed before every scan as
 * {@code from + (to − from)·min(1, (t − at)/over)}. One ramp at most per input: a new set or ramp
 * of the same input cancels the old one. The scenario runner and the live page both use it, so a
 * session saved from the page replays the same way under {@code drumloop run}. One thread only;
 * applying a prepared action allocates nothing.
 */
public final class ActionApplier {
    /** What the actions act on. */
    public interface Loop {
        Plant plant();

        Firmware firmware();

        void setSteamDemand(double frac);

        double steamDemandFrac();

        void setPressureSetpointPa(double pPa);

        double pressureSetpointPa();
    }

    private static final Fault.Kind[] TRANSMITTER_FAULTS = {
        Fault.Kind.STUCK, Fault.Kind.DRIFT, Fault.Kind.BIAS, Fault.Kind.FAIL_LOW, Fault.Kind.FAIL_HIGH,
        Fault.Kind.NOISE_BURST,
    };

    private final Loop loop;
    private final Action[] ramp = new Action[Action.Input.values().length];
    private final double[] rampFrom = new double[ramp.length];

    public ActionApplier(Loop loop) {
        this.loop = loop;
    }

    /** The plant fault a {@code FAULT} statement injects (build it once, outside the scan). */
    public static Fault faultOf(Action a) {
        return new Fault(Fault.Kind.valueOf(a.label()), a.target(), a.value(), a.overS());
    }

    /**
     * Apply one statement now.
     *
     * @param fault for a {@code FAULT} statement the fault to inject ({@link #faultOf}); null makes it here
     * @return false when the statement is of a kind this loop does not act on
     */
    public boolean apply(Action a, Fault fault) {
        OperatorCommands op = loop.firmware().operator();
        Plant p = loop.plant();
        switch (a.type()) {
            case SET:
                ramp[a.input().ordinal()] = null;
                set(a.input(), a.value());
                return true;
            case RAMP:
                ramp[a.input().ordinal()] = a;
                rampFrom[a.input().ordinal()] = current(a.input());
                return true;
            case MODE:
                op.requestMode(Mode.byLabel(a.label()));
                return true;
            case AUTO:
                op.requestAuto(true);
                return true;
            case MANUAL:
                op.requestAuto(false);
                return true;
            case RESET:
                op.reset();
                return true;
            case ACKNOWLEDGE:
                op.acknowledge(a.target());
                return true;
            case BYPASS:
                op.bypass(a.target(), a.reason(), a.value());
                return true;
            case FAULT:
                p.inject(fault != null ? fault : faultOf(a));
                return true;
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
                return true;
            default:
                return false;
        }
    }

    /** Move every running ramp to time {@code tS}; call before each scan. */
    public void updateRamps(double tS) {
        for (int i = 0; i < ramp.length; i++) {
            Action a = ramp[i];
            if (a != null) {
                double x = Math.min(1.0, (tS - a.atS()) / a.overS());
                set(a.input(), rampFrom[i] + (a.value() - rampFrom[i]) * x);
                if (x >= 1.0) {
                    ramp[i] = null;
                }
            }
        }
    }

    /** Apply a scenario input value (SI). */
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

    /** The present value of a scenario input, where a ramp starts from. */
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
