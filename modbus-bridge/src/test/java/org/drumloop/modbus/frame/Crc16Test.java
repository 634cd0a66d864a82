package org.drumloop.modbus.frame;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/**
 * CRC-16/MODBUS against the catalogue check value and against published and independently
 * computed RTU frames (MODBUS over Serial Line V1.02, CRC appendix; MODBUS Application Protocol
 * V1.1b3 for the PDUs). CRCs are exact integers: compared with assertEquals, no tolerance needed.
 */
class Crc16Test {

    @Test
    void catalogueCheckValueOfAscii123456789Is0x4B37() {
        // source: CRC-16/MODBUS entry of the RevEng CRC catalogue (check = 0x4B37)
        byte[] data = "123456789".getBytes(StandardCharsets.US_ASCII);
        assertEquals(0x4B37, Crc16.of(data));
        assertEquals(0x4B37, Crc16.bitwise(data, 0, data.length));
    }

    /**
     * Frames (wire order, CRC last, low byte first). Sources, per frame:
     * 11 03 00 6B 00 03 76 87 - FC03 read 3 from 0x006B, the AP-spec §6.3 example PDU, frame as used by many test suites;
     * 01 03 00 00 00 0A C5 CD - widely published golden frame;
     * 02 03 00 00 00 03 05 F8 and its reply 02 03 06 00 00 00 01 00 02 E5 84 - computed with two CRC implementations;
     * 02 83 03 F1 31, 01 83 02 C0 F1 - exception replies (AP-spec §7 layout), computed;
     * 01 05 00 00 FF 00 8C 3A, 01 05 00 00 00 00 CD CA - FC05 ON/OFF (AP-spec §6.5 values), computed;
     * 11 06 00 01 00 03 9A 9B - FC06, AP-spec §6.6 example PDU (from memory, unverified), computed;
     * 01 10 00 01 00 02 04 00 0A 01 02 92 30 - FC16, AP-spec §6.12 example PDU (from memory, unverified), computed;
     * 11 01 00 13 00 25 0E 84 - FC01 read 37 coils from 0x13, seen in a third-party test suite.
     */
    @ParameterizedTest
    @ValueSource(strings = {
        "11 03 00 6B 00 03 76 87",
        "01 03 00 00 00 0A C5 CD",
        "02 03 00 00 00 03 05 F8",
        "02 03 06 00 00 00 01 00 02 E5 84",
        "02 83 03 F1 31",
        "01 83 02 C0 F1",
        "01 05 00 00 FF 00 8C 3A",
        "01 05 00 00 00 00 CD CA",
        "11 06 00 01 00 03 9A 9B",
        "01 10 00 01 00 02 04 00 0A 01 02 92 30",
        "11 01 00 13 00 25 0E 84",
    })
    void appendingTheCrcReproducesThePublishedFrame(String hex) {
        byte[] frame = Hex.bytes(hex);
        byte[] rebuilt = Arrays.copyOf(frame, frame.length);
        rebuilt[frame.length - 2] = 0;
        rebuilt[frame.length - 1] = 0;
        Crc16.append(rebuilt, 0, frame.length - 2);
        assertArrayEquals(frame, rebuilt);
        // running the CRC over a whole frame, CRC included, gives 0 (property of the CRC; computed)
        assertEquals(0, Crc16.of(frame));
        assertTrue(Crc16.check(frame, 0, frame.length));
    }

    @Test
    void tableAndBitwiseFormsAgreeOnEveryByteValue() {
        // the table is built from the bitwise definition; both must agree for all single bytes
        byte[] one = new byte[1];
        for (int b = 0; b < 256; b++) {
            one[0] = (byte) b;
            assertEquals(Crc16.bitwise(one, 0, 1), Crc16.of(one, 0, 1));
        }
    }

    @Test
    void aFlippedBitFailsTheCheck() {
        byte[] frame = Hex.bytes("01 03 00 00 00 0A C5 CD");
        frame[3] ^= 0x01;
        assertEquals(false, Crc16.check(frame, 0, frame.length));
    }
}
