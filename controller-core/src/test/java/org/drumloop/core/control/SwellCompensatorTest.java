package org.drumloop.core.control;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Swell estimate as a washout of steam flow, K tau s/(1 + tau s): its step response is
 * K dq exp(-t/tau) (closed form); the backward-Euler form decays by tau/(tau + h) per scan.
 */
class SwellCompensatorTest {
    static final double H_S = 0.1;

    @Test
    void aSteamStepGivesADecayingEstimate() {
        double k = 0.02;
        double tau = 40.0;
        SwellCompensator s = new SwellCompensator(k, tau);
        s.update(1.0, true, H_S);
        assertEquals(0.0, s.estimateM(), 0.0, "no estimate at steady flow");
        double dq = 1.1;
        for (int i = 1; i <= 400; i++) {
            s.update(1.0 + dq, true, H_S);
            // exact discrete form
            assertEquals(k * dq * Math.pow(tau / (tau + H_S), i), s.estimateM(), 1e-14);
        }
        // against the continuous response at t = 40 s: backward Euler differs by O(h/tau) = 2.5e-3 relative
        assertEquals(k * dq * Math.exp(-1.0), s.estimateM(), 2e-3 * k * dq);
    }

    @Test
    void aBadSteamFlowFreezesTheInputSoTheEstimateDecays() {
        SwellCompensator s = new SwellCompensator(0.02, 40.0);
        s.update(1.0, true, H_S);
        s.update(2.0, true, H_S);
        double e = s.estimateM();
        s.update(Double.NaN, false, H_S);
        assertEquals(e * 40.0 / 40.1, s.estimateM(), 1e-15);
    }

    @Test
    void theLoadProgramIsLinearInLoad() {
        LoadProgram p = new LoadProgram(true, 0.05, -0.05, 2.0);
        assertEquals(0.05, p.offsetM(0.0, true), 1e-15);
        assertEquals(0.0, p.offsetM(1.0, true), 1e-15);
        assertEquals(-0.05, p.offsetM(3.0, true), 1e-15, "clamped at rated load");
        assertEquals(-0.05, p.offsetM(Double.NaN, false), 1e-15, "held while the flow is unusable");
        assertEquals(0.0, new LoadProgram(false, 0.05, -0.05, 2.0).offsetM(1.0, true), 0.0);
    }
}
