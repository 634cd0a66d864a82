package org.drumloop.bench.record;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/**
 * Which build of the bench made a record: the project version and the git commit it was built
 * from, both written into the build by Maven ({@code version.properties} by resource filtering,
 * {@code git.properties} by the build's call of {@code git rev-parse HEAD} and
 * {@code git status --porcelain}). A build without git metadata (a source archive) knows its version
 * only; "development build" is said only when neither is known (classes compiled outside Maven).
 *
 * @param version project version, or "" when unknown
 * @param commit  full commit id (40 hex digits), or "" when unknown
 * @param dirty   tracked files differed from the commit when the bench was built
 */
public record BuildInfo(String version, String commit, boolean dirty) {
    /** Shown when neither the version nor the commit is known. */
    public static final String DEVELOPMENT = "development build";

    private static final BuildInfo CURRENT = load();

    /** The build this code belongs to. */
    public static BuildInfo current() { return CURRENT; }

    static BuildInfo load() {
        Properties v = read("/org/drumloop/bench/version.properties");
        Properties g = read("/org/drumloop/bench/git.properties");
        return of(v.getProperty("version", ""), g.getProperty("commit", ""), "true".equals(g.getProperty("dirty")));
    }

    /** From raw values; placeholders left by a build that did not fill them count as unknown. */
    static BuildInfo of(String version, String commit, boolean dirty) {
        String ver = version == null || version.isBlank() || version.contains("${") ? "" : version.strip();
        String c = commit == null ? "" : commit.strip();
        if (!c.matches("[0-9a-f]{7,64}")) {
            c = "";
        }
        return new BuildInfo(ver, c, dirty && !c.isEmpty());
    }

    private static Properties read(String resource) {
        Properties p = new Properties();
        try (InputStream in = BuildInfo.class.getResourceAsStream(resource)) {
            if (in != null) {
                p.load(in);
            }
        } catch (IOException e) {
            // unknown: said as such in the records
        }
        return p;
    }

    /** The commit shortened as git does by default (7 hex digits), or "". */
    public String shortCommit() { return commit.length() > 7 ? commit.substring(0, 7) : commit; }

    /**
     * One line naming the build, the same in {@code --version} and on every record, e.g.
     * {@code 0.1.0-SNAPSHOT, commit 57d2d49ef0bd06a07e87e4a04901999b9ff59a1e (built with uncommitted changes)}.
     */
    public String describe() {
        if (version.isEmpty() && commit.isEmpty()) {
            return DEVELOPMENT;
        }
        StringBuilder sb = new StringBuilder(version.isEmpty() ? "version unknown" : version);
        if (commit.isEmpty()) {
            sb.append(", commit unknown (built without git metadata)");
        } else {
            sb.append(", commit ").append(commit);
            if (dirty) {
                sb.append(" (built with uncommitted changes)");
            }
        }
        return sb.toString();
    }
}
