package org.drumloop.core.signal;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.junit.jupiter.api.Test;

/** Validation of one analogue input: NE 43 on the loop current, staleness, spikes, held value while BAD. */
class AnalogInputTest {
    static final double DT_S = 0.1;
    /** A 0-16 bar(a) pressure transmitter, 2 bar/s credible rate, 1 s stale limit (invented demo data). */
    static final AnalogCal CAL = new AnalogCal(0.0, 16e5, 2e5, 1.0);

    @Test
    void aLoopCurrentIsScaledAndClassified() {
        ProcessImage in = new ProcessImage();
        AnalogInput a = new AnalogInput(Signal.DRUM_PRESSURE, CAL);
        in.setCurrentMa(Signal.DRUM_PRESSURE, 12.0, Quality.GOOD, 0.0);
        a.update(in, 0.0, DT_S);
        // 12 mA is mid-range: 8 bar (linear scaling, NE 43 4-20 mA)
        assertEquals(8e5, a.valueSi(), 1e-9);
        assertEquals(Quality.GOOD, a.quality());
        in.setCurrentMa(Signal.DRUM_PRESSURE, 3.5, Quality.GOOD, 0.1);
        a.update(in, 0.1, DT_S);
        assertEquals(Quality.BAD, a.quality(), "NE 43 failure current");
        assertEquals(8e5, a.valueSi(), 1e-9, "last usable value held");
        in.setCurrentMa(Signal.DRUM_PRESSURE, 12.0, Quality.GOOD, 0.2);
        a.update(in, 0.2, DT_S);
        assertEquals(Quality.GOOD, a.quality(), "recovers at once: the chain restarts after a failure");
    }

    @Test
    void anEngineeringValueGetsTheEquivalentNe43Bands() {
        ProcessImage in = new ProcessImage();
        AnalogInput a = new AnalogInput(Signal.DRUM_PRESSURE, CAL);
        // 20.75 mA equivalent: 16 bar * 16.75/16 = 16.75 bar -> UNCERTAIN band (20.5-21.0 mA)
        in.set(Signal.DRUM_PRESSURE, 16.75e5, Quality.GOOD, 0.0);
        a.update(in, 0.0, DT_S);
        assertEquals(Quality.UNCERTAIN, a.quality());
        in.set(Signal.DRUM_PRESSURE, Double.NaN, Quality.GOOD, 0.1);
        a.update(in, 0.1, DT_S);
        assertEquals(Quality.BAD, a.quality());
    }

    @Test
    void aStaleInputIsBad() {
        ProcessImage in = new ProcessImage();
        AnalogInput a = new AnalogInput(Signal.DRUM_PRESSURE, CAL);
        in.set(Signal.DRUM_PRESSURE, 9e5, Quality.GOOD, 0.0);
        a.update(in, 1.0, DT_S);
        assertEquals(Quality.GOOD, a.quality(), "exactly 1 s old is still fresh");
        a.update(in, 1.1, DT_S);
        assertEquals(Quality.BAD, a.quality());
    }

    @Test
    void aOneScanSpikeIsRejectedAndALastingStepAcceptedNextScan() {
        ProcessImage in = new ProcessImage();
        AnalogInput a = new AnalogInput(Signal.DRUM_PRESSURE, CAL);
        in.set(Signal.DRUM_PRESSURE, 9e5, Quality.GOOD, 0.0);
        a.update(in, 0.0, DT_S);
        in.set(Signal.DRUM_PRESSURE, 9.1e5, Quality.GOOD, 0.1); // 1 bar/s: credible
        a.update(in, 0.1, DT_S);
        assertEquals(Quality.GOOD, a.quality());
        in.set(Signal.DRUM_PRESSURE, 12e5, Quality.GOOD, 0.2); // 29 bar/s: a spike
        a.update(in, 0.2, DT_S);
        assertEquals(Quality.BAD, a.quality());
        assertEquals(9.1e5, a.valueSi(), 1e-9);
        a.update(in, 0.3, DT_S); // the new value stays: accepted
        assertEquals(Quality.GOOD, a.quality());
        assertEquals(12e5, a.valueSi(), 1e-9);
    }
}
