package org.drumloop.modbus.graphcheck;

/** A bridge class that knows the physics and the bench: {@code ModuleGraphTest} must catch it. Never shipped. */
public final class UsesThePlantAndTheBench {
    private UsesThePlantAndTheBench() {}

    public static double level(org.drumloop.plant.Plant p) { return p.levelM(); }

    public static int ok() { return org.drumloop.bench.ExitCode.OK; }
}
