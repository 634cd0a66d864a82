package org.drumloop.plant.water;

/**
 * IAPWS Industrial Formulation 1997 for water and steam: the parts the drum model needs.
 *
 * <ul>
 *   <li>Region 1 (compressed liquid) basic equation, Gibbs free energy g(p, T), Table 2.</li>
 *   <li>Region 2 (vapour) basic equation, ideal part Table 10 and residual part Table 11.</li>
 *   <li>Region 3 (near-critical) basic equation, Helmholtz free energy f(rho, T), Table 30.</li>
 *   <li>Region 4 (saturation line) equations 30 and 31, Table 34.</li>
 * </ul>
 *
 * <p>All arguments and results are SI: pressure in Pa, temperature in K, specific volume in
 * m3/kg, density in kg/m3, energies in J/kg, entropy and heat capacity in J/(kg K), speed of
 * sound in m/s. The release itself works in MPa and kJ; the conversion happens here.
 *
 * <p>Every method is static, allocates nothing and reads no state, so it is safe on a hot path
 * and from any thread. Arguments are not range checked: outside a region's range of validity the
 * equations still return numbers, but they are extrapolations.
 */
public final class Iapws97 {

    /** Specific gas constant of water, J/(kg K) (IF97 eq. 1). */
    public static final double R = 461.526;
    /** Critical temperature, K (IF97 eq. 3). */
    public static final double CRITICAL_TEMPERATURE_K = 647.096;
    /** Critical pressure, Pa (IF97 eq. 4). */
    public static final double CRITICAL_PRESSURE_PA = 22.064e6;
    /** Critical density, kg/m3 (IF97 eq. 2). */
    public static final double CRITICAL_DENSITY_KG_M3 = 322.0;
    /** Temperature at which the saturation line leaves regions 1 and 2 for region 3, K. */
    public static final double REGION3_BOUNDARY_TEMPERATURE_K = 623.15;
    /** Lowest temperature of the saturation line (triple point region), K. */
    public static final double TRIPLE_POINT_TEMPERATURE_K = 273.16;

    private static final double MPA = 1e6;

    private Iapws97() {
    }

    // ---------------------------------------------------------------- region 1, Table 2

    private static final double R1_P_STAR_PA = 16.53e6;
    private static final double R1_T_STAR_K = 1386.0;

    private static final int[] R1_I = {
        0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8,
        21, 23, 29, 30, 31, 32};
    private static final int[] R1_J = {
        -2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10,
        -8, -11, -6, -29, -31, -38, -39, -40, -41};
    private static final double[] R1_N = {
        0.14632971213167, -0.84548187169114, -0.37563603672040e1, 0.33855169168385e1,
        -0.95791963387872, 0.15772038513228, -0.16616417199501e-1, 0.81214629983568e-3,
        0.28319080123804e-3, -0.60706301565874e-3, -0.18990068218419e-1, -0.32529748770505e-1,
        -0.21841717175414e-1, -0.52838357969930e-4, -0.47184321073267e-3, -0.30001780793026e-3,
        0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4,
        -0.28270797985312e-5, -0.85205128120103e-9, -0.22425281908000e-5, -0.65171222895601e-6,
        -0.14341729937924e-12, -0.40516996860117e-6, -0.12734301741641e-8, -0.17424871230634e-9,
        -0.68762131295531e-18, 0.14478307828521e-19, 0.26335781662795e-22, -0.11947622640071e-22,
        0.18228094581404e-23, -0.93537087292458e-25};

    // derivative selectors for the dimensionless Gibbs / Helmholtz functions
    private static final int G = 0;
    private static final int G_PI = 1;
    private static final int G_PIPI = 2;
    private static final int G_TAU = 3;
    private static final int G_TAUTAU = 4;
    private static final int G_PITAU = 5;

    /** gamma of region 1 or one of its derivatives (selector {@code which}). */
    private static double gamma1(double pi, double tau, int which) {
        double a = 7.1 - pi;
        double b = tau - 1.222;
        double sum = 0.0;
        for (int k = 0; k < R1_N.length; k++) {
            int i = R1_I[k];
            int j = R1_J[k];
            double n = R1_N[k];
            switch (which) {
                case G:
                    sum += n * ipow(a, i) * ipow(b, j);
                    break;
                case G_PI:
                    sum -= n * i * ipow(a, i - 1) * ipow(b, j);
                    break;
                case G_PIPI:
                    sum += n * i * (i - 1) * ipow(a, i - 2) * ipow(b, j);
                    break;
                case G_TAU:
                    sum += n * ipow(a, i) * j * ipow(b, j - 1);
                    break;
                case G_TAUTAU:
                    sum += n * ipow(a, i) * j * (j - 1) * ipow(b, j - 2);
                    break;
                default:
                    sum -= n * i * ipow(a, i - 1) * j * ipow(b, j - 1);
                    break;
            }
        }
        return sum;
    }

    /** Region 1 specific volume, m3/kg. */
    public static double specificVolume1(double pPa, double tK) {
        double pi = pPa / R1_P_STAR_PA;
        return pi * gamma1(pi, R1_T_STAR_K / tK, G_PI) * R * tK / pPa;
    }

    /** Region 1 density, kg/m3: 1/v1, for sub-cooled feed water and reference legs. */
    public static double liquidDensity(double pPa, double tK) {
        return 1.0 / specificVolume1(pPa, tK);
    }

    /** Region 1 specific enthalpy, J/kg. */
    public static double enthalpy1(double pPa, double tK) {
        double tau = R1_T_STAR_K / tK;
        return R * tK * tau * gamma1(pPa / R1_P_STAR_PA, tau, G_TAU);
    }

    /** Region 1 specific internal energy, J/kg. */
    public static double internalEnergy1(double pPa, double tK) {
        double pi = pPa / R1_P_STAR_PA;
        double tau = R1_T_STAR_K / tK;
        return R * tK * (tau * gamma1(pi, tau, G_TAU) - pi * gamma1(pi, tau, G_PI));
    }

    /** Region 1 specific entropy, J/(kg K). */
    public static double entropy1(double pPa, double tK) {
        double pi = pPa / R1_P_STAR_PA;
        double tau = R1_T_STAR_K / tK;
        return R * (tau * gamma1(pi, tau, G_TAU) - gamma1(pi, tau, G));
    }

    /** Region 1 specific isobaric heat capacity, J/(kg K). */
    public static double cp1(double pPa, double tK) {
        double tau = R1_T_STAR_K / tK;
        return -R * tau * tau * gamma1(pPa / R1_P_STAR_PA, tau, G_TAUTAU);
    }

    /** Region 1 speed of sound, m/s. */
    public static double speedOfSound1(double pPa, double tK) {
        double pi = pPa / R1_P_STAR_PA;
        double tau = R1_T_STAR_K / tK;
        double gp = gamma1(pi, tau, G_PI);
        double gpp = gamma1(pi, tau, G_PIPI);
        double gtt = gamma1(pi, tau, G_TAUTAU);
        double gpt = gamma1(pi, tau, G_PITAU);
        double x = gp - tau * gpt;
        return Math.sqrt(R * tK * gp * gp / (x * x / (tau * tau * gtt) - gpp));
    }

    // ---------------------------------------------------------------- region 2, Tables 10, 11

    private static final double R2_P_STAR_PA = 1e6;
    private static final double R2_T_STAR_K = 540.0;

    private static final int[] R2_J0 = {0, 1, -5, -4, -3, -2, -1, 2, 3};
    private static final double[] R2_N0 = {
        -0.96927686500217e1, 0.10086655968018e2, -0.56087911283020e-2, 0.71452738081455e-1,
        -0.40710498223928, 0.14240819171444e1, -0.43839511319450e1, -0.28408632460772,
        0.21268463753307e-1};

    private static final int[] R2_I = {
        1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 5, 6, 6, 6, 7, 7, 7, 8, 8, 9, 10, 10,
        10, 16, 16, 18, 20, 20, 20, 21, 22, 23, 24, 24, 24};
    private static final int[] R2_J = {
        0, 1, 2, 3, 6, 1, 2, 4, 7, 36, 0, 1, 3, 6, 35, 1, 2, 3, 7, 3, 16, 35, 0, 11, 25, 8, 36, 13,
        4, 10, 14, 29, 50, 57, 20, 35, 48, 21, 53, 39, 26, 40, 58};
    /** Table 11; note n for (I=9, J=13) is 0.19809712802088e-7 (a wrong value circulates). */
    private static final double[] R2_N = {
        -0.17731742473213e-2, -0.17834862292358e-1, -0.45996013696365e-1, -0.57581259083432e-1,
        -0.50325278727930e-1, -0.33032641670203e-4, -0.18948987516315e-3, -0.39392777243355e-2,
        -0.43797295650573e-1, -0.26674547914087e-4, 0.20481737692309e-7, 0.43870667284435e-6,
        -0.32277677238570e-4, -0.15033924542148e-2, -0.40668253562649e-1, -0.78847309559367e-9,
        0.12790717852285e-7, 0.48225372718507e-6, 0.22922076337661e-5, -0.16714766451061e-10,
        -0.21171472321355e-2, -0.23895741934104e2, -0.59059564324270e-17, -0.12621808899101e-5,
        -0.38946842435739e-1, 0.11256211360459e-10, -0.82311340897998e1, 0.19809712802088e-7,
        0.10406965210174e-18, -0.10234747095929e-12, -0.10018179379511e-8, -0.80882908646985e-10,
        0.10693031879409, -0.33662250574171, 0.89185845355421e-24, 0.30629316876232e-12,
        -0.42002467698208e-5, -0.59056029685639e-25, 0.37826947613457e-5, -0.12768608934681e-14,
        0.73087610595061e-28, 0.55414715350778e-16, -0.94369707241210e-6};

    /** Ideal-gas part gamma0 of region 2 or a derivative (pi derivatives handled by callers). */
    private static double gamma0(double pi, double tau, int which) {
        double sum = 0.0;
        for (int k = 0; k < R2_N0.length; k++) {
            int j = R2_J0[k];
            double n = R2_N0[k];
            switch (which) {
                case G:
                    sum += n * ipow(tau, j);
                    break;
                case G_TAU:
                    sum += n * j * ipow(tau, j - 1);
                    break;
                case G_TAUTAU:
                    sum += n * j * (j - 1) * ipow(tau, j - 2);
                    break;
                default:
                    throw new IllegalArgumentException("selector");
            }
        }
        return which == G ? Math.log(pi) + sum : sum;
    }

    /** Residual part gammaR of region 2 or one of its derivatives. */
    private static double gammaR(double pi, double tau, int which) {
        double b = tau - 0.5;
        double sum = 0.0;
        for (int k = 0; k < R2_N.length; k++) {
            int i = R2_I[k];
            int j = R2_J[k];
            double n = R2_N[k];
            switch (which) {
                case G:
                    sum += n * ipow(pi, i) * ipow(b, j);
                    break;
                case G_PI:
                    sum += n * i * ipow(pi, i - 1) * ipow(b, j);
                    break;
                case G_PIPI:
                    sum += n * i * (i - 1) * ipow(pi, i - 2) * ipow(b, j);
                    break;
                case G_TAU:
                    sum += n * ipow(pi, i) * j * ipow(b, j - 1);
                    break;
                case G_TAUTAU:
                    sum += n * ipow(pi, i) * j * (j - 1) * ipow(b, j - 2);
                    break;
                default:
                    sum += n * i * ipow(pi, i - 1) * j * ipow(b, j - 1);
                    break;
            }
        }
        return sum;
    }

    /** Region 2 specific volume, m3/kg. */
    public static double specificVolume2(double pPa, double tK) {
        double pi = pPa / R2_P_STAR_PA;
        double tau = R2_T_STAR_K / tK;
        return pi * (1.0 / pi + gammaR(pi, tau, G_PI)) * R * tK / pPa;
    }

    /** Region 2 density, kg/m3: 1/v2. */
    public static double vapourDensity(double pPa, double tK) {
        return 1.0 / specificVolume2(pPa, tK);
    }

    /** Region 2 specific enthalpy, J/kg. */
    public static double enthalpy2(double pPa, double tK) {
        double pi = pPa / R2_P_STAR_PA;
        double tau = R2_T_STAR_K / tK;
        return R * tK * tau * (gamma0(pi, tau, G_TAU) + gammaR(pi, tau, G_TAU));
    }

    /** Region 2 specific internal energy, J/kg. */
    public static double internalEnergy2(double pPa, double tK) {
        double pi = pPa / R2_P_STAR_PA;
        double tau = R2_T_STAR_K / tK;
        double gt = gamma0(pi, tau, G_TAU) + gammaR(pi, tau, G_TAU);
        double gp = 1.0 / pi + gammaR(pi, tau, G_PI);
        return R * tK * (tau * gt - pi * gp);
    }

    /** Region 2 specific entropy, J/(kg K). */
    public static double entropy2(double pPa, double tK) {
        double pi = pPa / R2_P_STAR_PA;
        double tau = R2_T_STAR_K / tK;
        double gt = gamma0(pi, tau, G_TAU) + gammaR(pi, tau, G_TAU);
        double g = gamma0(pi, tau, G) + gammaR(pi, tau, G);
        return R * (tau * gt - g);
    }

    /** Region 2 specific isobaric heat capacity, J/(kg K). */
    public static double cp2(double pPa, double tK) {
        double pi = pPa / R2_P_STAR_PA;
        double tau = R2_T_STAR_K / tK;
        return -R * tau * tau * (gamma0(pi, tau, G_TAUTAU) + gammaR(pi, tau, G_TAUTAU));
    }

    /** Region 2 speed of sound, m/s. */
    public static double speedOfSound2(double pPa, double tK) {
        double pi = pPa / R2_P_STAR_PA;
        double tau = R2_T_STAR_K / tK;
        double grp = gammaR(pi, tau, G_PI);
        double grpp = gammaR(pi, tau, G_PIPI);
        double grpt = gammaR(pi, tau, G_PITAU);
        double gtt = gamma0(pi, tau, G_TAUTAU) + gammaR(pi, tau, G_TAUTAU);
        double a = 1.0 + pi * grp;
        double b = 1.0 + pi * grp - tau * pi * grpt;
        return Math.sqrt(R * tK * a * a / ((1.0 - pi * pi * grpp) + b * b / (tau * tau * gtt)));
    }

    // ---------------------------------------------------------------- region 3, Table 30

    private static final double R3_N1 = 0.10658070028513e1;
    private static final int[] R3_I = {
        0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 4, 5, 5, 5, 6,
        6, 6, 7, 8, 9, 9, 10, 10, 11};
    private static final int[] R3_J = {
        0, 1, 2, 7, 10, 12, 23, 2, 6, 15, 17, 0, 2, 6, 7, 22, 26, 0, 2, 4, 16, 26, 0, 2, 4, 26, 1,
        3, 26, 0, 2, 26, 2, 26, 2, 26, 0, 1, 26};
    private static final double[] R3_N = {
        -0.15732845290239e2, 0.20944396974307e2, -0.76867707878716e1, 0.26185947787954e1,
        -0.28080781148620e1, 0.12053369696517e1, -0.84566812812502e-2, -0.12654315477714e1,
        -0.11524407806681e1, 0.88521043984318, -0.64207765181607, 0.38493460186671,
        -0.85214708824206, 0.48972281541877e1, -0.30502617256965e1, 0.39420536879154e-1,
        0.12558408424308, -0.27999329698710, 0.13899799569460e1, -0.20189915023570e1,
        -0.82147637173963e-2, -0.47596035734923, 0.43984074473500e-1, -0.44476435428739,
        0.90572070719733, 0.70522450087967, 0.10770512626332, -0.32913623258954,
        -0.50871062041158, -0.22175400873096e-1, 0.94260751665092e-1, 0.16436278447961,
        -0.13503372241348e-1, -0.14834345352472e-1, 0.57922953628084e-3, 0.32308904703711e-2,
        0.80964802996215e-4, -0.16557679795037e-3, -0.44923899061815e-4};

    /** phi of region 3 or a derivative; selectors reuse the gamma names (pi stands for delta). */
    private static double phi3(double delta, double tau, int which) {
        double sum;
        switch (which) {
            case G:
                sum = R3_N1 * Math.log(delta);
                break;
            case G_PI:
                sum = R3_N1 / delta;
                break;
            case G_PIPI:
                sum = -R3_N1 / (delta * delta);
                break;
            default:
                sum = 0.0;
                break;
        }
        for (int k = 0; k < R3_N.length; k++) {
            int i = R3_I[k];
            int j = R3_J[k];
            double n = R3_N[k];
            switch (which) {
                case G:
                    sum += n * ipow(delta, i) * ipow(tau, j);
                    break;
                case G_PI:
                    sum += n * i * ipow(delta, i - 1) * ipow(tau, j);
                    break;
                case G_PIPI:
                    sum += n * i * (i - 1) * ipow(delta, i - 2) * ipow(tau, j);
                    break;
                case G_TAU:
                    sum += n * ipow(delta, i) * j * ipow(tau, j - 1);
                    break;
                case G_TAUTAU:
                    sum += n * ipow(delta, i) * j * (j - 1) * ipow(tau, j - 2);
                    break;
                default:
                    sum += n * i * ipow(delta, i - 1) * j * ipow(tau, j - 1);
                    break;
            }
        }
        return sum;
    }

    /** Region 3 pressure from density and temperature, Pa. */
    public static double pressure3(double rhoKgM3, double tK) {
        double delta = rhoKgM3 / CRITICAL_DENSITY_KG_M3;
        double tau = CRITICAL_TEMPERATURE_K / tK;
        return rhoKgM3 * R * tK * delta * phi3(delta, tau, G_PI);
    }

    /** Region 3 isothermal slope dp/drho at constant T, Pa m3/kg. */
    public static double dPressureDDensity3(double rhoKgM3, double tK) {
        double delta = rhoKgM3 / CRITICAL_DENSITY_KG_M3;
        double tau = CRITICAL_TEMPERATURE_K / tK;
        return R * tK * (2.0 * delta * phi3(delta, tau, G_PI)
                + delta * delta * phi3(delta, tau, G_PIPI));
    }

    /** Region 3 specific enthalpy, J/kg. */
    public static double enthalpy3(double rhoKgM3, double tK) {
        double delta = rhoKgM3 / CRITICAL_DENSITY_KG_M3;
        double tau = CRITICAL_TEMPERATURE_K / tK;
        return R * tK * (tau * phi3(delta, tau, G_TAU) + delta * phi3(delta, tau, G_PI));
    }

    /** Region 3 specific internal energy, J/kg. */
    public static double internalEnergy3(double rhoKgM3, double tK) {
        double tau = CRITICAL_TEMPERATURE_K / tK;
        return R * tK * tau * phi3(rhoKgM3 / CRITICAL_DENSITY_KG_M3, tau, G_TAU);
    }

    /** Region 3 specific entropy, J/(kg K). */
    public static double entropy3(double rhoKgM3, double tK) {
        double delta = rhoKgM3 / CRITICAL_DENSITY_KG_M3;
        double tau = CRITICAL_TEMPERATURE_K / tK;
        return R * (tau * phi3(delta, tau, G_TAU) - phi3(delta, tau, G));
    }

    /** Region 3 specific isobaric heat capacity, J/(kg K). */
    public static double cp3(double rhoKgM3, double tK) {
        double delta = rhoKgM3 / CRITICAL_DENSITY_KG_M3;
        double tau = CRITICAL_TEMPERATURE_K / tK;
        double pd = phi3(delta, tau, G_PI);
        double pdd = phi3(delta, tau, G_PIPI);
        double ptt = phi3(delta, tau, G_TAUTAU);
        double pdt = phi3(delta, tau, G_PITAU);
        double x = delta * pd - delta * tau * pdt;
        return R * (-tau * tau * ptt + x * x / (2.0 * delta * pd + delta * delta * pdd));
    }

    /** Region 3 speed of sound, m/s. */
    public static double speedOfSound3(double rhoKgM3, double tK) {
        double delta = rhoKgM3 / CRITICAL_DENSITY_KG_M3;
        double tau = CRITICAL_TEMPERATURE_K / tK;
        double pd = phi3(delta, tau, G_PI);
        double pdd = phi3(delta, tau, G_PIPI);
        double ptt = phi3(delta, tau, G_TAUTAU);
        double pdt = phi3(delta, tau, G_PITAU);
        double x = delta * pd - delta * tau * pdt;
        return Math.sqrt(R * tK * (2.0 * delta * pd + delta * delta * pdd - x * x / (tau * tau * ptt)));
    }

    /**
     * Density on the liquid (or vapour) branch of region 3 where p3(rho, T) equals {@code pPa}:
     * the saturated densities above 623.15 K when {@code pPa} is the saturation pressure.
     * A coarse march from the far end of the branch brackets the first crossing, then Newton
     * steps refine it inside the bracket (bisection when a step leaves it).
     *
     * @param liquid true for the liquid branch (march down from 800 kg/m3), false for the
     *               vapour branch (march up from 50 kg/m3)
     * @return density in kg/m3, or NaN if no crossing is found
     */
    public static double density3(double pPa, double tK, boolean liquid) {
        final double stepKgM3 = 2.0;
        double a = liquid ? 800.0 : 50.0;
        double fa = pressure3(a, tK) - pPa;
        if (liquid ? fa < 0.0 : fa > 0.0) {
            return Double.NaN;
        }
        double b = a;
        double fb = fa;
        boolean found = false;
        for (int k = 0; k < 600; k++) {
            b = liquid ? a - stepKgM3 : a + stepKgM3;
            fb = pressure3(b, tK) - pPa;
            if ((fa > 0.0) != (fb > 0.0) || fb == 0.0) {
                found = true;
                break;
            }
            a = b;
            fa = fb;
        }
        if (!found) {
            return Double.NaN;
        }
        double lo = Math.min(a, b);
        double hi = Math.max(a, b);
        double flo = lo == a ? fa : fb;
        double rho = 0.5 * (lo + hi);
        for (int k = 0; k < 200; k++) {
            double f = pressure3(rho, tK) - pPa;
            if (f == 0.0) {
                return rho;
            }
            if ((f > 0.0) == (flo > 0.0)) {
                lo = rho;
                flo = f;
            } else {
                hi = rho;
            }
            double next = rho - f / dPressureDDensity3(rho, tK);
            if (!(next > lo && next < hi)) {
                next = 0.5 * (lo + hi);
            }
            double change = Math.abs(next - rho);
            rho = next;
            if (change <= 1e-15 * rho || hi - lo <= 4e-16 * rho) {
                break;
            }
        }
        return rho;
    }

    // ---------------------------------------------------------------- region 4, Table 34

    private static final double N1 = 0.11670521452767e4;
    private static final double N2 = -0.72421316703206e6;
    private static final double N3 = -0.17073846940092e2;
    private static final double N4 = 0.12020824702470e5;
    private static final double N5 = -0.32325550322333e7;
    private static final double N6 = 0.14915108613530e2;
    private static final double N7 = -0.48232657361591e4;
    private static final double N8 = 0.40511340542057e6;
    private static final double N9 = -0.23855557567849;
    private static final double N10 = 0.65017534844798e3;

    /** Saturation pressure at temperature T (273.15 K to 647.096 K), Pa: IF97 eq. 30. */
    public static double saturationPressurePa(double tK) {
        double theta = tK + N9 / (tK - N10);
        double a = theta * theta + N1 * theta + N2;
        double b = N3 * theta * theta + N4 * theta + N5;
        double c = N6 * theta * theta + N7 * theta + N8;
        double x = 2.0 * c / (-b + Math.sqrt(b * b - 4.0 * a * c));
        double x2 = x * x;
        return x2 * x2 * MPA;
    }

    /** Saturation temperature at pressure p (611.213 Pa to 22.064 MPa), K: IF97 eq. 31. */
    public static double saturationTemperatureK(double pPa) {
        double beta = Math.sqrt(Math.sqrt(pPa / MPA));
        double beta2 = beta * beta;
        double e = beta2 + N3 * beta + N6;
        double f = N1 * beta2 + N4 * beta + N7;
        double g = N2 * beta2 + N5 * beta + N8;
        double d = 2.0 * g / (-f - Math.sqrt(f * f - 4.0 * e * g));
        double s = N10 + d;
        return 0.5 * (s - Math.sqrt(s * s - 4.0 * (N9 + N10 * d)));
    }

    // ---------------------------------------------------------------- helpers

    /** x to an integer power by repeated squaring (negative powers through the reciprocal). */
    static double ipow(double x, int n) {
        if (n < 0) {
            return 1.0 / ipow(x, -n);
        }
        double result = 1.0;
        double base = x;
        int e = n;
        while (e != 0) {
            if ((e & 1) != 0) {
                result *= base;
            }
            base *= base;
            e >>= 1;
        }
        return result;
    }
}
