package org.drumloop.plant.water;

/**
 * Saturated water and steam at one pressure, with the pressure derivatives the drum model
 * needs. A mutable holder: the caller allocates one and lets {@link SaturationTable#lookup}
 * (or {@link SaturationTable#direct}) overwrite it on every call, so the hot path allocates
 * nothing. Suffix W is the saturated liquid (water), suffix S the saturated vapour (steam).
 */
public final class SaturationState {
    /** Pressure the state was evaluated at, Pa. */
    public double pPa;
    /** Saturation temperature, K. */
    public double tsK;
    /** Saturated liquid density, kg/m3. */
    public double rhoW;
    /** Saturated vapour density, kg/m3. */
    public double rhoS;
    /** Saturated liquid specific enthalpy, J/kg. */
    public double hW;
    /** Saturated vapour specific enthalpy, J/kg. */
    public double hS;
    /** dTs/dp, K/Pa. */
    public double dTsDp;
    /** d(rhoW)/dp, kg/m3 per Pa. */
    public double dRhoWDp;
    /** d(rhoS)/dp, kg/m3 per Pa. */
    public double dRhoSDp;
    /** d(hW)/dp, J/kg per Pa. */
    public double dHWDp;
    /** d(hS)/dp, J/kg per Pa. */
    public double dHSDp;

    /** Latent heat of evaporation hS - hW, J/kg. */
    public double latentHeat() {
        return hS - hW;
    }

    /** Copies every field of {@code other} into this holder. */
    public void set(SaturationState other) {
        pPa = other.pPa;
        tsK = other.tsK;
        rhoW = other.rhoW;
        rhoS = other.rhoS;
        hW = other.hW;
        hS = other.hS;
        dTsDp = other.dTsDp;
        dRhoWDp = other.dRhoWDp;
        dRhoSDp = other.dRhoSDp;
        dHWDp = other.dHWDp;
        dHSDp = other.dHSDp;
    }

    @Override
    public String toString() {
        return "SaturationState[pPa=" + pPa + ", tsK=" + tsK + ", rhoW=" + rhoW + ", rhoS=" + rhoS
                + ", hW=" + hW + ", hS=" + hS + ", dTsDp=" + dTsDp + ", dRhoWDp=" + dRhoWDp
                + ", dRhoSDp=" + dRhoSDp + ", dHWDp=" + dHWDp + ", dHSDp=" + dHSDp + "]";
    }
}
