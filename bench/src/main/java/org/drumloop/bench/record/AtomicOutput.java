package org.drumloop.bench.record;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;

/**
 * A text output written to a temporary file beside its target and moved into place only when
 * complete, so a failed run never truncates or half-writes an earlier record.
 */
public final class AtomicOutput implements AutoCloseable {
    private final Path target;
    private final Path temp;
    private final BufferedWriter writer;
    private boolean done;

    public AtomicOutput(Path target) throws IOException {
        this.target = target;
        Path dir = target.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        this.temp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".part");
        this.writer = new BufferedWriter(Files.newBufferedWriter(temp, StandardCharsets.UTF_8), 1 << 16);
    }

    public Writer writer() { return writer; }

    public Path target() { return target; }

    /** Flush, close and move into place. */
    public void commit() throws IOException {
        writer.close();
        try {
            Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
        }
        done = true;
        try {
            // temporary files are private (rw-------); a record is an ordinary readable file
            Files.setPosixFilePermissions(target, PosixFilePermissions.fromString("rw-r--r--"));
        } catch (UnsupportedOperationException | IOException e) {
            // not a POSIX file system: keep what the platform gave
        }
    }

    /** Discard unless committed. */
    @Override
    public void close() {
        if (!done) {
            try {
                writer.close();
            } catch (IOException ignored) {
                // the temporary file is deleted below either way
            }
            try {
                Files.deleteIfExists(temp);
            } catch (IOException ignored) {
                // nothing more to do: the target is untouched
            }
        }
    }

    /**
     * Make sure records can be written into a folder before anything runs: creates it and a
     * temporary file in it (removed at once), so a read-only or full file system, a file in the
     * folder's place or a missing permission fails here, not half-way through a run.
     */
    public static void checkFolder(Path dir) throws IOException {
        try {
            Files.createDirectories(dir);
            Path probe = Files.createTempFile(dir.toAbsolutePath(), ".drumloop-write-check.", ".part");
            Files.delete(probe);
        } catch (IOException e) {
            throw new IOException(dir + ": records cannot be written there (" + e.getClass().getSimpleName()
                    + (e.getMessage() == null ? "" : ": " + e.getMessage()) + ")", e);
        }
    }

    /** Write a whole text atomically. */
    public static void write(Path target, String text) throws IOException {
        try (AtomicOutput o = new AtomicOutput(target)) {
            o.writer().write(text);
            o.commit();
        }
    }
}
