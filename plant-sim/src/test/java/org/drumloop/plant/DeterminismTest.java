package org.drumloop.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import org.junit.jupiter.api.Test;

/** Same plant file, seed and inputs give bit-identical results; another seed changes only noise. */
class DeterminismTest {

    private static double[] run(long seed) throws Exception {
        Plant p = new Plant(PlantFiles.aux(), seed);
        double[] out = new double[7];
        for (int i = 0; i < 1200; i++) {
            if (i == 100) {
                p.setSteamDemand(1.2);
            }
            if (i == 600) {
                p.setFeedValveDemand(0.75);
            }
            p.step(0.1);
            out[6] += p.transmitter(TransmitterId.LEVEL_A).value();
        }
        out[0] = p.levelM();
        out[1] = p.drumPressurePa();
        out[2] = p.feedFlowKgS();
        out[3] = p.transmitter(TransmitterId.LEVEL_A).value();
        out[4] = p.transmitter(TransmitterId.DRUM_PRESSURE).currentMa();
        out[5] = p.transmitter(TransmitterId.LEVEL_C).value();
        return out;
    }

    @Test
    void sameSeedGivesBitIdenticalResults() throws Exception {
        double[] a = run(42);
        double[] b = run(42);
        for (int i = 0; i < a.length; i++) {
            assertEquals(Double.doubleToRawLongBits(a[i]), Double.doubleToRawLongBits(b[i]), "output " + i);
        }
    }

    @Test
    void differentSeedsDifferInNoiseOnly() throws Exception {
        double[] a = run(42);
        double[] b = run(43);
        for (int i = 0; i < 3; i++) {
            assertEquals(Double.doubleToRawLongBits(a[i]), Double.doubleToRawLongBits(b[i]), "truth " + i + " is seed-free");
        }
        assertNotEquals(a[6], b[6], "noisy transmitter differs over the run");
        // level noise is 10 Pa (aux-boiler.plant): 6 sigma of the difference of two draws bounds it
        assertEquals(a[3], b[3], 6 * Math.sqrt(2) * 10, "and only by noise [Pa]");
    }

    @Test
    void threeLevelTransmittersHaveIndependentNoise() throws Exception {
        double[] a = run(42);
        assertNotEquals(a[3], a[5]);
    }
}
