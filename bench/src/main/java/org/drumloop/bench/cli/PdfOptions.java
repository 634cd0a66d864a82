package org.drumloop.bench.cli;

import java.io.IOException;
import java.nio.file.Path;

import org.drumloop.bench.record.PdfPrinter;

import picocli.CommandLine.Option;

/** {@code --pdf} and {@code --paper}, for every command that writes HTML records. */
public final class PdfOptions {
    @Option(names = "--pdf", description = "also write each record as PDF beside its HTML (report.pdf, index.pdf);"
            + " printed with a headless Chromium (or $" + PdfPrinter.BROWSER_ENV + "); exit 3 when none is installed")
    boolean pdf;

    @Option(names = "--paper", paramLabel = "A4|LETTER", defaultValue = "A4",
            description = "paper of the PDF: ${COMPLETION-CANDIDATES} (default ${DEFAULT-VALUE})")
    PdfPrinter.Paper paper = PdfPrinter.Paper.A4;

    /** The printer when --pdf was given (found before anything runs), else null. */
    PdfPrinter printer() throws PdfPrinter.UnavailableException {
        return pdf ? PdfPrinter.find() : null;
    }

    /** Print {@code DIR/NAME.html} to {@code DIR/NAME.pdf} when a printer is given. */
    void print(PdfPrinter printer, Path dir, String name) throws IOException {
        if (printer != null) {
            printer.print(dir.resolve(name + ".html"), dir.resolve(name + ".pdf"), paper);
        }
    }
}
