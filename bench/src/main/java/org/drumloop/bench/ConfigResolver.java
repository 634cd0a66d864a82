package org.drumloop.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URI;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.file.FileSystem;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import java.util.stream.Stream;

/**
 * Finds user files by name or path. A reference with a slash or the file extension is a path
 * (relative to the file that names it, then to the working directory). A bare name such as
 * {@code aux-boiler} or {@code default} is looked up in the project's {@code config/KIND/} folder
 * (next to the naming file's folder, then under the working directory) and last in the copy of the
 * default configuration shipped inside the jar, so the demo works from the jar alone.
 */
public final class ConfigResolver {
    /** Folder of the shipped configuration on the class path. */
    static final String BUNDLED = "config";

    private static Path bundledRoot;

    private ConfigResolver() {
    }

    /**
     * @param ref        name or path as written
     * @param kind       config sub-folder: plants, tuning, scenarios, maps
     * @param ext        extension with dot: .plant, .tuning, .scenario, .csv
     * @param relativeTo the file that names it (may be null)
     * @return the file, or null when not found
     */
    public static Path resolve(String ref, String kind, String ext, Path relativeTo) {
        boolean pathLike = ref.contains("/") || ref.contains("\\") || ref.endsWith(ext);
        Path base = relativeTo == null ? null : relativeTo.toAbsolutePath().getParent();
        if (pathLike) {
            if (base != null && Files.isRegularFile(base.resolve(ref))) {
                return base.resolve(ref);
            }
            Path p = Paths.get(ref);
            return Files.isRegularFile(p) ? p : null;
        }
        String fileName = ref + ext;
        if (base != null) {
            Path sibling = base.resolveSibling(kind).resolve(fileName);
            if (Files.isRegularFile(sibling)) {
                return sibling;
            }
            if (Files.isRegularFile(base.resolve(fileName))) {
                return base.resolve(fileName);
            }
        }
        Path local = Paths.get(BUNDLED, kind, fileName);
        if (Files.isRegularFile(local)) {
            return local;
        }
        Path root = bundledRoot();
        if (root != null && Files.isRegularFile(root.resolve(kind).resolve(fileName))) {
            return root.resolve(kind).resolve(fileName);
        }
        return null;
    }

    /**
     * How to show a resolved file to the user: files from the shipped copy read
     * {@code config/KIND/NAME} (not the temporary folder they were extracted to); others as given.
     */
    public static String displayName(Path p) {
        Path root = bundledRoot();
        if (root != null) {
            Path abs = p.toAbsolutePath().normalize();
            Path r = root.toAbsolutePath().normalize();
            if (abs.startsWith(r)) {
                return BUNDLED + "/" + r.relativize(abs).toString().replace('\\', '/');
            }
        }
        return p.toString();
    }

    /** Names available for a kind (working directory's config first, then the shipped copy). */
    public static List<String> names(String kind, String ext) {
        Path dir = Paths.get(BUNDLED, kind);
        if (!Files.isDirectory(dir)) {
            Path root = bundledRoot();
            dir = root == null ? null : root.resolve(kind);
        }
        if (dir == null || !Files.isDirectory(dir)) {
            return List.of();
        }
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(ext))
                    .map(n -> n.substring(0, n.length() - ext.length())).sorted().collect(Collectors.toList());
        } catch (IOException e) {
            return List.of();
        }
    }

    /**
     * The shipped configuration as a directory: the class-path folder itself when running from
     * classes, or a private copy extracted once from the jar (files keep their relative layout, so a
     * tuning file finds its interlocks file).
     */
    public static synchronized Path bundledRoot() {
        if (bundledRoot != null) {
            return bundledRoot;
        }
        URL url = ConfigResolver.class.getResource("/" + BUNDLED + "/plants");
        if (url == null) {
            url = ConfigResolver.class.getResource("/" + BUNDLED + "/tuning");
        }
        if (url == null) {
            return null;
        }
        try {
            URI uri = url.toURI();
            if ("file".equals(uri.getScheme())) {
                bundledRoot = Paths.get(uri).getParent();
            } else if ("jar".equals(uri.getScheme())) {
                bundledRoot = extract(uri);
            }
        } catch (URISyntaxException | IOException e) {
            throw new UncheckedIOException(new IOException("cannot read the shipped configuration: " + e.getMessage(), e));
        }
        return bundledRoot;
    }

    private static Path extract(URI uri) throws IOException {
        Path target = Files.createTempDirectory("drumloop-config-");
        // deleteOnExit runs in reverse order of registration: register parents before children
        target.toFile().deleteOnExit();
        try (FileSystem fs = FileSystems.newFileSystem(uri, Map.of())) {
            Path src = fs.getPath("/" + BUNDLED);
            try (Stream<Path> walk = Files.walk(src)) {
                for (Path p : (Iterable<Path>) walk::iterator) {
                    Path dst = target.resolve(src.relativize(p).toString());
                    if (Files.isDirectory(p)) {
                        Files.createDirectories(dst);
                    } else {
                        Files.copy(p, dst);
                    }
                    dst.toFile().deleteOnExit();
                }
            }
        }
        return target;
    }
}
