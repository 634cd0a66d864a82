package org.drumloop.modbus.frame;

/**
 * CRC-16/MODBUS as used by the RTU frame check: reflected polynomial 0x8005 (processed LSB-first
 * as 0xA001), initial value 0xFFFF, no final XOR; the low byte goes on the wire first.
 *
 * <p>Table-driven (256 entries built once from the bitwise definition), no allocation per call.
 */
public final class Crc16 {
    private static final int[] TABLE = new int[256];

    static {
        for (int i = 0; i < 256; i++) {
            int c = i;
            for (int k = 0; k < 8; k++) {
                c = (c & 1) != 0 ? (c >>> 1) ^ 0xA001 : c >>> 1;
            }
            TABLE[i] = c;
        }
    }

    private Crc16() {}

    /** CRC of {@code len} bytes from {@code off}; result 0..0xFFFF. */
    public static int of(byte[] data, int off, int len) {
        int crc = 0xFFFF;
        for (int i = off; i < off + len; i++) {
            crc = (crc >>> 8) ^ TABLE[(crc ^ data[i]) & 0xFF];
        }
        return crc;
    }

    public static int of(byte[] data) { return of(data, 0, data.length); }

    /** Bitwise reference form of the same CRC (slow; kept to check the table against the definition). */
    public static int bitwise(byte[] data, int off, int len) {
        int crc = 0xFFFF;
        for (int i = off; i < off + len; i++) {
            crc ^= data[i] & 0xFF;
            for (int k = 0; k < 8; k++) {
                crc = (crc & 1) != 0 ? (crc >>> 1) ^ 0xA001 : crc >>> 1;
            }
        }
        return crc;
    }

    /** Append the CRC of {@code data[off..off+len)} at {@code data[off+len]}, low byte first. */
    public static void append(byte[] data, int off, int len) {
        int crc = of(data, off, len);
        data[off + len] = (byte) crc;
        data[off + len + 1] = (byte) (crc >>> 8);
    }

    /** True when the last two of {@code len} bytes are the CRC of the ones before them. */
    public static boolean check(byte[] data, int off, int len) {
        return len >= 3 && of(data, off, len) == 0;
    }
}
