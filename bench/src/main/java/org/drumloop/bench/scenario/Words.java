package org.drumloop.bench.scenario;

import java.util.ArrayList;
import java.util.List;

import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.EngUnit;

/**
 * The words of one scenario line with a cursor, and the quantity readers every statement uses.
 * Words are split on blanks; a double-quoted phrase is one word (the quotes removed). A number may
 * carry its unit attached ({@code 30s}, {@code 80%}) or as the next word ({@code 30 s}).
 */
final class Words {
    private final String file;
    private final int line;
    private final List<String> words;
    private int pos;

    Words(String file, int line, String text) throws ConfigException {
        this.file = file;
        this.line = line;
        this.words = split(file, line, text);
    }

    static List<String> split(String file, int line, String text) throws ConfigException {
        List<String> out = new ArrayList<>();
        int i = 0;
        int n = text.length();
        while (i < n) {
            char c = text.charAt(i);
            if (Character.isWhitespace(c)) {
                i++;
            } else if (c == '"') {
                int end = text.indexOf('"', i + 1);
                if (end < 0) {
                    throw new ConfigException(file, line, text.substring(i), "quote not closed");
                }
                out.add(text.substring(i + 1, end));
                i = end + 1;
            } else {
                int start = i;
                while (i < n && !Character.isWhitespace(text.charAt(i)) && text.charAt(i) != '"') {
                    i++;
                }
                out.add(text.substring(start, i));
            }
        }
        return out;
    }

    String file() { return file; }

    int line() { return line; }

    boolean hasMore() { return pos < words.size(); }

    String peek() { return pos < words.size() ? words.get(pos) : null; }

    /** The last word read (for error messages), or the first word. */
    String last() { return words.isEmpty() ? "" : words.get(Math.max(0, Math.min(pos, words.size()) - 1)); }

    String next(String what) throws ConfigException {
        if (pos >= words.size()) {
            throw error(last(), "expected " + what + " after this word");
        }
        return words.get(pos++);
    }

    /** Consume the word if it is {@code w} (case-insensitive). */
    boolean accept(String w) {
        if (pos < words.size() && words.get(pos).equalsIgnoreCase(w)) {
            pos++;
            return true;
        }
        return false;
    }

    void expect(String w) throws ConfigException {
        String got = next("'" + w + "'");
        if (!got.equalsIgnoreCase(w)) {
            throw error(got, "expected '" + w + "' here");
        }
    }

    void end() throws ConfigException {
        if (pos < words.size()) {
            throw error(words.get(pos), "unexpected word at the end of the statement");
        }
    }

    /** Everything from the cursor to the end, joined by blanks. */
    String rest() {
        String s = String.join(" ", words.subList(pos, words.size()));
        pos = words.size();
        return s;
    }

    ConfigException error(String word, String message) {
        return new ConfigException(file, line, word, message);
    }

    /** A plain number without unit (e.g. a seed or a count). */
    double plainNumber(String what) throws ConfigException {
        String w = next(what);
        try {
            return Double.parseDouble(w);
        } catch (NumberFormatException e) {
            throw error(w, "not a number (" + what + ")");
        }
    }

    /**
     * Read a number and its unit and convert it to SI.
     *
     * @param siUnit the SI unit the quantity must have ("m", "Pa", "kg/s", "1", "K", "s", ...)
     * @param what   what the number means, for the error message
     */
    double quantity(String siUnit, String what) throws ConfigException {
        Quantity q = rawQuantity(what);
        return q.toSi(this, siUnit, what);
    }

    /**
     * Read a difference of two values (a bias, a band, a rate) in SI: only the unit's factor applies,
     * never its offset, so a bias of 5 degC is 5 K and a bias of 1 barg is 1e5 Pa.
     */
    double deltaQuantity(String siUnit, String what) throws ConfigException {
        Quantity q = rawQuantity(what);
        return q.deltaToSi(this, siUnit, what);
    }

    /** Read a time ({@code s}, {@code min} or {@code h}) in seconds. */
    double timeS(String what) throws ConfigException {
        return quantity("s", what);
    }

    /** A number word with its unit word (attached or separate). */
    Quantity rawQuantity(String what) throws ConfigException {
        String w = next(what + " (number with unit)");
        int split = numberPrefixLength(w);
        if (split == 0) {
            throw error(w, "expected a number with a unit (" + what + ")");
        }
        double v;
        try {
            v = Double.parseDouble(w.substring(0, split));
        } catch (NumberFormatException e) {
            throw error(w, "not a number (" + what + ")");
        }
        String unit = w.substring(split);
        if (unit.isEmpty()) {
            unit = peek();
            if (unit == null) {
                throw error(w, "unit missing (" + what + ")");
            }
            pos++;
        }
        return new Quantity(w, v, unit);
    }

    /** Length of the leading number in a word: sign, digits, point, exponent. */
    static int numberPrefixLength(String w) {
        int i = 0;
        int n = w.length();
        if (i < n && (w.charAt(i) == '-' || w.charAt(i) == '+')) {
            i++;
        }
        int digits = 0;
        while (i < n && (Character.isDigit(w.charAt(i)) || w.charAt(i) == '.')) {
            if (w.charAt(i) == '.' && i + 1 < n && w.charAt(i + 1) == '.') {
                break; // range "0..900"
            }
            i++;
            digits++;
        }
        if (digits == 0) {
            return 0;
        }
        if (i < n && (w.charAt(i) == 'e' || w.charAt(i) == 'E') && i + 1 < n
                && (Character.isDigit(w.charAt(i + 1)) || ((w.charAt(i + 1) == '-' || w.charAt(i + 1) == '+')
                && i + 2 < n && Character.isDigit(w.charAt(i + 2))))) {
            i += 2;
            while (i < n && Character.isDigit(w.charAt(i))) {
                i++;
            }
        }
        return i;
    }

    /** A time window {@code A..B UNIT}, e.g. {@code 0..900 s}; returns {from, to} in seconds. */
    double[] window(String what) throws ConfigException {
        String w = next(what + " (A..B with unit)");
        int dots = w.indexOf("..");
        if (dots <= 0) {
            throw error(w, "expected a time window like 0..900 s (" + what + ")");
        }
        String a = w.substring(0, dots);
        String rest = w.substring(dots + 2);
        int split = numberPrefixLength(rest);
        if (split == 0) {
            throw error(w, "expected a time window like 0..900 s (" + what + ")");
        }
        String unit = rest.substring(split);
        if (unit.isEmpty()) {
            unit = next("unit of the time window");
        }
        double fromV;
        double toV;
        try {
            fromV = Double.parseDouble(a);
            toV = Double.parseDouble(rest.substring(0, split));
        } catch (NumberFormatException e) {
            throw error(w, "not a time window (" + what + ")");
        }
        double f = new Quantity(w, fromV, unit).toSi(this, "s", what);
        double t = new Quantity(w, toV, unit).toSi(this, "s", what);
        if (t < f) {
            throw error(w, "window ends before it starts");
        }
        return new double[] {f, t};
    }

    /** A number as written with its unit, before conversion. */
    record Quantity(String word, double value, String unit) {
        /** This quantity as a difference in SI: the unit's offset (degC, barg) cancels. */
        double deltaToSi(Words w, String siUnit, String what) throws ConfigException {
            return toSi(w, siUnit, what) - new Quantity(word, 0.0, unit).toSi(w, siUnit, what);
        }

        double toSi(Words w, String siUnit, String what) throws ConfigException {
            if (!Double.isFinite(value)) {
                throw w.error(word, "not a finite number (" + what + ")");
            }
            if ("s".equals(siUnit)) {
                // Time units beyond EngUnit's seconds: 1 min = 60 s, 1 h = 3600 s (SI brochure, accepted units).
                switch (unit) {
                    case "min": return value * 60.0;
                    case "h": return value * 3600.0;
                    default: break;
                }
            }
            EngUnit u = EngUnit.bySymbol(unit);
            if (u == null) {
                throw w.error(unit, "unknown unit (" + what + " needs a unit of " + describe(siUnit) + ")");
            }
            if (!u.siUnit().equals(siUnit)) {
                throw w.error(unit, "wrong unit: " + what + " needs a unit of " + describe(siUnit));
            }
            return u.toSi(value);
        }

        static String describe(String si) {
            switch (si) {
                case "m": return "length (mm, m)";
                case "Pa": return "pressure (Pa, kPa, mbar, bar, barg, MPa, mmH2O)";
                case "kg/s": return "mass flow (t/h, kg/s)";
                case "1": return "fraction (%, 1)";
                case "K": return "temperature (degC, K)";
                case "s": return "time (s, min, h)";
                case "W": return "power (W, kW, MW)";
                default: return si;
            }
        }
    }
}
