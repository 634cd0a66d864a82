package org.drumloop.core.soe;

import java.util.Locale;

/**
 * Plain-text rendering of sequence-of-events entries for consoles, logs and reports (allocates;
 * use it in the drain sink, never inside the scan).
 *
 * <p>Line layout: scan time with millisecond resolution, scan number, tag, kind, message, e.g.
 * {@code "   12.300 s  #123  LALL  TRIP  trip: level 2oo3 <= -200 mm"}.
 */
public final class SoeText {
    private SoeText() {
    }

    /** One event as a line (no line terminator). */
    public static String line(double tS, long scan, String tag, EventKind kind, String message) {
        return String.format(Locale.ROOT, "%9.3f s  #%d  %s  %s  %s", tS, scan, tag, kind.name(), message);
    }

    /** Column headings for CSV output, matching {@link #csv}. */
    public static final String CSV_HEADER = "time_s,scan,tag,kind,message";

    /** One event as a CSV record (RFC 4180 quoting of tag and message when needed). */
    public static String csv(double tS, long scan, String tag, EventKind kind, String message) {
        return String.format(Locale.ROOT, "%.3f,%d,%s,%s,%s", tS, scan, quote(tag), kind.name(), quote(message));
    }

    static String quote(String s) {
        if (s == null) {
            return "";
        }
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
