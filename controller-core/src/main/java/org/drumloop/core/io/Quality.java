package org.drumloop.core.io;

/** Quality of a process value, in the sense of a DCS/PLC status: a value without quality is half a value. */
public enum Quality {
    /** Measured, refreshed within its age limit, inside its valid range. */
    GOOD,
    /** Usable with care: e.g. NAMUR NE 43 under/over-range band (3.6-3.8 mA, 20.5-21.0 mA) or a substituted value. */
    UNCERTAIN,
    /** Not usable: failure current, stale (not refreshed within its age limit), out of range or not finite. */
    BAD
}
