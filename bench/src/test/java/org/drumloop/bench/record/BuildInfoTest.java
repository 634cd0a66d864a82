package org.drumloop.bench.record;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.TimeUnit;

import org.drumloop.bench.Main;
import org.junit.jupiter.api.Test;

/** The build names itself as git names the checkout it was built from. */
class BuildInfoTest {
    /** What {@code git rev-parse --short HEAD} prints here, or null when this is not a git checkout. */
    static String gitShortHead() throws Exception {
        Process p;
        try {
            p = new ProcessBuilder("git", "rev-parse", "--short", "HEAD").redirectErrorStream(false).start();
        } catch (java.io.IOException e) {
            return null; // no git on this machine
        }
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        if (!p.waitFor(30, TimeUnit.SECONDS) || p.exitValue() != 0) {
            return null;
        }
        return out;
    }

    @Test
    void theEmbeddedCommitIsTheCheckoutsHead() throws Exception {
        BuildInfo b = BuildInfo.current();
        assertFalse(b.version().isEmpty(), "the project version is written into every build");
        String head = gitShortHead();
        if (head == null) {
            // a source archive without git metadata: the version alone, never a made-up commit
            assertEquals("", b.commit());
            assertTrue(b.describe().startsWith(b.version()), b.describe());
        } else {
            // git's own abbreviation of HEAD (git rev-parse --short) is a prefix of the embedded full id
            assertTrue(b.commit().startsWith(head), b.commit() + " vs " + head);
            assertTrue(b.describe().contains(head), b.describe());
        }
    }

    @Test
    void versionOptionPrintsTheSameLineAsTheRecords() {
        StringWriter out = new StringWriter();
        assertEquals(0, Main.execute(new PrintWriter(out), new PrintWriter(new StringWriter()), "--version"));
        assertEquals("drumloop " + BuildInfo.current().describe(), out.toString().strip());
    }

    @Test
    void unknownPartsAreSaidAsSuch() {
        assertEquals(BuildInfo.DEVELOPMENT, BuildInfo.of("${project.version}", "", false).describe());
        assertEquals("0.2.0, commit unknown (built without git metadata)", BuildInfo.of("0.2.0", "", true).describe());
        String id = "57d2d49ef0bd06a07e87e4a04901999b9ff59a1e";
        assertEquals("version unknown, commit " + id + " (built with uncommitted changes)",
                BuildInfo.of("", id, true).describe());
        assertEquals("57d2d49", BuildInfo.of("1", id, false).shortCommit());
    }

    @Test
    void theCommandLineIsQuotedForTheShell() {
        // POSIX shell quoting (IEEE Std 1003.1, 2.2.2 single quotes): inside '...' nothing is special but '
        assertEquals("a/b.scenario", Invocation.shellQuote("a/b.scenario"));
        assertEquals("'my run'", Invocation.shellQuote("my run"));
        assertEquals("'it'\\''s'", Invocation.shellQuote("it's"));
        assertEquals("''", Invocation.shellQuote(""));
    }
}
