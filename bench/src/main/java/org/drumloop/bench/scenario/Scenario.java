package org.drumloop.bench.scenario;

import java.nio.file.Path;
import java.util.List;

import org.drumloop.bench.expect.Expectation;

/**
 * A parsed scenario: what to run, on which plant and tuning, what happens when, and what must hold.
 *
 * @param file            the file as the user named it (for messages)
 * @param path            the file, or null when parsed from text
 * @param name            short name (file name without extension), used for output folders
 * @param title           one-line title
 * @param description     free text (may be empty)
 * @param plant           plant name or path as written
 * @param plantLine       line of the plant statement (0 when defaulted)
 * @param tuning          tuning name or path as written
 * @param tuningLine      line of the tuning statement (0 when defaulted)
 * @param durationS       run length [s]
 * @param seed            plant noise seed
 * @param initialLoadFrac steam demand the plant starts balanced at [fraction of rating]
 * @param swellComp       false to run with the firmware's swell compensation switched off
 * @param actions         timed statements in time order (stable for equal times)
 * @param expectations    acceptance criteria in file order
 * @param source          the file's lines, for the report
 */
public record Scenario(String file, Path path, String name, String title, String description, String plant,
                       int plantLine, String tuning, int tuningLine, double durationS, long seed,
                       double initialLoadFrac, boolean swellComp, List<Action> actions, List<Expectation> expectations,
                       List<String> source) {
}
