package org.drumloop.modbus.map;

/** How a channel's raw value is held in the table. */
public enum DataType {
    BOOL("bool", 0, 0.0, 1.0),
    INT16("int16", 1, -32768.0, 32767.0),
    UINT16("uint16", 1, 0.0, 65535.0),
    INT32("int32", 2, -2147483648.0, 2147483647.0),
    UINT32("uint32", 2, 0.0, 4294967295.0),
    FLOAT32("float32", 2, -Float.MAX_VALUE, Float.MAX_VALUE);

    private final String word;
    private final int registers;
    private final double minRaw;
    private final double maxRaw;

    DataType(String word, int registers, double minRaw, double maxRaw) {
        this.word = word;
        this.registers = registers;
        this.minRaw = minRaw;
        this.maxRaw = maxRaw;
    }

    public String word() { return word; }

    /** Registers occupied (0 for a bit). */
    public int registers() { return registers; }

    /** Occupies two registers, so a word order applies. */
    public boolean is32() { return registers == 2; }

    /** Smallest representable raw value. */
    public double minRaw() { return minRaw; }

    /** Largest representable raw value. */
    public double maxRaw() { return maxRaw; }

    public static DataType byWord(String w) {
        for (DataType t : values()) {
            if (t.word.equals(w)) {
                return t;
            }
        }
        return null;
    }
}
