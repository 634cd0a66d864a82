package org.drumloop.bench.live;

/**
 * The closed loop as the live page sees it: one scan at a time, actions at scan boundaries, a
 * snapshot of values and the events since the last look. Every method is called on the loop
 * thread only; the implementation needs no locking.
 */
public interface LiveSession {
    /** Static description (names, lines, ranges, choices); may be called from any thread. */
    LiveInfo info();

    /** Simulated time of the last completed scan [s]. */
    double timeS();

    /** Run one scan of firmware and plant, advancing simulated time by the scan period. */
    void scan();

    /**
     * Apply a validated action before the next scan: operator actions through the firmware's own
     * queued, bumpless paths; instructor actions on the plant.
     */
    void apply(LiveAction action);

    /** Copy the present values into {@code s} (no allocation). */
    void fill(LiveSnapshot s);

    /** Hand over the sequence-of-events entries and plant events since the last call. */
    void drainEvents(Sink sink);

    /**
     * The head of a scenario file that replays this session from its start: title, plant, tuning,
     * seed, initial load and the initial operator settings, with the given duration. The live
     * loop appends the timed statements of every action applied since.
     */
    java.util.List<String> scenarioHead(double durationS);

    /** Receives events; allocation here is fine (events are rare). */
    interface Sink {
        void accept(double tS, String tag, String kind, String message);
    }
}
