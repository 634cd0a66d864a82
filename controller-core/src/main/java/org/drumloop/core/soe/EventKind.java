package org.drumloop.core.soe;

/** What a sequence-of-events entry records. */
public enum EventKind {
    /** An alarm became active. */
    ALARM,
    /** An alarm went back to normal. */
    ALARM_CLEAR,
    /** A trip latched (its actions are demanded). */
    TRIP,
    /** A latched trip was released by a reset. */
    TRIP_CLEAR,
    /** An operator reset was applied (or refused while a condition was present). */
    RESET,
    /** An operator acknowledged an alarm or trip. */
    ACK,
    /** A bypass started (the message is the operator's reason). */
    BYPASS,
    /** A bypass ended, by expiry or by the operator. */
    BYPASS_END,
    /** A control mode change (manual, single-element, three-element). */
    MODE,
    /** Any other operator action. */
    OPERATOR,
    /** A fault of the controller itself (watchdog, scan body error, bad signal). */
    FAULT,
    /** Information only. */
    INFO
}
