package org.drumloop.core;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.util.ArrayList;
import java.util.List;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.core.soe.EventKind;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

class FirmwareTest {
    static final double DT_S = 0.1;
    /** Invented demo auxiliary boiler: 4.2 m2 water surface, 0.9 MPa, feed at 90 degC (project demo data). */
    static final double AREA_M2 = 4.2;
    static final double PRESSURE_PA = 9e5;
    static final double FEED_TEMP_K = 363.15;
    /** Feed flow at a fully open valve: rated 10 t/h at 62 % opening (project demo data). */
    static final double FEED_MAX_KGS = (10_000.0 / 3600.0) / 0.62;
    static final double RATED_KGS = 10_000.0 / 3600.0;

    FirmwareConfig cfg;
    Firmware fw;
    DrumRig rig;
    final ProcessImage in = new ProcessImage();
    final ProcessImage out = new ProcessImage();
    final List<String> events = new ArrayList<>();
    double tS;

    @BeforeEach
    void setUp() throws Exception {
        cfg = FirmwareConfig.load(FirmwareConfigTest.DEFAULT_TUNING);
        fw = new Firmware(cfg);
        rig = new DrumRig(cfg, AREA_M2, FEED_MAX_KGS, PRESSURE_PA, FEED_TEMP_K);
        rig.steady(0.62 * FEED_MAX_KGS);
        tS = 0.0;
    }

    void run(double seconds) {
        int n = (int) Math.round(seconds / DT_S);
        for (int i = 0; i < n; i++) {
            rig.write(in, tS);
            fw.scan(in, out, tS, DT_S);
            fw.events().drainTo((t, scan, tag, kind, msg) -> events.add(tag + " " + kind + " " + msg));
            rig.step(out, DT_S);
            tS += DT_S;
        }
    }

    boolean logged(String text) {
        for (String e : events) {
            if (e.contains(text)) {
                return true;
            }
        }
        return false;
    }

    @Test
    void startsInThreeElementWithoutABumpAndHoldsASteadyDrum() {
        run(0.1);
        // the first scan holds the start valve position (tuning manual_valve 62 %)
        assertEquals(0.62, out.value(Signal.FEED_VALVE_DEMAND), 1e-12, "start position from the tuning file");
        run(60);
        assertEquals(Mode.THREE_ELEMENT, fw.status().mode);
        // At steady state feed = steam, so the valve stays where it is; the flow compensation and the
        // rig use the same square law, so only table interpolation (< 2e-4 relative) separates them.
        assertEquals(0.62, out.value(Signal.FEED_VALVE_DEMAND), 2e-3, "no drift at steady state");
        assertEquals(0.0, fw.status().levelM, 2e-3, "level stays at NWL within 2 mm");
        assertTrue(logged("level_control MODE mode three-element"), events.toString());
    }

    @Test
    void aLoadStepIsCarriedByTheFeedforwardWithSmallLevelDeviation() throws Exception {
        // This rig has no swell, so the swell compensation is switched off (it would subtract a swell
        // that never comes); the default interlocks are kept.
        cfg = FirmwareConfig.parse("no-swell.tuning", FirmwareConfigTest.with(FirmwareConfigTest.defaultLines(),
                "swell", "gain", "gain 0 mm/(t/h)"), cfg.interlocks());
        fw = new Firmware(cfg);
        rig = new DrumRig(cfg, AREA_M2, FEED_MAX_KGS, PRESSURE_PA, FEED_TEMP_K);
        rig.steady(0.4 * RATED_KGS);
        run(300);
        rig.steamKgS = 0.8 * RATED_KGS;
        double worst = 0.0;
        for (int i = 0; i < 3000; i++) {
            run(DT_S);
            worst = Math.max(worst, Math.abs(rig.levelM));
        }
        // Design goal for the default tuning (project requirement): within about +/-80 mm on a 40->80 %
        // step. This rig has no swell, so only the feed loop lag moves the level: well inside.
        assertTrue(worst < 0.080, "worst level deviation " + worst + " m");
        assertEquals(0.8 * RATED_KGS, rig.feedKgS, 0.01 * RATED_KGS, "feed follows steam at the end (within 1 % of rated)");
    }

    @Test
    void aBadSteamFlowForcesSingleElementBumplesslyAndLogsIt() {
        run(30);
        double before = out.value(Signal.FEED_VALVE_DEMAND);
        rig.quality[Signal.STEAM_FLOW_DP.ordinal()] = Quality.BAD;
        run(DT_S);
        assertEquals(Mode.SINGLE_ELEMENT, fw.status().mode);
        assertTrue(fw.status().forcedSingleElement);
        // Bumpless: the single-element controller tracked the valve; with the level at setpoint the
        // first single-element output differs only by one scan of integral action (closed form
        // Kc*h/Ti*e with Kc = 0.2 %/mm = 2 /m, Ti = 600 s, e below 2 mm: 2*0.1/600*0.002 = 7e-7),
        // bounded here by 1e-4
        assertEquals(before, out.value(Signal.FEED_VALVE_DEMAND), 1e-4);
        assertTrue(logged("steam_flow_dp FAULT signal bad"), events.toString());
        assertTrue(logged("three-element blocked"), events.toString());
        rig.quality[Signal.STEAM_FLOW_DP.ordinal()] = Quality.GOOD;
        run(4.0);
        assertEquals(Mode.SINGLE_ELEMENT, fw.status().mode, "held until flows were good for flow_good_delay (5 s)");
        run(1.5);
        assertEquals(Mode.THREE_ELEMENT, fw.status().mode);
        assertTrue(logged("three-element released"), events.toString());
    }

    @Test
    void manualToAutoAndModeChangesAreBumplessAndLogged() {
        run(20);
        fw.operator().requestAuto(false);
        run(DT_S);
        assertEquals(Mode.MANUAL, fw.status().mode);
        double held = out.value(Signal.FEED_VALVE_DEMAND);
        fw.operator().setManualOutput(0.55);
        run(10);
        assertEquals(0.55, out.value(Signal.FEED_VALVE_DEMAND), 1e-12);
        fw.operator().requestMode(Mode.SINGLE_ELEMENT);
        run(DT_S);
        assertEquals(Mode.SINGLE_ELEMENT, fw.status().mode);
        // The first automatic output starts from the manual value; it moves only by one scan of
        // P and I on a level that drifted in manual: bound it by Kc*|e|*(1 + h/Ti) with |e| < 5 mm
        double e = Math.abs(fw.status().levelM);
        assertTrue(e < 0.005, "level drift in 10 s of manual " + e);
        double kc = cfg.singleElement().kc();
        assertEquals(0.55, out.value(Signal.FEED_VALVE_DEMAND), kc * e * (1 + 0.1 / cfg.singleElement().tiS()) + 1e-12);
        fw.operator().requestMode(Mode.THREE_ELEMENT);
        double u0 = out.value(Signal.FEED_VALVE_DEMAND);
        run(DT_S);
        assertEquals(Mode.THREE_ELEMENT, fw.status().mode);
        assertEquals(u0, out.value(Signal.FEED_VALVE_DEMAND), 0.01, "one scan of slave action only");
        assertTrue(held > 0.0);
        assertTrue(logged("operator selects manual"));
        assertTrue(logged("manual valve position set"));
        assertTrue(logged("operator selects single-element"));
        assertTrue(logged("MODE mode single-element"));
        assertTrue(logged("MODE mode three-element"));
    }

    @Test
    void manualAndAnOutputGivenInTheSameScanKeepTheOperatorsOutput() {
        // An operator who selects manual and types an output in one action expects that output;
        // the take-over value (bumpless) applies only when no output was given (common practice).
        run(20);
        fw.operator().requestAuto(false);
        fw.operator().setManualOutput(0.40);
        run(DT_S);
        assertEquals(Mode.MANUAL, fw.status().mode);
        assertEquals(0.40, out.value(Signal.FEED_VALVE_DEMAND), 1e-12);
    }

    @Test
    void theStandbyPumpStartsWhenTheDutyPumpTripsAndResetChangesOver() {
        run(10);
        assertTrue(out.bool(Signal.PUMP_A_RUN));
        assertFalse(out.bool(Signal.PUMP_B_RUN));
        rig.pumpATrips = true;
        // start_timeout 5 s in the default tuning: the trip is declared once the command has stood
        // 5 s without feedback; the duty pump was already running, so the timer has long expired.
        run(DT_S * 2);
        assertTrue(out.bool(Signal.PUMP_B_RUN), "standby started");
        assertFalse(out.bool(Signal.PUMP_A_RUN), "failed duty pump's command removed");
        assertTrue(logged("feed_pump_a FAULT duty pump tripped"), events.toString());
        assertTrue(logged("feed_pump_b INFO standby pump auto-started: duty pump trip"), events.toString());
        fw.operator().reset();
        run(DT_S);
        assertEquals(1, fw.status().dutyPump, "B is duty after the reset");
        assertTrue(out.bool(Signal.PUMP_B_RUN));
        assertTrue(logged("pump reset: duty b"));
    }

    @Test
    void theStandbyPumpStartsOnLowFeedPressureAfterTheDelay() {
        run(10);
        rig.feedPressurePa = 10.0e5; // below low_pressure 10.5 bara
        run(2.9);
        assertFalse(out.bool(Signal.PUMP_B_RUN), "delay 3 s not yet over");
        run(0.3);
        assertTrue(out.bool(Signal.PUMP_B_RUN));
        assertTrue(out.bool(Signal.PUMP_A_RUN), "duty keeps running");
        assertTrue(logged("standby pump auto-started: low feed pressure"));
    }

    @Test
    void highHighLevelStopsTheFeedPumpsThroughTheInterlocks() {
        run(5);
        rig.levelM = 0.25; // above LAHH +200 mm on all three transmitters
        run(1.9);
        assertTrue(out.bool(Signal.PUMP_A_RUN), "on-delay 2 s not yet over");
        run(0.3);
        assertFalse(out.bool(Signal.PUMP_A_RUN));
        assertFalse(out.bool(Signal.PUMP_B_RUN));
        assertTrue(out.bool(Signal.TRIP_LAHH));
        assertTrue(logged("LAHH TRIP"), events.toString());
    }

    @Test
    void losingEveryLevelTransmitterForcesManualWithTheValveHeld() {
        run(10);
        double u = out.value(Signal.FEED_VALVE_DEMAND);
        rig.quality[Signal.LEVEL_DP_A.ordinal()] = Quality.BAD;
        rig.quality[Signal.LEVEL_DP_B.ordinal()] = Quality.BAD;
        run(1);
        assertEquals(Mode.THREE_ELEMENT, fw.status().mode, "one transmitter is enough to control");
        rig.quality[Signal.LEVEL_DP_C.ordinal()] = Quality.BAD;
        run(DT_S);
        assertEquals(Mode.MANUAL, fw.status().mode);
        assertTrue(fw.status().forcedManual);
        run(5);
        assertEquals(u, out.value(Signal.FEED_VALVE_DEMAND), 0.01, "valve held where control left it");
        assertTrue(logged("no usable level transmitter"));
    }

    @Test
    void aFullScanAllocatesNothing() {
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long id = Thread.currentThread().getId();
        org.drumloop.core.soe.SoeSink sink = (t, scan, tag, kind, msg) -> { };
        // warm up so that class loading and first-call work are over
        for (int i = 0; i < 20_000; i++) {
            oneScan(sink, i);
        }
        long before = mx.getThreadAllocatedBytes(id);
        for (int i = 0; i < 100_000; i++) {
            oneScan(sink, i);
        }
        long bytes = mx.getThreadAllocatedBytes(id) - before;
        // Project requirement: zero allocation per scan. The smallest Java object takes 16 bytes, so
        // a single allocation in every scan would show as at least 1,600,000 bytes here. The bound
        // of 16,000 bytes (fewer than one object per 100 scans) leaves room for the few hundred
        // bytes the JVM itself may charge to the thread once (JIT deoptimisation re-materialising
        // scalar-replaced objects), which is not a per-scan cost.
        assertTrue(bytes < 16_000L, "bytes allocated over 100,000 scans: " + bytes);
    }

    private void oneScan(org.drumloop.core.soe.SoeSink sink, int i) {
        // alternate the steam flow a little so conditioning and control do real work
        rig.steamKgS = RATED_KGS * (0.6 + 0.2 * ((i / 500) % 2));
        rig.write(in, tS);
        fw.scan(in, out, tS, DT_S);
        fw.events().drainTo(sink);
        rig.step(out, DT_S);
        tS += DT_S;
    }

    @Test
    void operatorRequestsThatAreRefusedShowInTheLog() {
        fw.operator().setLevelSetpoint(0.5); // outside the tappings (+/-300 mm)
        fw.operator().bypass("LALL", "test", 60.0); // not bypassable in the default interlocks
        fw.operator().acknowledge("NOPE");
        run(DT_S);
        assertTrue(logged("level setpoint refused"));
        assertTrue(logged("LALL OPERATOR bypass refused"), events.toString());
        assertTrue(logged("acknowledge refused"));
        assertFalse(fw.operator().setManualOutput(1.5), "out of 0..1 refused at once");
        assertEquals(EventKind.OPERATOR, EventKind.valueOf("OPERATOR"));
    }

    @Test
    void aFailureCurrentOnOneLevelTransmitterLeavesControlOnTheOtherTwo() {
        run(10);
        // NE 43: 3.5 mA is a failure signal; the rig's other inputs stay engineering values
        FirmwareConfig c = cfg;
        int n = (int) Math.round(5.0 / DT_S);
        for (int i = 0; i < n; i++) {
            rig.write(in, tS);
            in.setCurrentMa(Signal.LEVEL_DP_B, 3.5, Quality.GOOD, tS);
            fw.scan(in, out, tS, DT_S);
            fw.events().drainTo((t, scan, tag, kind, msg) -> events.add(tag + " " + kind + " " + msg));
            rig.step(out, DT_S);
            tS += DT_S;
        }
        assertEquals(Quality.BAD, fw.status().levelTxQuality[1]);
        assertEquals(Quality.UNCERTAIN, fw.status().levelQuality, "two of three left: mean, uncertain");
        assertEquals(Mode.THREE_ELEMENT, fw.status().mode);
        assertEquals(rig.levelM, fw.status().levelM, 2e-3, "still measures the drum (2 mm: table interpolation and lag)");
        assertTrue(logged("level_dp_b FAULT signal bad"), events.toString());
        assertTrue(c.levelCal().lowSi() > c.levelCal().highSi(), "reverse calibration: 4 mA at the low level (largest dp)");
    }

    @Test
    void aBadDrumPressureIsReplacedByTheDesignPressure() {
        run(10);
        double level = fw.status().levelM;
        rig.quality[Signal.DRUM_PRESSURE.ordinal()] = Quality.BAD;
        run(1);
        assertEquals(Quality.BAD, fw.status().drumPressureQuality);
        // design pressure 9 bara equals the rig's 9 bar: the compensated level does not move
        assertEquals(9e5, fw.status().drumPressurePa, 1e-6);
        assertEquals(level, fw.status().levelM, 1e-3);
        assertEquals(Quality.UNCERTAIN, fw.status().levelQuality, "compensated with a substituted pressure");
        assertTrue(logged("drum_pressure FAULT signal bad"));
    }

    @Test
    void retuningTheLevelMasterInOperationIsBumplessAndLogged() {
        run(30);
        fw.operator().setLevelSetpoint(0.02); // give the master a standing error
        run(5);
        double before = fw.control().masterOut();
        double e = fw.status().levelSetpointM - fw.status().levelForControlM;
        org.drumloop.core.control.PidParams p = cfg.levelMaster();
        fw.operator().retune(OperatorCommands.LEVEL_MASTER, p.withKc(3 * p.kc()));
        run(DT_S);
        double after = fw.control().masterOut();
        // Without bumpless retuning the output would jump by (3 - 1) Kc e; with it, only one scan of
        // integral action and of the level's movement separates the two (bounded by Kc |e| / 4 here,
        // far below the 2 Kc |e| jump)
        assertTrue(Math.abs(after - before) < 0.25 * p.kc() * Math.abs(e) + 1e-9,
                "master moved " + (after - before) + " kg/s; a bump would be " + 2 * p.kc() * e);
        assertEquals(3 * p.kc(), fw.control().master().params().kc(), 1e-12);
        assertTrue(logged("level_master OPERATOR tuning changed"));
    }
}
