package org.drumloop.core.soe;

/**
 * Sequence-of-events log: a fixed-capacity ring of events written inside the scan and drained by
 * the caller after every scan, before the next one begins.
 *
 * <p>{@link #record} allocates nothing: the arrays are made once here and messages are constant or
 * preformatted strings held by the caller. When the ring is full the newest event is dropped and
 * counted in {@link #lost()}; the oldest events are kept because the start of a disturbance (the
 * first-out) matters more than its tail.
 *
 * <p>Not thread-safe: record and drain from the scan thread (the executive's listener runs there).
 */
public final class SoeLog {
    private final double[] timeS;
    private final long[] scanNo;
    private final String[] tags;
    private final EventKind[] kinds;
    private final String[] messages;
    private int head;   // index of the oldest entry
    private int size;
    private long lost;
    private long recorded;

    /** @param capacity number of events the ring holds between two drains, at least 1 */
    public SoeLog(int capacity) {
        if (capacity < 1) {
            throw new IllegalArgumentException("SOE capacity must be at least 1, got " + capacity);
        }
        timeS = new double[capacity];
        scanNo = new long[capacity];
        tags = new String[capacity];
        kinds = new EventKind[capacity];
        messages = new String[capacity];
    }

    /** Append one event; drops it (and counts it lost) when the ring is full. Allocates nothing. */
    public void record(double tS, long scan, String tag, EventKind kind, String message) {
        int cap = timeS.length;
        if (size == cap) {
            lost++;
            return;
        }
        int i = head + size;
        if (i >= cap) {
            i -= cap;
        }
        timeS[i] = tS;
        scanNo[i] = scan;
        tags[i] = tag;
        kinds[i] = kind;
        messages[i] = message;
        size++;
        recorded++;
    }

    /** Hand every stored event to {@code sink}, oldest first, and empty the ring. */
    public int drainTo(SoeSink sink) {
        int n = size;
        int cap = timeS.length;
        for (int k = 0; k < n; k++) {
            int i = head;
            sink.accept(timeS[i], scanNo[i], tags[i], kinds[i], messages[i]);
            tags[i] = null;
            messages[i] = null;
            head = i + 1 == cap ? 0 : i + 1;
            size--;
        }
        return n;
    }

    /** Events dropped because the ring was full. */
    public long lost() { return lost; }

    /** Events accepted since construction. */
    public long recorded() { return recorded; }

    /** Events waiting to be drained. */
    public int size() { return size; }

    public int capacity() { return timeS.length; }
}
