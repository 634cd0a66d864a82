package org.drumloop.core.control;

/**
 * PID block in ideal (ISA) form with setpoint weighting, filtered derivative, output and rate limits,
 * direct/reverse action, anti-windup by back-calculation, a tracking input for bumpless transfer and
 * bumpless parameter changes. See {@link PidParams} for the control law.
 *
 * <p>Discretisation for scan period h (Astrom and Hagglund, Advanced PID Control, ISA 2006, on the computer
 * implementation of PID controllers; chapter not given, from memory):
 * <pre>
 *   P(k)   = s Kc (b r(k) - y(k))
 *   D(k)   = Td/(Td + N h) D(k-1) + s Kc Td N/(Td + N h) ((c r(k) - y(k)) - (c r(k-1) - y(k-1)))
 *   v(k)   = P(k) + I(k) + D(k) + ff(k);   u(k) = rate- and magnitude-limited v(k)
 *   I(k+1) = I(k) + s Kc h/Ti (r(k) - y(k)) + h/Tt (u(k) - v(k))
 * </pre>
 * The backward-difference derivative is stable for every Td, N and h. The back-calculation term uses
 * the output actually sent (after both limits), so a rate-limited output also stops windup. With no
 * integral action (Ti infinite) I is a fixed bias (the manual-reset value) set by tracking or
 * {@link #reset}, and back-calculation is off.
 *
 * <p>First scan after construction or {@link #reset}: the derivative memory is seeded with the present
 * input, so the first output has no derivative spike; the rate limit starts from the first output.
 * Non-finite setpoint, measurement or feedforward: state untouched, previous output held,
 * {@link PidStatus#badInput} raised. Allocation-free; no clock.
 */
public final class Pid {
    private PidParams prm;
    private final PidStatus status = new PidStatus();

    private double integral;
    private double derivative;
    private double lastDerivInput;
    private double lastSp = Double.NaN;
    private double lastPv = Double.NaN;
    private double out;
    private boolean seeded;
    private boolean inhibitUp;
    private boolean inhibitDown;

    public Pid(PidParams params) {
        this.prm = params;
    }

    public PidParams params() { return prm; }

    /**
     * Change settings between scans without a bump: the integral absorbs the change of the
     * proportional term at the last setpoint and measurement, so the next output starts where the
     * last one ended (Astrom and Hagglund 2006, bumpless parameter changes).
     */
    public void setParams(PidParams next) {
        if (seeded && Double.isFinite(lastSp) && Double.isFinite(lastPv)) {
            double pOld = sign(prm) * prm.kc() * (prm.b() * lastSp - lastPv);
            double pNew = sign(next) * next.kc() * (next.b() * lastSp - lastPv);
            integral += pOld - pNew;
            // Keep the derivative state in the new gain's scale; its contribution decays anyway.
            if (prm.kc() > 0.0 && sign(prm) == sign(next) && prm.tdS() > 0.0 && next.tdS() > 0.0) {
                derivative *= next.kc() / prm.kc();
            } else {
                derivative = 0.0;
            }
        }
        this.prm = next;
    }

    /**
     * Conditional integration for cascades: while a downstream stage is at a limit, the integral may
     * not move the output further towards it ({@code up}: no increase, {@code down}: no decrease).
     * Stays in force until changed; the caller sets it before each {@link #update}.
     */
    public void inhibitIntegration(boolean up, boolean down) {
        inhibitUp = up;
        inhibitDown = down;
    }

    /** Forget the history: the output becomes {@code outValue} held by the integral (bias). */
    public void reset(double outValue) {
        integral = outValue;
        derivative = 0.0;
        out = outValue;
        seeded = false;
    }

    /**
     * Automatic operation for one scan.
     *
     * @param sp  setpoint r
     * @param pv  measurement y
     * @param ff  feedforward added to the output (inside the limits and anti-windup)
     * @param dtS scan period h [s]; a non-positive period changes nothing
     * @return the output u
     */
    public double update(double sp, double pv, double ff, double dtS) {
        PidStatus st = status;
        st.tracking = false;
        if (!Double.isFinite(sp) || !Double.isFinite(pv) || !Double.isFinite(ff) || !(dtS > 0.0)) {
            st.badInput = !(Double.isFinite(sp) && Double.isFinite(pv) && Double.isFinite(ff));
            st.out = out;
            return out;
        }
        st.badInput = false;
        PidParams p = prm;
        double s = sign(p);
        double pTerm = s * p.kc() * (p.b() * sp - pv);
        double dTerm = derivativeStep(p, s, sp, pv, dtS);
        double v = pTerm + integral + dTerm + ff;
        double u = v;
        boolean lim = false;
        if (u > p.outMax()) {
            u = p.outMax();
            lim = true;
        } else if (u < p.outMin()) {
            u = p.outMin();
            lim = true;
        }
        if (seeded && Double.isFinite(p.rateMaxPerS())) {
            double step = p.rateMaxPerS() * dtS;
            if (u > out + step) {
                u = out + step;
                lim = true;
            } else if (u < out - step) {
                u = out - step;
                lim = true;
            }
        }
        st.sp = sp;
        st.pv = pv;
        st.error = s * (sp - pv);
        st.p = pTerm;
        st.i = integral;
        st.d = dTerm;
        st.ff = ff;
        st.unlimited = v;
        st.out = u;
        st.limited = lim;
        if (Double.isFinite(p.tiS())) {
            double dI = s * p.kc() * dtS / p.tiS() * (sp - pv);
            if ((dI > 0.0 && inhibitUp) || (dI < 0.0 && inhibitDown)) {
                dI = 0.0;
            }
            double next = integral + dI;
            if (Double.isFinite(p.ttS())) {
                // A gain h/Tt above 1 would overcorrect in one scan; cap it (reset completes in one scan).
                double k = Math.min(dtS / p.ttS(), 1.0);
                next += k * (u - v);
            }
            if (Double.isFinite(next)) {
                integral = next;
            }
        }
        out = u;
        lastSp = sp;
        lastPv = pv;
        seeded = true;
        return u;
    }

    /**
     * Tracking (manual or inactive) for one scan: the output is {@code trackOut} and the integral is set
     * so that P + I + D + ff equals it; the derivative memory follows the measurement. The first
     * automatic scan afterwards therefore starts at {@code trackOut} (bumpless transfer).
     */
    public double track(double sp, double pv, double ff, double trackOut, double dtS) {
        PidStatus st = status;
        st.tracking = true;
        if (!Double.isFinite(trackOut)) {
            st.badInput = true;
            st.out = out;
            return out;
        }
        PidParams p = prm;
        double s = sign(p);
        boolean inputsOk = Double.isFinite(sp) && Double.isFinite(pv) && Double.isFinite(ff);
        st.badInput = !inputsOk;
        double pTerm = 0.0;
        double dTerm = 0.0;
        double ffUsed = 0.0;
        if (inputsOk) {
            pTerm = s * p.kc() * (p.b() * sp - pv);
            dTerm = dtS > 0.0 ? derivativeStep(p, s, sp, pv, dtS) : derivative;
            ffUsed = ff;
            lastSp = sp;
            lastPv = pv;
            seeded = true;
        } else {
            seeded = false;
        }
        integral = trackOut - pTerm - dTerm - ffUsed;
        out = trackOut;
        st.sp = sp;
        st.pv = pv;
        st.error = s * (sp - pv);
        st.p = pTerm;
        st.i = integral;
        st.d = dTerm;
        st.ff = ffUsed;
        st.unlimited = trackOut;
        st.out = trackOut;
        st.limited = false;
        return trackOut;
    }

    private double derivativeStep(PidParams p, double s, double sp, double pv, double dtS) {
        double in = p.c() * sp - pv;
        if (!seeded) {
            lastDerivInput = in;
            derivative = 0.0;
            return 0.0;
        }
        if (p.tdS() > 0.0) {
            double den = p.tdS() + p.n() * dtS;
            derivative = p.tdS() / den * derivative + s * p.kc() * p.tdS() * p.n() / den * (in - lastDerivInput);
        } else {
            derivative = 0.0;
        }
        lastDerivInput = in;
        return derivative;
    }

    private static double sign(PidParams p) {
        return p.reverse() ? 1.0 : -1.0;
    }

    /** Last output. */
    public double out() { return out; }

    /** Integral state (the bias in P-only use). */
    public double integral() { return integral; }

    /** Status of the last scan (live object, overwritten each scan). */
    public PidStatus status() { return status; }
}
