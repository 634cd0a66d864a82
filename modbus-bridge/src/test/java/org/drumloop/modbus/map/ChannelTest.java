package org.drumloop.modbus.map;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.drumloop.core.io.EngUnit;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** A channel's scaling into the image and its NAMUR NE 43 fault detection. */
class ChannelTest {
    private static final double EXACT_TOL = 1e-9;

    private static Channel loop() {
        // int16 0..27648 = 4..20 mA, NE 43 thresholds 3.6 / 21.0 mA (the map's defaults for mA)
        return new Channel(Signal.LEVEL_DP_A, Table.INPUT_REGISTER, 1, 0, DataType.INT16, null, 0, 27648, 4, 20,
                EngUnit.MA, false, Channel.NE43_FAIL_LOW_MA, Channel.NE43_FAIL_HIGH_MA, 1.0, "", 1);
    }

    @ParameterizedTest
    @CsvSource({
        // mA, quality; source: NAMUR NE 43 as summarised in the check values: 3.8..20.5 mA carries
        // measurement, <= 3.6 or >= 21.0 mA is a failure; the bands between are uncertain (common practice)
        "4.0, GOOD", "12.0, GOOD", "20.0, GOOD", "3.8, GOOD", "20.5, GOOD",
        "3.7, UNCERTAIN", "20.8, UNCERTAIN",
        "3.6, BAD", "3.5, BAD", "21.0, BAD", "22.0, BAD", "0.0, BAD",
    })
    void namurNe43Classification(double mA, Quality expected) {
        assertEquals(expected, loop().classify(mA));
    }

    @Test
    void aNonFiniteValueIsBad() {
        assertEquals(Quality.BAD, loop().classify(Double.NaN));
    }

    @Test
    void aLoopCurrentGoesIntoTheImageAsCurrent() {
        Channel c = loop();
        int[] regs = {13824};
        double mA = c.engFromRegisters(regs, 0);
        // 13824 counts = N/2 of 27648 -> 12 mA (check values §3 headroom convention)
        assertEquals(12.0, mA, EXACT_TOL);
        ProcessImage img = new ProcessImage();
        c.toImage(mA, img, Quality.GOOD, 5.0);
        assertEquals(12.0, img.currentMa(Signal.LEVEL_DP_A), EXACT_TOL);
        assertEquals(Quality.GOOD, img.quality(Signal.LEVEL_DP_A));
        assertEquals(12.0, c.engFromImage(img), EXACT_TOL);
    }

    @Test
    void anEngineeringValueGoesIntoTheImageInSi() {
        // 8 barg = 8e5 + 101325 Pa absolute (ISO 2533 standard atmosphere, as in EngUnit)
        Channel c = new Channel(Signal.DRUM_PRESSURE, Table.INPUT_REGISTER, 1, 0, DataType.UINT16, null, 0, 20000,
                0, 20, EngUnit.BARG, false, Double.NaN, Double.NaN, 1.0, "", 1);
        int[] regs = {8000};
        ProcessImage img = new ProcessImage();
        c.toImage(c.engFromRegisters(regs, 0), img, Quality.GOOD, 0.0);
        assertEquals(901_325.0, img.value(Signal.DRUM_PRESSURE), 1e-6);
        assertEquals(8.0, c.engFromImage(img), EXACT_TOL);
    }
}
