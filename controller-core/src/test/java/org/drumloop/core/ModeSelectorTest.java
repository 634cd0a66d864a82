package org.drumloop.core;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Mode selection: load hysteresis between single- and three-element, forced modes on bad signals.
 * Single-element at low load and start-up, three-element above a load threshold, and single-element
 * forced when a flow signal is lost follow ANSI/ISA-77.42.01 drum feedwater practice (from memory,
 * content not checked against the text); the thresholds are this project's tuning-file values.
 */
class ModeSelectorTest {
    static final double H_S = 0.1;

    @Test
    void loadSelectionHasHysteresis() {
        ModeSelector s = new ModeSelector(true, 0.30, 0.20, 5.0);
        double[] load = {0.10, 0.25, 0.31, 0.25, 0.21, 0.19, 0.25, 0.31};
        Mode[] want = {Mode.SINGLE_ELEMENT, Mode.SINGLE_ELEMENT, Mode.THREE_ELEMENT, Mode.THREE_ELEMENT,
            Mode.THREE_ELEMENT, Mode.SINGLE_ELEMENT, Mode.SINGLE_ELEMENT, Mode.THREE_ELEMENT};
        for (int i = 0; i < load.length; i++) {
            assertEquals(want[i], s.select(true, Mode.THREE_ELEMENT, true, true, load[i], H_S), "load " + load[i]);
        }
    }

    @Test
    void aBadFlowForcesSingleElementUntilFlowsHaveBeenGoodForTheDelay() {
        ModeSelector s = new ModeSelector(false, 0.30, 0.20, 1.0);
        assertEquals(Mode.THREE_ELEMENT, s.select(true, Mode.THREE_ELEMENT, true, true, 0.5, H_S));
        assertEquals(Mode.SINGLE_ELEMENT, s.select(true, Mode.THREE_ELEMENT, true, false, 0.5, H_S));
        int scans = 0;
        while (s.select(true, Mode.THREE_ELEMENT, true, true, 0.5, H_S) == Mode.SINGLE_ELEMENT) {
            scans++;
        }
        // 1.0 s of good flows at 0.1 s per scan: released on the 10th good scan (floating sum of
        // ten 0.1 s steps reaches 0.9999999999999999 < 1.0, so the 11th) - within one scan
        assertEquals(10, scans, 1);
    }

    @Test
    void noUsableLevelForcesManual() {
        ModeSelector s = new ModeSelector(false, 0.30, 0.20, 1.0);
        assertEquals(Mode.MANUAL, s.select(true, Mode.THREE_ELEMENT, false, true, 0.5, H_S));
        assertEquals(Mode.MANUAL, s.select(false, Mode.THREE_ELEMENT, true, true, 0.5, H_S));
        assertEquals(Mode.SINGLE_ELEMENT, s.select(true, Mode.SINGLE_ELEMENT, true, true, 0.5, H_S));
    }
}
