package org.drumloop.core.control;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Three-element cascade (ANSI/ISA-77.42.01-1999, content from memory: level master trims a feed-flow demand that carries
 * the steam flow as feedforward; feed-flow slave positions the valve) and bumpless changes between
 * manual, single-element and three-element (Astrom and Hagglund 2006: inactive blocks track).
 * Zero bump means equal to the last output to rounding (1e-12) when the inputs do not change.
 */
class ThreeElementTest {
    static final double H_S = 0.1;
    static final double EXACT = 1e-12;

    static ThreeElement make() {
        Pid single = new Pid(new PidParams(12.0, 240, 0, 10, 1, 0, 0, 1, 0.1, 240, true));
        Pid master = new Pid(new PidParams(83.0, 180, 0, 10, 1, 0, -1.4, 1.4, 1.4, 180, true));
        Pid slave = new Pid(new PidParams(0.09, 4, 0, 10, 1, 0, 0, 1, 0.2, 4, true));
        return new ThreeElement(single, master, slave, 1.0, 0.0, 4.2);
    }

    @Test
    void singleToThreeElementAndBackIsBumpless() {
        ThreeElement te = make();
        double sp = 0.0;
        double level = 0.004;
        double steam = 2.0;
        double feed = 2.1;
        for (int i = 0; i < 20; i++) {
            te.update(ThreeElement.SINGLE, sp, level, steam, feed, 0.5, Double.NaN, H_S);
        }
        double u = te.valveFrac();
        // while single-element runs, the master holds the feed setpoint at the measured feed flow
        assertEquals(feed, te.feedSetpointKgS(), EXACT);
        // the single-element integral moved by one scan after the last output: Kc h/Ti e
        double expectedSingleStep = 12.0 * H_S / 240 * (sp - level);
        double u3 = te.update(ThreeElement.THREE, sp, level, steam, feed, 0.5, Double.NaN, H_S);
        // three-element's first output: the slave tracked u with sp = feed = pv, so its P is zero
        // and its integral holds u exactly
        assertEquals(u, u3, EXACT);
        for (int i = 0; i < 20; i++) {
            te.update(ThreeElement.THREE, sp, level, steam, feed, 0.5, Double.NaN, H_S);
        }
        double v = te.valveFrac();
        double u1 = te.update(ThreeElement.SINGLE, sp, level, steam, feed, 0.5, Double.NaN, H_S);
        assertEquals(v, u1, EXACT, "single-element tracked the valve: first output equals it");
        assertEquals(true, expectedSingleStep < 0, "sanity: a level above setpoint closes the valve");
    }

    @Test
    void manualToEitherModeIsBumpless() {
        for (int mode : new int[] {ThreeElement.SINGLE, ThreeElement.THREE}) {
            ThreeElement te = make();
            for (int i = 0; i < 30; i++) {
                te.update(ThreeElement.MANUAL, 0.0, -0.01, 2.0, 1.8, 0.47, Double.NaN, H_S);
            }
            assertEquals(0.47, te.valveFrac(), 0.0);
            double u = te.update(mode, 0.0, -0.01, 2.0, 1.8, 0.47, Double.NaN, H_S);
            assertEquals(0.47, u, EXACT, "mode " + mode);
        }
    }

    @Test
    void theFeedSetpointIsMasterPlusFeedforward() {
        ThreeElement te = make();
        te.update(ThreeElement.MANUAL, 0.0, 0.0, 2.0, 2.0, 0.5, Double.NaN, H_S);
        te.update(ThreeElement.THREE, 0.0, -0.010, 2.5, 2.0, 0.5, Double.NaN, H_S);
        // master: tracked 2.0 - 2.0 = 0 before, then P = Kc (0 - (-0.01)) = 0.83 (level 10 mm low),
        // but its output rate limit 1.4 (kg/s)/s allows 0.14 kg/s in one 0.1 s scan
        assertEquals(0.83, te.master().status().p, 1e-12);
        assertEquals(0.14, te.masterOut(), 1e-12);
        assertEquals(2.5 + 0.14, te.feedSetpointKgS(), 1e-12);
        assertEquals(2.5, te.feedforwardKgS(), 0.0);
    }

    @Test
    void aForcedValvePositionOverridesAndEveryBlockTracksIt() {
        ThreeElement te = make();
        for (int i = 0; i < 10; i++) {
            te.update(ThreeElement.THREE, 0.0, 0.0, 2.0, 2.0, 0.5, Double.NaN, H_S);
        }
        assertEquals(0.0, te.update(ThreeElement.THREE, 0.0, 0.0, 2.0, 2.0, 0.5, 0.0, H_S), 0.0);
        // released: starts from the forced position (zero bump) and then moves with rate limit
        double u = te.update(ThreeElement.THREE, 0.0, 0.0, 2.0, 2.0, 0.5, Double.NaN, H_S);
        assertEquals(0.0, u, EXACT);
    }

    @Test
    void aSaturatedValveDoesNotWindUpTheLevelMaster() {
        ThreeElement te = make();
        te.update(ThreeElement.MANUAL, 0.0, 0.0, 2.0, 2.0, 0.9, Double.NaN, H_S);
        // level 10 mm low (master P = 0.83 kg/s, inside its +/-1.4 limits) and feed flow stuck below
        // its setpoint: the slave opens to its limit 1.0
        for (int i = 0; i < 600; i++) {
            te.update(ThreeElement.THREE, 0.0, -0.01, 2.0, 2.0, 0.5, Double.NaN, H_S);
        }
        assertEquals(1.0, te.valveFrac(), 0.0);
        double held = te.master().integral();
        for (int i = 0; i < 600; i++) {
            te.update(ThreeElement.THREE, 0.0, -0.01, 2.0, 2.0, 0.5, Double.NaN, H_S);
        }
        // conditional integration: no further increase while the valve is at its limit (without it
        // the integral would grow by Kc h/Ti e = 83*0.1/180*0.01 per scan, 0.28 kg/s over 600 scans)
        assertEquals(held, te.master().integral(), 0.0);
    }
}
