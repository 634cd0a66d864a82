package org.drumloop.core.signal;

/**
 * Density (pressure) compensation of a differential-pressure drum level transmitter with a cold,
 * condensate-filled reference leg.
 *
 * <p>Hydrostatic balance with the lower tapping at height 0 and the upper at H, reference leg full of
 * water at {@code Tref} and drum pressure, saturated water of density rho_l to height h and saturated
 * steam rho_v above it:
 * <pre>
 *   dP = g [rho_ref H - rho_l h - rho_v (H - h)]   =>   h = [H (rho_ref - rho_v) - dP/g] / (rho_l - rho_v)
 * </pre>
 * (source: hydrostatic balance; the same form is given in boiler instrumentation texts). The result is
 * returned relative to the normal water level (NWL). g = 9.80665 m/s2 (standard gravity, CGPM).
 * Densities come from the firmware's own {@link SteamTables} at the measured drum pressure.
 */
public final class LevelCompensator {
    /** Standard gravity [m/s2] (source: CGPM 1901 definition). */
    public static final double G_M_S2 = 9.80665;

    private final double tapSpanM;
    private final double nwlAboveLowerTapM;
    private final double refLegTempK;
    private double cachedPressurePa = Double.NaN;
    private double rhoL;
    private double rhoV;
    private double rhoRef;

    /**
     * @param tapSpanM           vertical distance H between the tappings [m] (positive)
     * @param nwlAboveLowerTapM  height of the normal water level above the lower tapping [m]
     * @param refLegTempK        temperature of the reference leg water [K]
     */
    public LevelCompensator(double tapSpanM, double nwlAboveLowerTapM, double refLegTempK) {
        if (!(tapSpanM > 0.0)) {
            throw new IllegalArgumentException("tap span must be positive");
        }
        this.tapSpanM = tapSpanM;
        this.nwlAboveLowerTapM = nwlAboveLowerTapM;
        this.refLegTempK = refLegTempK;
    }

    /** Height above the lower tapping [m] for the given densities (the bare formula). */
    public static double heightM(double dpPa, double tapSpanM, double rhoRef, double rhoL, double rhoV) {
        return (tapSpanM * (rhoRef - rhoV) - dpPa / G_M_S2) / (rhoL - rhoV);
    }

    /** Differential pressure [Pa] the transmitter sees at height {@code hM} above the lower tap (forward formula). */
    public static double dpPa(double hM, double tapSpanM, double rhoRef, double rhoL, double rhoV) {
        return G_M_S2 * (rhoRef * tapSpanM - rhoL * hM - rhoV * (tapSpanM - hM));
    }

    /** Compensated level relative to NWL [m] from the transmitter dp [Pa] and the drum pressure [Pa abs]. */
    public double levelM(double dpPa, double drumPressurePa) {
        setPressure(drumPressurePa);
        return levelM(dpPa);
    }

    /**
     * Look the densities up for a drum pressure [Pa abs] once, for several transmitters in the same
     * scan ({@link #levelM(double)}); a repeated pressure costs nothing.
     */
    public void setPressure(double drumPressurePa) {
        if (drumPressurePa != cachedPressurePa) {
            rhoL = SteamTables.saturatedLiquidDensity(drumPressurePa);
            rhoV = SteamTables.saturatedVapourDensity(drumPressurePa);
            rhoRef = SteamTables.liquidDensity(refLegTempK, drumPressurePa);
            cachedPressurePa = drumPressurePa;
        }
    }

    /** Compensated level relative to NWL [m] at the pressure of the last {@link #setPressure}. */
    public double levelM(double dpPa) {
        return heightM(dpPa, tapSpanM, rhoRef, rhoL, rhoV) - nwlAboveLowerTapM;
    }

    /** Saturated vapour density [kg/m3] at the pressure of the last {@link #setPressure}. */
    public double vapourDensity() { return rhoV; }

    public double tapSpanM() { return tapSpanM; }

    public double nwlAboveLowerTapM() { return nwlAboveLowerTapM; }

    public double refLegTempK() { return refLegTempK; }
}
