package org.drumloop.bench.record;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * {@code events.csv} ({@code t[s],tag,kind,message}) plus an in-memory copy of the first events
 * for the report. Events are rare (alarms, trips, mode changes, actions), so formatting them may
 * allocate.
 */
public final class EventLog {
    /** Events kept in memory for the report; later ones are only in the file. */
    public static final int KEPT = 5000;

    private final Writer out;
    private final List<EventRecord> kept = new ArrayList<>();
    private long count;

    /** @param out the file, or null to keep events in memory only */
    public EventLog(Writer out) throws IOException {
        this.out = out;
        if (out != null) {
            out.write("t[s],tag,kind,message\n");
        }
    }

    public void add(double tS, String tag, String kind, String message) {
        count++;
        if (kept.size() < KEPT) {
            kept.add(new EventRecord(tS, tag, kind, message));
        }
        if (out != null) {
            try {
                out.write(String.format(java.util.Locale.ROOT, "%.2f,%s,%s,%s%n", tS, csv(tag), csv(kind),
                        csv(message)));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
    }

    public List<EventRecord> kept() { return Collections.unmodifiableList(kept); }

    public long count() { return count; }

    /** CSV field per RFC 4180: quoted when it holds a comma, quote or line break; quotes doubled. */
    public static String csv(String s) {
        if (s == null) {
            return "";
        }
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
