package org.drumloop.core.safety;

/** Which fixed annunciator output (see {@link InterlockOutputs}) an interlock drives, if any. */
public enum Annunciator {
    LAL, LAH, LALL, LAHH, TAL, LDAH, NONE;

    /** Look up by name, case-insensitive, or null. */
    public static Annunciator byText(String s) {
        for (Annunciator a : values()) {
            if (a.name().equalsIgnoreCase(s)) {
                return a;
            }
        }
        return null;
    }
}
