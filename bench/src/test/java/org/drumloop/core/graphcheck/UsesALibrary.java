package org.drumloop.core.graphcheck;

/** A firmware class that uses a library: {@code ModuleGraphTest} must catch it. Never shipped. */
public final class UsesALibrary {
    private UsesALibrary() {}

    public static Object parser() { return new picocli.CommandLine(new Object()); }
}
