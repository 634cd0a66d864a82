package org.drumloop.bench.live;

import java.util.ArrayList;
import java.util.List;

/**
 * A small closed loop for testing the live server and page without the real firmware and plant:
 * an integrating drum (level rate = (feed − steam)/(ρ·A)), a proportional-integral level
 * controller with manual/auto, two pumps, and four level interlocks that latch, acknowledge,
 * reset and bypass like the firmware's. It keeps its own record of every scan so tests can check
 * what the page shows against what the loop computed.
 */
final class FakeLiveSession implements LiveSession {
    static final double SCAN_S = 0.1;
    /** ρ·A of the invented test drum [kg/m]: small so the level moves fast in tests. */
    static final double RHO_A_KG_PER_M = 800.0;
    static final double RATED_STEAM_KGS = 10_000.0 / 3600.0;
    static final double FEED_PER_VALVE_KGS = 5.0;
    static final double LAL_M = -0.100, LAH_M = 0.100, LALL_M = -0.200, LAHH_M = 0.200;
    static final List<String> TAGS = List.of("LAL", "LAH", "LALL", "LAHH");
    static final boolean[] IS_TRIP = {false, false, true, true};

    private final boolean hardware;
    private double tS;
    private double levelM;
    private double setpointM;
    private double demandFrac = 0.6;
    private double valveFrac;
    private double manualOut;
    private double integral;
    private String mode = "three-element";
    private boolean auto = true;
    private final boolean[] pump = {true, false};
    private final boolean[] active = new boolean[4];
    private final boolean[] latched = new boolean[4];
    private final boolean[] acked = {true, true, true, true};
    private final double[] bypassUntilS = {Double.NaN, Double.NaN, Double.NaN, Double.NaN};
    private int firstOut = -1;
    private final PendingEvents pendingEvents = new PendingEvents();
    /** The loop's own record: one row per scan {tS, levelM, steamKgS, feedKgS, valveFrac, outFrac}. */
    final List<double[]> record = new ArrayList<>();
    private final List<String> lines = new ArrayList<>();
    final List<LiveAction> applied = java.util.Collections.synchronizedList(new ArrayList<>());

    /** The recorded row of the scan that ended at {@code tS} (nearest), or null. */
    double[] recordAt(double t) {
        synchronized (record) {
            double[] best = null;
            for (double[] r : record) {
                if (best == null || Math.abs(r[0] - t) < Math.abs(best[0] - t)) {
                    best = r;
                }
            }
            return best;
        }
    }

    FakeLiveSession(boolean hardware) {
        this.hardware = hardware;
        valveFrac = demandFrac * RATED_STEAM_KGS / FEED_PER_VALVE_KGS;
        manualOut = valveFrac;
        integral = valveFrac;
    }

    @Override
    public LiveInfo info() {
        return new LiveInfo("test-drum", "invented test vessel for the live page", "test.tuning", hardware,
                hardware ? "Modbus TCP 127.0.0.1 (test)" : "simulated plant, in process", SCAN_S, -0.3, 0.3,
                List.of(new LiveInfo.Line("LAL", LAL_M, false), new LiveInfo.Line("LAH", LAH_M, false),
                        new LiveInfo.Line("LALL", LALL_M, true), new LiveInfo.Line("LAHH", LAHH_M, true)),
                RATED_STEAM_KGS, 1.5e6,
                List.of(new LiveInfo.Transmitter("level_tx_a", "level A", "Pa"),
                        new LiveInfo.Transmitter("steam_flow_tx", "steam flow", "Pa"),
                        new LiveInfo.Transmitter("feed_temp_tx", "feed temperature", "K")),
                TAGS, List.of("feed_pump_a", "feed_pump_b", "burner"));
    }

    @Override
    public double timeS() {
        return tS;
    }

    @Override
    public void scan() {
        tS = Math.round((tS + SCAN_S) * 1e6) / 1e6;
        double steam = demandFrac * RATED_STEAM_KGS;
        double out;
        if (auto && !"manual".equals(mode)) {
            double e = setpointM - levelM;
            integral += 0.02 * e * SCAN_S;
            out = Math.max(0, Math.min(1, 2.0 * e + integral));
        } else {
            out = manualOut;
            integral = out; // tracking for bumpless return to auto
        }
        valveFrac = out;
        double feed = (pump[0] || pump[1]) ? valveFrac * FEED_PER_VALVE_KGS : 0.0;
        levelM += (feed - steam) / RHO_A_KG_PER_M * SCAN_S;
        double[] limits = {LAL_M, LAH_M, LALL_M, LAHH_M};
        for (int i = 0; i < 4; i++) {
            if (!Double.isNaN(bypassUntilS[i]) && tS >= bypassUntilS[i]) {
                bypassUntilS[i] = Double.NaN;
                event(TAGS.get(i), "BYPASS_END", "bypass expired");
            }
            boolean cond = limits[i] < 0 ? levelM < limits[i] : levelM > limits[i];
            if (!Double.isNaN(bypassUntilS[i])) {
                cond = false;
            }
            if (cond && !active[i]) {
                acked[i] = false;
                if (IS_TRIP[i]) {
                    latched[i] = true;
                    if (firstOut < 0) {
                        firstOut = i;
                    }
                }
                event(TAGS.get(i), IS_TRIP[i] ? "TRIP" : "ALARM", IS_TRIP[i] ? "trip" : "alarm");
            } else if (!cond && active[i]) {
                event(TAGS.get(i), IS_TRIP[i] ? "TRIP_CLEAR" : "ALARM_CLEAR", "condition clear");
            }
            active[i] = cond;
        }
        synchronized (record) {
            record.add(new double[] {tS, levelM, steam, feed, valveFrac, out});
        }
    }

    private void event(String tag, String kind, String msg) {
        pendingEvents.accept(tS, tag, kind, msg);
    }

    @Override
    public void apply(LiveAction a) {
        applied.add(a);
        lines.add("at " + LiveAction.fmt(tS) + " s " + a.scenarioStatement());
        switch (a.kind()) {
            case MODE: mode = a.target(); auto = !"manual".equals(mode); event("level", "MODE", "mode " + mode); break;
            case AUTO: auto = a.auto(); event("level", "OPERATOR", auto ? "auto" : "manual"); break;
            case MANUAL_OUTPUT: manualOut = a.valueSi(); event("level", "OPERATOR", "manual output " + a.valueEu() + " %"); break;
            case SETPOINT: setpointM = a.valueSi(); event("level", "OPERATOR", "setpoint " + a.valueEu() + " mm"); break;
            case ACKNOWLEDGE:
                for (int i = 0; i < 4; i++) {
                    if ("all".equals(a.target()) || TAGS.get(i).equals(a.target())) {
                        acked[i] = true;
                    }
                }
                event(a.target(), "ACK", "acknowledged");
                break;
            case RESET:
                for (int i = 0; i < 4; i++) {
                    if (!active[i]) {
                        latched[i] = false;
                    }
                }
                firstOut = -1;
                event("all", "RESET", "reset");
                break;
            case BYPASS: {
                int i = TAGS.indexOf(a.target());
                bypassUntilS[i] = tS + a.durationS();
                event(a.target(), "BYPASS", "bypassed: " + a.text());
                break;
            }
            case STEAM_DEMAND: demandFrac = a.valueSi(); break;
            case TRIP:
                if ("feed_pump_a".equals(a.target())) {
                    pump[0] = false;
                } else if ("feed_pump_b".equals(a.target())) {
                    pump[1] = false;
                }
                event(a.target(), "PLANT", "tripped");
                break;
            default:
                break;
        }
    }

    @Override
    public void fill(LiveSnapshot s) {
        s.tS = tS;
        s.levelM = levelM;
        s.levelIndicatedM = levelM;
        s.levelSetpointM = setpointM;
        s.steamFlowKgS = demandFrac * RATED_STEAM_KGS;
        s.feedFlowKgS = (pump[0] || pump[1]) ? valveFrac * FEED_PER_VALVE_KGS : 0.0;
        s.steamFlowMeasuredKgS = s.steamFlowKgS;
        s.feedFlowMeasuredKgS = s.feedFlowKgS;
        s.feedFlowSetpointKgS = Double.NaN;
        s.valveDemandFrac = valveFrac;
        s.valvePositionFrac = valveFrac;
        s.drumPressurePa = 9.0e5;
        s.feedTempK = 358.15;
        s.feedPressurePa = 1.4e6;
        s.firingFrac = demandFrac;
        s.steamDemandFrac = demandFrac;
        s.pumpARunning = pump[0];
        s.pumpBRunning = pump[1];
        s.burnerOn = true;
        s.fuelCutoff = latched[2];
        s.mode = mode;
        s.auto = auto;
        for (int i = 0; i < 4; i++) {
            s.active[i] = active[i];
            s.latched[i] = latched[i];
            s.acknowledged[i] = acked[i];
            s.bypassed[i] = !Double.isNaN(bypassUntilS[i]);
            s.trip[i] = IS_TRIP[i];
            s.bypassLeftS[i] = bypassUntilS[i] - tS;
        }
        s.firstOut = firstOut;
    }

    @Override
    public void drainEvents(Sink sink) {
        pendingEvents.drainTo(sink);
    }

    @Override
    public List<String> scenarioLines() {
        List<String> l = new ArrayList<>(List.of("title     live session on the test drum", "plant     test-drum",
                "tuning    test", "duration  " + LiveAction.fmt(Math.ceil(tS) + 1) + " s"));
        l.addAll(lines);
        return l;
    }
}
