package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** Horizontal-cylinder segment geometry (circular segment area, closed form). */
class DrumGeometryTest {
    private static final double D = 1.2;
    private static final double L = 3.5;
    private final DrumGeometry g = DrumGeometry.cylinder(D, L);

    @Test
    void halfFullHoldsHalfTheCylinderAndTheWidestSurface() {
        // pi D^2 L / 8 and D L (circle geometry); round-off only
        assertEquals(Math.PI * D * D * L / 8, g.volumeBelow(D / 2), 1e-12);
        assertEquals(D * L, g.surfaceArea(D / 2), 1e-12);
        assertEquals(Math.PI * D * D * L / 4, g.fullVolume(), 1e-12);
    }

    @Test
    void quarterHeightMatchesTheSegmentFormula() {
        // segment of height R/2: area = R^2 (pi/3 - sqrt(3)/4) (circle geometry)
        double r = D / 2;
        assertEquals(L * r * r * (Math.PI / 3 - Math.sqrt(3) / 4), g.volumeBelow(r / 2), 1e-12);
    }

    @Test
    void inverseReturnsTheHeight() {
        for (double y = 0.01; y < D; y += 0.0997) {
            assertEquals(y, g.heightOf(g.volumeBelow(y), D / 2), 1e-9, "y = " + y);
        }
        assertEquals(0, g.heightOf(-1, 0.5), 0.0, "clamped at the bottom");
        assertEquals(D, g.heightOf(10, 0.5), 0.0, "clamped at the top");
    }

    @Test
    void surfaceAreaIsTheDerivativeOfVolume() {
        double y = 0.8;
        double h = 1e-6;
        double fd = (g.volumeBelow(y + h) - g.volumeBelow(y - h)) / (2 * h);
        assertEquals(fd, g.surfaceArea(y), 1e-6 * fd);
    }
}
