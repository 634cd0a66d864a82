package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.drumloop.plant.water.Iapws97;
import org.drumloop.plant.water.SaturationState;
import org.drumloop.plant.water.SaturationTable;
import org.junit.jupiter.api.Test;

/**
 * Differential-pressure level with a cold reference leg: check-values §4.1 worked example
 * (H = 0.800 m, reference leg 50 °C, level 0.400 m; densities and dP computed there with IF97).
 */
class LevelTransmitterTest {
    private static final double H_M = 0.8;
    private static final double T_REF_K = 50 + 273.15;

    private static void check(double pPa, double dpAtHalf, double dpEmpty, double dpFull) {
        SaturationState s = new SaturationState();
        SaturationTable.standard().lookup(pPa, s);
        double rhoRef = Iapws97.liquidDensity(pPa, T_REF_K);
        // values printed to 0.01 Pa; densities to 6 digits: 0.05 Pa covers both
        assertEquals(dpAtHalf, LevelDp.dpPa(H_M, 0.4, rhoRef, s.rhoW, s.rhoS), 0.05, "dP at h = 0.4 m");
        assertEquals(dpEmpty, LevelDp.dpPa(H_M, 0, rhoRef, s.rhoW, s.rhoS), 0.05, "dP at h = 0");
        assertEquals(dpFull, LevelDp.dpPa(H_M, H_M, rhoRef, s.rhoW, s.rhoS), 0.05, "dP at h = H");
        // inverting with the right densities gives h = 0.400000 m (check-values §4.1)
        assertEquals(0.4, LevelDp.levelM(H_M, dpAtHalf, rhoRef, s.rhoW, s.rhoS), 1e-6);
    }

    @Test
    void workedExampleAtTenBar() {
        check(10e5, 4254.53, 7714.25, 794.81);
    }

    @Test
    void workedExampleAtSixtyBar() {
        check(60e5, 4677.32, 7529.78, 1824.85);
    }

    @Test
    void plantLevelTransmitterIsReverseActingAndReadsMidScaleAtNwl() throws Exception {
        Plant p = new Plant(PlantFiles.aux(), 1);
        Transmitter t = p.transmitter(TransmitterId.LEVEL_A);
        assertTrue(t.upperRangeValue() < t.lowerRangeValue(), "reverse acting: 20 mA at the smaller dP");
        // symmetric range -300..+300 mm, calibrated hot at the nominal pressure: NWL is mid-scale
        // 12 mA (check-values §3 scaling); noise 10 Pa over a ~5 kPa span is about 0.03 mA
        assertEquals(12.0, t.currentMa(), 0.15);
        // the noise-free dP follows the reference-leg formula for the plant's true level
        double dp = LevelDp.dpPa(p.levelTapSpanM(), p.levelM() - p.levelTapLowM(), p.referenceLegDensity(),
                p.waterDensity(), p.steamDensity());
        assertEquals(dp, t.value(), 6 * 10, "within 6 sigma of the 10 Pa noise");
    }
}
