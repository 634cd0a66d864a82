package org.drumloop.modbus.map;

/**
 * Order of the four bytes A B C D (A most significant) of a 32-bit value over two registers.
 * Modbus fixes big-endian bytes inside a register but not the order of the registers, so the
 * field has four conventions; a map names one explicitly for every 32-bit channel.
 */
public enum WordOrder {
    /** Register 1 = A B, register 2 = C D ("high word first", big-endian). */
    ABCD,
    /** Register 1 = C D, register 2 = A B ("low word first", word-swapped). */
    CDAB,
    /** Register 1 = B A, register 2 = D C (byte-swapped). */
    BADC,
    /** Register 1 = D C, register 2 = B A (little-endian). */
    DCBA;

    public static WordOrder byName(String s) {
        for (WordOrder w : values()) {
            if (w.name().equals(s)) {
                return w;
            }
        }
        return null;
    }
}
