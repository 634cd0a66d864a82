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
     * Last check before an action is queued (the page gets 400 with the message when refused);
     * called on a server thread, so it must only read immutable state.
     */
    default void check(LiveAction action) throws IllegalArgumentException {
    }

    /**
     * This session so far as a scenario file that replays it from its start: title, plant,
     * tuning, seed, initial load, duration, then every action applied, timed ({@code at T s ...}),
     * in the order applied. Called on the loop thread.
     */
    java.util.List<String> scenarioLines();

    /** Receives events; allocation here is fine (events are rare). */
    interface Sink {
        void accept(double tS, String tag, String kind, String message);
    }
}
