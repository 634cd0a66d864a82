package org.drumloop.core.io;

/**
 * Engineering units used at the edges (channel maps, scenarios, reports) and their affine
 * conversion to the SI unit used inside: {@code si = eu * factor + offset}.
 *
 * <p>Gauge pressure uses standard atmosphere 101 325 Pa (source: ISO 2533 standard atmosphere /
 * CGPM definition of the standard atmosphere). 1 mmH2O = 9.80665 Pa (conventional definition,
 * from memory). 1 t/h = 1000/3600 kg/s (definition).
 */
public enum EngUnit {
    M("m", "m", 1.0, 0.0),
    MM("mm", "m", 1e-3, 0.0),
    PA("Pa", "Pa", 1.0, 0.0),
    KPA("kPa", "Pa", 1e3, 0.0),
    MBAR("mbar", "Pa", 100.0, 0.0),
    BAR("bar", "Pa", 1e5, 0.0),
    /** Absolute bar, spelled out. */
    BARA("bara", "Pa", 1e5, 0.0),
    /** Gauge bar: absolute = gauge + 1 standard atmosphere. */
    BARG("barg", "Pa", 1e5, 101_325.0),
    MPA("MPa", "Pa", 1e6, 0.0),
    MMH2O("mmH2O", "Pa", 9.80665, 0.0),
    KG_PER_S("kg/s", "kg/s", 1.0, 0.0),
    T_PER_H("t/h", "kg/s", 1000.0 / 3600.0, 0.0),
    PERCENT("%", "1", 0.01, 0.0),
    FRACTION("1", "1", 1.0, 0.0),
    DEG_C("degC", "K", 1.0, 273.15),
    KELVIN("K", "K", 1.0, 0.0),
    MW("MW", "W", 1e6, 0.0),
    KW("kW", "W", 1e3, 0.0),
    W("W", "W", 1.0, 0.0),
    SECOND("s", "s", 1.0, 0.0),
    /** Loop current; not converted to SI, the firmware scales it with its transmitter calibration. */
    MA("mA", "mA", 1.0, 0.0),
    /** Binary signals. */
    BOOL("bool", "", 1.0, 0.0);

    private final String symbol;
    private final String si;
    private final double factor;
    private final double offset;

    EngUnit(String symbol, String si, double factor, double offset) {
        this.symbol = symbol;
        this.si = si;
        this.factor = factor;
        this.offset = offset;
    }

    /** The spelling in files and headers, e.g. "barg", "t/h", "degC". */
    public String symbol() { return symbol; }

    /** The SI unit this converts to ("Pa", "kg/s", "K", "1" for fractions). */
    public String siUnit() { return si; }

    public double toSi(double eu) { return eu * factor + offset; }

    public double fromSi(double si) { return (si - offset) / factor; }

    /** Look a symbol up (case-sensitive, as written in files), or null when unknown. */
    public static EngUnit bySymbol(String symbol) {
        for (EngUnit u : values()) {
            if (u.symbol.equals(symbol)) {
                return u;
            }
        }
        return null;
    }
}
