package org.drumloop.core.safety;

import java.util.List;
import org.drumloop.core.io.Quality;
import org.drumloop.core.soe.EventKind;
import org.drumloop.core.soe.SoeLog;

/**
 * The running interlocks: evaluates every alarm and trip of an {@link InterlockConfig} once per
 * scan and writes each alarm, clear, trip, reset, acknowledgement and bypass to the
 * sequence-of-events log in the scan it happens.
 *
 * <p>Per interlock, each scan, in this order:
 * <ol>
 * <li><b>Bypass</b>: requested bypasses start, expired ones end (at the first scan with
 *     {@code tS >= start + duration}). A bypassed interlock neither annunciates nor acts, but its
 *     condition is still evaluated and shown ({@link #active(int)}).</li>
 * <li><b>Channels</b>: each voted channel is compared with the setpoint with hysteresis: a HIGH
 *     function's channel trips at {@code x >= setpoint} and clears at {@code x < setpoint - hyst}
 *     (LOW: trips at {@code x <= setpoint}, clears at {@code x > setpoint + hyst}); in between it
 *     keeps its state. A channel that is BAD, not finite, or UNCERTAIN (unless the interlock says
 *     uncertain is usable) votes tripped when {@code bad_counts_as_tripped} is yes, healthy when no.</li>
 * <li><b>Voting</b>: the condition is present when at least M of the N channels vote tripped.
 *     1oo1 on level normally watches the firmware's selected (median) level; 1oo2 watches A and B;
 *     2oo3 watches A, B and C.</li>
 * <li><b>On-delay</b>: the function becomes active when the condition has been present for
 *     {@code n = ceil(delay / dt - 1e-9)} scans after the scan where it appeared, i.e. at the first
 *     scan whose time is at least (appearance + delay); a single scan without the condition restarts
 *     the count. It drops out as soon as the condition clears (no off-delay). The count is in
 *     scans of the nominal period (the shortest {@code dt} seen); a scan whose {@code dt} spans
 *     slots the executive skipped after an overrun counts as that many scans, so the delay stays
 *     tied to time.</li>
 * <li><b>Reset</b> (when requested): each latched function whose condition is clear is released;
 *     one whose condition is still present stays latched (logged as refused).</li>
 * <li><b>Latch and annunciate</b>: a latching function latches when active and not bypassed, and
 *     stays on until its condition is clear and a reset is applied; a non-latching one follows
 *     {@code active && !bypassed}. Each rising edge needs an acknowledgement.</li>
 * <li><b>First-out</b>: the first trip to latch since the first-out was last released; when
 *     several latch in the same scan, the one first in the file wins.</li>
 * </ol>
 *
 * <p>Operator calls ({@link #requestReset()}, {@link #acknowledge}, {@link #bypass},
 * {@link #endBypass}) are made on the scan thread between scans; their effects and log entries
 * happen in the next {@link #evaluate}. {@code evaluate} allocates nothing.
 */
public final class InterlockSet {
    private static final String RESET_TAG = "interlocks";

    private final InterlockConfig cfg;
    private final InterlockSpec[] specs;
    private final SoeLog log;
    private final int n;

    // per-interlock state
    private final boolean[][] channelTripped;
    private final boolean[] raw;
    private final int[] heldScans;
    private final boolean[] active;
    private final boolean[] latched;
    private final boolean[] on;
    private final boolean[] acked;
    private final boolean[] bypassed;
    private final double[] bypassEndS;
    private final String[] bypassReason;
    // operator requests waiting for the next evaluate
    private final boolean[] pendingBypass;
    private final double[] pendingBypassEndS;
    private final String[] pendingReason;
    private final boolean[] pendingBypassEnd;
    private final boolean[] pendingAck;
    private boolean pendingReset;
    private int firstOut = -1;
    private double nominalDtS = Double.NaN;
    private String lastRefusal = "";

    // preformatted messages
    private final String[] msgOn;
    private final String[] msgClear;
    private final String[] msgClearBypassed;
    private final String[] msgConditionClear;

    public InterlockSet(InterlockConfig cfg, SoeLog log) {
        this.cfg = java.util.Objects.requireNonNull(cfg, "cfg");
        this.log = java.util.Objects.requireNonNull(log, "log");
        this.n = cfg.size();
        this.specs = cfg.specs().toArray(new InterlockSpec[0]);
        channelTripped = new boolean[n][3];
        raw = new boolean[n];
        heldScans = new int[n];
        active = new boolean[n];
        latched = new boolean[n];
        on = new boolean[n];
        acked = new boolean[n];
        bypassed = new boolean[n];
        bypassEndS = new double[n];
        bypassReason = new String[n];
        pendingBypass = new boolean[n];
        pendingBypassEndS = new double[n];
        pendingReason = new String[n];
        pendingBypassEnd = new boolean[n];
        pendingAck = new boolean[n];
        msgOn = new String[n];
        msgClear = new String[n];
        msgClearBypassed = new String[n];
        msgConditionClear = new String[n];
        for (int i = 0; i < n; i++) {
            InterlockSpec s = specs[i];
            acked[i] = true;
            bypassReason[i] = "";
            String what = s.variable().text() + " " + s.voting().text() + " "
                    + (s.direction() == InterlockSpec.Direction.LOW ? "<= " : ">= ") + s.setpointText();
            msgOn[i] = (s.isTrip() ? "trip: " : "alarm: ") + what;
            msgClear[i] = s.latch() ? "released by reset" : "clear";
            msgClearBypassed[i] = "suppressed by bypass";
            msgConditionClear[i] = "condition clear, latched until reset";
        }
    }

    public InterlockConfig config() { return cfg; }

    /**
     * Evaluate every interlock for one scan and write the results to {@code out}.
     *
     * @param in   conditioned inputs of this scan
     * @param tS   scan time [s]
     * @param scan scan number (for the log)
     * @param dtS  scan period [s]; when not positive nothing changes and {@code out} shows the held state
     * @param out  written completely
     */
    public void evaluate(InterlockInputs in, double tS, long scan, double dtS, InterlockOutputs out) {
        if (dtS > 0.0) {
            if (!(dtS >= nominalDtS)) {
                nominalDtS = dtS;   // first scan, or a shorter period
            }
            applyBypassRequests(tS, scan);
            for (int i = 0; i < n; i++) {
                evaluateCondition(i, in, tS, scan, dtS);
            }
            if (pendingReset) {
                pendingReset = false;
                applyReset(tS, scan);
            }
            for (int i = 0; i < n; i++) {
                annunciate(i, tS, scan);
            }
            for (int i = 0; i < n; i++) {
                if (pendingAck[i]) {
                    pendingAck[i] = false;
                    if (!acked[i]) {
                        acked[i] = true;
                        log.record(tS, scan, specs[i].tag(), EventKind.ACK, "acknowledged");
                    }
                }
            }
        }
        writeOutputs(out);
    }

    private void applyBypassRequests(double tS, long scan) {
        for (int i = 0; i < n; i++) {
            if (pendingBypassEnd[i]) {
                pendingBypassEnd[i] = false;
                if (bypassed[i]) {
                    bypassed[i] = false;
                    log.record(tS, scan, specs[i].tag(), EventKind.BYPASS_END, "bypass removed by operator");
                }
            }
            if (pendingBypass[i]) {
                pendingBypass[i] = false;
                bypassed[i] = true;
                bypassEndS[i] = pendingBypassEndS[i];
                bypassReason[i] = pendingReason[i];
                pendingReason[i] = null;
                log.record(tS, scan, specs[i].tag(), EventKind.BYPASS, bypassReason[i]);
            }
            if (bypassed[i] && tS >= bypassEndS[i] - 1e-9) {
                bypassed[i] = false;
                log.record(tS, scan, specs[i].tag(), EventKind.BYPASS_END, "bypass expired");
            }
        }
    }

    private void evaluateCondition(int i, InterlockInputs in, double tS, long scan, double dtS) {
        InterlockSpec s = specs[i];
        boolean[] chState = channelTripped[i];
        double sp = s.setpointSi();
        double hyst = s.hysteresisSi();
        boolean high = s.direction() == InterlockSpec.Direction.HIGH;
        int votes = 0;
        for (int j = 0; j < s.channelCount(); j++) {
            int ch = s.channel(j);
            double x;
            Quality q;
            switch (s.variable()) {
                case LEVEL:
                    if (ch == InterlockSpec.CH_SELECTED) {
                        x = in.levelSelectedM;
                        q = in.levelSelectedQuality;
                    } else {
                        x = in.levelM[ch];
                        q = in.levelQuality[ch];
                    }
                    break;
                case FEED_TEMP:
                    x = in.feedTempK;
                    q = in.feedTempQuality;
                    break;
                default:
                    x = in.levelDeviationM;
                    q = in.levelDeviationQuality;
                    break;
            }
            boolean usable = (q == Quality.GOOD || (q == Quality.UNCERTAIN && s.uncertainUsable())) && Double.isFinite(x);
            boolean vote;
            if (usable) {
                if (high) {
                    if (x >= sp) {
                        chState[j] = true;
                    } else if (x < sp - hyst) {
                        chState[j] = false;
                    }
                } else {
                    if (x <= sp) {
                        chState[j] = true;
                    } else if (x > sp + hyst) {
                        chState[j] = false;
                    }
                }
                vote = chState[j];
            } else {
                vote = s.badCountsAsTripped();
            }
            if (vote) {
                votes++;
            }
        }
        boolean present = s.voting().met(votes);
        if (present) {
            if (!raw[i]) {
                heldScans[i] = 0;
            } else {
                long slots = Math.max(1L, Math.round(dtS / nominalDtS));
                heldScans[i] = (int) Math.min(Integer.MAX_VALUE, heldScans[i] + slots);
            }
            double scans = Math.ceil(s.onDelayS() / nominalDtS - 1e-9);
            active[i] = heldScans[i] >= scans;
        } else {
            if (raw[i] && latched[i]) {
                log.record(tS, scan, s.tag(), EventKind.INFO, msgConditionClear[i]);
            }
            active[i] = false;
        }
        raw[i] = present;
    }

    private void applyReset(double tS, long scan) {
        log.record(tS, scan, RESET_TAG, EventKind.RESET, "reset requested");
        for (int i = 0; i < n; i++) {
            if (!latched[i]) {
                continue;
            }
            if (raw[i]) {
                log.record(tS, scan, specs[i].tag(), EventKind.RESET, "reset refused: condition present");
            } else {
                latched[i] = false;
                if (firstOut == i) {
                    firstOut = -1;
                }
            }
        }
    }

    private void annunciate(int i, double tS, long scan) {
        InterlockSpec s = specs[i];
        boolean effective;
        if (s.latch()) {
            if (active[i] && !bypassed[i]) {
                latched[i] = true;
            }
            effective = latched[i] && !bypassed[i];
        } else {
            effective = active[i] && !bypassed[i];
        }
        if (effective && !on[i]) {
            acked[i] = false;
            log.record(tS, scan, s.tag(), s.isTrip() ? EventKind.TRIP : EventKind.ALARM, msgOn[i]);
            if (s.isTrip() && firstOut < 0) {
                firstOut = i;
            }
        } else if (!effective && on[i]) {
            log.record(tS, scan, s.tag(), s.isTrip() ? EventKind.TRIP_CLEAR : EventKind.ALARM_CLEAR,
                    bypassed[i] ? msgClearBypassed[i] : msgClear[i]);
        }
        on[i] = effective;
    }

    private void writeOutputs(InterlockOutputs out) {
        out.fuelCutoff = false;
        out.feedPumpsStop = false;
        out.feedValveClose = false;
        out.alarmLal = false;
        out.alarmLah = false;
        out.tripLall = false;
        out.tripLahh = false;
        out.alarmTal = false;
        out.alarmLdah = false;
        out.anyBypassed = false;
        out.unacknowledged = false;
        for (int i = 0; i < n; i++) {
            InterlockSpec s = specs[i];
            out.anyBypassed |= bypassed[i];
            out.unacknowledged |= !acked[i];
            if (!on[i]) {
                continue;
            }
            out.fuelCutoff |= s.has(Action.FUEL_CUTOFF);
            out.feedPumpsStop |= s.has(Action.FEED_PUMPS_STOP);
            out.feedValveClose |= s.has(Action.FEED_VALVE_CLOSE);
            switch (s.annunciator()) {
                case LAL: out.alarmLal = true; break;
                case LAH: out.alarmLah = true; break;
                case LALL: out.tripLall = true; break;
                case LAHH: out.tripLahh = true; break;
                case TAL: out.alarmTal = true; break;
                case LDAH: out.alarmLdah = true; break;
                default: break;
            }
        }
        out.firstOut = firstOut;
    }

    // ---- operator actions (scan thread, between scans) ----------------------------------------

    /** Reset latched functions whose condition is clear; applied in the next evaluate. */
    public void requestReset() { pendingReset = true; }

    /**
     * Acknowledge one interlock by tag, or every one with "all"; applied and logged in the next
     * evaluate. Returns false for an unknown tag.
     */
    public boolean acknowledge(String tagOrAll) {
        if ("all".equalsIgnoreCase(tagOrAll)) {
            for (int i = 0; i < n; i++) {
                pendingAck[i] = true;
            }
            return true;
        }
        int i = indexOf(tagOrAll);
        if (i < 0) {
            return false;
        }
        pendingAck[i] = true;
        return true;
    }

    /**
     * Bypass an interlock for {@code durationS} from {@code tS}. Refused (false, see
     * {@link #lastRefusal()}) without a reason, for an unknown tag, when the interlock may not be
     * bypassed, or when the duration is not positive or longer than its bypass_max. The bypass
     * starts, with the reason in the log, in the next evaluate and ends by itself at
     * {@code tS + durationS}. A second bypass of a bypassed interlock replaces the first.
     */
    public boolean bypass(String tag, String reason, double durationS, double tS) {
        int i = indexOf(tag);
        if (i < 0) {
            lastRefusal = "unknown interlock";
            return false;
        }
        if (reason == null || reason.isBlank()) {
            lastRefusal = "a bypass needs a reason";
            return false;
        }
        InterlockSpec s = specs[i];
        if (!(s.bypassMaxS() > 0)) {
            lastRefusal = "this interlock may not be bypassed";
            return false;
        }
        if (!(durationS > 0)) {
            lastRefusal = "bypass duration must be positive";
            return false;
        }
        if (!Double.isFinite(tS)) {
            lastRefusal = "bypass start time is not a time";
            return false;
        }
        if (durationS > s.bypassMaxS() * (1 + 1e-12)) {
            lastRefusal = "bypass duration exceeds bypass_max";
            return false;
        }
        pendingBypass[i] = true;
        pendingBypassEndS[i] = tS + durationS;
        pendingReason[i] = "bypass: " + reason.strip();
        lastRefusal = "";
        return true;
    }

    /** End a bypass before it expires; logged in the next evaluate. False for an unknown tag. */
    public boolean endBypass(String tag) {
        int i = indexOf(tag);
        if (i < 0) {
            return false;
        }
        pendingBypass[i] = false;
        pendingBypassEnd[i] = true;
        return true;
    }

    /** Why the last {@link #bypass} call was refused ("" after a successful one). */
    public String lastRefusal() { return lastRefusal; }

    // ---- state (read between scans) -----------------------------------------------------------

    public int size() { return n; }

    public String tag(int i) { return specs[i].tag(); }

    public InterlockSpec spec(int i) { return specs[i]; }

    /** Index of a tag (case-insensitive), -1 when unknown. */
    public int indexOf(String tag) {
        if (tag == null) {
            return -1;
        }
        for (int i = 0; i < n; i++) {
            if (specs[i].tag().equalsIgnoreCase(tag)) {
                return i;
            }
        }
        return -1;
    }

    /** The voted condition is present (before the on-delay). */
    public boolean conditionPresent(int i) { return raw[i]; }

    /** The condition has held for the on-delay: the raw state, shown even while bypassed. */
    public boolean active(int i) { return active[i]; }

    /** Latched and waiting for its condition to clear and a reset. */
    public boolean latched(int i) { return latched[i]; }

    /** Annunciating and acting (latched or active, and not bypassed). */
    public boolean effective(int i) { return on[i]; }

    public boolean bypassed(int i) { return bypassed[i]; }

    /** When the bypass ends [s] (meaningful while bypassed). */
    public double bypassEndS(int i) { return bypassEndS[i]; }

    /** The reason logged for the current bypass. */
    public String bypassReason(int i) { return bypassReason[i]; }

    /** Nothing to acknowledge: no unacknowledged rising edge since the last acknowledgement. */
    public boolean acknowledged(int i) { return acked[i]; }

    public boolean isTrip(int i) { return specs[i].isTrip(); }

    /** First-out index, -1 when none. */
    public int firstOut() { return firstOut; }

    /** Rows of the cause-and-effect table (heading first), for printing outside the scan. */
    public List<String[]> causeEffectTable() { return cfg.causeEffectTable(); }
}
