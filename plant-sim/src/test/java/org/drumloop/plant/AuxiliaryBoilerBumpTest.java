package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringWriter;
import org.junit.jupiter.api.Test;

/**
 * Open-loop bump tests of the invented auxiliary boiler (aux-boiler.plant, numbers invented for
 * demo) against the features computed in the project reference §10 (source: Åström &amp; Bell
 * 2000 model, values computed by an independent implementation with IF97, as recorded in the
 * project reference): steam +2 t/h → swell +73 mm at 15 s, level above its start for 300 s,
 * pressure 0.90 → 0.65 MPa; feed +2 t/h → dip −23 mm at 30 s, zero crossing at 199 s; heat
 * +0.8 MW → +20 mm at 4 s, −38 mm at 50 s.
 */
class AuxiliaryBoilerBumpTest {
    private static final double TWO_TPH_PERCENT = 20; // 2 t/h of the 10 t/h rating

    @Test
    void steamBumpSwellsAndPressureFalls() throws Exception {
        StringWriter csv = new StringWriter();
        BumpTest.Result r = BumpTest.run(PlantFiles.aux(), BumpTest.Input.STEAM, TWO_TPH_PERCENT, 310, 1, csv);
        // magnitudes: the demo plant file rounds the §10 data (e.g. NWL volume), so 2 mm and 1 s
        assertEquals(0.073, r.maxLevelM(), 0.002, "swell peak [m]");
        assertEquals(15, r.maxLevelTimeS(), 1.0, "time of the peak after the step [s]");
        assertTrue(r.minLevelM() >= 0, "level stays above its start for 300 s");
        assertEquals(0.65e6, r.finalPressurePa(), 0.01e6, "pressure after 300 s, given to 0.01 MPa");
        String[] lines = csv.toString().split("\n");
        assertEquals(BumpTest.HEADER, lines[0]);
        assertTrue(lines[0].startsWith("t[s],drum_level[mm],drum_pressure[barg],steam_flow[t/h],feed_flow[t/h],heat[MW]"));
        assertEquals(3101 + 1, lines.length, "one row per 100 ms, 0..310 s, plus the header");
    }

    @Test
    void feedBumpShrinksFirstThenRises() throws Exception {
        BumpTest.Result r = BumpTest.run(PlantFiles.aux(), BumpTest.Input.FEED, TWO_TPH_PERCENT, 300, 1, null);
        assertEquals(-0.023, r.minLevelM(), 0.002, "shrink dip [m]");
        assertEquals(30, r.minLevelTimeS(), 2.0, "time of the dip [s]; flat minimum");
        assertTrue(r.finalLevelM() > 0, "back above the start after the zero crossing near 199 s");
    }

    @Test
    void feedBumpCrossesZeroNear199Seconds() throws Exception {
        Plant p = new Plant(PlantFiles.aux(), 1);
        p.setSteamFlowOverrideKgS(p.steamFlowKgS());
        p.setFeedFlowOverrideKgS(p.feedFlowKgS() + 2 / 3.6);
        p.setFiringManual(p.firingFrac());
        double crossing = Double.NaN;
        double prev = 0;
        for (int i = 1; i <= 3000 && Double.isNaN(crossing); i++) {
            p.step(0.1);
            if (i > 10 && prev < 0 && p.levelM() >= 0) {
                crossing = i * 0.1;
            }
            prev = p.levelM();
        }
        assertEquals(199, crossing, 3.0, "zero crossing [s]");
    }

    @Test
    void heatBumpSwellsThenCollapses() throws Exception {
        Plant p = new Plant(PlantFiles.aux(), 1);
        p.setSteamFlowOverrideKgS(p.steamFlowKgS());
        p.setFeedFlowOverrideKgS(p.feedFlowKgS());
        p.setFiringManual(p.firingFrac());
        p.setHeatStepW(0.8e6);
        double at4 = 0;
        for (int i = 1; i <= 500; i++) {
            p.step(0.1);
            if (i == 40) {
                at4 = p.levelM();
            }
        }
        assertEquals(0.020, at4, 0.002, "level at 4 s [m]");
        assertEquals(-0.038, p.levelM(), 0.002, "level at 50 s [m]");
    }

    @Test
    void fuelBumpRaisesPressure() throws Exception {
        BumpTest.Result r = BumpTest.run(PlantFiles.aux(), BumpTest.Input.FUEL, 5, 60, 1, null);
        assertTrue(r.finalPressurePa() > 0.9e6, "more firing, higher pressure: " + r.finalPressurePa());
    }
}
