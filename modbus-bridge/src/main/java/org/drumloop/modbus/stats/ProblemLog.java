package org.drumloop.modbus.stats;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.LongSupplier;

import org.slf4j.Logger;
import org.slf4j.event.Level;

/**
 * Logging that a peer cannot flood: at most one line per {@link #intervalS} for each kind of
 * problem, with the count of the others. The first occurrence of a kind is logged at once; later
 * ones within the interval are counted, and the count comes out with the next line of that kind,
 * or from {@link #flushDue()} (called by the server's housekeeping about once a second) once the
 * interval has passed, or from {@link #flush()} at close. Thread-safe.
 */
public final class ProblemLog {
    private final Logger log;
    private final long intervalNs;
    private final LongSupplier clockNs;
    private final List<Kind> kinds = new ArrayList<>();

    /** One line per second per kind, on the system's monotonic clock. */
    public ProblemLog(Logger log) { this(log, 1.0, System::nanoTime); }

    public ProblemLog(Logger log, double intervalS, LongSupplier clockNs) {
        this.log = log;
        this.intervalNs = (long) (intervalS * 1e9);
        this.clockNs = clockNs;
    }

    /** A kind of problem, named for the summary line ("bad header", "CRC error"), logged at {@code level}. */
    public synchronized Kind kind(String name, Level level) {
        Kind k = new Kind(name, level);
        kinds.add(k);
        return k;
    }

    /** Log the counts of every kind whose interval has passed since its last line. */
    public void flushDue() { flush(false); }

    /** Log every count still pending (at close). */
    public void flush() { flush(true); }

    private void flush(boolean all) {
        List<Kind> copy;
        synchronized (this) {
            copy = new ArrayList<>(kinds);
        }
        long now = clockNs.getAsLong();
        for (Kind k : copy) {
            k.flush(now, all);
        }
    }

    /** One kind of problem with its own rate limit. */
    public final class Kind {
        private final String name;
        private final Level level;
        private boolean logged;
        private long lastLineNs;
        private long suppressed;
        private long total;

        private Kind(String name, Level level) {
            this.name = name;
            this.level = level;
        }

        /**
         * One occurrence. Logs {@code format} (SLF4J {} placeholders) with {@code args} unless a line
         * of this kind was logged less than the interval ago; then only counts it.
         */
        public void report(String format, Object... args) {
            long now = clockNs.getAsLong();
            long others;
            synchronized (this) {
                total++;
                if (logged && now - lastLineNs < intervalNs) {
                    suppressed++;
                    return;
                }
                others = suppressed;
                suppressed = 0;
                logged = true;
                lastLineNs = now;
            }
            if (!log.isEnabledForLevel(level)) {
                return;
            }
            if (others > 0) {
                log.atLevel(level).log(format + " (and " + others + " more " + name + " not logged)", args);
            } else {
                log.atLevel(level).log(format, args);
            }
        }

        /** Occurrences reported so far. */
        public synchronized long total() { return total; }

        private void flush(long now, boolean all) {
            long n;
            long spanNs;
            synchronized (this) {
                if (suppressed == 0 || (!all && now - lastLineNs < intervalNs)) {
                    return;
                }
                n = suppressed;
                spanNs = now - lastLineNs;
                suppressed = 0;
                lastLineNs = now;
            }
            if (log.isEnabledForLevel(level)) {
                log.atLevel(level).log(String.format(Locale.ROOT, "%d more %s not logged in the last %.1f s", n, name, spanNs / 1e9));
            }
        }
    }
}
