package org.drumloop.bench.live;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Test-side JSON reader for whole documents (objects, arrays, strings, numbers, booleans, null),
 * RFC 8259, independent of the server's own request parser so the two check each other.
 */
final class MiniJson {
    private final String s;
    private int i;

    private MiniJson(String s) {
        this.s = s;
    }

    static Object parse(String text) {
        MiniJson p = new MiniJson(text);
        Object v = p.value();
        p.ws();
        if (p.i != text.length()) {
            throw new IllegalArgumentException("trailing text at " + p.i + ": " + text);
        }
        return v;
    }

    static Map<String, Object> obj(Object o) {
        Map<String, Object> out = new LinkedHashMap<>();
        ((Map<?, ?>) o).forEach((k, v) -> out.put((String) k, v));
        return out;
    }

    static List<Object> list(Object o) {
        return new ArrayList<>((List<?>) o);
    }

    private void ws() {
        while (i < s.length() && Character.isWhitespace(s.charAt(i))) {
            i++;
        }
    }

    private Object value() {
        ws();
        char c = s.charAt(i);
        if (c == '{') {
            i++;
            Map<String, Object> m = new LinkedHashMap<>();
            ws();
            if (s.charAt(i) == '}') {
                i++;
                return m;
            }
            while (true) {
                ws();
                String k = (String) value();
                ws();
                i++; // ':'
                m.put(k, value());
                ws();
                if (s.charAt(i++) == '}') {
                    return m;
                }
            }
        }
        if (c == '[') {
            i++;
            List<Object> l = new ArrayList<>();
            ws();
            if (s.charAt(i) == ']') {
                i++;
                return l;
            }
            while (true) {
                l.add(value());
                ws();
                if (s.charAt(i++) == ']') {
                    return l;
                }
            }
        }
        if (c == '"') {
            StringBuilder b = new StringBuilder();
            i++;
            while (true) {
                char d = s.charAt(i++);
                if (d == '"') {
                    return b.toString();
                }
                if (d == '\\') {
                    char e = s.charAt(i++);
                    switch (e) {
                        case 'n': b.append('\n'); break;
                        case 't': b.append('\t'); break;
                        case 'r': b.append('\r'); break;
                        case 'b': b.append('\b'); break;
                        case 'f': b.append('\f'); break;
                        case 'u': b.append((char) Integer.parseInt(s.substring(i, i + 4), 16)); i += 4; break;
                        default: b.append(e);
                    }
                } else {
                    b.append(d);
                }
            }
        }
        if (s.startsWith("true", i)) {
            i += 4;
            return Boolean.TRUE;
        }
        if (s.startsWith("false", i)) {
            i += 5;
            return Boolean.FALSE;
        }
        if (s.startsWith("null", i)) {
            i += 4;
            return null;
        }
        int start = i;
        while (i < s.length() && "+-.eE0123456789".indexOf(s.charAt(i)) >= 0) {
            i++;
        }
        return Double.valueOf(s.substring(start, i));
    }

    /** Quote a Java string as a JSON string literal. */
    static String quote(String v) {
        StringBuilder b = new StringBuilder("\"");
        for (char c : v.toCharArray()) {
            if (c == '"' || c == '\\') {
                b.append('\\').append(c);
            } else if (c < 0x20) {
                b.append(String.format("\\u%04x", (int) c));
            } else {
                b.append(c);
            }
        }
        return b.append('"').toString();
    }
}
