package org.drumloop.core.safety;

import java.util.Arrays;
import java.util.Objects;

/**
 * One alarm or trip, immutable: what it watches, how it votes, when it acts and what it does.
 * Values are SI (level in m relative to NWL, temperature in K, time in s); the text the user wrote
 * is kept for tables and messages.
 *
 * <p>Level channels are numbered {@link #CH_A}, {@link #CH_B}, {@link #CH_C} (the three
 * transmitters) and {@link #CH_SELECTED} (the firmware's median-selected level). Feed temperature
 * and level deviation have a single channel.
 */
public final class InterlockSpec {
    /** Alarm (annunciates; latches only when configured) or trip (always latches until reset). */
    public enum Kind { ALARM, TRIP }

    /** The process variable watched. */
    public enum Variable {
        LEVEL("level", "m"), FEED_TEMP("feed_temp", "K"), LEVEL_DEVIATION("level_deviation", "m");

        private final String text;
        private final String siUnit;

        Variable(String text, String siUnit) {
            this.text = text;
            this.siUnit = siUnit;
        }

        public String text() { return text; }

        public String siUnit() { return siUnit; }

        public static Variable byText(String s) {
            for (Variable v : values()) {
                if (v.text.equals(s)) {
                    return v;
                }
            }
            return null;
        }
    }

    /** Acts when the variable falls to the setpoint (LOW) or rises to it (HIGH). */
    public enum Direction { LOW, HIGH }

    public static final int CH_A = 0;
    public static final int CH_B = 1;
    public static final int CH_C = 2;
    public static final int CH_SELECTED = 3;

    private final String tag;
    private final int line;
    private final String description;
    private final Kind kind;
    private final Variable variable;
    private final int[] channels;
    private final Voting voting;
    private final Direction direction;
    private final double setpointSi;
    private final double hysteresisSi;
    private final double onDelayS;
    private final boolean badCountsAsTripped;
    private final boolean uncertainUsable;
    private final boolean latch;
    private final boolean[] actions;
    private final double bypassMaxS;
    private final Annunciator annunciator;
    private final String setpointText;
    private final String hysteresisText;

    /**
     * @param tag                short unique name (e.g. "LALL")
     * @param line               line in the file where the block starts (0 when built in code)
     * @param description        free text for tables (may be empty)
     * @param channels           channel numbers (see class comment); length must equal the voting's N
     * @param setpointSi         setpoint [m or K]
     * @param hysteresisSi       deadband for clearing, non-negative [m or K]
     * @param onDelayS           the condition must hold this long before the function acts [s], non-negative
     * @param badCountsAsTripped an unusable channel votes tripped (true) or healthy (false)
     * @param uncertainUsable    an UNCERTAIN channel is used as measured (true) or treated as unusable (false)
     * @param latch              stays on until the condition has cleared and a reset is applied
     * @param actions            actions demanded while effective
     * @param bypassMaxS         longest bypass allowed [s]; 0 forbids bypassing
     * @param setpointText       the setpoint as written, with unit (for tables)
     * @param hysteresisText     the hysteresis as written, with unit (for tables)
     */
    public InterlockSpec(String tag, int line, String description, Kind kind, Variable variable, int[] channels,
            Voting voting, Direction direction, double setpointSi, double hysteresisSi, double onDelayS,
            boolean badCountsAsTripped, boolean uncertainUsable, boolean latch, Action[] actions, double bypassMaxS,
            Annunciator annunciator, String setpointText, String hysteresisText) {
        this.tag = Objects.requireNonNull(tag, "tag");
        this.line = line;
        this.description = description == null ? "" : description;
        this.kind = Objects.requireNonNull(kind, "kind");
        this.variable = Objects.requireNonNull(variable, "variable");
        this.channels = channels.clone();
        this.voting = Objects.requireNonNull(voting, "voting");
        this.direction = Objects.requireNonNull(direction, "direction");
        this.setpointSi = setpointSi;
        this.hysteresisSi = hysteresisSi;
        this.onDelayS = onDelayS;
        this.badCountsAsTripped = badCountsAsTripped;
        this.uncertainUsable = uncertainUsable;
        this.latch = latch;
        this.actions = new boolean[Action.values().length];
        for (Action a : actions) {
            this.actions[a.ordinal()] = true;
        }
        this.bypassMaxS = bypassMaxS;
        this.annunciator = annunciator == null ? Annunciator.NONE : annunciator;
        this.setpointText = setpointText == null ? Double.toString(setpointSi) : setpointText;
        this.hysteresisText = hysteresisText == null ? Double.toString(hysteresisSi) : hysteresisText;
        if (tag.isEmpty()) {
            throw new IllegalArgumentException("empty tag");
        }
        if (this.channels.length != voting.channels()) {
            throw new IllegalArgumentException(tag + ": " + voting.text() + " needs " + voting.channels()
                    + " channels, got " + this.channels.length);
        }
        int maxChannel = variable == Variable.LEVEL ? CH_SELECTED : 0;
        for (int c : this.channels) {
            if (c < 0 || c > maxChannel) {
                throw new IllegalArgumentException(tag + ": channel " + c + " does not exist for " + variable.text());
            }
        }
        if (!Double.isFinite(setpointSi) || !(hysteresisSi >= 0) || !Double.isFinite(hysteresisSi)
                || !(onDelayS >= 0) || !Double.isFinite(onDelayS) || !(bypassMaxS >= 0) || !Double.isFinite(bypassMaxS)) {
            throw new IllegalArgumentException(tag + ": setpoint, hysteresis, delay and bypass_max must be finite; "
                    + "hysteresis, delay and bypass_max non-negative");
        }
        if (kind == Kind.TRIP && !latch) {
            throw new IllegalArgumentException(tag + ": a trip always latches");
        }
    }

    public String tag() { return tag; }

    public int line() { return line; }

    public String description() { return description; }

    public Kind kind() { return kind; }

    public boolean isTrip() { return kind == Kind.TRIP; }

    public Variable variable() { return variable; }

    /** Number of channels voted over. */
    public int channelCount() { return channels.length; }

    /** Channel number of the i-th voted channel. */
    public int channel(int i) { return channels[i]; }

    public Voting voting() { return voting; }

    public Direction direction() { return direction; }

    public double setpointSi() { return setpointSi; }

    public double hysteresisSi() { return hysteresisSi; }

    public double onDelayS() { return onDelayS; }

    public boolean badCountsAsTripped() { return badCountsAsTripped; }

    public boolean uncertainUsable() { return uncertainUsable; }

    public boolean latch() { return latch; }

    public boolean has(Action a) { return actions[a.ordinal()]; }

    public double bypassMaxS() { return bypassMaxS; }

    public Annunciator annunciator() { return annunciator; }

    public String setpointText() { return setpointText; }

    public String hysteresisText() { return hysteresisText; }

    /** Channel names as written in files ("a b c", "selected"). */
    public String channelsText() {
        StringBuilder sb = new StringBuilder();
        for (int c : channels) {
            if (sb.length() > 0) {
                sb.append(' ');
            }
            sb.append(channelName(variable, c));
        }
        return sb.toString();
    }

    /** Name of a channel number in files. */
    public static String channelName(Variable v, int c) {
        if (v != Variable.LEVEL) {
            return v.text();
        }
        switch (c) {
            case CH_A: return "a";
            case CH_B: return "b";
            case CH_C: return "c";
            default: return "selected";
        }
    }

    @Override
    public String toString() {
        return tag + " " + kind + " " + variable.text() + " " + direction + " " + setpointText + " "
                + voting.text() + " [" + channelsText() + "] delay " + onDelayS + " s actions "
                + Arrays.toString(actions);
    }
}
