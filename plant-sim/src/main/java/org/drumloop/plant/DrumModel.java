package org.drumloop.plant;

import org.drumloop.plant.water.SaturationState;
import org.drumloop.plant.water.SaturationTable;

/**
 * The Åström–Bell drum-boiler model (K.J. Åström, R.D. Bell, "Drum-boiler dynamics", Automatica
 * 36 (2000) 363–378), as restated in the project's model reference §2–§8: four states
 * {@code y = [Vwt, p, ar, Vsd]} (total water volume [m3], drum pressure [Pa], riser-outlet steam
 * quality [-], steam volume under the drum surface [m3]).
 *
 * <p>Inputs are public fields held constant over an integration step: feed flow and enthalpy, heat
 * to the risers, a tube leak, and a steam flow {@code qsFixedKgS + qsPerPa * p} (a fixed flow, a
 * choked valve, or both). The derivative function never changes its inputs and allocates nothing.
 */
public final class DrumModel implements Rk4.Ode {
    /** Standard gravity [m/s2] (CGPM 1901). */
    public static final double G = 9.80665;
    /** Lowest quality used in the equations (guard, model reference §8). */
    public static final double MIN_QUALITY = 1e-6;

    // parameters (SI)
    public final double vdM3;
    public final double vrM3;
    public final double vdcM3;
    public final double vtM3;
    public final double adcM2;
    public final double mtKg;
    public final double mrKg;
    public final double mdKg;
    public final double cpJKgK;
    public final double kFriction;
    public final double beta;
    public final double tdS;
    /** Gravity in the loop momentum balance [m/s2]. */
    public final double gravity;
    /** Bubble volume the drum would hold without condensation [m3]; set by the steady state. */
    public double vsd0M3;

    // inputs, held over a step
    public double qfKgS;
    public double hfJKg;
    public double heatW;
    public double qsFixedKgS;
    public double qsPerPa;
    public double qLeakKgS;

    // results of the last derivative evaluation
    public double avOut;
    public double qdcOut;
    public double qrOut;
    public double qsdOut;
    public double qcdOut;
    public double vwdOut;
    public double qsOut;
    public double hsOut;
    public double hwOut;

    private final SaturationTable table;
    private final double pMinPa;
    private final double pMaxPa;
    /** Saturation state at the pressure of the last derivative evaluation. */
    public final SaturationState sat = new SaturationState();

    public DrumModel(double vdM3, double vrM3, double vdcM3, double adcM2, double mtKg, double mrKg,
                     double mdKg, double cpJKgK, double kFriction, double beta, double tdS,
                     double gravity, SaturationTable table) {
        this.vdM3 = vdM3;
        this.vrM3 = vrM3;
        this.vdcM3 = vdcM3;
        this.vtM3 = vdM3 + vrM3 + vdcM3;
        this.adcM2 = adcM2;
        this.mtKg = mtKg;
        this.mrKg = mrKg;
        this.mdKg = mdKg;
        this.cpJKgK = cpJKgK;
        this.kFriction = kFriction;
        this.beta = beta;
        this.tdS = tdS;
        this.gravity = gravity;
        this.table = table;
        this.pMinPa = table.pMinPa();
        this.pMaxPa = table.pMaxPa();
    }

    public static DrumModel of(PlantConfig c, SaturationTable table) {
        return new DrumModel(c.value(PlantKey.DRUM_VOLUME), c.value(PlantKey.RISER_VOLUME),
                c.value(PlantKey.DOWNCOMER_VOLUME), c.value(PlantKey.DOWNCOMER_AREA),
                c.value(PlantKey.TOTAL_METAL_MASS), c.value(PlantKey.RISER_METAL_MASS),
                c.value(PlantKey.DRUM_METAL_MASS), c.value(PlantKey.METAL_SPECIFIC_HEAT),
                c.value(PlantKey.LOOP_FRICTION), c.value(PlantKey.BUBBLE_FACTOR),
                c.value(PlantKey.BUBBLE_RESIDENCE_TIME), c.value(PlantKey.GRAVITY), table);
    }

    /** Downcomer (circulation) flow from the quasi-static loop momentum balance, §4.4 [kg/s]. */
    public double downcomerFlow(double rw, double rs, double av) {
        return Math.sqrt(2 * rw * adcM2 * (rw - rs) * gravity * av * vrM3 / kFriction);
    }

    @Override
    public void computeDerivatives(double tS, double[] y, double[] yDot) {
        double p = Math.min(Math.max(y[1], pMinPa), pMaxPa);
        table.lookup(p, sat);
        final double rw = sat.rhoW;
        final double rs = sat.rhoS;
        final double hw = sat.hW;
        final double hs = sat.hS;
        final double hc = hs - hw;
        final double drw = sat.dRhoWDp;
        final double drs = sat.dRhoSDp;
        final double dhw = sat.dHWDp;
        final double dhs = sat.dHSDp;
        final double dts = sat.dTsDp;
        final double vwt = y[0];
        final double ar = Math.max(y[2], MIN_QUALITY);
        final double vsd = Math.max(y[3], 0);
        final double vst = vtM3 - vwt;
        final double mcp = cpJKgK;

        // void fraction and its partials (§4.5), one logarithm for all three
        final double av;
        final double davDar;
        final double cFactor;
        final double eta = ar * (rw - rs) / rs;
        if (eta < VoidFraction.SERIES_ETA) {
            av = VoidFraction.av(ar, rw, rs);
            davDar = VoidFraction.dAvDar(ar, rw, rs);
            cFactor = VoidFraction.c(ar, rw, rs);
        } else {
            final double lg = Math.log1p(eta);
            av = rw / (rw - rs) * (1 - lg / eta);
            davDar = rw / (rs * eta) * (lg / eta - 1 / (1 + eta));
            cFactor = 1 + rw / (rs * (1 + eta)) - (rs + rw) / (rs * eta) * lg;
        }
        final double davDp = (rw * drs - rs * drw) * cFactor / ((rw - rs) * (rw - rs));
        final double qdc = downcomerFlow(rw, rs, av);
        final double qs = qsFixedKgS + qsPerPa * p;
        final double qf = qfKgS;
        final double hf = hfJKg;
        final double q = heatW;

        // 4.1 global mass and energy balances: 2x2 system for dVwt, dp
        final double e11 = rw - rs;
        final double e12 = vst * drs + vwt * drw;
        final double e21 = rw * hw - rs * hs;
        final double e22 = vst * (hs * drs + rs * dhs) + vwt * (hw * drw + rw * dhw) - vtM3 + mtKg * mcp * dts;
        final double b1 = qf - qs - qLeakKgS;
        final double b2 = q + qf * hf - qs * hs - qLeakKgS * hw;
        final double det = e11 * e22 - e12 * e21;
        final double dvwt = (b1 * e22 - e12 * b2) / det;
        final double dp = (e11 * b2 - e21 * b1) / det;

        // 4.2 risers
        final double e32 = (rw * dhw - ar * hc * drw) * (1 - av) * vrM3
                + ((1 - ar) * hc * drs + rs * dhs) * av * vrM3
                + (rs + (rw - rs) * ar) * hc * vrM3 * davDp - vrM3 + mrKg * mcp * dts;
        final double e33 = ((1 - ar) * rs + ar * rw) * hc * vrM3 * davDar;
        final double dar = (q - ar * hc * qdc - e32 * dp) / e33;

        // 4.3 steam under the surface
        final double vwd = vwt - vdcM3 - (1 - av) * vrM3;
        final double e42 = vsd * drs + (rs * vsd * dhs + rw * vwd * dhw - vsd - vwd + mdKg * mcp * dts) / hc
                + ar * (1 + beta) * vrM3 * (av * drs + (1 - av) * drw + (rs - rw) * davDp);
        final double e43 = ar * (1 + beta) * (rs - rw) * vrM3 * davDar;
        final double dvsd = ((rs / tdS) * (vsd0M3 - vsd) + (hf - hw) / hc * qf - e42 * dp - e43 * dar) / rs;

        yDot[0] = dvwt;
        yDot[1] = dp;
        yDot[2] = dar;
        yDot[3] = dvsd;

        // outputs
        final double dRiserMass = vrM3 * ((av * drs + (1 - av) * drw + (rs - rw) * davDp) * dp + (rs - rw) * davDar * dar);
        final double qr = qdc - dRiserMass;
        avOut = av;
        qdcOut = qdc;
        qrOut = qr;
        qsdOut = (rs / tdS) * (vsd - vsd0M3) + ar * qdc + ar * beta * (qdc - qr);
        qcdOut = (hw - hf) / hc * qf + (rs * vsd * dhs + rw * vwd * dhw - (vsd + vwd) + mdKg * mcp * dts) / hc * dp;
        vwdOut = vwd;
        qsOut = qs;
        hsOut = hs;
        hwOut = hw;
    }

    /** Total water and steam mass in the loop for state {@code y} [kg]. */
    public double totalMassKg(double[] y, SaturationState scratch) {
        table.lookup(clampP(y[1]), scratch);
        return scratch.rhoS * (vtM3 - y[0]) + scratch.rhoW * y[0];
    }

    /**
     * Stored energy of water, steam and metal for state {@code y} [J] (the quantity whose rate is
     * {@code Q + qf hf - qs hs} in §4.1; its zero is arbitrary).
     */
    public double totalEnergyJ(double[] y, SaturationState scratch) {
        double p = clampP(y[1]);
        table.lookup(p, scratch);
        double vst = vtM3 - y[0];
        return scratch.rhoS * scratch.hS * vst + scratch.rhoW * scratch.hW * y[0] - p * vtM3
                + mtKg * cpJKgK * scratch.tsK;
    }

    double clampP(double p) {
        return Math.min(Math.max(p, pMinPa), pMaxPa);
    }

    /**
     * Steady state at pressure {@code pPa} and riser-outlet quality {@code ar} (§6 procedure):
     * sets {@code heatW}, {@code qfKgS = qs}, the fixed steam flow and {@link #vsd0M3}; fills
     * {@code y} with Vwt chosen so that the drum holds {@code vBelowSurfaceM3} (water plus
     * bubbles) below its surface, and with {@code vsdSsM3} of bubbles.
     */
    public void steadyStateFromQuality(double pPa, double ar, double hfJKg, double vsdSsM3,
                                       double vBelowSurfaceM3, double[] y) {
        table.lookup(pPa, sat);
        double rw = sat.rhoW;
        double rs = sat.rhoS;
        double hc = sat.hS - sat.hW;
        double av = VoidFraction.av(ar, rw, rs);
        double qdc = downcomerFlow(rw, rs, av);
        double q = ar * hc * qdc;
        double qs = q / (sat.hS - hfJKg);
        this.hfJKg = hfJKg;
        this.heatW = q;
        this.qfKgS = qs;
        this.qsFixedKgS = qs;
        this.qsPerPa = 0;
        this.qLeakKgS = 0;
        this.vsd0M3 = vsdSsM3 + tdS * (sat.hW - hfJKg) * qs / (hc * rs);
        double vwd = vBelowSurfaceM3 - vsdSsM3;
        y[0] = vwd + vdcM3 + (1 - av) * vrM3;
        y[1] = pPa;
        y[2] = ar;
        y[3] = vsdSsM3;
    }

    /** Riser quality that gives steam flow {@code qsKgS} at pressure {@code pPa} (bisection). */
    public double qualityForSteamFlow(double pPa, double qsKgS, double hfJKg) {
        table.lookup(pPa, sat);
        double rw = sat.rhoW;
        double rs = sat.rhoS;
        double hc = sat.hS - sat.hW;
        double lo = MIN_QUALITY;
        double hi = 0.9;
        for (int i = 0; i < 200; i++) {
            double mid = 0.5 * (lo + hi);
            double qdc = downcomerFlow(rw, rs, VoidFraction.av(mid, rw, rs));
            double qs = mid * hc * qdc / (sat.hS - hfJKg);
            if (qs < qsKgS) {
                lo = mid;
            } else {
                hi = mid;
            }
            if (hi - lo < 1e-15) {
                break;
            }
        }
        return 0.5 * (lo + hi);
    }
}
