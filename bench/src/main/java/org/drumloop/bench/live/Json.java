package org.drumloop.bench.live;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The little JSON the live page needs: parsing one flat request object (string, number, boolean
 * and null members; nesting is refused) and writing values into a {@link StringBuilder}.
 *
 * <p>Grammar per RFC 8259. Only what a command needs is accepted, so the server never has to
 * guess what a nested structure means.
 */
final class Json {
    private Json() {
    }

    /** A request that is not well-formed JSON or not a flat object. */
    static final class ParseException extends Exception {
        ParseException(String message) {
            super(message);
        }
    }

    /**
     * Parse a flat JSON object. Values come back as {@code String}, {@code Double},
     * {@code Boolean} or {@link #NULL}.
     */
    static Map<String, Object> parseObject(String text) throws ParseException {
        Reader r = new Reader(text);
        r.skipWs();
        r.expect('{');
        Map<String, Object> out = new LinkedHashMap<>();
        r.skipWs();
        if (r.peek() == '}') {
            r.pos++;
        } else {
            while (true) {
                r.skipWs();
                String key = r.string();
                r.skipWs();
                r.expect(':');
                r.skipWs();
                Object value = r.value();
                if (out.put(key, value) != null) {
                    throw new ParseException("member \"" + key + "\" given twice");
                }
                r.skipWs();
                char c = r.next();
                if (c == '}') {
                    break;
                }
                if (c != ',') {
                    throw new ParseException("expected ',' or '}' at character " + r.pos);
                }
            }
        }
        r.skipWs();
        if (r.pos != text.length()) {
            throw new ParseException("unexpected text after the object at character " + (r.pos + 1));
        }
        return out;
    }

    /** Marker for a JSON null member. */
    static final Object NULL = new Object() {
        @Override
        public String toString() {
            return "null";
        }
    };

    private static final class Reader {
        final String s;
        int pos;

        Reader(String s) {
            this.s = s;
        }

        char peek() throws ParseException {
            if (pos >= s.length()) {
                throw new ParseException("unexpected end of the request body");
            }
            return s.charAt(pos);
        }

        char next() throws ParseException {
            char c = peek();
            pos++;
            return c;
        }

        void expect(char c) throws ParseException {
            char got = next();
            if (got != c) {
                throw new ParseException("expected '" + c + "' at character " + pos + ", found '" + got + "'");
            }
        }

        void skipWs() {
            while (pos < s.length()) {
                char c = s.charAt(pos);
                if (c == ' ' || c == '\t' || c == '\n' || c == '\r') {
                    pos++;
                } else {
                    break;
                }
            }
        }

        Object value() throws ParseException {
            char c = peek();
            if (c == '"') {
                return string();
            }
            if (c == '{' || c == '[') {
                throw new ParseException("nested objects and arrays are not accepted in a command");
            }
            if (s.startsWith("true", pos)) {
                pos += 4;
                return Boolean.TRUE;
            }
            if (s.startsWith("false", pos)) {
                pos += 5;
                return Boolean.FALSE;
            }
            if (s.startsWith("null", pos)) {
                pos += 4;
                return NULL;
            }
            return number();
        }

        Double number() throws ParseException {
            int start = pos;
            if (pos < s.length() && s.charAt(pos) == '-') {
                pos++;
            }
            while (pos < s.length()) {
                char c = s.charAt(pos);
                if ((c >= '0' && c <= '9') || c == '.' || c == 'e' || c == 'E' || c == '+' || c == '-') {
                    pos++;
                } else {
                    break;
                }
            }
            String t = s.substring(start, pos);
            // RFC 8259 number: -? int frac? exp?
            if (!t.matches("-?(0|[1-9][0-9]*)(\\.[0-9]+)?([eE][+-]?[0-9]+)?")) {
                throw new ParseException("not a JSON value at character " + (start + 1));
            }
            return Double.valueOf(t);
        }

        String string() throws ParseException {
            expect('"');
            StringBuilder b = new StringBuilder();
            while (true) {
                char c = next();
                if (c == '"') {
                    return b.toString();
                }
                if (c < 0x20) {
                    throw new ParseException("control character inside a string at character " + pos);
                }
                if (c != '\\') {
                    b.append(c);
                    continue;
                }
                char e = next();
                switch (e) {
                    case '"': b.append('"'); break;
                    case '\\': b.append('\\'); break;
                    case '/': b.append('/'); break;
                    case 'b': b.append('\b'); break;
                    case 'f': b.append('\f'); break;
                    case 'n': b.append('\n'); break;
                    case 'r': b.append('\r'); break;
                    case 't': b.append('\t'); break;
                    case 'u':
                        if (pos + 4 > s.length()) {
                            throw new ParseException("short \\u escape");
                        }
                        try {
                            b.append((char) Integer.parseInt(s.substring(pos, pos + 4), 16));
                        } catch (NumberFormatException ex) {
                            throw new ParseException("bad \\u escape at character " + pos);
                        }
                        pos += 4;
                        break;
                    default:
                        throw new ParseException("bad escape \\" + e + " at character " + pos);
                }
            }
        }
    }

    // ---- writing ---------------------------------------------------------------------------

    /** Append a JSON string literal. */
    static StringBuilder str(StringBuilder b, String s) {
        if (s == null) {
            return b.append("null");
        }
        b.append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"': b.append("\\\""); break;
                case '\\': b.append("\\\\"); break;
                case '\n': b.append("\\n"); break;
                case '\r': b.append("\\r"); break;
                case '\t': b.append("\\t"); break;
                default:
                    if (c < 0x20 || c == '<' || c == '>' || c == '&') {
                        // escaped so a value can never close a script tag or inject markup
                        b.append(String.format("\\u%04x", (int) c));
                    } else {
                        b.append(c);
                    }
            }
        }
        return b.append('"');
    }

    /** Append a number rounded to {@code decimals} places; NaN and infinities become null. */
    static StringBuilder num(StringBuilder b, double v, int decimals) {
        if (!Double.isFinite(v)) {
            return b.append("null");
        }
        double scale = Math.pow(10, decimals);
        double r = Math.round(v * scale) / scale;
        if (r == Math.rint(r) && Math.abs(r) < 1e15) {
            return b.append((long) r);
        }
        return b.append(r);
    }
}
