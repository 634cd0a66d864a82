package org.drumloop.bench.tune;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.drumloop.core.io.EngUnit;

/**
 * Writes a tuned {@code .tuning} file: the base file's lines with the tuned keys' values replaced
 * (each changed line says what it was), under a header that states the data, the fits and the rules.
 * Gains are written in the units of the shipped files ({@code %/mm}, {@code (t/h)/mm},
 * {@code %/(t/h)}, {@code mm/(t/h)}), times in seconds.
 */
public final class TuningFileWriter {
    /** Significant digits of a written setting. */
    static final int DIGITS = 4;

    /** {@code %/mm} in SI (1/m). */
    static final double PERCENT_PER_MM = EngUnit.PERCENT.toSi(1) / EngUnit.MM.toSi(1);
    /** {@code (t/h)/mm} in SI ((kg/s)/m). */
    static final double TPH_PER_MM = EngUnit.T_PER_H.toSi(1) / EngUnit.MM.toSi(1);
    /** {@code %/(t/h)} in SI (1/(kg/s)). */
    static final double PERCENT_PER_TPH = EngUnit.PERCENT.toSi(1) / EngUnit.T_PER_H.toSi(1);
    /** {@code mm/(t/h)} in SI (m/(kg/s)). */
    static final double MM_PER_TPH = EngUnit.MM.toSi(1) / EngUnit.T_PER_H.toSi(1);

    private TuningFileWriter() {
    }

    /** The keys a design changes, as {@code section.key} to {@code value unit}, in file order. */
    public static Map<String, String> changes(TuningDesign.Design d) {
        Map<String, String> c = new LinkedHashMap<>();
        if (d.single() != null) {
            pi(c, "single_element", d.single().pi().kc() / PERCENT_PER_MM, "%/mm", d.single().pi().tiS());
        }
        if (d.master() != null) {
            pi(c, "level_master", d.master().pi().kc() / TPH_PER_MM, "(t/h)/mm", d.master().pi().tiS());
        }
        if (d.slave() != null) {
            pi(c, "feed_slave", d.slave().pi().kc() / PERCENT_PER_TPH, "%/(t/h)", d.slave().pi().tiS());
        }
        if (d.swell() != null) {
            c.put("swell.gain", KeyLines.number(d.swell().gainMPerKgS() / MM_PER_TPH, DIGITS) + " mm/(t/h)");
            c.put("swell.time_constant", KeyLines.number(d.swell().tauS(), DIGITS) + " s");
        }
        return c;
    }

    /** Proportional-integral settings; derivative off (SIMC PI) and tracking time = integral time (common practice for PI). */
    private static void pi(Map<String, String> c, String section, double gain, String unit, double tiS) {
        c.put(section + ".gain", KeyLines.number(gain, DIGITS) + " " + unit);
        c.put(section + ".integral_time", KeyLines.number(tiS, DIGITS) + " s");
        c.put(section + ".derivative_time", "0 s");
        c.put(section + ".tracking_time", KeyLines.number(tiS, DIGITS) + " s");
    }

    /**
     * The tuned file's lines.
     *
     * @param base    the base file's lines
     * @param changes from {@link #changes}
     * @param header  header lines (without '#'), placed above the base file's own
     * @param interlocks the interlocks file name to write, or null to keep the base's
     */
    public static List<String> write(List<String> base, Map<String, String> changes, List<String> header,
                                     String interlocks) {
        Map<String, String> was = new LinkedHashMap<>();
        Map<String, String> all = new LinkedHashMap<>(changes);
        if (interlocks != null) {
            all.put("general.interlocks", interlocks);
        }
        String section = null;
        for (String line : base) {
            String code = KeyLines.stripComment(line).strip();
            if (code.startsWith("[") && code.endsWith("]")) {
                section = code.substring(1, code.length() - 1).strip();
            } else if (!code.isEmpty() && section != null) {
                String[] f = code.split("\\s+", 2);
                String q = section + "." + f[0];
                if (all.containsKey(q)) {
                    was.put(q, "tuned (base: " + (f.length > 1 ? f[1] : "") + ")");
                }
            }
        }
        if (interlocks != null) {
            was.put("general.interlocks", "copied beside this file");
        }
        List<String> out = new ArrayList<>();
        for (String h : header) {
            out.add(h.isEmpty() ? "#" : "# " + h);
        }
        out.add("#");
        out.add(String.format(Locale.ROOT, "# The base file follows, its comments as they were; %d settings changed,"
                + " each marked 'tuned'.", changes.size()));
        out.add("");
        out.addAll(KeyLines.replace(base, all, was));
        return out;
    }
}
