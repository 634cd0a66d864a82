package org.drumloop.plant.water;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.hummeling.if97.IF97;
import java.lang.reflect.Constructor;
import java.lang.reflect.Method;
import org.junit.jupiter.api.Test;

/**
 * Cross-check against an independent IF97 implementation, the com.hummeling:if97:1.0.5 library
 * (test scope only). The library is used in its DEFAULT unit system: pressure in MPa,
 * temperature in K, specific volume in m3/kg, energies in kJ/kg, entropy and heat capacity in
 * kJ/(kg K), speed of sound in m/s. Everything is converted to SI here before comparing.
 *
 * <p>Range: 1 to 180 bar, the range of the bench's saturation cross-check. Up to 16.529 MPa both
 * sides evaluate the same basic equations (regions 1, 2, 4), so values agree to rounding. Above
 * it the library obtains saturated states through its own region 3 route, while drumloop solves
 * the region 3 basic equation for density; measured differences are up to 1.4e-7 in values and
 * 1e-4 in differenced slopes there, hence the looser region 3 tolerances below.
 */
class Iapws97AgainstReferenceLibraryTest {

    private static final double MPA = 1e6;
    private static final double KJ = 1e3;
    private static final double P_MIN_PA = 1e5;
    private static final double P_MAX_PA = 180e5;
    private static final int POINTS = 600;

    /** Regions 1/2: same equations on both sides, measured at most 1e-10; 1e-9 margin. */
    private static final double VALUE_TOL_R12 = 1e-9;
    /** Region 3: different solution routes, measured at most 1.4e-7; 1e-6 margin. */
    private static final double VALUE_TOL_R3 = 1e-6;
    /**
     * Derivatives, relative part and f/p-scaled part (dh_v/dp passes through zero near 31 bar).
     * Regions 1/2: library slopes by central difference with step 1e-5 p, measured 7e-8.
     * Region 3: library slopes by central difference with step 1e-3 p (its region 3 values are
     * too rough for smaller steps), measured 1e-4.
     */
    private static final double DERIV_TOL_R12 = 1e-6;
    private static final double DERIV_SCALE_TOL_R12 = 1e-9;
    private static final double DERIV_TOL_R3 = 1e-3;
    private static final double DERIV_SCALE_TOL_R3 = 1e-6;

    private final IF97 lib = new IF97(IF97.UnitSystem.DEFAULT);
    private final SaturationTable table = SaturationTable.standard();
    private final SaturationState s = new SaturationState();

    /** Library saturation values in SI: Ts, rho_l, rho_v, h_l, h_v. */
    private double[] library(double pPa) throws Exception {
        double p = pPa / MPA;
        return new double[] {
            lib.saturationTemperatureP(p),
            1.0 / lib.specificVolumeSaturatedLiquidP(p),
            1.0 / lib.specificVolumeSaturatedVapourP(p),
            lib.specificEnthalpySaturatedLiquidP(p) * KJ,
            lib.specificEnthalpySaturatedVapourP(p) * KJ,
        };
    }

    @Test
    void saturationLineAgreesWithTheReferenceLibraryFrom1To180Bar() throws Exception {
        double pb = SaturationTable.REGION3_BOUNDARY_PRESSURE_PA;
        String[] names = {"Ts", "rho_l", "rho_v", "h_l", "h_v"};
        for (int k = 0; k <= POINTS; k++) {
            double p = Math.min(P_MAX_PA, P_MIN_PA * Math.pow(P_MAX_PA / P_MIN_PA, (double) k / POINTS));
            boolean region3 = p > pb;
            double step = (region3 ? 1e-3 : 1e-5) * p;
            double[] ref = library(p);
            // slopes only where the library's difference stencil stays on one side of 16.529 MPa
            boolean slopes = region3 ? p - step > pb : p + step < pb;
            double[] up = slopes ? library(p + step) : null;
            double[] down = slopes ? library(p - step) : null;
            for (SaturationState mine : both(p)) {
                double[] values = {mine.tsK, mine.rhoW, mine.rhoS, mine.hW, mine.hS};
                double[] derivs = {mine.dTsDp, mine.dRhoWDp, mine.dRhoSDp, mine.dHWDp, mine.dHSDp};
                for (int i = 0; i < 5; i++) {
                    String at = names[i] + " at " + p + " Pa";
                    // source: com.hummeling:if97:1.0.5 saturation functions
                    assertEquals(ref[i], values[i],
                            Math.abs(ref[i]) * (region3 ? VALUE_TOL_R3 : VALUE_TOL_R12), at);
                    if (slopes) {
                        // source: central difference of com.hummeling:if97:1.0.5 values
                        double d = (up[i] - down[i]) / (2.0 * step);
                        double tol = region3
                                ? Math.abs(d) * DERIV_TOL_R3 + Math.abs(ref[i] / p) * DERIV_SCALE_TOL_R3
                                : Math.abs(d) * DERIV_TOL_R12 + Math.abs(ref[i] / p) * DERIV_SCALE_TOL_R12;
                        assertEquals(d, derivs[i], tol, "d" + at);
                    }
                }
            }
        }
    }

    @Test
    void region1And2AgreeWithTheReferenceLibraryOffTheSaturationLine() throws Exception {
        // region 1: sub-cooled liquid between 1 and 180 bar, 280 K up to 1 K below saturation
        // (and at most 623.15 K); region 2: superheated steam between 1 and 160 bar, 1 K above
        // saturation up to 900 K. Same equations in the library: 1e-9 relative (rounding only).
        for (double pBar = 1; pBar <= 180; pBar += 7.3) {
            double p = pBar * 1e5;
            double ts = Iapws97.saturationTemperatureK(p);
            for (double t = 280; t <= Math.min(ts - 1, 623.15); t += 17.1) {
                String at = " at " + p + " Pa, " + t + " K";
                double pm = p / MPA;
                // source: com.hummeling:if97:1.0.5 property functions of (p, T)
                rel(lib.specificVolumePT(pm, t), Iapws97.specificVolume1(p, t), "v1" + at);
                rel(lib.specificEnthalpyPT(pm, t) * KJ, Iapws97.enthalpy1(p, t), "h1" + at);
                rel(lib.specificInternalEnergyPT(pm, t) * KJ, Iapws97.internalEnergy1(p, t), "u1" + at);
                rel(lib.specificEntropyPT(pm, t) * KJ, Iapws97.entropy1(p, t), "s1" + at);
                rel(lib.isobaricHeatCapacityPT(pm, t) * KJ, Iapws97.cp1(p, t), "cp1" + at);
                rel(lib.speedOfSoundPT(pm, t), Iapws97.speedOfSound1(p, t), "w1" + at);
                rel(lib.densityPT(pm, t), Iapws97.liquidDensity(p, t), "rho1" + at);
            }
            if (pBar > 160) {
                continue;
            }
            for (double t = ts + 1; t <= 900; t += 23.7) {
                String at = " at " + p + " Pa, " + t + " K";
                double pm = p / MPA;
                // source: com.hummeling:if97:1.0.5 property functions of (p, T)
                rel(lib.specificVolumePT(pm, t), Iapws97.specificVolume2(p, t), "v2" + at);
                rel(lib.specificEnthalpyPT(pm, t) * KJ, Iapws97.enthalpy2(p, t), "h2" + at);
                rel(lib.specificInternalEnergyPT(pm, t) * KJ, Iapws97.internalEnergy2(p, t), "u2" + at);
                rel(lib.specificEntropyPT(pm, t) * KJ, Iapws97.entropy2(p, t), "s2" + at);
                rel(lib.isobaricHeatCapacityPT(pm, t) * KJ, Iapws97.cp2(p, t), "cp2" + at);
                rel(lib.speedOfSoundPT(pm, t), Iapws97.speedOfSound2(p, t), "w2" + at);
            }
        }
    }

    @Test
    void region3BasicEquationAgreesWithTheReferenceLibrary() throws Exception {
        // The library keeps its region 3 (rho, T) functions package-private; they are reached
        // by reflection (pinned library version 1.0.5, test scope only). Units: MPa, kJ/kg,
        // kJ/(kg K), m/s. Same basic equation on both sides: 1e-9 relative (rounding only).
        Class<?> region3 = Class.forName("com.hummeling.if97.Region3");
        Constructor<?> make = region3.getDeclaredConstructor();
        make.setAccessible(true);
        Object lib3 = make.newInstance();
        Method p = rhoT(region3, "pressureRhoT");
        Method h = rhoT(region3, "specificEnthalpyRhoT");
        Method u = rhoT(region3, "specificInternalEnergyRhoT");
        Method s3 = rhoT(region3, "specificEntropyRhoT");
        Method cp = rhoT(region3, "specificIsobaricHeatCapacityRhoT");
        Method w = rhoT(region3, "speedOfSoundRhoT");
        for (double t = 630.0; t <= 860.0; t += 23.0) {
            for (double rho = 120.0; rho <= 720.0; rho += 60.0) {
                String at = " at " + rho + " kg/m3, " + t + " K";
                // source: com.hummeling:if97:1.0.5 region 3 functions of (rho, T)
                rel((double) p.invoke(lib3, rho, t) * MPA, Iapws97.pressure3(rho, t), "p3" + at);
                rel((double) h.invoke(lib3, rho, t) * KJ, Iapws97.enthalpy3(rho, t), "h3" + at);
                rel((double) u.invoke(lib3, rho, t) * KJ, Iapws97.internalEnergy3(rho, t), "u3" + at);
                rel((double) s3.invoke(lib3, rho, t) * KJ, Iapws97.entropy3(rho, t), "s3" + at);
                rel((double) cp.invoke(lib3, rho, t) * KJ, Iapws97.cp3(rho, t), "cp3" + at);
                rel((double) w.invoke(lib3, rho, t), Iapws97.speedOfSound3(rho, t), "w3" + at);
            }
        }
    }

    private static Method rhoT(Class<?> type, String name) throws NoSuchMethodException {
        Method m = type.getDeclaredMethod(name, double.class, double.class);
        m.setAccessible(true);
        return m;
    }

    @Test
    void region3SaturatedDensitySlopesObeyTheImplicitFunctionTheorem() {
        // Closed form: on the saturation line p3(rho(p), Ts(p)) = p, so
        // drho/dp = (1 - dp3/dT|rho * dTs/dp) / (dp3/drho|T). Partial derivatives of the region 3
        // equation taken here by central differences (rho: analytic; T: step 1e-6 T), so the
        // tolerance 1e-5 relative covers their truncation error and the differenced slopes.
        for (double p = 16.6e6; p <= 18e6; p += 0.07e6) {
            table.lookup(p, s);
            for (int branch = 0; branch < 2; branch++) {
                double rho = branch == 0 ? s.rhoW : s.rhoS;
                double dRho = branch == 0 ? s.dRhoWDp : s.dRhoSDp;
                double dt = 1e-6 * s.tsK;
                double dpdT = (Iapws97.pressure3(rho, s.tsK + dt) - Iapws97.pressure3(rho, s.tsK - dt))
                        / (2 * dt);
                double expected = (1.0 - dpdT * s.dTsDp) / Iapws97.dPressureDDensity3(rho, s.tsK);
                assertEquals(expected, dRho, Math.abs(expected) * 1e-5,
                        (branch == 0 ? "drho_l/dp" : "drho_v/dp") + " at " + p + " Pa");
            }
        }
    }

    private SaturationState[] both(double p) {
        SaturationState direct = new SaturationState();
        SaturationTable.direct(p, direct);
        SaturationState looked = new SaturationState();
        table.lookup(p, looked);
        return new SaturationState[] {direct, looked};
    }

    private static void rel(double expected, double actual, String what) {
        assertEquals(expected, actual, Math.abs(expected) * VALUE_TOL_R12, what);
    }
}
