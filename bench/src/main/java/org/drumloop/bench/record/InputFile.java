package org.drumloop.bench.record;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * An input file named on a record: its role (scenario, plant, tuning, interlocks, channel map,
 * trend), its path as the user knows it, and the SHA-256 of its bytes (FIPS 180-4), so any change
 * to the file shows on the record.
 *
 * @param role   what the file is to the run
 * @param path   path as shown to the user (shipped files read {@code config/KIND/NAME})
 * @param sha256 64 lower-case hex digits
 */
public record InputFile(String role, String path, String sha256) {
    /** Read and hash a file. */
    public static InputFile of(String role, Path file, String shownPath) throws IOException {
        return new InputFile(role, shownPath, sha256(file));
    }

    /** SHA-256 of a file's bytes, hex. */
    public static String sha256(Path file) throws IOException {
        MessageDigest md;
        try {
            md = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform provides SHA-256", e);
        }
        byte[] buf = new byte[8192];
        try (InputStream in = Files.newInputStream(file)) {
            for (int n = in.read(buf); n >= 0; n = in.read(buf)) {
                md.update(buf, 0, n);
            }
        }
        return HexFormat.of().formatHex(md.digest());
    }
}
