package org.drumloop.core;

import java.util.Arrays;
import org.drumloop.core.io.Quality;

/**
 * Live view of the firmware for trends and screens: plain fields, overwritten at the end of every
 * scan. Read it on the scan thread between scans (e.g. in a scan listener); another thread may see
 * a mix of two scans. SI units throughout; levels relative to normal water level.
 */
public final class FirmwareStatus {
    /** Scan number (0 for the first) and its time [s]. */
    public long scan;
    public double tS;

    /** Active mode, the strategy the operator selected, and auto/manual. */
    public Mode mode = Mode.MANUAL;
    public Mode requestedMode = Mode.THREE_ELEMENT;
    public boolean auto;
    /** Three-element blocked by a bad flow signal; manual forced by loss of every level transmitter; low-load band. */
    public boolean forcedSingleElement;
    public boolean forcedManual;
    public boolean lowLoad;

    /** Selected (median) compensated level [m] and its quality. */
    public double levelM;
    public Quality levelQuality = Quality.BAD;
    /** Transmitters A, B, C compensated [m] and qualities; spread among usable ones [m]. */
    public final double[] levelTxM = new double[3];
    public final Quality[] levelTxQuality = new Quality[3];
    public double levelDeviationM;
    /** Effective setpoint (operator setpoint plus load program) [m] and the operator's setpoint [m]. */
    public double levelSetpointM;
    public double operatorSetpointM;
    /** Level the controller acts on (after swell compensation) [m] and the swell estimate [m]. */
    public double levelForControlM;
    public double swellEstimateM;

    /** Compensated flows [kg/s] and qualities. */
    public double steamFlowKgS;
    public Quality steamFlowQuality = Quality.BAD;
    public double feedFlowKgS;
    public Quality feedFlowQuality = Quality.BAD;
    /** Feedforward, master output and feed-flow setpoint [kg/s]. */
    public double feedforwardKgS;
    public double masterOut;
    public double feedFlowSetpointKgS;

    /** Drum pressure [Pa abs], feed temperature [K], feed pressure [Pa abs] (substituted values when BAD) and qualities. */
    public double drumPressurePa;
    public Quality drumPressureQuality = Quality.BAD;
    public double feedTempK;
    public Quality feedTempQuality = Quality.BAD;
    public double feedPressurePa;
    public Quality feedPressureQuality = Quality.BAD;

    /** Valve demand sent and the manual position [1]. */
    public double valveDemandFrac;
    public double manualValveFrac;

    /** Pump run commands and duty pump (0 = A, 1 = B); standby running; duty tripped. */
    public boolean pumpARun;
    public boolean pumpBRun;
    public int dutyPump;
    public boolean standbyRunning;
    public boolean dutyPumpFailed;

    /** Interlock actions and annunciators. */
    public boolean fuelCutoff;
    public boolean feedPumpsStop;
    public boolean feedValveClose;
    public boolean alarmLal;
    public boolean alarmLah;
    public boolean tripLall;
    public boolean tripLahh;
    public boolean alarmTal;
    public boolean alarmLdah;
    /** First-out trip index in the interlock set, -1 when none. */
    public int firstOut = -1;

    public FirmwareStatus() {
        Arrays.fill(levelTxQuality, Quality.BAD);
    }
}
