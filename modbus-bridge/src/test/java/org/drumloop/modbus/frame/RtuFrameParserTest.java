package org.drumloop.modbus.frame;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The RTU parser finds whole frames in a byte stream fed in chunks of every size, whatever the
 * split. Frames: the published and computed frames of the serial guide / AP-spec examples (see
 * {@link Crc16Test} for each frame's source). Byte counts and lengths are exact: no tolerance.
 */
class RtuFrameParserTest {

    @ParameterizedTest
    @CsvSource({
        "true, 11 03 00 6B 00 03 76 87",
        "true, 01 03 00 00 00 0A C5 CD",
        "true, 01 05 00 00 FF 00 8C 3A",
        "true, 11 06 00 01 00 03 9A 9B",
        "true, 01 10 00 01 00 02 04 00 0A 01 02 92 30",
        "true, 11 01 00 13 00 25 0E 84",
        "false, 02 03 06 00 00 00 01 00 02 E5 84",
        "false, 02 83 03 F1 31",
        "false, 01 83 02 C0 F1",
        "false, 01 05 00 00 00 00 CD CA",
    })
    void aKnownFrameSplitAtEveryChunkSizeIsFoundOnceAndWhole(boolean request, String hex) {
        byte[] frame = Hex.bytes(hex);
        // three frames back to back, fed in chunks of 1..3n bytes
        byte[] stream = new byte[3 * frame.length];
        for (int k = 0; k < 3; k++) {
            System.arraycopy(frame, 0, stream, k * frame.length, frame.length);
        }
        for (int chunk = 1; chunk <= stream.length; chunk++) {
            RtuFrameParser p = new RtuFrameParser(request);
            int frames = 0;
            for (int off = 0; off < stream.length; off += chunk) {
                int end = Math.min(stream.length, off + chunk);
                for (int i = off; i < end; i++) {
                    RtuFrameParser.Result r = p.feed(stream[i]);
                    if (r == RtuFrameParser.Result.FRAME) {
                        frames++;
                        assertArrayEquals(frame, Arrays.copyOf(p.buffer(), p.length()), "chunk " + chunk);
                    } else {
                        assertEquals(RtuFrameParser.Result.NEED_MORE, r, "chunk " + chunk + " byte " + i);
                    }
                }
            }
            assertEquals(3, frames, "chunk " + chunk);
        }
    }

    @Test
    void aCorruptedCrcIsReportedAndTheNextFrameStillParses() {
        byte[] bad = Hex.bytes("01 03 00 00 00 0A C5 CE");
        byte[] good = Hex.bytes("01 03 00 00 00 0A C5 CD");
        RtuFrameParser p = new RtuFrameParser(true);
        RtuFrameParser.Result last = null;
        for (byte b : bad) {
            last = p.feed(b);
        }
        assertEquals(RtuFrameParser.Result.BAD_CRC, last);
        for (byte b : good) {
            last = p.feed(b);
        }
        assertEquals(RtuFrameParser.Result.FRAME, last);
    }

    @Test
    void silenceDropsAPartialFrameSoTheNextFrameSynchronises() {
        byte[] good = Hex.bytes("11 03 00 6B 00 03 76 87");
        RtuFrameParser p = new RtuFrameParser(true);
        for (int i = 0; i < 5; i++) {
            p.feed(good[i]);
        }
        assertEquals(RtuFrameParser.Result.DROPPED, p.silence());
        RtuFrameParser.Result last = null;
        for (byte b : good) {
            last = p.feed(b);
        }
        assertEquals(RtuFrameParser.Result.FRAME, last);
        assertEquals(RtuFrameParser.Result.IDLE, p.silence());
    }

    @Test
    void aFunctionWithoutALengthRuleEndsAtSilence() {
        // FC 0x2B (encapsulated interface) is not served; the frame ends on t3.5 silence
        byte[] pdu = Hex.bytes("2B 0E 01 00");
        byte[] frame = RtuFrames.frame(1, pdu);
        RtuFrameParser p = new RtuFrameParser(true);
        for (byte b : frame) {
            assertEquals(RtuFrameParser.Result.NEED_MORE, p.feed(b));
        }
        assertEquals(RtuFrameParser.Result.FRAME, p.silence());
        assertEquals(frame.length, p.length());
    }
}
