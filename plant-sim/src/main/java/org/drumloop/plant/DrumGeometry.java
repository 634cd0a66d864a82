package org.drumloop.plant;

/**
 * Volume below a liquid surface and its inverse for the drum: either a horizontal cylinder
 * (circular-segment geometry, valid from the bottom to the top of the shell) or the constant
 * surface area of Åström–Bell's model ({@code level = volume / Ad}).
 */
public final class DrumGeometry {
    private final boolean cylinder;
    private final double diameterM;
    private final double lengthM;
    private final double areaM2;

    private DrumGeometry(boolean cylinder, double diameterM, double lengthM, double areaM2) {
        this.cylinder = cylinder;
        this.diameterM = diameterM;
        this.lengthM = lengthM;
        this.areaM2 = areaM2;
    }

    public static DrumGeometry cylinder(double diameterM, double lengthM) {
        return new DrumGeometry(true, diameterM, lengthM, diameterM * lengthM);
    }

    public static DrumGeometry constantArea(double areaM2, double heightM) {
        return new DrumGeometry(false, heightM, 0, areaM2);
    }

    public static DrumGeometry of(PlantConfig c) {
        if ("cylinder".equals(c.choice(PlantKey.LEVEL_GEOMETRY))) {
            return cylinder(c.drumDiameterM(), c.drumLengthM());
        }
        return constantArea(c.value(PlantKey.DRUM_SURFACE_AREA), c.drumDiameterM());
    }

    /** Height of the shell [m]. */
    public double heightM() { return diameterM; }

    /** Volume below the surface at height {@code yM} above the bottom [m3]. */
    public double volumeBelow(double yM) {
        if (!cylinder) {
            return areaM2 * yM;
        }
        double y = Math.min(Math.max(yM, 0), diameterM);
        double r = 0.5 * diameterM;
        double c = r - y;
        return lengthM * (r * r * Math.acos(c / r) - c * Math.sqrt(Math.max(0, y * (diameterM - y))));
    }

    /** Free-surface area at height {@code yM} [m2]. */
    public double surfaceArea(double yM) {
        if (!cylinder) {
            return areaM2;
        }
        double y = Math.min(Math.max(yM, 0), diameterM);
        return 2 * lengthM * Math.sqrt(y * (diameterM - y));
    }

    /** Full volume of the shell [m3] (constant-area form: area times height). */
    public double fullVolume() { return volumeBelow(diameterM); }

    /**
     * Height of the surface that encloses {@code volumeM3} below it [m], clamped to the shell (the
     * constant-area form is not clamped). {@code guessM} starts the Newton iteration.
     */
    public double heightOf(double volumeM3, double guessM) {
        if (!cylinder) {
            return volumeM3 / areaM2;
        }
        if (volumeM3 <= 0) {
            return 0;
        }
        double full = fullVolume();
        if (volumeM3 >= full) {
            return diameterM;
        }
        double lo = 0;
        double hi = diameterM;
        double y = (guessM > 0 && guessM < diameterM) ? guessM : 0.5 * diameterM;
        for (int i = 0; i < 60; i++) {
            double f = volumeBelow(y) - volumeM3;
            if (f == 0) {
                return y;
            }
            if (f > 0) {
                hi = y;
            } else {
                lo = y;
            }
            double a = surfaceArea(y);
            double next = a > 0 ? y - f / a : 0.5 * (lo + hi);
            if (!(next >= lo && next <= hi)) {
                next = 0.5 * (lo + hi);
            }
            if (Math.abs(next - y) < 1e-13 * diameterM) {
                return next;
            }
            y = next;
        }
        return y;
    }
}
