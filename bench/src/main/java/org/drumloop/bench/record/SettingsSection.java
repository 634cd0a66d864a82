package org.drumloop.bench.record;

import java.util.List;
import java.util.Locale;
import java.util.Set;

import org.drumloop.core.FirmwareConfig;
import org.drumloop.core.safety.InterlockConfig;
import org.drumloop.modbus.map.Channel;
import org.drumloop.modbus.map.ChannelMap;

/**
 * The settings a record was made with: the transmitter ranges and signal checks and the control
 * tuning, section by section as in the tuning file with the file's units; the interlocks as the
 * cause-and-effect table (the same table {@code drumloop interlocks} prints); and the channel map
 * when the run went over Modbus.
 */
public final class SettingsSection {
    /** Tuning sections that describe transmitters (ranges, compensation data, signal checks). */
    static final Set<String> TRANSMITTER_SECTIONS = Set.of("level_transmitters", "drum_pressure", "steam_flow",
            "feed_flow", "feed_temp", "feed_pressure");

    private SettingsSection() {
    }

    /**
     * @param tuningShown     the tuning file as the user knows it
     * @param interlocksShown the interlocks file as the user knows it
     * @param map             the channel map used, or null
     * @param mapShown        the channel map file as the user knows it (ignored without a map)
     */
    public static void html(StringBuilder sb, FirmwareConfig fc, String tuningShown, String interlocksShown,
                            ChannelMap map, String mapShown) {
        sb.append("<section id=\"settings\"><h2>Settings in use</h2>\n");
        List<FirmwareConfig.Setting> all = fc.settings();
        sb.append("<h3>Transmitter ranges and signal checks <span class=\"meta\">(tuning <code>")
                .append(Html.esc(tuningShown)).append("</code>)</span></h3>\n<div class=\"settings\" id=\"transmitters\">\n");
        groups(sb, all, true);
        sb.append("</div>\n<h3>Control <span class=\"meta\">(tuning <code>").append(Html.esc(tuningShown))
                .append("</code>)</span></h3>\n<div class=\"settings\" id=\"tuning\">\n");
        groups(sb, all, false);
        sb.append("</div>\n<h3>Interlocks: cause and effect <span class=\"meta\">(<code>").append(Html.esc(interlocksShown))
                .append("</code>)</span></h3>\n");
        causeEffect(sb, fc.interlocks());
        if (map != null) {
            sb.append("<h3>Channel map <span class=\"meta\">(<code>").append(Html.esc(mapShown))
                    .append("</code>)</span></h3>\n");
            channelMap(sb, map);
        }
        sb.append("</section>\n");
    }

    private static void groups(StringBuilder sb, List<FirmwareConfig.Setting> all, boolean transmitters) {
        String open = null;
        for (FirmwareConfig.Setting s : all) {
            if (TRANSMITTER_SECTIONS.contains(s.section()) != transmitters) {
                continue;
            }
            if (!s.section().equals(open)) {
                if (open != null) {
                    sb.append("</tbody></table>\n");
                }
                open = s.section();
                sb.append("<table class=\"tuning\" data-section=\"").append(Html.esc(open)).append("\"><caption>[")
                        .append(Html.esc(open)).append("]</caption><tbody>\n");
            }
            sb.append("<tr><th>").append(Html.esc(s.key())).append("</th><td class=\"num\">").append(Html.esc(s.value()))
                    .append("</td><td>").append(Html.esc(s.unit())).append("</td></tr>\n");
        }
        if (open != null) {
            sb.append("</tbody></table>\n");
        }
    }

    /** The cause-and-effect matrix of an interlock configuration as an HTML table ({@code id="cause-effect"}). */
    public static void causeEffect(StringBuilder sb, InterlockConfig ic) {
        List<String[]> rows = ic.causeEffectTable();
        sb.append("<table class=\"causes\" id=\"cause-effect\"><thead><tr>");
        for (String h : rows.get(0)) {
            sb.append("<th>").append(Html.esc(h)).append("</th>");
        }
        sb.append("</tr></thead><tbody>\n");
        for (String[] r : rows.subList(1, rows.size())) {
            sb.append("<tr>");
            for (String c : r) {
                sb.append("<td>").append(Html.esc(c)).append("</td>");
            }
            sb.append("</tr>\n");
        }
        sb.append("</tbody></table>\n");
    }

    /** A channel map as an I/O list: one row per channel with its Modbus place and scaling. */
    public static void channelMap(StringBuilder sb, ChannelMap map) {
        sb.append("<table class=\"causes\" id=\"channel-map\"><thead><tr><th>signal</th><th>direction</th>"
                + "<th>table</th><th>unit id</th><th>address</th><th>type</th><th>raw range</th><th>engineering range</th>"
                + "<th>fault below / above</th><th>stale after</th><th>description</th></tr></thead><tbody>\n");
        for (Channel c : map.channels()) {
            sb.append("<tr><td>").append(Html.esc(c.signal().tag())).append("</td><td>")
                    .append(map.inputs().contains(c) ? "to controller" : "from controller").append("</td><td>")
                    .append(Html.esc(c.table().word())).append("</td><td class=\"num\">").append(c.unitId())
                    .append("</td><td class=\"num\">").append(c.address()).append("</td><td>")
                    .append(Html.esc(c.type().word())).append(c.order() == null ? "" : " " + Html.esc(c.order().name()))
                    .append("</td><td>").append(c.isBool() ? "" : num(c.rawLo()) + " .. " + num(c.rawHi()))
                    .append("</td><td>").append(c.isBool() ? "" : num(c.engLo()) + " .. " + num(c.engHi()) + " "
                            + Html.esc(c.engUnit().symbol())).append("</td><td>")
                    .append(num(c.faultLow())).append(" / ").append(num(c.faultHigh())).append("</td><td>")
                    .append(Double.isInfinite(c.staleAfterS()) ? "no limit" : num(c.staleAfterS()) + " s")
                    .append("</td><td>").append(Html.esc(c.description())).append("</td></tr>\n");
        }
        sb.append("</tbody></table>\n");
    }

    private static String num(double v) {
        if (Double.isNaN(v)) {
            return "-";
        }
        return HtmlReport.trim(Double.parseDouble(String.format(Locale.ROOT, "%.6g", v)));
    }
}
