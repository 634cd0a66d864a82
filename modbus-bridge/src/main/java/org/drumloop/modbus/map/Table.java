package org.drumloop.modbus.map;

/** The four Modbus data tables, with the 1-based reference prefix some manuals print (0xxxx, 1xxxx, 3xxxx, 4xxxx). */
public enum Table {
    COIL("coil", true, true, '0'),
    DISCRETE_INPUT("discrete_input", true, false, '1'),
    INPUT_REGISTER("input_register", false, false, '3'),
    HOLDING_REGISTER("holding_register", false, true, '4');

    private final String word;
    private final boolean bits;
    private final boolean writable;
    private final char referencePrefix;

    Table(String word, boolean bits, boolean writable, char referencePrefix) {
        this.word = word;
        this.bits = bits;
        this.writable = writable;
        this.referencePrefix = referencePrefix;
    }

    /** Spelling in map files. */
    public String word() { return word; }

    /** Single-bit table (coils, discrete inputs) rather than 16-bit registers. */
    public boolean isBits() { return bits; }

    /** A Modbus client may write this table (coils, holding registers). */
    public boolean isWritable() { return writable; }

    /** Leading digit of the 1-based "Modicon" reference style (e.g. 4 in 40001). */
    public char referencePrefix() { return referencePrefix; }

    public static Table byWord(String w) {
        for (Table t : values()) {
            if (t.word.equals(w)) {
                return t;
            }
        }
        return null;
    }
}
