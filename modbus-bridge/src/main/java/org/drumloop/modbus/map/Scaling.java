package org.drumloop.modbus.map;

/**
 * Pure functions between register contents, raw numbers, engineering values and SI.
 *
 * <p>Linear scaling: {@code eng = engLo + (raw - rawLo) / (rawHi - rawLo) * (engHi - engLo)} and
 * its inverse. Registers are held as ints 0..0xFFFF. Raw values written to integer registers are
 * rounded half away from zero and saturated at the data type's limits; NaN writes 0.
 */
public final class Scaling {
    private Scaling() {}

    /** Assemble the 32-bit pattern A B C D from two registers in the given order. */
    public static int join32(int reg1, int reg2, WordOrder order) {
        switch (order) {
            case ABCD: return (reg1 << 16) | reg2;
            case CDAB: return (reg2 << 16) | reg1;
            case BADC: return (swapBytes(reg1) << 16) | swapBytes(reg2);
            case DCBA: return (swapBytes(reg2) << 16) | swapBytes(reg1);
            default: throw new IllegalArgumentException(String.valueOf(order));
        }
    }

    /** Register 1 of the 32-bit pattern {@code bits} in the given order. */
    public static int first32(int bits, WordOrder order) {
        int hi = bits >>> 16;
        int lo = bits & 0xFFFF;
        switch (order) {
            case ABCD: return hi;
            case CDAB: return lo;
            case BADC: return swapBytes(hi);
            case DCBA: return swapBytes(lo);
            default: throw new IllegalArgumentException(String.valueOf(order));
        }
    }

    /** Register 2 of the 32-bit pattern {@code bits} in the given order. */
    public static int second32(int bits, WordOrder order) {
        int hi = bits >>> 16;
        int lo = bits & 0xFFFF;
        switch (order) {
            case ABCD: return lo;
            case CDAB: return hi;
            case BADC: return swapBytes(lo);
            case DCBA: return swapBytes(hi);
            default: throw new IllegalArgumentException(String.valueOf(order));
        }
    }

    static int swapBytes(int reg) { return ((reg & 0xFF) << 8) | ((reg >>> 8) & 0xFF); }

    /** The raw number held in {@code regs[off..]} for a numeric type. */
    public static double readRaw(DataType type, WordOrder order, int[] regs, int off) {
        switch (type) {
            case INT16: return (short) regs[off];
            case UINT16: return regs[off] & 0xFFFF;
            case INT32: return join32(regs[off], regs[off + 1], order);
            case UINT32: return join32(regs[off], regs[off + 1], order) & 0xFFFF_FFFFL;
            case FLOAT32: return Float.intBitsToFloat(join32(regs[off], regs[off + 1], order));
            default: throw new IllegalArgumentException("not a register type: " + type);
        }
    }

    /** Store a raw number into {@code regs[off..]}, rounded and saturated for integer types. */
    public static void writeRaw(DataType type, WordOrder order, double raw, int[] regs, int off) {
        if (type == DataType.FLOAT32) {
            int bits = Float.floatToRawIntBits((float) raw);
            regs[off] = first32(bits, order);
            regs[off + 1] = second32(bits, order);
            return;
        }
        double r = Double.isNaN(raw) ? 0.0 : Math.max(type.minRaw(), Math.min(type.maxRaw(), Math.round(raw)));
        long v = (long) r;
        switch (type) {
            case INT16:
            case UINT16:
                regs[off] = (int) (v & 0xFFFF);
                return;
            case INT32:
            case UINT32:
                int bits = (int) v;
                regs[off] = first32(bits, order);
                regs[off + 1] = second32(bits, order);
                return;
            default:
                throw new IllegalArgumentException("not a register type: " + type);
        }
    }

    /** Raw → engineering, linear through (rawLo, engLo) and (rawHi, engHi). */
    public static double toEng(double raw, double rawLo, double rawHi, double engLo, double engHi) {
        return engLo + (raw - rawLo) / (rawHi - rawLo) * (engHi - engLo);
    }

    /** Engineering → raw, the inverse of {@link #toEng}. */
    public static double toRaw(double eng, double rawLo, double rawHi, double engLo, double engHi) {
        return rawLo + (eng - engLo) / (engHi - engLo) * (rawHi - rawLo);
    }

    /** Limit to [lo, hi]; NaN stays NaN. */
    public static double clamp(double v, double lo, double hi) {
        return v < lo ? lo : (v > hi ? hi : v);
    }
}
