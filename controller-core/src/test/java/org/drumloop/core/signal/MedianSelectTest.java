package org.drumloop.core.signal;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.drumloop.core.io.Quality;
import org.junit.jupiter.api.Test;

/** Median-of-three selection (common practice for drum level; that ANSI/ISA-77.42.01 names median selection is from memory). */
class MedianSelectTest {
    static final Quality G = Quality.GOOD;
    static final Quality U = Quality.UNCERTAIN;
    static final Quality B = Quality.BAD;

    @Test
    void threeGoodInputsGiveTheMedianAndTheSpread() {
        MedianSelect m = new MedianSelect();
        m.select(0.010, G, -0.020, G, 0.030, G);
        assertEquals(0.010, m.valueM(), 0.0);
        assertEquals(G, m.quality());
        assertEquals(0.050, m.deviationM(), 1e-15);
        // a single wild transmitter cannot move the selection
        m.select(0.010, G, 0.500, G, 0.012, G);
        assertEquals(0.012, m.valueM(), 0.0);
    }

    @Test
    void oneBadInputAveragesTheOtherTwo() {
        MedianSelect m = new MedianSelect();
        m.select(0.010, G, 9.0, B, 0.030, G);
        assertEquals(0.020, m.valueM(), 1e-15);
        assertEquals(U, m.quality());
        assertEquals(0.020, m.deviationM(), 1e-15);
        assertEquals(2, m.usable());
    }

    @Test
    void oneUsableInputIsUsedAsUncertainAndNoneHoldsTheLastValueAsBad() {
        MedianSelect m = new MedianSelect();
        m.select(0.010, B, 0.040, U, 0.030, B);
        assertEquals(0.040, m.valueM(), 0.0);
        assertEquals(U, m.quality());
        assertEquals(B, m.deviationQuality());
        m.select(1.0, B, 2.0, B, 3.0, B);
        assertEquals(0.040, m.valueM(), 0.0);
        assertEquals(B, m.quality());
    }

    @Test
    void theMedianCarriesItsOwnQuality() {
        MedianSelect m = new MedianSelect();
        m.select(0.010, G, 0.020, U, 0.030, G);
        assertEquals(0.020, m.valueM(), 0.0);
        assertEquals(U, m.quality());
    }
}
