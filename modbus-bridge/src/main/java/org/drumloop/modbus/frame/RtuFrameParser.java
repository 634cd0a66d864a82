package org.drumloop.modbus.frame;

/**
 * Byte-stream parser for Modbus RTU frames. Bytes are fed as they arrive; the parser knows each
 * frame's length from its function code (and byte count), checks the CRC, and reports a whole
 * frame. A silence of at least t3.5 ({@link #silence()}) ends whatever was collected: a partial
 * frame is dropped, a frame of unknown function code is completed there.
 *
 * <p>One preallocated buffer of {@link Modbus#MAX_RTU_ADU} bytes; no allocation while parsing.
 */
public final class RtuFrameParser {
    /** What a fed byte or a silence produced. */
    public enum Result { NEED_MORE, FRAME, BAD_CRC, OVERFLOW, DROPPED, IDLE }

    private final boolean requests;
    private final byte[] buf = new byte[Modbus.MAX_RTU_ADU];
    private int have;
    private boolean complete;

    /** @param requests true to parse requests (server side), false for responses (client side) */
    public RtuFrameParser(boolean requests) { this.requests = requests; }

    /** Feed one byte. After FRAME, BAD_CRC or OVERFLOW the parser starts a new frame on the next byte. */
    public Result feed(byte b) {
        if (complete) {
            have = 0;
            complete = false;
        }
        if (have == buf.length) {
            have = 0;
            return Result.OVERFLOW;
        }
        buf[have++] = b;
        int need = requests ? RtuFrames.requestLength(buf, have) : RtuFrames.responseLength(buf, have);
        if (need > buf.length) {
            complete = true;
            return Result.OVERFLOW;
        }
        if (need > 0 && have == need) {
            complete = true;
            return Crc16.check(buf, 0, have) ? Result.FRAME : Result.BAD_CRC;
        }
        return Result.NEED_MORE;
    }

    /**
     * The line was silent for at least t3.5. A frame of unknown length rule ends here (FRAME or
     * BAD_CRC); a partial frame of known length is DROPPED; nothing collected gives IDLE.
     */
    public Result silence() {
        if (complete || have == 0) {
            complete = false;
            have = 0;
            return Result.IDLE;
        }
        int need = requests ? RtuFrames.requestLength(buf, have) : RtuFrames.responseLength(buf, have);
        complete = true;
        if (need == 0 && have >= 4) {
            return Crc16.check(buf, 0, have) ? Result.FRAME : Result.BAD_CRC;
        }
        return Result.DROPPED;
    }

    /** Bytes of the last frame (valid after FRAME or BAD_CRC until the next feed). */
    public int length() { return have; }

    /** The internal buffer; the frame is {@code buffer()[0..length())}. */
    public byte[] buffer() { return buf; }

    /** Bytes collected towards an unfinished frame. */
    public int pending() { return complete ? 0 : have; }
}
