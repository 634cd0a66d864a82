package org.drumloop.plant;

/**
 * Differential pressure of a drum-level transmitter with a cold, condensate-filled reference leg
 * (hydrostatic balance; check-values §4.1): taps {@code H} apart, saturated water to height
 * {@code h} above the lower tap, saturated steam above it, reference leg full of water at
 * {@code rhoRef}: {@code dP = g [rhoRef H - rhoL h - rhoV (H - h)]}. Reverse acting: dP falls as the
 * level rises.
 */
public final class LevelDp {
    private LevelDp() { }

    /** dP = HP - LP [Pa] for level {@code hM} above the lower tap (clamped to 0..H). */
    public static double dpPa(double tapSpanM, double hM, double rhoRef, double rhoL, double rhoV) {
        double h = Math.min(Math.max(hM, 0), tapSpanM);
        return DrumModel.G * (rhoRef * tapSpanM - rhoL * h - rhoV * (tapSpanM - h));
    }

    /** Inverse: level above the lower tap [m] from dP and the three densities. */
    public static double levelM(double tapSpanM, double dpPa, double rhoRef, double rhoL, double rhoV) {
        return (tapSpanM * (rhoRef - rhoV) - dpPa / DrumModel.G) / (rhoL - rhoV);
    }
}
