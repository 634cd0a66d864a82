package org.drumloop.bench.record;

import java.io.IOException;
import java.net.InetAddress;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneId;
import java.time.ZonedDateTime;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * What every record says about how it was made: when (UTC and local offset) and for how long, with
 * which build of the bench on which host and Java, by which command line, from which input files
 * (each with its SHA-256), with which seed, and against which controller under test. Run reports,
 * campaign cover sheets and certificates all carry it.
 *
 * @param title        the record's title
 * @param startedUtc   when the run started
 * @param zone         the bench host's time zone (the local offset is shown beside UTC)
 * @param wallS        wall-clock duration [s]
 * @param build        the bench build
 * @param host         host name
 * @param java         Java runtime (vendor and version)
 * @param commandLine  the command as typed, quoted for a shell
 * @param workingDir   the folder relative paths were read from
 * @param inputs       every input file with its hash
 * @param seed         random seed of the simulated plant, or null when none applies
 * @param controller   the controller under test, or null for the bench's own firmware
 * @param rows         further label/value lines a kind of record adds (e.g. plant time)
 */
public record RecordHeader(String title, Instant startedUtc, ZoneId zone, double wallS, BuildInfo build, String host,
                           String java, String commandLine, String workingDir, List<InputFile> inputs, Long seed,
                           ControllerUnderTest controller, List<String[]> rows) {
    private static final DateTimeFormatter UTC = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss 'UTC'", Locale.ROOT);
    private static final DateTimeFormatter LOCAL = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss xxx", Locale.ROOT);

    /**
     * An external controller proven on the bench, as the tester names it (free text) and the link it
     * was reached over.
     *
     * @param name     e.g. the PLC's tag or model as written on the test sheet
     * @param firmware firmware or application version as read from the controller
     * @param link     link settings, e.g. {@code Modbus TCP 127.0.0.1:1502 unit 1, poll 50 ms}
     * @param map      channel map file used (shown path), or "" when none
     */
    public record ControllerUnderTest(String name, String firmware, String link, String map) {
    }

    /** Start a header now. */
    public static Builder begin(String title) {
        return new Builder(title, Instant.now(), System.nanoTime());
    }

    /** Date and time in UTC, e.g. {@code 2026-12-02 17:35:16 UTC}. */
    public String utcText() {
        return UTC.format(startedUtc.atZone(ZoneId.of("UTC")));
    }

    /** Date and time on the host's clock with its offset, e.g. {@code 2026-12-02 18:35:16 +01:00}. */
    public String localText() {
        return LOCAL.format(ZonedDateTime.ofInstant(startedUtc, zone));
    }

    /** The date shown on every printed page. */
    public String dateText() {
        return utcText();
    }

    /** The header as a two-column HTML table ({@code id="record-header"}). */
    public void html(StringBuilder sb) {
        sb.append("<table class=\"header\" id=\"record-header\"><tbody>\n");
        row(sb, "run started", Html.esc(utcText()) + " &middot; local " + Html.esc(localText()) + " ("
                + Html.esc(zone.getId()) + ")");
        row(sb, "duration", Html.esc(duration(wallS)) + " wall time");
        row(sb, "bench", "drumloop " + Html.esc(build.describe()));
        row(sb, "host", Html.esc(host));
        row(sb, "Java", Html.esc(java));
        row(sb, "command", "<code>" + Html.esc(commandLine) + "</code>");
        row(sb, "working directory", "<code>" + Html.esc(workingDir) + "</code>");
        if (seed != null) {
            row(sb, "seed", Long.toString(seed));
        }
        if (controller != null) {
            row(sb, "controller under test", Html.esc(controller.name().isEmpty() ? "(not named)" : controller.name()));
            row(sb, "its firmware", Html.esc(controller.firmware().isEmpty() ? "(not given)" : controller.firmware()));
            row(sb, "link", Html.esc(controller.link()));
        }
        for (String[] r : rows) {
            row(sb, Html.esc(r[0]), Html.esc(r[1]));
        }
        sb.append("</tbody></table>\n");
        sb.append("<table class=\"inputs\" id=\"inputs\"><thead><tr><th>input</th><th>file</th><th>SHA-256</th></tr>"
                + "</thead><tbody>\n");
        for (InputFile f : inputs) {
            sb.append("<tr><td>").append(Html.esc(f.role())).append("</td><td><code>").append(Html.esc(f.path()))
                    .append("</code></td><td><code class=\"hash\">").append(f.sha256()).append("</code></td></tr>\n");
        }
        sb.append("</tbody></table>\n");
    }

    private static void row(StringBuilder sb, String k, String v) {
        sb.append("<tr><th>").append(k).append("</th><td>").append(v).append("</td></tr>\n");
    }

    static String duration(double s) {
        if (s < 60) {
            return String.format(Locale.ROOT, "%.2f s", s);
        }
        long t = Math.round(s);
        return String.format(Locale.ROOT, "%d:%02d:%02d (%.0f s)", t / 3600, t / 60 % 60, t % 60, s);
    }

    /** Collects the header while a run goes on; {@link #finish()} fixes the duration. */
    public static final class Builder {
        private final String title;
        private final Instant started;
        private final long startedNs;
        private final List<InputFile> inputs = new ArrayList<>();
        private final List<String[]> rows = new ArrayList<>();
        private Long seed;
        private ControllerUnderTest controller;

        Builder(String title, Instant started, long startedNs) {
            this.title = title;
            this.started = started;
            this.startedNs = startedNs;
        }

        /** Name an input file; its hash is taken now. The same path is listed once. */
        public Builder input(String role, Path file, String shownPath) throws IOException {
            for (InputFile f : inputs) {
                if (f.path().equals(shownPath)) {
                    return this;
                }
            }
            inputs.add(InputFile.of(role, file, shownPath));
            return this;
        }

        /** Name an input already hashed (e.g. from another record of the same campaign). */
        public Builder input(InputFile f) {
            for (InputFile g : inputs) {
                if (g.path().equals(f.path()) && g.sha256().equals(f.sha256())) {
                    return this;
                }
            }
            inputs.add(f);
            return this;
        }

        public Builder seed(long s) {
            this.seed = s;
            return this;
        }

        /** The external controller under test, as the tester names it, and its link. */
        public Builder controllerUnderTest(String name, String firmware, String link, String map) {
            this.controller = new ControllerUnderTest(name == null ? "" : name, firmware == null ? "" : firmware,
                    link == null ? "" : link, map == null ? "" : map);
            return this;
        }

        /** A further line of the header. */
        public Builder row(String label, String value) {
            rows.add(new String[] {label, value});
            return this;
        }

        public String title() { return title; }

        public RecordHeader finish() {
            double wall = (System.nanoTime() - startedNs) * 1e-9;
            return new RecordHeader(title, started, ZoneId.systemDefault(), wall, BuildInfo.current(), hostName(),
                    javaText(), Invocation.text(), Invocation.workingDirectory(), List.copyOf(inputs), seed,
                    controller, List.copyOf(rows));
        }
    }

    static String javaText() {
        return System.getProperty("java.vendor", "") + " " + System.getProperty("java.runtime.version",
                System.getProperty("java.version", "")) + " (" + System.getProperty("os.name", "") + " "
                + System.getProperty("os.arch", "") + ")";
    }

    /** The host's name without a name-service look-up where the kernel says it (a look-up can hang for seconds). */
    static String hostName() {
        try {
            Path k = Path.of("/proc/sys/kernel/hostname");
            if (Files.isReadable(k)) {
                String h = Files.readString(k, StandardCharsets.US_ASCII).strip();
                if (!h.isEmpty()) {
                    return h;
                }
            }
        } catch (IOException | RuntimeException e) {
            // fall through
        }
        for (String v : new String[] {"HOSTNAME", "COMPUTERNAME"}) {
            String h = System.getenv(v);
            if (h != null && !h.isBlank()) {
                return h.strip();
            }
        }
        try {
            return InetAddress.getLocalHost().getHostName();
        } catch (IOException e) {
            return "(unknown)";
        }
    }
}
