package org.drumloop.core;

/**
 * The operator's requests to the firmware. Any thread may call these methods; the requests are
 * queued (fixed capacity, in order) and applied at the start of the next scan, where each is
 * written to the sequence-of-events log. A method returns false when the request is malformed
 * (not finite, out of 0..1) or the queue is full; whether the firmware then accepted it (e.g. a
 * bypass with a reason on a bypassable interlock) shows in the log.
 */
public final class OperatorCommands {
    static final int MODE = 1;
    static final int AUTO = 2;
    static final int MANUAL_OUTPUT = 3;
    static final int SETPOINT = 4;
    static final int RESET = 5;
    static final int ACK = 6;
    static final int BYPASS = 7;
    static final int RETUNE = 8;

    /** Controller names for {@link #retune}. */
    public static final String SINGLE_ELEMENT = "single_element";
    public static final String LEVEL_MASTER = "level_master";
    public static final String FEED_SLAVE = "feed_slave";

    /** Queue capacity; more requests between two scans than this are refused. */
    public static final int CAPACITY = 32;

    private final int[] kind = new int[CAPACITY];
    private final double[] number = new double[CAPACITY];
    private final Mode[] mode = new Mode[CAPACITY];
    private final String[] tag = new String[CAPACITY];
    private final String[] reason = new String[CAPACITY];
    private final org.drumloop.core.control.PidParams[] params = new org.drumloop.core.control.PidParams[CAPACITY];
    private int count;

    /** Ask for a mode: MANUAL switches to manual; SINGLE_ELEMENT or THREE_ELEMENT selects that strategy in auto. */
    public boolean requestMode(Mode m) {
        if (m == null) {
            return false;
        }
        return put(MODE, 0.0, m, null, null);
    }

    /** Auto (true) or manual (false), keeping the selected strategy. */
    public boolean requestAuto(boolean auto) {
        return put(AUTO, auto ? 1.0 : 0.0, null, null, null);
    }

    /** Valve position used in manual [0..1]. */
    public boolean setManualOutput(double valveFrac) {
        if (!(valveFrac >= 0.0 && valveFrac <= 1.0)) {
            return false;
        }
        return put(MANUAL_OUTPUT, valveFrac, null, null, null);
    }

    /** Level setpoint relative to normal water level [m]; refused in the log when outside the tappings. */
    public boolean setLevelSetpoint(double levelM) {
        if (!Double.isFinite(levelM)) {
            return false;
        }
        return put(SETPOINT, levelM, null, null, null);
    }

    /** Reset latched trips whose condition is clear, and the feed pump duty/standby state. */
    public boolean reset() {
        return put(RESET, 0.0, null, null, null);
    }

    /** Acknowledge one alarm or trip by tag, or "all". */
    public boolean acknowledge(String tagOrAll) {
        if (tagOrAll == null || tagOrAll.isBlank()) {
            return false;
        }
        return put(ACK, 0.0, null, tagOrAll.strip(), null);
    }

    /** Bypass an interlock for a time, with a reason (refused without one). */
    public boolean bypass(String interlockTag, String why, double durationS) {
        if (interlockTag == null || !Double.isFinite(durationS)) {
            return false;
        }
        return put(BYPASS, durationS, null, interlockTag.strip(), why);
    }

    /**
     * Retune one controller ({@link #SINGLE_ELEMENT}, {@link #LEVEL_MASTER} or {@link #FEED_SLAVE})
     * without a bump: the new settings take effect at the start of the next scan and the integral
     * absorbs the change of the proportional term. Action (reverse/direct) cannot be changed here.
     */
    public boolean retune(String controller, org.drumloop.core.control.PidParams p) {
        if (p == null || !(SINGLE_ELEMENT.equals(controller) || LEVEL_MASTER.equals(controller) || FEED_SLAVE.equals(controller))) {
            return false;
        }
        synchronized (this) {
            if (!put(RETUNE, 0.0, null, controller, null)) {
                return false;
            }
            params[count - 1] = p;
            return true;
        }
    }

    private synchronized boolean put(int k, double x, Mode m, String t, String r) {
        if (count >= CAPACITY) {
            return false;
        }
        params[count] = null;
        kind[count] = k;
        number[count] = x;
        mode[count] = m;
        tag[count] = t;
        reason[count] = r;
        count++;
        return true;
    }

    /** Move the queued requests into the firmware's arrays (same capacity); returns the count. Allocation-free. */
    synchronized int drain(int[] k, double[] x, Mode[] m, String[] t, String[] r, org.drumloop.core.control.PidParams[] pp) {
        int n = count;
        System.arraycopy(params, 0, pp, 0, n);
        System.arraycopy(kind, 0, k, 0, n);
        System.arraycopy(number, 0, x, 0, n);
        System.arraycopy(mode, 0, m, 0, n);
        System.arraycopy(tag, 0, t, 0, n);
        System.arraycopy(reason, 0, r, 0, n);
        for (int i = 0; i < n; i++) {
            mode[i] = null;
            tag[i] = null;
            reason[i] = null;
            params[i] = null;
        }
        count = 0;
        return n;
    }
}
