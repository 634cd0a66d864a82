package org.drumloop.core.control;

/** What a {@link Pid} did in its last scan, for trends and tests. Plain fields, overwritten each scan. */
public final class PidStatus {
    /** Setpoint and measurement used. */
    public double sp;
    public double pv;
    /** Control error with the action sign applied (positive means "more output"). */
    public double error;
    /** Proportional, integral and derivative parts and the feedforward added. */
    public double p;
    public double i;
    public double d;
    public double ff;
    /** Output before limits (P + I + D + FF) and after limits and rate limit. */
    public double unlimited;
    public double out;
    /** The output was held at a limit (magnitude or rate) in this scan. */
    public boolean limited;
    /** The block followed its tracking input in this scan (manual or inactive). */
    public boolean tracking;
    /** An input was not finite; state and output were held. */
    public boolean badInput;
}
