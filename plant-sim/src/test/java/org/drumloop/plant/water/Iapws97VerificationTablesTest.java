package org.drumloop.plant.water;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The verification values printed in the IAPWS-IF97 release, reproduced by {@link Iapws97}.
 * The release prints nine significant digits (in MPa, K, m3/kg, kJ/kg, kJ/(kg K), m/s), so every
 * check allows 1e-8 relative: a value rounded to nine digits can be off by half a unit in the
 * ninth digit, at most 5e-9 relative (tolerance choice: common practice). Two raw region 2
 * values (700 K, 30 MPa: v and h) sit right at a rounding boundary, which the tolerance covers.
 */
class Iapws97VerificationTablesTest {

    /** Nine printed digits: half a unit in the ninth digit is at most 5e-9; 1e-8 leaves margin. */
    private static final double REL_TOL = 1e-8;
    private static final double MPA = 1e6;
    private static final double KJ = 1e3;

    private static void assertRel(double expected, double actual, String what) {
        assertEquals(expected, actual, Math.abs(expected) * REL_TOL, what);
    }

    @Test
    void saturationPressureMatchesTable35() {
        // source: IAPWS-IF97, Table 35
        assertRel(0.353658941e-2 * MPA, Iapws97.saturationPressurePa(300.0), "psat(300 K)");
        assertRel(0.263889776e1 * MPA, Iapws97.saturationPressurePa(500.0), "psat(500 K)");
        assertRel(0.123443146e2 * MPA, Iapws97.saturationPressurePa(600.0), "psat(600 K)");
    }

    @Test
    void saturationTemperatureMatchesTable36() {
        // source: IAPWS-IF97, Table 36
        assertRel(0.372755919e3, Iapws97.saturationTemperatureK(0.1 * MPA), "Tsat(0.1 MPa)");
        assertRel(0.453035632e3, Iapws97.saturationTemperatureK(1.0 * MPA), "Tsat(1 MPa)");
        assertRel(0.584149488e3, Iapws97.saturationTemperatureK(10.0 * MPA), "Tsat(10 MPa)");
    }

    /** Row of Table 5 or 15: T, p, then v, h, u, s, cp, w in the release's units. */
    private static void checkRegion1(double tK, double pMpa, double v, double h, double u,
            double s, double cp, double w) {
        double p = pMpa * MPA;
        String at = " at " + tK + " K, " + pMpa + " MPa";
        assertRel(v, Iapws97.specificVolume1(p, tK), "v1" + at);
        assertRel(h * KJ, Iapws97.enthalpy1(p, tK), "h1" + at);
        assertRel(u * KJ, Iapws97.internalEnergy1(p, tK), "u1" + at);
        assertRel(s * KJ, Iapws97.entropy1(p, tK), "s1" + at);
        assertRel(cp * KJ, Iapws97.cp1(p, tK), "cp1" + at);
        assertRel(w, Iapws97.speedOfSound1(p, tK), "w1" + at);
        assertRel(1.0 / v, Iapws97.liquidDensity(p, tK), "rho1" + at);
    }

    private static void checkRegion2(double tK, double pMpa, double v, double h, double u,
            double s, double cp, double w) {
        double p = pMpa * MPA;
        String at = " at " + tK + " K, " + pMpa + " MPa";
        assertRel(v, Iapws97.specificVolume2(p, tK), "v2" + at);
        assertRel(h * KJ, Iapws97.enthalpy2(p, tK), "h2" + at);
        assertRel(u * KJ, Iapws97.internalEnergy2(p, tK), "u2" + at);
        assertRel(s * KJ, Iapws97.entropy2(p, tK), "s2" + at);
        assertRel(cp * KJ, Iapws97.cp2(p, tK), "cp2" + at);
        assertRel(w, Iapws97.speedOfSound2(p, tK), "w2" + at);
    }

    @Test
    void region1MatchesTable5() {
        // source: IAPWS-IF97, Table 5
        checkRegion1(300, 3, 0.100215168e-2, 0.115331273e3, 0.112324818e3, 0.392294792,
                0.417301218e1, 0.150773921e4);
        checkRegion1(300, 80, 0.971180894e-3, 0.184142828e3, 0.106448356e3, 0.368563852,
                0.401008987e1, 0.163469054e4);
        checkRegion1(500, 3, 0.120241800e-2, 0.975542239e3, 0.971934985e3, 0.258041912e1,
                0.465580682e1, 0.124071337e4);
    }

    @Test
    void region2MatchesTable15() {
        // source: IAPWS-IF97, Table 15
        checkRegion2(300, 0.0035, 0.394913866e2, 0.254991145e4, 0.241169160e4, 0.852238967e1,
                0.191300162e1, 0.427920172e3);
        checkRegion2(700, 0.0035, 0.923015898e2, 0.333568375e4, 0.301262819e4, 0.101749996e2,
                0.208141274e1, 0.644289068e3);
        // the 30 MPa row is the one that exposes a wrong n for (I=9, J=13) in Table 11
        checkRegion2(700, 30, 0.542946619e-2, 0.263149474e4, 0.246861076e4, 0.517540298e1,
                0.103505092e2, 0.480386523e3);
    }

    /** Row of Table 33: T, rho, then p (MPa), h, u, s, cp, w. */
    private static void checkRegion3(double tK, double rho, double pMpa, double h, double u,
            double s, double cp, double w) {
        String at = " at " + tK + " K, " + rho + " kg/m3";
        assertRel(pMpa * MPA, Iapws97.pressure3(rho, tK), "p3" + at);
        assertRel(h * KJ, Iapws97.enthalpy3(rho, tK), "h3" + at);
        assertRel(u * KJ, Iapws97.internalEnergy3(rho, tK), "u3" + at);
        assertRel(s * KJ, Iapws97.entropy3(rho, tK), "s3" + at);
        assertRel(cp * KJ, Iapws97.cp3(rho, tK), "cp3" + at);
        assertRel(w, Iapws97.speedOfSound3(rho, tK), "w3" + at);
    }

    @Test
    void region3MatchesTable33() {
        // source: IAPWS-IF97, Table 33, from memory (all 18 digits agree, which a wrong
        // recollection or a wrong coefficient would not do; also cross-checked against the
        // reference library in Iapws97AgainstReferenceLibraryTest)
        checkRegion3(650, 500, 0.255837018e2, 0.186343019e4, 0.181226279e4, 0.405427273e1,
                0.138935717e2, 0.502005554e3);
        checkRegion3(650, 200, 0.222930643e2, 0.237512401e4, 0.226365868e4, 0.485438792e1,
                0.446579342e2, 0.383444594e3);
        checkRegion3(750, 500, 0.783095639e2, 0.225868845e4, 0.210206932e4, 0.446971906e1,
                0.634165359e1, 0.760696041e3);
    }
}
