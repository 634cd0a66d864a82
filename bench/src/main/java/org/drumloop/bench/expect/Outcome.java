package org.drumloop.bench.expect;

/**
 * The verdict on one expectation after a run.
 *
 * @param line     line of the expectation in the scenario file
 * @param text     the expectation as written
 * @param passed   true when it held
 * @param measured what was measured, in engineering units, for the report
 */
public record Outcome(int line, String text, boolean passed, String measured) {
}
