package org.drumloop.core.graphcheck;

/** A firmware class that reads the plant model: {@code ModuleGraphTest} must catch it. Never shipped. */
public final class UsesThePlant {
    private UsesThePlant() {}

    public static double level(org.drumloop.plant.Plant p) { return p.levelM(); }
}
