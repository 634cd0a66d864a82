package org.drumloop.bench.live;

import java.util.ArrayList;
import java.util.List;

/**
 * Events of the loop thread (firmware log, plant, page actions) waiting to be handed to the page's
 * broadcaster with {@link #drainTo}. Loop thread only. Nothing is allocated in a scan without events.
 */
final class PendingEvents implements LiveSession.Sink {
    private record Entry(double tS, String tag, String kind, String message) {
    }

    private final List<Entry> entries = new ArrayList<>();

    /** Keep one event for the next {@link #drainTo}. */
    @Override
    public void accept(double tS, String tag, String kind, String message) {
        entries.add(new Entry(tS, tag, kind, message));
    }

    /** Hand every kept event to {@code sink}, oldest first, and forget them. */
    void drainTo(LiveSession.Sink sink) {
        if (entries.isEmpty()) {
            return; // the usual scan: nothing to hand over, nothing allocated
        }
        for (int i = 0; i < entries.size(); i++) {
            Entry e = entries.get(i);
            sink.accept(e.tS(), e.tag(), e.kind(), e.message());
        }
        entries.clear();
    }
}
