package org.drumloop.core;

import org.drumloop.core.io.EngUnit;

/**
 * Units accepted in {@code .tuning} files and their conversion to SI. Simple units come from
 * {@link EngUnit} plus a few the tuning needs (ms, min, kg/m3); a compound unit is written
 * {@code A/B} with optional parentheses, e.g. {@code %/mm}, {@code (t/h)/mm}, {@code %/(t/h)},
 * {@code mm/s}, {@code bar/s}. Compound units scale only (no offset). Each unit has a dimension
 * spelled by its SI units, e.g. {@code 1/m}, {@code (kg/s)/m}, {@code Pa/s}.
 */
final class TuningUnits {
    private TuningUnits() { }

    /** A parsed unit: si = value * factor + offset, with its SI dimension. */
    record Unit(String dim, double factor, double offset) {
        double toSi(double v) { return v * factor + offset; }
    }

    /** Parse a unit spelling, or null when unknown. */
    static Unit parse(String text) {
        Unit u = simple(text);
        if (u != null) {
            return u;
        }
        int depth = 0;
        int slash = -1;
        for (int i = 0; i < text.length(); i++) {
            char ch = text.charAt(i);
            if (ch == '(') {
                depth++;
            } else if (ch == ')') {
                depth--;
            } else if (ch == '/' && depth == 0) {
                if (slash >= 0) {
                    return null; // a/b/c is ambiguous
                }
                slash = i;
            }
        }
        if (slash <= 0 || slash == text.length() - 1) {
            return null;
        }
        Unit num = simple(unwrap(text.substring(0, slash)));
        Unit den = simple(unwrap(text.substring(slash + 1)));
        if (num == null || den == null || den.factor == 0.0) {
            return null;
        }
        return new Unit(wrap(num.dim) + "/" + wrap(den.dim), num.factor / den.factor, 0.0);
    }

    private static String unwrap(String s) {
        if (s.length() >= 2 && s.charAt(0) == '(' && s.charAt(s.length() - 1) == ')') {
            return s.substring(1, s.length() - 1);
        }
        return s;
    }

    private static String wrap(String dim) {
        return dim.indexOf('/') >= 0 ? "(" + dim + ")" : dim;
    }

    private static Unit simple(String s) {
        switch (s) {
            case "ms": return new Unit("s", 1e-3, 0.0);
            case "min": return new Unit("s", 60.0, 0.0);
            case "kg/m3": return new Unit("kg/m3", 1.0, 0.0);
            default: break;
        }
        EngUnit e = EngUnit.bySymbol(s);
        if (e == null || e == EngUnit.MA || e == EngUnit.BOOL) {
            return null;
        }
        double factor = e.toSi(1.0) - e.toSi(0.0);
        return new Unit(e.siUnit(), factor, e.toSi(0.0));
    }
}
