package org.drumloop.core;

/** Feedwater control mode. */
public enum Mode {
    /** The operator sets the feed valve; every controller tracks. */
    MANUAL("manual"),
    /** Drum level alone positions the feed valve (start-up and low load). */
    SINGLE_ELEMENT("single-element"),
    /** Level master plus steam-flow feedforward sets the feed-flow slave, which positions the valve. */
    THREE_ELEMENT("three-element");

    private static final Mode[] VALUES = values();

    private final String label;

    Mode(String label) {
        this.label = label;
    }

    /** The word used in files, commands and screens: "manual", "single-element", "three-element". */
    public String label() { return label; }

    /** Look a label up; null when unknown. */
    public static Mode byLabel(String label) {
        for (Mode m : VALUES) {
            if (m.label.equals(label)) {
                return m;
            }
        }
        return null;
    }
}
