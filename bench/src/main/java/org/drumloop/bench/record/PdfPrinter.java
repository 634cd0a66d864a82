package org.drumloop.bench.record;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

/**
 * Prints an HTML record to PDF with a headless Chromium-based browser (its print-to-PDF keeps the
 * text as text, so the PDF is searchable, and applies the records' print stylesheet exactly as a
 * person printing the page would get it). The browser is {@code $DRUMLOOP_BROWSER} when set, else
 * the first of {@code chromium}, {@code chromium-browser}, {@code google-chrome},
 * {@code google-chrome-stable} on the {@code PATH}. The PDF is written beside its target and moved
 * into place only when complete. Nothing is fetched: records are self-contained and the browser
 * runs with a fresh, private profile that is removed afterwards.
 */
public final class PdfPrinter {
    /** Environment variable naming the browser to print with. */
    public static final String BROWSER_ENV = "DRUMLOOP_BROWSER";
    static final String[] CANDIDATES = {"chromium", "chromium-browser", "google-chrome", "google-chrome-stable"};
    /** Longest a print may take (a cold browser start on a busy machine takes a few seconds). */
    static final long TIMEOUT_S = 180;

    /** Paper sizes the records are laid out for. */
    public enum Paper {
        A4("A4"), LETTER("letter");

        private final String css;

        Paper(String css) {
            this.css = css;
        }

        /** The CSS {@code @page size} keyword. */
        public String css() { return css; }
    }

    /** No means to print a PDF on this machine; the message says what to install. */
    public static final class UnavailableException extends IOException {
        private static final long serialVersionUID = 1L;

        UnavailableException(String message) {
            super(message);
        }
    }

    private final Path browser;

    private PdfPrinter(Path browser) {
        this.browser = browser;
    }

    /** The printer of this machine. */
    public static PdfPrinter find() throws UnavailableException {
        String env = System.getenv(BROWSER_ENV);
        if (env != null && !env.isBlank()) {
            Path p = Path.of(env.strip());
            if (Files.isExecutable(p)) {
                return new PdfPrinter(p);
            }
            throw new UnavailableException(BROWSER_ENV + "=" + env + ": not an executable file");
        }
        String path = System.getenv("PATH");
        if (path != null) {
            for (String name : CANDIDATES) {
                for (String dir : path.split(File.pathSeparator)) {
                    if (!dir.isEmpty() && Files.isExecutable(Path.of(dir, name))) {
                        return new PdfPrinter(Path.of(dir, name));
                    }
                }
            }
        }
        throw new UnavailableException("--pdf: no means to print a PDF on this machine: install Chromium (Debian:"
                + " apt-get install chromium) or set " + BROWSER_ENV + " to a Chromium-based browser");
    }

    public Path browser() { return browser; }

    /**
     * Print {@code html} (a self-contained record) to {@code pdf} on the given paper.
     *
     * @throws IOException the browser failed or the PDF could not be written; an earlier
     *                     {@code pdf} is then left as it was
     */
    public void print(Path html, Path pdf, Paper paper) throws IOException {
        Path dir = pdf.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        // the page size is the printer's choice in the record itself; the PDF fixes it
        String page = Files.readString(html, StandardCharsets.UTF_8);
        int style = page.indexOf("</style>");
        if (style < 0) {
            throw new IOException(html + ": not a drumloop record (no style sheet)");
        }
        page = page.substring(0, style) + "@page{size:" + paper.css() + "}\n" + page.substring(style);
        Path source = Files.createTempFile(dir, "." + pdf.getFileName() + ".", ".html");
        Path out = Files.createTempFile(dir, "." + pdf.getFileName() + ".", ".part");
        Path profile = Files.createTempDirectory("drumloop-print-");
        try {
            Files.writeString(source, page, StandardCharsets.UTF_8);
            Files.delete(out);
            List<String> cmd = new ArrayList<>(List.of(browser.toString(), "--headless", "--disable-gpu",
                    "--no-pdf-header-footer", "--no-first-run", "--no-default-browser-check",
                    "--disable-background-networking", "--disable-component-update", "--disable-sync",
                    "--disable-extensions", "--user-data-dir=" + profile.toAbsolutePath(),
                    "--print-to-pdf=" + out.toAbsolutePath()));
            if ("root".equals(System.getProperty("user.name"))) {
                cmd.add(1, "--no-sandbox"); // Chromium refuses to start as root with its sandbox
            }
            cmd.add(source.toAbsolutePath().toUri().toString());
            Path log = profile.resolve("print.log");
            Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile()).start();
            boolean done;
            try {
                done = p.waitFor(TIMEOUT_S, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                p.destroyForcibly();
                throw new IOException("printing " + html + " was interrupted", e);
            }
            if (!done) {
                p.destroyForcibly();
                throw new IOException(browser + " did not print " + html + " within " + TIMEOUT_S + " s");
            }
            if (!Files.isRegularFile(out) || Files.size(out) < 5 || !startsWithPdf(out)) {
                throw new IOException(browser + " wrote no PDF for " + html + " (exit " + p.exitValue() + "): "
                        + tail(log));
            }
            try {
                Files.move(out, pdf, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(out, pdf, StandardCopyOption.REPLACE_EXISTING);
            }
            try {
                Files.setPosixFilePermissions(pdf, java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
            } catch (UnsupportedOperationException e) {
                // not a POSIX file system
            }
        } finally {
            Files.deleteIfExists(source);
            Files.deleteIfExists(out);
            deleteTree(profile);
        }
    }

    private static boolean startsWithPdf(Path f) throws IOException {
        byte[] head = new byte[5];
        try (var in = Files.newInputStream(f)) {
            return in.read(head) == 5 && new String(head, StandardCharsets.US_ASCII).equals("%PDF-");
        }
    }

    private static String tail(Path log) {
        try {
            String s = Files.readString(log, StandardCharsets.UTF_8).strip();
            return s.length() > 600 ? "..." + s.substring(s.length() - 600) : s.isEmpty() ? "(no output)" : s;
        } catch (IOException e) {
            return "(no output)";
        }
    }

    private static void deleteTree(Path dir) {
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : (Iterable<Path>) walk.sorted(Comparator.reverseOrder())::iterator) {
                Files.deleteIfExists(p);
            }
        } catch (IOException e) {
            // a browser helper still holding a file: the temporary folder is left for the system to clean
        }
    }
}
