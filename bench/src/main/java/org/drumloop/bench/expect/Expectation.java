package org.drumloop.bench.expect;

import java.util.Locale;

import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.EngUnit;

/**
 * An acceptance criterion of a scenario, judged while the run goes: {@link #observe} is called once
 * per recorded scan (no allocation), {@link #finish} once at the end.
 */
public abstract class Expectation {
    /** Times within this of a stated instant count as at that instant (half of the shortest scan, 10 ms). */
    protected static final double TIME_EPS_S = 0.005;

    private final String file;
    private final int line;
    private final String text;

    protected Expectation(String file, int line, String text) {
        this.file = file;
        this.line = line;
        this.text = text;
    }

    public String file() { return file; }

    public int line() { return line; }

    public String text() { return text; }

    /** Resolve names against the firmware (interlock tags); errors name the scenario line. */
    public void bind(Binder binder) throws ConfigException {
    }

    /** Reset the judging state; called before a run. */
    public abstract void start();

    /** One sample. Must not allocate. */
    public abstract void observe(Frame f);

    /** Verdict after the last sample at {@code endS}. */
    public abstract Outcome finish(double endS);

    protected Outcome outcome(boolean passed, String measured) {
        return new Outcome(line, text, passed, measured);
    }

    protected ConfigException error(String word, String message) {
        return new ConfigException(file, line, word, message);
    }

    /** A value in engineering units with its symbol, e.g. {@code -41.3 mm}. */
    public static String eng(Channel c, double si) {
        if (Double.isNaN(si)) {
            return "n/a";
        }
        return fmt(c.unit().fromSi(si), c.decimals()) + " " + c.unit().symbol();
    }

    /** A difference in engineering units (no offset: barg, degC). */
    public static String engDelta(Channel c, double si) {
        EngUnit u = c.unit();
        return fmt(u.fromSi(si) - u.fromSi(0.0), c.decimals()) + " " + u.symbol();
    }

    public static String fmt(double v, int decimals) {
        return String.format(Locale.ROOT, "%." + Math.max(0, Math.min(decimals, 6)) + "f", v);
    }

    public static String seconds(double s) {
        return fmt(s, 1) + " s";
    }
}
