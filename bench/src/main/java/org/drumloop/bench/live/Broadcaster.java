package org.drumloop.bench.live;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads the loop's newest snapshot every {@code periodMs} of wall time, turns it into one JSON
 * message and hands it to every connected page. Runs on its own thread; each SSE connection writes
 * from its own thread too (see {@link LiveServer}), so a slow browser delays nobody else and the
 * scan never waits for either.
 *
 * <p>Keeps the trend history (last {@link #HISTORY_S} s of simulated time, one point per message)
 * and the recent events for pages that connect later.
 */
final class Broadcaster implements Runnable {
    /** Trend history kept for late joiners: ten minutes of simulated time, plus a little. */
    static final double HISTORY_S = 660.0;
    static final int RECENT_EVENTS = 300;

    private final LiveLoop loop;
    private final LiveInfo info;
    private final long periodMs;
    private final String runId;
    private final Object lock = new Object();
    private final ArrayDeque<double[]> history = new ArrayDeque<>();
    private final ArrayDeque<LiveEvent> recent = new ArrayDeque<>();
    private final List<LiveEvent> fresh = new ArrayList<>();
    private String message = null;
    /** The newest message as one ready-to-send SSE frame, encoded once for every client. */
    private byte[] frame = new byte[0];
    private long seq;
    private volatile boolean running = true;

    Broadcaster(LiveLoop loop, long periodMs, String runId) {
        this.loop = loop;
        this.info = loop.session().info();
        this.periodMs = periodMs;
        this.runId = runId;
    }

    void stop() {
        running = false;
        synchronized (lock) {
            lock.notifyAll();
        }
    }

    /** Sequence number of the newest message (0 before the first). */
    long seq() {
        synchronized (lock) {
            return seq;
        }
    }

    /** A message ready to send: its number and its SSE frame ({@code id:} and {@code data:} lines). */
    record Frame(long seq, byte[] bytes) {
    }

    /**
     * Wait until a message newer than {@code after} exists and return it, or null when stopped.
     * Called by the SSE writer threads; every client gets the same encoded bytes.
     */
    Frame await(long after) throws InterruptedException {
        synchronized (lock) {
            while (running && seq <= after) {
                lock.wait(1_000);
            }
            return running ? new Frame(seq, frame) : null;
        }
    }

    /**
     * The loop wakes this thread after a publish, once per period; when the loop is not running
     * (or is slower than the period) a timeout of two periods keeps the messages coming.
     */
    @Override
    public void run() {
        long periodNs = periodMs * 1_000_000L;
        long last = System.nanoTime();
        while (running && !Thread.currentThread().isInterrupted()) {
            java.util.concurrent.locks.LockSupport.parkNanos(this, 2 * periodNs);
            long now = System.nanoTime();
            if (now - last >= periodNs / 2) { // ignore early, spurious wake-ups
                last = now;
                tick();
            }
        }
    }

    /** Build and publish one message (also called directly by tests). */
    void tick() {
        LiveSnapshot s = loop.latest();
        fresh.clear();
        loop.drainEvents(fresh);
        StringBuilder b = new StringBuilder(2048);
        synchronized (lock) {
            for (LiveEvent e : fresh) {
                recent.addLast(e);
                if (recent.size() > RECENT_EVENTS) {
                    recent.removeFirst();
                }
            }
            double[] last = history.peekLast();
            if (s.scan == 0) {
                // nothing computed yet: no trend point
            } else if (last == null || s.tS > last[0]) {
                history.addLast(trendPoint(s));
            } else if (s.tS < last[0]) {
                history.clear(); // session restarted
                history.addLast(trendPoint(s));
            }
            while (!history.isEmpty() && history.peekFirst()[0] < s.tS - HISTORY_S) {
                history.removeFirst();
            }
            seq++;
            b.append("{\"seq\":").append(seq).append(",\"run\":");
            Json.str(b, runId);
            b.append(",\"values\":");
            values(b, s);
            b.append(",\"events\":");
            events(b, fresh);
            b.append('}');
            message = b.toString();
            frame = ("id: " + seq + "\ndata: " + message + "\n\n").getBytes(java.nio.charset.StandardCharsets.UTF_8);
            lock.notifyAll();
        }
    }

    /** Whole state for a page that has just (re)connected: info, history, recent events, latest values. */
    String state() {
        StringBuilder b = new StringBuilder(64 * 1024);
        synchronized (lock) {
            b.append("{\"seq\":").append(seq).append(",\"run\":");
            Json.str(b, runId);
            b.append(",\"info\":");
            info(b);
            b.append(",\"paused\":").append(loop.paused());
            b.append(",\"speed\":");
            Json.num(b, loop.speed(), 3);
            b.append(",\"history\":[");
            boolean first = true;
            for (double[] p : history) {
                if (!first) {
                    b.append(',');
                }
                first = false;
                point(b, p);
            }
            b.append("],\"events\":");
            events(b, recent);
            b.append(",\"message\":").append(message == null ? "null" : message);
            b.append('}');
        }
        return b.toString();
    }

    // ---- JSON pieces; engineering units at this edge ------------------------------------------

    private static final double MM = 1e3;
    private static final double TH = 3.6; // kg/s -> t/h
    private static final double ATM_PA = 101_325.0; // standard atmosphere, gauge pressure base (ISO 2533)

    /** On hardware the flows are the firmware's measurements (there is no plant truth to show). */
    private double[] trendPoint(LiveSnapshot s) {
        boolean hw = info.hardware();
        return new double[] {s.tS, s.levelIndicatedM, s.levelM, hw ? s.steamFlowMeasuredKgS : s.steamFlowKgS,
            hw ? s.feedFlowMeasuredKgS : s.feedFlowKgS, s.valvePositionFrac, s.drumPressurePa, s.levelSetpointM};
    }

    /** [t s, level ind mm, level truth mm, steam t/h, feed t/h, valve %, pressure barg, setpoint mm]. */
    private static void point(StringBuilder b, double[] p) {
        b.append('[');
        Json.num(b, p[0], 2).append(',');
        Json.num(b, p[1] * MM, 1).append(',');
        Json.num(b, p[2] * MM, 1).append(',');
        Json.num(b, p[3] * TH, 3).append(',');
        Json.num(b, p[4] * TH, 3).append(',');
        Json.num(b, p[5] * 100, 2).append(',');
        Json.num(b, (p[6] - ATM_PA) / 1e5, 3).append(',');
        Json.num(b, p[7] * MM, 1);
        b.append(']');
    }

    private void values(StringBuilder b, LiveSnapshot s) {
        b.append("{\"t_s\":");
        Json.num(b, s.tS, 2);
        b.append(",\"scan\":").append(s.scan);
        b.append(",\"published_ns\":").append(s.publishedNanos);
        b.append(",\"level_mm\":");
        Json.num(b, s.levelIndicatedM * MM, 1);
        b.append(",\"level_true_mm\":");
        Json.num(b, s.levelM * MM, 1);
        b.append(",\"setpoint_mm\":");
        Json.num(b, s.levelSetpointM * MM, 1);
        b.append(",\"steam_th\":");
        Json.num(b, s.steamFlowKgS * TH, 3);
        b.append(",\"feed_th\":");
        Json.num(b, s.feedFlowKgS * TH, 3);
        b.append(",\"steam_meas_th\":");
        Json.num(b, s.steamFlowMeasuredKgS * TH, 3);
        b.append(",\"feed_meas_th\":");
        Json.num(b, s.feedFlowMeasuredKgS * TH, 3);
        b.append(",\"feed_sp_th\":");
        Json.num(b, s.feedFlowSetpointKgS * TH, 3);
        b.append(",\"output_pct\":");
        Json.num(b, s.valveDemandFrac * 100, 2);
        b.append(",\"valve_pct\":");
        Json.num(b, s.valvePositionFrac * 100, 2);
        b.append(",\"pressure_barg\":");
        Json.num(b, (s.drumPressurePa - ATM_PA) / 1e5, 3);
        b.append(",\"feed_temp_c\":");
        Json.num(b, s.feedTempK - 273.15, 1);
        b.append(",\"feed_pressure_barg\":");
        Json.num(b, (s.feedPressurePa - ATM_PA) / 1e5, 2);
        b.append(",\"firing_pct\":");
        Json.num(b, s.firingFrac * 100, 1);
        b.append(",\"demand_pct\":");
        Json.num(b, s.steamDemandFrac * 100, 1);
        b.append(",\"pump_a\":").append(s.pumpARunning);
        b.append(",\"pump_b\":").append(s.pumpBRunning);
        b.append(",\"burner\":").append(s.burnerOn);
        b.append(",\"fuel_cutoff\":").append(s.fuelCutoff);
        b.append(",\"plant_invalid\":").append(s.plantInvalid);
        b.append(",\"mode\":");
        Json.str(b, s.mode);
        b.append(",\"auto\":").append(s.auto);
        b.append(",\"paused\":").append(loop.paused());
        b.append(",\"speed\":");
        Json.num(b, loop.speed(), 3);
        ScanTiming t = loop.timing();
        b.append(",\"jitter_p99_ms\":");
        Json.num(b, t.quantileMs(0.99), 2);
        b.append(",\"overruns\":").append(t.overruns());
        b.append(",\"first_out\":");
        Json.str(b, s.firstOut >= 0 && s.firstOut < info.interlocks().size() ? info.interlocks().get(s.firstOut) : null);
        b.append(",\"interlocks\":[");
        for (int i = 0; i < s.active.length; i++) {
            if (i > 0) {
                b.append(',');
            }
            b.append("{\"tag\":");
            Json.str(b, info.interlocks().get(i));
            b.append(",\"trip\":").append(s.trip[i]);
            b.append(",\"active\":").append(s.active[i]);
            b.append(",\"latched\":").append(s.latched[i]);
            b.append(",\"acked\":").append(s.acknowledged[i]);
            b.append(",\"bypassed\":").append(s.bypassed[i]);
            b.append(",\"bypass_left_s\":");
            Json.num(b, s.bypassed[i] ? s.bypassLeftS[i] : Double.NaN, 0);
            b.append('}');
        }
        b.append("]}");
    }

    private static void events(StringBuilder b, Iterable<LiveEvent> list) {
        b.append('[');
        boolean first = true;
        for (LiveEvent e : list) {
            if (!first) {
                b.append(',');
            }
            first = false;
            b.append("{\"seq\":").append(e.seq()).append(",\"t_s\":");
            Json.num(b, e.tS(), 2);
            b.append(",\"tag\":");
            Json.str(b, e.tag());
            b.append(",\"kind\":");
            Json.str(b, e.kind());
            b.append(",\"message\":");
            Json.str(b, e.message());
            b.append('}');
        }
        b.append(']');
    }

    private void info(StringBuilder b) {
        b.append("{\"plant\":");
        Json.str(b, info.plantName());
        b.append(",\"description\":");
        Json.str(b, info.description());
        b.append(",\"tuning\":");
        Json.str(b, info.tuningName());
        b.append(",\"hardware\":").append(info.hardware());
        b.append(",\"io\":");
        Json.str(b, info.ioDescription());
        b.append(",\"scan_ms\":");
        Json.num(b, info.scanPeriodS() * 1e3, 1);
        b.append(",\"gauge_min_mm\":");
        Json.num(b, info.gaugeMinM() * MM, 1);
        b.append(",\"gauge_max_mm\":");
        Json.num(b, info.gaugeMaxM() * MM, 1);
        double[] sp = info.setpointRangeM();
        b.append(",\"setpoint_min_mm\":");
        Json.num(b, sp[0] * MM, 1);
        b.append(",\"setpoint_max_mm\":");
        Json.num(b, sp[1] * MM, 1);
        b.append(",\"steam_rated_th\":");
        Json.num(b, info.steamRatedKgS() * TH, 3);
        b.append(",\"pressure_max_barg\":");
        Json.num(b, (info.pressureMaxPa() - ATM_PA) / 1e5, 2);
        b.append(",\"steam_demand_max_pct\":");
        Json.num(b, CommandParser.STEAM_DEMAND_MAX_PERCENT, 0);
        b.append(",\"bypass_max_s\":");
        Json.num(b, CommandParser.BYPASS_MAX_S, 0);
        b.append(",\"lines\":[");
        for (int i = 0; i < info.lines().size(); i++) {
            LiveInfo.Line l = info.lines().get(i);
            b.append(i > 0 ? "," : "").append("{\"tag\":");
            Json.str(b, l.tag());
            b.append(",\"mm\":");
            Json.num(b, l.levelM() * MM, 1);
            b.append(",\"trip\":").append(l.trip()).append('}');
        }
        b.append("],\"transmitters\":[");
        for (int i = 0; i < info.transmitters().size(); i++) {
            LiveInfo.Transmitter t = info.transmitters().get(i);
            b.append(i > 0 ? "," : "").append("{\"tag\":");
            Json.str(b, t.tag());
            b.append(",\"label\":");
            Json.str(b, t.label());
            b.append(",\"si\":");
            Json.str(b, t.siUnit());
            b.append('}');
        }
        b.append("],\"interlocks\":[");
        for (int i = 0; i < info.interlocks().size(); i++) {
            b.append(i > 0 ? "," : "");
            Json.str(b, info.interlocks().get(i));
        }
        b.append("],\"trippable\":[");
        for (int i = 0; i < info.trippable().size(); i++) {
            b.append(i > 0 ? "," : "");
            Json.str(b, info.trippable().get(i));
        }
        b.append("]}");
    }
}
