package org.drumloop.modbus.frame;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** MBAP layout, ADU size limits, quantity limits and RTU timers against the Modbus specifications. */
class FramingLimitsTest {
    /**
     * Timer values are printed to 4 decimals of a millisecond in the source table: half a unit of
     * that (0.5e-7 s), with a little room for a value that sits exactly on the rounding boundary.
     */
    private static final double TIMER_TOL_S = 0.6e-7;

    @Test
    void theMbapExampleReadsTwoInputRegistersFromUnit0x11() {
        // source: MODBUS Messaging on TCP/IP Implementation Guide V1.0b, MBAP header layout;
        // example frame computed from it: length 6 = unit id + 5 PDU bytes
        byte[] expected = Hex.bytes("00 01 00 00 00 06 11 04 00 00 00 02");
        byte[] built = Mbap.frame(1, 0x11, Hex.bytes("04 00 00 00 02"));
        assertArrayEquals(expected, built);
        Mbap h = Mbap.decode(expected, 0);
        assertEquals(new Mbap(1, 0, 6, 0x11), h);
        assertEquals(5, h.pduLength());
        assertTrue(h.plausible());
        assertFalse(new Mbap(1, 1, 6, 1).plausible(), "protocol id must be 0");
        assertFalse(new Mbap(1, 0, 255, 1).plausible(), "length at most 254 = 1 + 253");
    }

    @Test
    void aduSizesFollowThePduLimit() {
        // source: MODBUS Application Protocol V1.1b3 §4.1: PDU <= 253, RTU ADU <= 256, TCP ADU <= 260
        assertEquals(253, Modbus.MAX_PDU);
        assertEquals(256, Modbus.MAX_RTU_ADU);
        assertEquals(260, Modbus.MAX_TCP_ADU);
    }

    @Test
    void quantityLimitsAreThoseOfTheApplicationProtocol() {
        // source: MODBUS Application Protocol V1.1b3 §6.1 (2000 coils), §6.2 (2000 inputs), §6.3/§6.4
        // (125 registers), §6.11 (1968 coils), §6.12 (123 registers), §6.17 (121 write registers)
        assertEquals(0x7D0, Modbus.MAX_READ_BITS);
        assertEquals(0x7D, Modbus.MAX_READ_REGISTERS);
        assertEquals(0x7B0, Modbus.MAX_WRITE_COILS);
        assertEquals(0x7B, Modbus.MAX_WRITE_REGISTERS);
        assertEquals(0x79, Modbus.MAX_RW_WRITE_REGISTERS);
        // the largest reads and writes fill the PDU but never exceed it (computed: 2 + 2*125 = 252,
        // 6 + 2*123 = 252, 6 + 1968/8 = 252, 2 + 2000/8 = 252)
        assertTrue(2 + 2 * Modbus.MAX_READ_REGISTERS <= Modbus.MAX_PDU);
        assertTrue(6 + 2 * Modbus.MAX_WRITE_REGISTERS <= Modbus.MAX_PDU);
        assertTrue(6 + Modbus.MAX_WRITE_COILS / 8 <= Modbus.MAX_PDU);
        assertTrue(2 + Modbus.MAX_READ_BITS / 8 <= Modbus.MAX_PDU);
    }

    @ParameterizedTest
    @CsvSource({
        // baud, t1.5 [ms], t3.5 [ms]; source: MODBUS over Serial Line V1.02 §2.5.1.1, 11-bit
        // characters below 19200 baud computed from it, fixed 0.750/1.750 ms above 19200 baud
        "9600, 1.7188, 4.0104",
        "19200, 0.8594, 2.0052",
        "38400, 0.750, 1.750",
        "115200, 0.750, 1.750",
    })
    void interCharacterAndInterFrameTimersFollowTheSerialGuide(int baud, double t15Ms, double t35Ms) {
        assertEquals(t15Ms * 1e-3, RtuFrames.t15S(baud), TIMER_TOL_S);
        assertEquals(t35Ms * 1e-3, RtuFrames.t35S(baud), TIMER_TOL_S);
    }

    @Test
    void requestLengthsComeFromTheFunctionCodeAndByteCount() {
        // layouts of AP-spec §6.1-6.12: fixed 8-byte RTU requests for FC 1-6, 9 + byte count for 15/16
        assertEquals(8, RtuFrames.requestLength(Hex.bytes("11 03"), 2));
        assertEquals(-1, RtuFrames.requestLength(Hex.bytes("01 10 00 01 00"), 5));
        assertEquals(13, RtuFrames.requestLength(Hex.bytes("01 10 00 01 00 02 04"), 7));
        assertEquals(11, RtuFrames.responseLength(Hex.bytes("02 03 06"), 3));
        assertEquals(5, RtuFrames.responseLength(Hex.bytes("02 83"), 2));
    }
}
