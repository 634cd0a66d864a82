package org.drumloop.bench.tune;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Edits {@code key value unit} lines of a user file in place: the value and unit of a key are
 * replaced, its indentation and the column of the value are kept, and every other line (comments,
 * order, blank lines) stays as written. Shared by the tuning and plant file writers.
 */
final class KeyLines {
    private KeyLines() {
    }

    /**
     * Replaces the values of keys.
     *
     * @param lines   the file's lines
     * @param changes {@code key} (or {@code section.key} for files with {@code [section]} lines) to the new
     *                {@code value unit} text
     * @param comment trailing comment for each changed line (without '#'), or null to keep the line's own
     * @return the edited lines
     * @throws IllegalArgumentException a key was not found
     */
    static List<String> replace(List<String> lines, Map<String, String> changes, Map<String, String> comment) {
        List<String> out = new ArrayList<>(lines.size());
        String section = null;
        java.util.Set<String> done = new java.util.HashSet<>();
        for (String line : lines) {
            String code = stripComment(line).strip();
            if (code.startsWith("[") && code.endsWith("]")) {
                section = code.substring(1, code.length() - 1).strip();
                out.add(line);
                continue;
            }
            if (code.isEmpty()) {
                out.add(line);
                continue;
            }
            String key = code.split("\\s+")[0];
            String qualified = section == null ? key : section + "." + key;
            String value = changes.get(qualified);
            if (value == null) {
                out.add(line);
                continue;
            }
            done.add(qualified);
            out.add(edit(line, key, value, comment == null ? null : comment.get(qualified)));
        }
        for (String k : changes.keySet()) {
            if (!done.contains(k)) {
                throw new IllegalArgumentException("key " + k + " not found in the file");
            }
        }
        return out;
    }

    private static String edit(String line, String key, String value, String newComment) {
        int keyAt = line.indexOf(key);
        int valueAt = keyAt + key.length();
        while (valueAt < line.length() && Character.isWhitespace(line.charAt(valueAt))) {
            valueAt++;
        }
        String code = stripComment(line);
        int hash = code.length() < line.length() ? code.length() : -1;
        StringBuilder sb = new StringBuilder(line.substring(0, valueAt)).append(value);
        String c = newComment != null ? newComment : hash >= 0 ? line.substring(hash + 1).strip() : null;
        if (c != null && !c.isEmpty()) {
            int col = hash >= 0 ? hash : sb.length() + 1;
            sb.append(" ".repeat(Math.max(1, col - sb.length()))).append("# ").append(c);
        }
        return sb.toString();
    }

    /** The line without its comment: '#' at the line start or after white space starts one. */
    static String stripComment(String line) {
        for (int i = 0; i < line.length(); i++) {
            if (line.charAt(i) == '#' && (i == 0 || Character.isWhitespace(line.charAt(i - 1)))) {
                return line.substring(0, i);
            }
        }
        return line;
    }

    /** A number to a given count of significant digits, without an exponent. */
    static String number(double v, int digits) {
        if (v == 0) {
            return "0";
        }
        return new BigDecimal(v).round(new MathContext(digits)).stripTrailingZeros().toPlainString();
    }
}
