package org.drumloop.modbus.interop;

import static org.junit.jupiter.api.Assertions.fail;

import java.io.File;

/** Finds the command-line tools the link tests drive; a missing tool fails the test naming its package. */
final class ExternalTools {
    private ExternalTools() {}

    /** Absolute path of {@code command} on PATH, or a test failure naming the Debian package to install. */
    static String require(String command, String debianPackage) {
        String path = System.getenv("PATH");
        if (path != null) {
            for (String dir : path.split(File.pathSeparator)) {
                File f = new File(dir, command);
                if (f.isFile() && f.canExecute()) {
                    return f.getAbsolutePath();
                }
            }
        }
        return fail(command + " is not installed: install the Debian package '" + debianPackage
                + "' (apt-get install " + debianPackage + ")");
    }
}
