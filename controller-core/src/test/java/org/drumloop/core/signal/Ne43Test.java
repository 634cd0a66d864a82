package org.drumloop.core.signal;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.drumloop.core.io.Quality;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * NAMUR NE 43 bands: measurement 3.8-20.5 mA, failure at or below 3.6 mA and at or above 21.0 mA
 * (source: NAMUR NE 43); the bands in between are UNCERTAIN (common practice).
 */
class Ne43Test {
    @ParameterizedTest(name = "{0} mA -> {1}")
    @CsvSource({
        "3.5, BAD", "3.6, BAD", "3.61, UNCERTAIN", "3.79, UNCERTAIN", "3.8, GOOD", "4.0, GOOD",
        "12.0, GOOD", "20.0, GOOD", "20.5, GOOD", "20.51, UNCERTAIN", "20.99, UNCERTAIN", "21.0, BAD",
        "22.5, BAD", "NaN, BAD", "Infinity, BAD"})
    void bands(double mA, Quality q) {
        assertEquals(q, Ne43.classify(mA));
    }

    @ParameterizedTest(name = "{0} mA -> {1} mm")
    @CsvSource({
        // project check values, 4-20 mA scaling of a -300..+300 mm range
        "12.0, 0.0", "8.0, -150.0", "20.5, 318.75", "4.0, -300.0", "20.0, 300.0"})
    void scalingOfALevelRange(double mA, double mm) {
        // exact binary arithmetic on these values except 1e-13 rounding
        assertEquals(mm, Ne43.scale(mA, -300.0, 300.0), 1e-12);
        assertEquals(mA, Ne43.currentFor(mm, -300.0, 300.0), 1e-12);
    }
}
