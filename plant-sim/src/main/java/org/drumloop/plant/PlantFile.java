package org.drumloop.plant;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads a plant file: plain text, one {@code key value unit} per line, {@code #} starts a comment.
 * Text keys ({@code name}, {@code description}, {@code source}) take the rest of the line; choice
 * keys take one word and no unit; every number carries its unit. All keys are required; unknown
 * or repeated keys, missing or wrong units and out-of-range values are reported as
 * {@code file:line: key: message}.
 */
public final class PlantFile {
    private static final double G = 9.80665; // standard gravity [m/s2] (CGPM 1901)

    private PlantFile() { }

    public static PlantConfig load(Path p) throws PlantConfigException {
        List<String> lines;
        try {
            lines = Files.readAllLines(p, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new PlantConfigException(p.toString(), 0, "", "cannot read the file: " + e.getMessage());
        }
        return parse(p.toString(), lines);
    }

    public static PlantConfig parse(String fileName, List<String> lines) throws PlantConfigException {
        int n = PlantKey.values().length;
        double[] values = new double[n];
        String[] texts = new String[n];
        int[] at = new int[n];
        List<PlantConfigException> problems = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            int lineNo = i + 1;
            String line = stripComment(lines.get(i)).strip();
            if (line.isEmpty()) {
                continue;
            }
            try {
                parseLine(fileName, lineNo, line, values, texts, at);
            } catch (PlantConfigException e) {
                problems.add(e); // go on: the user sees every problem of the file at once
            }
        }
        for (PlantKey k : PlantKey.values()) {
            if (at[k.ordinal()] == 0) {
                problems.add(new PlantConfigException(fileName, 0, k.key(), "missing (every key is required)"));
            }
        }
        if (!problems.isEmpty()) {
            throw problems.size() == 1 ? problems.get(0) : new PlantConfigException(problems);
        }
        PlantConfig cfg = new PlantConfig(fileName, values, texts, at);
        crossCheck(cfg);
        return cfg;
    }

    /** One {@code key value unit} line into the value arrays. */
    private static void parseLine(String fileName, int lineNo, String line, double[] values, String[] texts, int[] at)
            throws PlantConfigException {
        String[] tok = line.split("\\s+");
        String word = tok[0];
        PlantKey key = PlantKey.byKey(word);
        if (key == null) {
            throw new PlantConfigException(fileName, lineNo, word, "unknown key");
        }
        if (at[key.ordinal()] != 0) {
            throw new PlantConfigException(fileName, lineNo, word,
                    "given twice (first on line " + at[key.ordinal()] + ")");
        }
        at[key.ordinal()] = lineNo;
        switch (key.dim) {
            case TEXT -> {
                String rest = line.substring(word.length()).strip();
                if (rest.length() >= 2 && rest.startsWith("\"") && rest.endsWith("\"")) {
                    rest = rest.substring(1, rest.length() - 1);
                }
                if (rest.isEmpty()) {
                    throw new PlantConfigException(fileName, lineNo, word, "text is missing");
                }
                texts[key.ordinal()] = rest;
            }
            case CHOICE -> {
                if (tok.length != 2) {
                    throw new PlantConfigException(fileName, lineNo, word,
                            "expected one of: " + String.join(", ", key.choices));
                }
                int idx = -1;
                for (int c = 0; c < key.choices.length; c++) {
                    if (key.choices[c].equals(tok[1])) {
                        idx = c;
                    }
                }
                if (idx < 0) {
                    throw new PlantConfigException(fileName, lineNo, word, "'" + tok[1]
                            + "' is not one of: " + String.join(", ", key.choices));
                }
                values[key.ordinal()] = idx;
            }
            default -> values[key.ordinal()] = number(fileName, lineNo, key, tok);
        }
    }

    private static String stripComment(String line) {
        for (int i = 0; i < line.length(); i++) {
            if (line.charAt(i) == '#' && (i == 0 || Character.isWhitespace(line.charAt(i - 1)))) {
                return line.substring(0, i);
            }
        }
        return line;
    }

    private static double number(String file, int line, PlantKey key, String[] tok) throws PlantConfigException {
        if (tok.length < 2) {
            throw new PlantConfigException(file, line, key.key(), "value and unit are missing");
        }
        if (tok.length < 3) {
            throw new PlantConfigException(file, line, key.key(),
                    "unit is missing (allowed: " + key.dim.unitList() + ")");
        }
        if (tok.length > 3) {
            throw new PlantConfigException(file, line, key.key(), "expected 'value unit', found extra words");
        }
        double v;
        try {
            v = Double.parseDouble(tok[1]);
        } catch (NumberFormatException e) {
            throw new PlantConfigException(file, line, key.key(), "'" + tok[1] + "' is not a number");
        }
        if (!Double.isFinite(v)) {
            throw new PlantConfigException(file, line, key.key(), "value must be finite");
        }
        int u = key.dim.unitIndex(tok[2]);
        if (u < 0) {
            throw new PlantConfigException(file, line, key.key(),
                    "unit '" + tok[2] + "' is not allowed here (allowed: " + key.dim.unitList() + ")");
        }
        double si = key.dim.toSi(v, u);
        if (si < key.minSi || si > key.maxSi) {
            throw new PlantConfigException(file, line, key.key(), "value " + tok[1] + " " + tok[2]
                    + " is out of range (" + key.minSi + " to " + key.maxSi + " in SI units)");
        }
        return si;
    }

    private static void fail(PlantConfig c, PlantKey k, String msg) throws PlantConfigException {
        throw new PlantConfigException(c.fileName(), c.lineOf(k), k.key(), msg);
    }

    /** Checks between keys; each names the key that is most likely wrong. */
    static void crossCheck(PlantConfig c) throws PlantConfigException {
        double vd = c.value(PlantKey.DRUM_VOLUME);
        double vr = c.value(PlantKey.RISER_VOLUME);
        if (c.value(PlantKey.RISER_METAL_MASS) > c.value(PlantKey.TOTAL_METAL_MASS)) {
            fail(c, PlantKey.RISER_METAL_MASS, "riser metal cannot exceed the total metal mass");
        }
        if (c.value(PlantKey.DRUM_METAL_MASS) > c.value(PlantKey.TOTAL_METAL_MASS)) {
            fail(c, PlantKey.DRUM_METAL_MASS, "drum metal cannot exceed the total metal mass");
        }
        double d = c.drumDiameterM();
        if (c.nwlHeightM() >= d) {
            fail(c, PlantKey.NWL_HEIGHT, "normal water level must lie below the drum top (diameter " + d + " m)");
        }
        if (c.riserTopHeightM() >= c.nwlHeightM()) {
            fail(c, PlantKey.RISER_TOP_HEIGHT, "riser tops must lie below the normal water level");
        }
        if (c.value(PlantKey.STEAM_UNDER_SURFACE_VOLUME) >= vd) {
            fail(c, PlantKey.STEAM_UNDER_SURFACE_VOLUME, "must be smaller than the drum volume");
        }
        DrumGeometry geo = DrumGeometry.of(c);
        if (geo.volumeBelow(c.nwlHeightM()) >= vd) {
            fail(c, PlantKey.NWL_HEIGHT, "the drum below NWL would hold more than drum_volume");
        }
        if ("cylinder".equals(c.choice(PlantKey.LEVEL_GEOMETRY))) {
            double a = geo.surfaceArea(c.nwlHeightM());
            double ad = c.value(PlantKey.DRUM_SURFACE_AREA);
            if (Math.abs(a - ad) > 0.10 * ad) {
                fail(c, PlantKey.DRUM_SURFACE_AREA, String.format(java.util.Locale.ROOT,
                        "%.3g m2 disagrees by more than 10 %% with the cylinder's surface at NWL (%.3g m2)", ad, a));
            }
        }
        if (vr <= 0) {
            fail(c, PlantKey.RISER_VOLUME, "must be positive");
        }
        if (c.value(PlantKey.FEED_PUMP_RATED_HEAD) >= c.value(PlantKey.FEED_PUMP_SHUTOFF_HEAD)) {
            fail(c, PlantKey.FEED_PUMP_RATED_HEAD, "must be below the shut-off head");
        }
        double ps = c.value(PlantKey.FEED_PUMP_SUCTION_PRESSURE);
        double shutoffPa = ps + 1000 * G * (c.value(PlantKey.FEED_PUMP_SHUTOFF_HEAD) - c.value(PlantKey.FEED_STATIC_LIFT));
        if (shutoffPa <= c.value(PlantKey.SAFETY_VALVE_SET_PRESSURE) * 0.5) {
            fail(c, PlantKey.FEED_PUMP_SHUTOFF_HEAD, "the pump cannot feed the drum near its working pressure");
        }
        if (c.value(PlantKey.SAFETY_VALVE_RESEAT_PRESSURE) >= c.value(PlantKey.SAFETY_VALVE_SET_PRESSURE)) {
            fail(c, PlantKey.SAFETY_VALVE_RESEAT_PRESSURE, "must be below the set pressure");
        }
        if (c.value(PlantKey.PRESSURE_SETPOINT) >= c.value(PlantKey.SAFETY_VALVE_RESEAT_PRESSURE)) {
            fail(c, PlantKey.PRESSURE_SETPOINT, "must be below the safety valve's reseat pressure");
        }
        if (c.nominalPressurePa() >= c.value(PlantKey.SAFETY_VALVE_RESEAT_PRESSURE)) {
            fail(c, PlantKey.NOMINAL_PRESSURE, "must be below the safety valve's reseat pressure");
        }
        if (c.value(PlantKey.LEVEL_TAP_HIGH) <= c.value(PlantKey.LEVEL_TAP_LOW)) {
            fail(c, PlantKey.LEVEL_TAP_HIGH, "must be above the low tap");
        }
        if (c.levelRangeLowM() < c.value(PlantKey.LEVEL_TAP_LOW)) {
            fail(c, PlantKey.LEVEL_RANGE_LOW, "the calibrated range must lie between the taps");
        }
        if (c.levelRangeHighM() > c.value(PlantKey.LEVEL_TAP_HIGH)) {
            fail(c, PlantKey.LEVEL_RANGE_HIGH, "the calibrated range must lie between the taps");
        }
        if (c.levelRangeHighM() <= c.levelRangeLowM()) {
            fail(c, PlantKey.LEVEL_RANGE_HIGH, "must be above level_range_low");
        }
        if (c.value(PlantKey.LEVEL_TAP_LOW) < c.drumBottomLevelM() || c.value(PlantKey.LEVEL_TAP_HIGH) > c.drumTopLevelM()) {
            fail(c, PlantKey.LEVEL_TAP_HIGH, "level taps must lie on the drum shell (between its bottom and top)");
        }
        checkRange(c, PlantKey.PRESSURE_TX_RANGE_LOW, PlantKey.PRESSURE_TX_RANGE_HIGH);
        checkRange(c, PlantKey.FEED_TEMP_TX_RANGE_LOW, PlantKey.FEED_TEMP_TX_RANGE_HIGH);
        checkRange(c, PlantKey.FEED_PRESSURE_TX_RANGE_LOW, PlantKey.FEED_PRESSURE_TX_RANGE_HIGH);
    }

    private static void checkRange(PlantConfig c, PlantKey lo, PlantKey hi) throws PlantConfigException {
        if (c.value(hi) <= c.value(lo)) {
            fail(c, hi, "must be above " + lo.key());
        }
    }
}
