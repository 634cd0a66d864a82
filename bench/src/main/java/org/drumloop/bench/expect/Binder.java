package org.drumloop.bench.expect;

/** What an expectation needs to know about the firmware before a run: its interlocks by tag. */
public interface Binder {
    /** Index of the interlock with this tag (case-insensitive), or -1. */
    int interlockIndex(String tag);

    /** True when the interlock is a trip (latching), false for an alarm. */
    boolean interlockIsTrip(int index);

    /** Tags known, for error messages. */
    String interlockTags();
}
