package org.drumloop.plant;

/**
 * The quantity a plant-file value measures and the units it may be written in, each with its
 * conversion to SI ({@code si = value * factor + offset}). plant-sim keeps its own small table
 * (it must not depend on controller-core).
 */
enum Dim {
    TEXT(),
    CHOICE(),
    LENGTH("m", 1, 0, "mm", 1e-3, 0),
    AREA("m2", 1, 0),
    VOLUME("m3", 1, 0),
    MASS("kg", 1, 0, "t", 1000, 0),
    TIME("s", 1, 0, "min", 60, 0, "h", 3600, 0),
    /** Absolute pressure: barg adds one standard atmosphere (101 325 Pa, definition). */
    PRESSURE("Pa", 1, 0, "kPa", 1e3, 0, "MPa", 1e6, 0, "bara", 1e5, 0, "barg", 1e5, 101_325),
    /** Pressure difference: no gauge/absolute units. */
    DIFF_PRESSURE("Pa", 1, 0, "kPa", 1e3, 0, "MPa", 1e6, 0, "mbar", 100, 0, "bar", 1e5, 0),
    /** Temperature: degC adds 273.15 K (definition of the Celsius scale). */
    TEMPERATURE("K", 1, 0, "degC", 1, 273.15),
    TEMP_DIFF("K", 1, 0),
    POWER("W", 1, 0, "kW", 1e3, 0, "MW", 1e6, 0),
    MASS_FLOW("kg/s", 1, 0, "kg/h", 1.0 / 3600, 0, "t/h", 1000.0 / 3600, 0),
    VOLUME_FLOW("m3/s", 1, 0, "m3/h", 1.0 / 3600, 0),
    /** Valve flow coefficient Kv: kept in its defining unit, m3/h of water at 1 bar drop. */
    KV("m3/h", 1, 0),
    SPECIFIC_HEAT("J/(kg.K)", 1, 0, "kJ/(kg.K)", 1e3, 0),
    DENSITY("kg/m3", 1, 0),
    ACCELERATION("m/s2", 1, 0),
    FRACTION("-", 1, 0, "%", 0.01, 0),
    NUMBER("-", 1, 0),
    INV_PRESSURE("1/Pa", 1, 0, "1/bar", 1e-5, 0, "1/MPa", 1e-6, 0);

    private final String[] units;
    private final double[] factors;
    private final double[] offsets;

    Dim(Object... table) {
        int n = table.length / 3;
        units = new String[n];
        factors = new double[n];
        offsets = new double[n];
        for (int i = 0; i < n; i++) {
            units[i] = (String) table[3 * i];
            factors[i] = ((Number) table[3 * i + 1]).doubleValue();
            offsets[i] = ((Number) table[3 * i + 2]).doubleValue();
        }
    }

    /** @return index of the unit, or -1 when it does not belong to this quantity */
    int unitIndex(String unit) {
        for (int i = 0; i < units.length; i++) {
            if (units[i].equals(unit)) {
                return i;
            }
        }
        return -1;
    }

    double toSi(double value, int unitIndex) {
        return value * factors[unitIndex] + offsets[unitIndex];
    }

    String unitList() {
        return String.join(", ", units);
    }
}
