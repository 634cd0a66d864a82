package org.drumloop.bench.record;

/**
 * One line of {@code events.csv}.
 *
 * @param tS      time [s]
 * @param tag     the alarm, trip, equipment or signal concerned ("scenario" for scenario actions)
 * @param kind    SOE kind (ALARM, TRIP, MODE, ...), PLANT for plant events, ACTION for scenario lines
 * @param message text
 */
public record EventRecord(double tS, String tag, String kind, String message) {
}
