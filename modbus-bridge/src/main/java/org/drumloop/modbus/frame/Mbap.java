package org.drumloop.modbus.frame;

/**
 * The 7-byte MBAP header that precedes a PDU on Modbus TCP (MODBUS Messaging on TCP/IP
 * Implementation Guide V1.0b): transaction id (2 bytes, echoed by the server), protocol id
 * (2 bytes, 0 for Modbus), length (2 bytes, counting the unit id and the PDU), unit id (1 byte).
 * All fields big-endian.
 *
 * @param transactionId 0..65535
 * @param protocolId 0 for Modbus
 * @param length unit id + PDU bytes, 2..254
 * @param unitId 0..255
 */
public record Mbap(int transactionId, int protocolId, int length, int unitId) {

    /** Length of the PDU this header announces. */
    public int pduLength() { return length - 1; }

    /** True when the header can start a Modbus request or response (protocol 0, PDU 1..253 bytes). */
    public boolean plausible() {
        return protocolId == 0 && length >= 2 && length <= Modbus.MAX_PDU + 1;
    }

    /** {@link #plausible()} of the header at {@code buf[off..off+7)}, without decoding it into a record. */
    public static boolean plausible(byte[] buf, int off) {
        int length = u16(buf, off + 4);
        return u16(buf, off + 2) == 0 && length >= 2 && length <= Modbus.MAX_PDU + 1;
    }

    /** {@link #pduLength()} of the header at {@code buf[off..off+7)}. */
    public static int pduLength(byte[] buf, int off) { return u16(buf, off + 4) - 1; }

    /** Decode the header at {@code buf[off..off+7)}. */
    public static Mbap decode(byte[] buf, int off) {
        return new Mbap(u16(buf, off), u16(buf, off + 2), u16(buf, off + 4), buf[off + 6] & 0xFF);
    }

    /** Write a header for a PDU of {@code pduLength} bytes at {@code buf[off..off+7)}, without allocating. */
    public static void encode(byte[] buf, int off, int transactionId, int unitId, int pduLength) {
        put16(buf, off, transactionId);
        put16(buf, off + 2, 0);
        put16(buf, off + 4, pduLength + 1);
        buf[off + 6] = (byte) unitId;
    }

    /** A whole TCP ADU (header + PDU) as a new array. */
    public static byte[] frame(int transactionId, int unitId, byte[] pdu) {
        byte[] out = new byte[Modbus.MBAP_LENGTH + pdu.length];
        encode(out, 0, transactionId, unitId, pdu.length);
        System.arraycopy(pdu, 0, out, Modbus.MBAP_LENGTH, pdu.length);
        return out;
    }

    static int u16(byte[] b, int off) { return ((b[off] & 0xFF) << 8) | (b[off + 1] & 0xFF); }

    static void put16(byte[] b, int off, int v) {
        b[off] = (byte) (v >>> 8);
        b[off + 1] = (byte) v;
    }
}
