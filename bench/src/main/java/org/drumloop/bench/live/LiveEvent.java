package org.drumloop.bench.live;

/**
 * One line of the page's event log: a sequence-of-events entry from the firmware, a plant event
 * or an instructor action.
 *
 * @param seq     running number given by the loop (gaps tell the page it missed something)
 * @param tS      simulated time [s]
 * @param tag     signal, interlock or equipment tag
 * @param kind    ALARM, TRIP, RESET, ACK, BYPASS, MODE, OPERATOR, FAULT, PLANT, ACTION, ...
 * @param message text as logged
 */
public record LiveEvent(long seq, double tS, String tag, String kind, String message) {
}
