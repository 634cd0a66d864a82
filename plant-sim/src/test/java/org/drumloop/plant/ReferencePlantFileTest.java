package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The whole plant built from config/plants/ab160.plant (cylindrical drum shell, feed enthalpy at
 * pump discharge pressure, steady state found from the rated steam flow) still reproduces the
 * open-loop step table of the 160 MW unit (source: Åström &amp; Bell 2000 model, values computed
 * by an independent implementation with IF97, as recorded in the project reference §7), with
 * prescribed flows and the heat step applied without burner lag.
 */
class ReferencePlantFileTest {
    private static final int[] STEPS = {20, 50, 100, 200, 500, 1000}; // 2, 5, 10, 20, 50, 100 s at 0.1 s
    private static final double[] STEAM_L_MM = {13.1, 25.3, 33.7, 32.0, 6.4, -35.5};
    private static final double[] STEAM_P_MPA = {8.4910, 8.4776, 8.4552, 8.4103, 8.2752, 8.0492};
    private static final double[] FEED_L_MM = {-0.8, -1.8, -2.6, -1.1, 16.2, 52.4};
    private static final double[] FEED_P_MPA = {8.4988, 8.4971, 8.4941, 8.4883, 8.4707, 8.4415};
    private static final double[] HEAT_L_MM = {4.9, 8.5, 9.5, 6.1, 2.0, 5.6};
    private static final double[] HEAT_P_MPA = {8.5060, 8.5149, 8.5298, 8.5598, 8.6505, 8.8045};
    // tolerances of the project's test list: 0.5 mm and 1 kPa. The file's plant differs from the
    // paper case in second-order ways (segment geometry, hf at 106 bar instead of 85 bar, steady
    // state from 181.3 t/h instead of ar = 0.051), which stay inside these bounds.
    private static final double L_TOL_MM = 0.5;
    private static final double P_TOL_PA = 1000;

    private static void check(double dqs, double dqf, double dq, double[] l, double[] pMpa) throws Exception {
        Plant p = new Plant(PlantFiles.ab160(), 1);
        p.setSteamFlowOverrideKgS(p.steamFlowKgS() + dqs);
        p.setFeedFlowOverrideKgS(p.feedFlowKgS() + dqf);
        p.setFiringManual(p.firingFrac());
        p.setHeatStepW(dq);
        int k = 0;
        for (int i = 1; i <= 1000; i++) {
            p.step(0.1);
            if (i == STEPS[k]) {
                assertEquals(l[k], p.levelM() * 1e3, L_TOL_MM, "level at " + i / 10.0 + " s");
                assertEquals(pMpa[k] * 1e6, p.drumPressurePa(), P_TOL_PA, "pressure at " + i / 10.0 + " s");
                k++;
            }
        }
    }

    @Test
    void steamStep() throws Exception {
        check(10, 0, 0, STEAM_L_MM, STEAM_P_MPA);
    }

    @Test
    void feedStep() throws Exception {
        check(0, 10, 0, FEED_L_MM, FEED_P_MPA);
    }

    @Test
    void heatStep() throws Exception {
        check(0, 0, 10e6, HEAT_L_MM, HEAT_P_MPA);
    }
}
