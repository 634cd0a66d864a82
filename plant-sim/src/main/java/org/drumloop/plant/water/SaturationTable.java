package org.drumloop.plant.water;

/**
 * The saturation line of IAPWS-IF97 tabulated once and interpolated: Ts, saturated liquid and
 * vapour densities and enthalpies, and their pressure derivatives, for any pressure in
 * {@code [pMinPa, pMaxPa]}.
 *
 * <p>Nodes are spaced evenly in ln(p). Each node stores the five values and their derivatives
 * with respect to ln(p); {@link #lookup} evaluates a cubic Hermite polynomial in ln(p) on the
 * interval holding p, so values are continuous with continuous first derivatives.
 *
 * <p>Below 16.529 MPa (Ts = 623.15 K) the saturated states come from IF97 regions 1 and 2; above
 * it from region 3. The two descriptions do not join smoothly, so the table is split into two
 * segments that meet exactly at that pressure: no interpolation interval straddles it, and at the
 * boundary pressure itself the region 1/2 values apply.
 *
 * <p>A built table is immutable, so one instance can be shared by any number of threads.
 * {@link #lookup} allocates nothing and reads no clock.
 */
public final class SaturationTable {

    /** Saturation pressure at 623.15 K, where the saturation line enters region 3, Pa. */
    public static final double REGION3_BOUNDARY_PRESSURE_PA =
            Iapws97.saturationPressurePa(Iapws97.REGION3_BOUNDARY_TEMPERATURE_K);
    /** Lowest pressure accepted by a table: the saturation pressure at 273.16 K, Pa. */
    public static final double LOWEST_PRESSURE_PA = 611.657;
    /** Highest pressure accepted by a table, Pa; closer to the critical point the saturated
     * densities become ill-conditioned and a table in ln(p) no longer fits. */
    public static final double HIGHEST_PRESSURE_PA = 21.0e6;

    /** Range and node count of {@link #standard()}: 0.01 MPa to 18 MPa. */
    public static final double STANDARD_P_MIN_PA = 0.01e6;
    public static final double STANDARD_P_MAX_PA = 18.0e6;
    public static final int STANDARD_NODES = 2000;

    /** Relative step of the central differences in {@link #direct}. */
    static final double DIFFERENCE_STEP = 1e-5;

    private static final int QUANTITIES = 5;
    private static final int STRIDE = 2 * QUANTITIES;

    private final double pMinPa;
    private final double pMaxPa;
    /** Segment below (and at) the region 3 boundary; null if the range lies above it. */
    private final Segment low;
    /** Segment above the region 3 boundary; null if the range lies below it. */
    private final Segment high;

    private static final class StandardHolder {
        static final SaturationTable INSTANCE =
                new SaturationTable(STANDARD_P_MIN_PA, STANDARD_P_MAX_PA, STANDARD_NODES);
    }

    /** The shared table for 0.01 MPa to 18 MPa, built on first use (thread-safe). */
    public static SaturationTable standard() {
        return StandardHolder.INSTANCE;
    }

    /**
     * Builds a table.
     *
     * @param pMinPa lowest pressure, Pa, at least {@link #LOWEST_PRESSURE_PA}
     * @param pMaxPa highest pressure, Pa, at most {@link #HIGHEST_PRESSURE_PA}
     * @param nodes  total number of nodes, at least 8; 2000 over 0.01-18 MPa give at most about
     *               5e-10 relative error in the values and 2e-7 in the derivatives
     */
    public SaturationTable(double pMinPa, double pMaxPa, int nodes) {
        if (!(pMinPa >= LOWEST_PRESSURE_PA && pMaxPa <= HIGHEST_PRESSURE_PA && pMinPa < pMaxPa)) {
            throw new IllegalArgumentException("pressure range " + pMinPa + " .. " + pMaxPa
                    + " Pa is not inside " + LOWEST_PRESSURE_PA + " .. " + HIGHEST_PRESSURE_PA + " Pa");
        }
        if (nodes < 8) {
            throw new IllegalArgumentException("nodes must be at least 8, got " + nodes);
        }
        this.pMinPa = pMinPa;
        this.pMaxPa = pMaxPa;
        double pb = REGION3_BOUNDARY_PRESSURE_PA;
        double total = Math.log(pMaxPa / pMinPa);
        if (pMaxPa <= pb) {
            low = new Segment(pMinPa, pMaxPa, nodes, false);
            high = null;
        } else if (pMinPa >= pb) {
            low = null;
            high = new Segment(pMinPa, pMaxPa, nodes, true);
        } else {
            int nHigh = (int) Math.round(nodes * Math.log(pMaxPa / pb) / total);
            nHigh = Math.max(8, nHigh);
            int nLow = Math.max(8, nodes - nHigh);
            low = new Segment(pMinPa, pb, nLow, false);
            high = new Segment(pb, pMaxPa, nHigh, true);
        }
    }

    /** Lowest pressure of the table, Pa. */
    public double pMinPa() {
        return pMinPa;
    }

    /** Highest pressure of the table, Pa. */
    public double pMaxPa() {
        return pMaxPa;
    }

    /** True if {@link #lookup} accepts {@code pPa} (false for NaN); lets a caller guard a hot path. */
    public boolean contains(double pPa) {
        return pPa >= pMinPa && pPa <= pMaxPa;
    }

    /**
     * Fills {@code out} with the saturated state at {@code pPa}. Allocation-free.
     *
     * @throws IllegalArgumentException if {@code pPa} is outside the table (or NaN)
     */
    public void lookup(double pPa, SaturationState out) {
        if (!contains(pPa)) {
            throw new IllegalArgumentException("pressure " + pPa + " Pa outside the saturation table "
                    + pMinPa + " .. " + pMaxPa + " Pa");
        }
        Segment seg = (low != null && pPa <= REGION3_BOUNDARY_PRESSURE_PA) ? low : high;
        seg.interpolate(pPa, out);
    }

    /** A run of nodes evenly spaced in ln(p). */
    private static final class Segment {
        private final double x0;
        private final double dx;
        private final double invDx;
        private final int n;
        /** Per node: five values then five d/d(ln p) derivatives. */
        private final double[] data;

        Segment(double pFromPa, double pToPa, int n, boolean region3) {
            this.n = n;
            this.x0 = Math.log(pFromPa);
            double x1 = Math.log(pToPa);
            this.dx = (x1 - x0) / (n - 1);
            this.invDx = 1.0 / dx;
            this.data = new double[n * STRIDE];
            SaturationState s = new SaturationState();
            for (int i = 0; i < n; i++) {
                double p = i == 0 ? pFromPa : i == n - 1 ? pToPa : Math.exp(x0 + i * dx);
                direct(p, region3, s);
                int o = i * STRIDE;
                data[o] = s.tsK;
                data[o + 1] = s.rhoW;
                data[o + 2] = s.rhoS;
                data[o + 3] = s.hW;
                data[o + 4] = s.hS;
                data[o + 5] = s.dTsDp * p;
                data[o + 6] = s.dRhoWDp * p;
                data[o + 7] = s.dRhoSDp * p;
                data[o + 8] = s.dHWDp * p;
                data[o + 9] = s.dHSDp * p;
            }
        }

        void interpolate(double pPa, SaturationState out) {
            double t = (Math.log(pPa) - x0) * invDx;
            int i = (int) t;
            if (i < 0) {
                i = 0;
            } else if (i > n - 2) {
                i = n - 2;
            }
            double s = t - i;
            double s2 = s * s;
            double s3 = s2 * s;
            // cubic Hermite basis and its derivative in s
            double h00 = 2.0 * s3 - 3.0 * s2 + 1.0;
            double h10 = (s3 - 2.0 * s2 + s) * dx;
            double h01 = 3.0 * s2 - 2.0 * s3;
            double h11 = (s3 - s2) * dx;
            double scale = invDx / pPa;
            double d00 = (6.0 * s2 - 6.0 * s) * scale;
            double d10 = (3.0 * s2 - 4.0 * s + 1.0) * dx * scale;
            double d01 = -d00;
            double d11 = (3.0 * s2 - 2.0 * s) * dx * scale;
            double[] d = data;
            int a = i * STRIDE;
            int b = a + STRIDE;
            out.pPa = pPa;
            out.tsK = h00 * d[a] + h10 * d[a + 5] + h01 * d[b] + h11 * d[b + 5];
            out.rhoW = h00 * d[a + 1] + h10 * d[a + 6] + h01 * d[b + 1] + h11 * d[b + 6];
            out.rhoS = h00 * d[a + 2] + h10 * d[a + 7] + h01 * d[b + 2] + h11 * d[b + 7];
            out.hW = h00 * d[a + 3] + h10 * d[a + 8] + h01 * d[b + 3] + h11 * d[b + 8];
            out.hS = h00 * d[a + 4] + h10 * d[a + 9] + h01 * d[b + 4] + h11 * d[b + 9];
            out.dTsDp = d00 * d[a] + d10 * d[a + 5] + d01 * d[b] + d11 * d[b + 5];
            out.dRhoWDp = d00 * d[a + 1] + d10 * d[a + 6] + d01 * d[b + 1] + d11 * d[b + 6];
            out.dRhoSDp = d00 * d[a + 2] + d10 * d[a + 7] + d01 * d[b + 2] + d11 * d[b + 7];
            out.dHWDp = d00 * d[a + 3] + d10 * d[a + 8] + d01 * d[b + 3] + d11 * d[b + 8];
            out.dHSDp = d00 * d[a + 4] + d10 * d[a + 9] + d01 * d[b + 4] + d11 * d[b + 9];
        }
    }

    // ---------------------------------------------------------------- direct evaluation

    /**
     * Direct IF97 evaluation at {@code pPa} (no table): Ts from the region 4 backward equation,
     * saturated states from regions 1 and 2 up to 16.529 MPa and from region 3 above, and the
     * derivatives by second-order differences with step 1e-5 p (central, or one-sided where a
     * central stencil would straddle 16.529 MPa). Allocation-free but far slower than
     * {@link #lookup}; meant for building tables and for checks.
     */
    public static void direct(double pPa, SaturationState out) {
        direct(pPa, pPa > REGION3_BOUNDARY_PRESSURE_PA, out);
    }

    /**
     * As {@link #direct(double, SaturationState)}, with the side of 16.529 MPa chosen by the
     * caller, so that a table segment starting exactly at the boundary gets region 3 values.
     */
    static void direct(double pPa, boolean region3, SaturationState out) {
        double h = DIFFERENCE_STEP * pPa;
        double pb = REGION3_BOUNDARY_PRESSURE_PA;
        // derivative stencil: central unless it would reach across the region boundary
        int mode;
        if (region3 && pPa - h < pb) {
            mode = 1; // forward differences inside region 3
        } else if (!region3 && pPa + h > pb) {
            mode = -1; // backward differences inside regions 1 and 2
        } else {
            mode = 0;
        }
        double pA;
        double pB;
        if (mode == 0) {
            pA = pPa + h;
            pB = pPa - h;
        } else {
            pA = pPa + mode * h;
            pB = pPa + 2 * mode * h;
        }
        values(pA, region3, out);
        double tA = out.tsK;
        double rwA = out.rhoW;
        double rsA = out.rhoS;
        double hwA = out.hW;
        double hsA = out.hS;
        values(pB, region3, out);
        double tB = out.tsK;
        double rwB = out.rhoW;
        double rsB = out.rhoS;
        double hwB = out.hW;
        double hsB = out.hS;
        values(pPa, region3, out);
        if (mode == 0) {
            double inv = 1.0 / (pA - pB);
            out.dTsDp = (tA - tB) * inv;
            out.dRhoWDp = (rwA - rwB) * inv;
            out.dRhoSDp = (rsA - rsB) * inv;
            out.dHWDp = (hwA - hwB) * inv;
            out.dHSDp = (hsA - hsB) * inv;
        } else {
            // f'(p) = (-3 f(p) + 4 f(p + s) - f(p + 2 s)) / (2 s), s = mode * h
            double inv = 1.0 / (2.0 * mode * h);
            out.dTsDp = (-3.0 * out.tsK + 4.0 * tA - tB) * inv;
            out.dRhoWDp = (-3.0 * out.rhoW + 4.0 * rwA - rwB) * inv;
            out.dRhoSDp = (-3.0 * out.rhoS + 4.0 * rsA - rsB) * inv;
            out.dHWDp = (-3.0 * out.hW + 4.0 * hwA - hwB) * inv;
            out.dHSDp = (-3.0 * out.hS + 4.0 * hsA - hsB) * inv;
        }
    }

    /**
     * Values only (no derivatives) at {@code pPa}, from regions 1 and 2 or from region 3;
     * derivative fields of {@code out} are left untouched.
     */
    static void values(double pPa, boolean region3, SaturationState out) {
        double ts = Iapws97.saturationTemperatureK(pPa);
        out.pPa = pPa;
        out.tsK = ts;
        if (!region3) {
            out.rhoW = 1.0 / Iapws97.specificVolume1(pPa, ts);
            out.rhoS = 1.0 / Iapws97.specificVolume2(pPa, ts);
            out.hW = Iapws97.enthalpy1(pPa, ts);
            out.hS = Iapws97.enthalpy2(pPa, ts);
        } else {
            double rw = Iapws97.density3(pPa, ts, true);
            double rs = Iapws97.density3(pPa, ts, false);
            out.rhoW = rw;
            out.rhoS = rs;
            out.hW = Iapws97.enthalpy3(rw, ts);
            out.hS = Iapws97.enthalpy3(rs, ts);
        }
    }
}
