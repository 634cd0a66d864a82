package org.drumloop.plant;

import java.util.Arrays;

/**
 * An immutable plant description, all values in SI (m, m2, m3, kg, s, Pa absolute, K, W, kg/s,
 * m3/s, fractions 0..1; the valve Kvs in m3/h by its definition). Read with {@link PlantFile}.
 */
public final class PlantConfig {
    private final String fileName;
    private final double[] values;
    private final String[] texts;
    private final int[] lines;

    PlantConfig(String fileName, double[] values, String[] texts, int[] lines) {
        this.fileName = fileName;
        this.values = values;
        this.texts = texts;
        this.lines = lines;
    }

    /** @return the file this configuration was read from, as the user named it */
    public String fileName() { return fileName; }

    public String name() { return texts[PlantKey.NAME.ordinal()]; }

    public String description() { return texts[PlantKey.DESCRIPTION.ordinal()]; }

    public String source() { return texts[PlantKey.SOURCE.ordinal()]; }

    /** @return the SI value of a numeric key */
    public double value(PlantKey key) { return values[key.ordinal()]; }

    /** @return the word chosen for a choice key (for example {@code cylinder}) */
    public String choice(PlantKey key) {
        return key.choices[(int) values[key.ordinal()]];
    }

    /** @return the line the key was read from (0 when set by code) */
    public int lineOf(PlantKey key) { return lines[key.ordinal()]; }

    /**
     * A copy with one numeric value replaced (SI). Meant for studies and tests (for example the
     * drum-metal sensitivity); no range checks are applied.
     */
    public PlantConfig with(PlantKey key, double si) {
        double[] v = Arrays.copyOf(values, values.length);
        v[key.ordinal()] = si;
        int[] l = Arrays.copyOf(lines, lines.length);
        l[key.ordinal()] = 0;
        return new PlantConfig(fileName, v, texts, l);
    }

    /** A copy with a choice key replaced by one of its words. */
    public PlantConfig withChoice(PlantKey key, String word) {
        for (int i = 0; i < key.choices.length; i++) {
            if (key.choices[i].equals(word)) {
                return with(key, i);
            }
        }
        throw new IllegalArgumentException(key.key() + ": no choice " + word);
    }

    /** Rated steam flow (steam demand 1.0 at nominal pressure) [kg/s]. */
    public double ratedSteamFlowKgS() { return value(PlantKey.RATED_STEAM_FLOW); }

    /** Nominal drum pressure, absolute [Pa]. */
    public double nominalPressurePa() { return value(PlantKey.NOMINAL_PRESSURE); }

    /** Steam demand at which the plant is normally run and bump-tested [fraction of rated]. */
    public double nominalLoadFrac() { return value(PlantKey.NOMINAL_LOAD); }

    /** Pressure-controller setpoint, absolute [Pa]. */
    public double pressureSetpointPa() { return value(PlantKey.PRESSURE_SETPOINT); }

    /** Maximum firing heat to the risers [W]. */
    public double maxHeatW() { return value(PlantKey.MAX_HEAT); }

    /** Inside diameter of the drum shell [m]. */
    public double drumDiameterM() { return value(PlantKey.DRUM_DIAMETER); }

    /** Length of the drum shell [m]. */
    public double drumLengthM() { return value(PlantKey.DRUM_LENGTH); }

    /** Normal water level above the bottom of the drum shell [m]. */
    public double nwlHeightM() { return value(PlantKey.NWL_HEIGHT); }

    /** Top of the riser ends above the bottom of the drum shell [m]. */
    public double riserTopHeightM() { return value(PlantKey.RISER_TOP_HEIGHT); }

    /** Level of the riser tops relative to NWL [m] (negative). */
    public double riserTopLevelM() { return riserTopHeightM() - nwlHeightM(); }

    /** Level of the drum top relative to NWL [m]. */
    public double drumTopLevelM() { return drumDiameterM() - nwlHeightM(); }

    /** Level of the drum bottom relative to NWL [m]. */
    public double drumBottomLevelM() { return -nwlHeightM(); }

    /** Lower end of the calibrated level range, relative to NWL [m]. */
    public double levelRangeLowM() { return value(PlantKey.LEVEL_RANGE_LOW); }

    /** Upper end of the calibrated level range, relative to NWL [m]. */
    public double levelRangeHighM() { return value(PlantKey.LEVEL_RANGE_HIGH); }

    @Override
    public String toString() {
        return "PlantConfig[" + name() + " from " + fileName + "]";
    }
}
