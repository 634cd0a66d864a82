package org.drumloop.bench.expect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.function.DoubleUnaryOperator;

import org.junit.jupiter.api.Test;

/**
 * Each expectation kind judged on synthetic traces whose answer is known in closed form.
 */
class ExpectationTest {
    private static final double DT = 0.1;
    private static final String F = "t.scenario";

    /** Feed a level trace x(t) from 0 to endS; setpoint 0. */
    private static Outcome run(Expectation e, double endS, DoubleUnaryOperator levelM) {
        Frame f = new Frame(2);
        e.start();
        long n = Math.round(endS / DT);
        for (long k = 0; k <= n; k++) {
            f.tS = k * DT;
            f.set(Channel.DRUM_LEVEL, levelM.applyAsDouble(f.tS));
            f.set(Channel.SETPOINT, 0.0);
            e.observe(f);
        }
        return e.finish(n * DT);
    }

    @Test
    void bandHoldsInsideAndFailsAtTheFirstSampleOutside() {
        // x = 0.05 sin(2 pi t / 100): peak 50 mm
        DoubleUnaryOperator sine = t -> 0.05 * Math.sin(2 * Math.PI * t / 100);
        assertTrue(run(new BandExpectation(F, 1, "b", Channel.DRUM_LEVEL, -0.051, 0.051, 0, 200), 200, sine).passed());
        Outcome o = run(new BandExpectation(F, 1, "b", Channel.DRUM_LEVEL, -0.04, 0.04, 0, 200), 200, sine);
        assertFalse(o.passed());
        // first time 0.05 sin(2 pi t/100) > 0.04: t = 100/(2 pi) asin(0.8) = 14.758 s -> first sample 14.8 s
        assertTrue(o.measured().contains("first outside at 14.8 s"), o.measured());
        // outside the window it does not matter
        assertTrue(run(new BandExpectation(F, 1, "b", Channel.DRUM_LEVEL, -0.01, 0.01, 0, 0.5), 200, sine).passed());
    }

    @Test
    void bandFailsWhenTheRunEndsBeforeTheWindow() {
        assertFalse(run(new BandExpectation(F, 1, "b", Channel.DRUM_LEVEL, -1, 1, 0, 300), 200, t -> 0).passed());
    }

    @Test
    void bandTreatsNanAsOutside() {
        assertFalse(run(new BandExpectation(F, 1, "b", Channel.DRUM_LEVEL, -1, 1, 0, 10), 10,
                t -> t > 5 ? Double.NaN : 0).passed());
    }

    @Test
    void settlingTimeOfAFirstOrderDecayMatchesTheClosedForm() {
        // x = 0.1 exp(-(t-10)/20) after a step at 10 s: |x| <= 0.01 from t = 10 + 20 ln 10 = 56.05 s
        DoubleUnaryOperator decay = t -> t < 10 ? 0 : 0.1 * Math.exp(-(t - 10) / 20);
        Outcome ok = run(new SettleExpectation(F, 1, "s", Channel.DRUM_LEVEL, 0, 0.01, 47, 10), 200, decay);
        assertTrue(ok.passed(), ok.measured());
        // last sample outside is 56.0 s -> settling time 46.0 s (one-sample resolution)
        assertTrue(ok.measured().startsWith("settling time 46.0 s"), ok.measured());
        assertFalse(run(new SettleExpectation(F, 1, "s", Channel.DRUM_LEVEL, 0, 0.01, 45, 10), 200, decay).passed());
    }

    @Test
    void settlingMustStayInside() {
        // inside early, leaves again at 150 s: not settled
        DoubleUnaryOperator late = t -> t > 150 ? 0.02 : 0;
        assertFalse(run(new SettleExpectation(F, 1, "s", Channel.DRUM_LEVEL, 0, 0.01, 60, 10), 200, late).passed());
    }

    @Test
    void alarmWithinAndNever() {
        Frame f = new Frame(2);
        InterlockExpectation within = new InterlockExpectation(F, 1, "a", false, "LAL", false, 600, 630);
        InterlockExpectation tooSoon = new InterlockExpectation(F, 1, "a", false, "LAL", false, 600, 610);
        InterlockExpectation never = new InterlockExpectation(F, 1, "t", true, "LALL", true, 0, 900);
        InterlockExpectation neverOther = new InterlockExpectation(F, 1, "t", true, "LALL", true, 0, 900);
        within.bindIndex(0);
        tooSoon.bindIndex(0);
        never.bindIndex(0);
        neverOther.bindIndex(1);
        Expectation[] all = {within, tooSoon, never, neverOther};
        for (Expectation e : all) {
            e.start();
        }
        for (int k = 0; k <= 9000; k++) {
            f.tS = k * DT;
            f.interlockActive[0] = f.tS >= 625.0 - 1e-9 && f.tS < 700;
            for (Expectation e : all) {
                e.observe(f);
            }
        }
        Outcome o = within.finish(900);
        assertTrue(o.passed());
        assertTrue(o.measured().contains("raised 25.0 s after 600.0 s"), o.measured());
        assertFalse(tooSoon.finish(900).passed());
        assertFalse(never.finish(900).passed());
        assertTrue(neverOther.finish(900).passed());
    }

    @Test
    void modeAtAndWithin() {
        Frame f = new Frame(0);
        ModeExpectation at = new ModeExpectation(F, 1, "m", "single-element", true, 450, 450);
        ModeExpectation within = new ModeExpectation(F, 1, "m", "single-element", false, 400, 402);
        ModeExpectation late = new ModeExpectation(F, 1, "m", "single-element", false, 400, 401);
        Expectation[] all = {at, within, late};
        for (Expectation e : all) {
            e.start();
        }
        for (int k = 0; k <= 9000; k++) {
            f.tS = k * DT;
            f.modeLabel = f.tS >= 401.5 - 1e-9 ? "single-element" : "three-element";
            for (Expectation e : all) {
                e.observe(f);
            }
        }
        assertTrue(at.finish(900).passed());
        Outcome w = within.finish(900);
        assertTrue(w.passed());
        assertTrue(w.measured().contains("1.5 s after"), w.measured());
        assertFalse(late.finish(900).passed());
    }

    @Test
    void iaeOfARampEqualsTheTriangleArea() {
        // |e| = 0.001 t over 0..100 s: IAE = 0.001 * 100^2 / 2 = 5 m*s (closed form); the rectangle rule
        // with the sample at the end of each interval over-estimates by 0.001 * 100 * dt / 2 = 0.005 m*s
        IaeExpectation e = new IaeExpectation(F, 1, "i", Channel.DRUM_LEVEL, Channel.SETPOINT, Double.NaN, 5.01, 0, 100);
        Outcome o = run(e, 100, t -> -0.001 * t);
        assertEquals(5.0, e.iaeSiS(), 0.0051);
        assertTrue(o.passed());
        IaeExpectation tight = new IaeExpectation(F, 1, "i", Channel.DRUM_LEVEL, null, 0.0, 4.9, 0, 100);
        assertFalse(run(tight, 100, t -> 0.001 * t).passed());
    }
}
