package org.drumloop.core;

/**
 * Decides the active control mode each scan from the operator's request and the state of the signals.
 *
 * <ul>
 *   <li>Not in auto: {@link Mode#MANUAL}.</li>
 *   <li>Level unusable (no usable transmitter): forced {@link Mode#MANUAL}, valve held.</li>
 *   <li>Operator asks for single-element: {@link Mode#SINGLE_ELEMENT}.</li>
 *   <li>Operator asks for three-element: three-element unless steam or feed flow is BAD (forced
 *       single-element; back to three-element once both flows have been usable for the return delay),
 *       or, with automatic selection on, the load is low: down to single-element below
 *       {@code downLoadFrac}, up again above {@code upLoadFrac} (hysteresis).</li>
 * </ul>
 * Allocation-free; the caller logs the changes it sees in {@link #active()} and the flags.
 */
public final class ModeSelector {
    private final boolean autoSelect;
    private final double upLoadFrac;
    private final double downLoadFrac;
    private final double returnDelayS;

    private Mode active = Mode.MANUAL;
    private boolean lowLoad = true;
    private boolean flowsForced;
    private boolean levelForced;
    private double flowsGoodForS;

    /**
     * @param autoSelect    change between single- and three-element on load
     * @param upLoadFrac    load (steam flow / rated) above which three-element is taken
     * @param downLoadFrac  load below which single-element is taken (below upLoadFrac)
     * @param returnDelayS  how long both flows must be usable before a forced single-element ends [s]
     */
    public ModeSelector(boolean autoSelect, double upLoadFrac, double downLoadFrac, double returnDelayS) {
        if (!(downLoadFrac < upLoadFrac) || !(returnDelayS >= 0.0)) {
            throw new IllegalArgumentException("load thresholds must be ordered and the delay non-negative");
        }
        this.autoSelect = autoSelect;
        this.upLoadFrac = upLoadFrac;
        this.downLoadFrac = downLoadFrac;
        this.returnDelayS = returnDelayS;
    }

    /**
     * @param auto         operator's auto/manual
     * @param requested    operator's strategy (SINGLE_ELEMENT or THREE_ELEMENT; MANUAL means not auto)
     * @param levelUsable  the selected level is usable
     * @param flowsUsable  both steam and feed flow are usable
     * @param loadFrac     steam flow / rated steam flow
     * @return the active mode
     */
    public Mode select(boolean auto, Mode requested, boolean levelUsable, boolean flowsUsable,
                       double loadFrac, double dtS) {
        if (flowsUsable) {
            flowsGoodForS += dtS;
            if (flowsForced && flowsGoodForS >= returnDelayS) {
                flowsForced = false;
            }
        } else {
            flowsGoodForS = 0.0;
            flowsForced = true;
        }
        if (flowsUsable && Double.isFinite(loadFrac)) {
            if (lowLoad && loadFrac > upLoadFrac) {
                lowLoad = false;
            } else if (!lowLoad && loadFrac < downLoadFrac) {
                lowLoad = true;
            }
        }
        levelForced = !levelUsable;
        Mode m;
        if (!auto || requested == Mode.MANUAL || levelForced) {
            m = Mode.MANUAL;
        } else if (requested == Mode.SINGLE_ELEMENT || flowsForced || (autoSelect && lowLoad)) {
            m = Mode.SINGLE_ELEMENT;
        } else {
            m = Mode.THREE_ELEMENT;
        }
        active = m;
        return m;
    }

    public Mode active() { return active; }

    /** Three-element is blocked because a flow signal is (or was until recently) BAD. */
    public boolean flowsForced() { return flowsForced; }

    /** Manual is forced because no level transmitter is usable. */
    public boolean levelForced() { return levelForced; }

    /** Load is in the low band (single-element when automatic selection is on). */
    public boolean lowLoad() { return lowLoad; }

    public boolean autoSelect() { return autoSelect; }
}
