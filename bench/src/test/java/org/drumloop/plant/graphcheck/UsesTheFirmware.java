package org.drumloop.plant.graphcheck;

/** A plant class that uses the firmware's I/O list: {@code ModuleGraphTest} must catch it. Never shipped. */
public final class UsesTheFirmware {
    private UsesTheFirmware() {}

    public static String tag() { return org.drumloop.core.io.Signal.LEVEL_DP_A.tag(); }
}
