package org.drumloop.modbus.server;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.drumloop.core.config.ConfigException;
import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.map.ChannelMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The served tables answered PDU by PDU: access rules, exception codes (AP-spec §7) and quantity
 * limits (AP-spec §6.1-6.12), clamping of written values, hand-over to and from the image.
 */
class ServedImageTest {
    private static final String HEADER = "signal,direction,table,unit,address,type,word_order,raw_lo,raw_hi,"
            + "eng_lo,eng_hi,eng_unit,clamp,fault_low,fault_high,stale_after_s,description";
    private static final double EXACT_TOL = 1e-9;

    static ServedImage image() { return new ServedImage(map()); }

    /** Inputs in input registers, a float in holding registers, outputs in holding registers and coils, unit 1. */
    static ChannelMap map() {
        List<ConfigException> problems = new ArrayList<>();
        ChannelMap map = ChannelMap.parse("t.csv", List.of(HEADER,
                "level_dp_a,to_controller,input_register,1,0,int16,,0,27648,4,20,mA,,,,1,",
                "drum_pressure,to_controller,input_register,1,1,uint16,,0,20000,0,20,barg,,,,1,",
                "feed_temp,to_controller,holding_register,1,10,float32,CDAB,,,0,250,degC,,,,1,",
                "pump_a_running,to_controller,discrete_input,1,0,bool,,,,,,,,,,1,",
                "feed_valve_demand,from_controller,holding_register,1,0,uint16,,0,10000,0,100,%,yes,,,0.5,",
                "level_indicated,from_controller,holding_register,1,1,float32,ABCD,,,-1000,1000,mm,yes,,,,",
                "pump_a_run,from_controller,coil,1,0,bool,,,,,,,,,,,",
                "fuel_cutoff,from_controller,coil,1,1,bool,,,,,,,,,,,"), problems);
        assertEquals(List.of(), problems);
        return map;
    }

    private static byte[] pdu(int... b) {
        byte[] out = new byte[b.length];
        for (int i = 0; i < b.length; i++) {
            out[i] = (byte) b[i];
        }
        return out;
    }

    private static byte[] call(ServedImage img, int unit, byte[] req) {
        byte[] resp = new byte[Modbus.MAX_PDU];
        int n = img.handle(unit, req, 0, req.length, resp, 0);
        return n < 0 ? null : Arrays.copyOf(resp, n);
    }

    @Test
    void publishedInputsReadBackAsRegistersAndBits() {
        ServedImage img = image();
        ProcessImage in = new ProcessImage();
        in.setCurrentMa(Signal.LEVEL_DP_A, 12.0, Quality.GOOD, 0);
        in.set(Signal.DRUM_PRESSURE, 8e5 + 101_325.0, Quality.GOOD, 0);
        in.setBool(Signal.PUMP_A_RUNNING, true, Quality.GOOD, 0);
        img.publishInputs(in, 1.0);
        // 12 mA on 0..27648 = 4..20 mA is 13824 = 0x3600; 8 barg on 0..20000 = 0..20 barg is 8000 = 0x1F40
        // (check values §3 headroom convention; EngUnit barg uses the ISO 2533 standard atmosphere)
        assertArrayEquals(pdu(0x04, 4, 0x36, 0x00, 0x1F, 0x40), call(img, 1, pdu(0x04, 0, 0, 0, 2)));
        assertArrayEquals(pdu(0x02, 1, 0x01), call(img, 1, pdu(0x02, 0, 0, 0, 1)));
    }

    @ParameterizedTest
    @CsvSource({
        // request PDU (hex bytes), expected exception code; AP-spec §7: 02 = address outside what the
        // server has, 03 = malformed field (quantity, byte count, coil value), 01 = unsupported function
        "04 00 00 00 03, 2",             // reads past the last mapped input register
        "04 00 05 00 01, 2",             // unmapped register
        "03 00 0A 00 01, 0",             // half a float32 may be read: no exception
        "04 00 00 00 00, 3",             // quantity 0
        "04 00 00 00 7E, 3",             // 126 registers > 125 (AP-spec §6.4)
        "01 00 00 07 D1, 3",             // 2001 coils > 2000 (AP-spec §6.1)
        "06 00 0A 00 01, 2",             // write to an input channel (feed_temp) is refused
        "06 00 01 00 01, 2",             // FC06 to half of a float32 output
        "05 00 00 12 34, 3",             // FC05 value neither FF00 nor 0000 (AP-spec §6.5)
        "05 00 07 FF 00, 2",             // unmapped coil
        "10 00 00 00 01 04 00 01 00 02, 3", // byte count 4 for 1 register
        "10 00 00 00 7C F8, 3",          // 124 registers > 123 (AP-spec §6.12)
        "10 00 01 00 01 02 00 00, 2",    // FC16 covering half a float32
        "0F 00 00 00 03 01 07, 2",       // FC15 past the last coil
        "2B 0E 01 00, 1",                // function not served
    })
    void exceptionCodesFollowTheApplicationProtocol(String hex, int code) {
        String[] parts = hex.trim().split(" ");
        byte[] req = new byte[parts.length];
        for (int i = 0; i < parts.length; i++) {
            req[i] = (byte) Integer.parseInt(parts[i], 16);
        }
        byte[] resp = call(image(), 1, req);
        if (code == 0) {
            assertEquals(req[0], resp[0]);
        } else {
            assertArrayEquals(pdu((req[0] & 0xFF) | 0x80, code), resp);
        }
    }

    @Test
    void anotherUnitIdIsNotServed() {
        assertEquals(null, call(image(), 7, pdu(0x04, 0, 0, 0, 1)));
    }

    @Test
    void writtenValuesAreClampedToTheEngineeringRangeAndHandedToTheImage() {
        ServedImage img = image();
        img.publishInputs(new ProcessImage(), 3.0);
        // FC06 12000 = 120.00 % on 0..10000 = 0..100 %: clamped to 100 %, and read back clamped
        assertArrayEquals(pdu(0x06, 0, 0, 0x2E, 0xE0), call(img, 1, pdu(0x06, 0, 0, 0x2E, 0xE0)));
        assertArrayEquals(pdu(0x03, 2, 0x27, 0x10), call(img, 1, pdu(0x03, 0, 0, 0, 1)));
        // FC16 writes -12.5 mm to level_indicated as float32 ABCD (0xC1480000, IEEE 754 computed)
        assertArrayEquals(pdu(0x10, 0, 1, 0, 2), call(img, 1, pdu(0x10, 0, 1, 0, 2, 4, 0xC1, 0x48, 0, 0)));
        // FC15 sets coil 0 and clears coil 1
        assertArrayEquals(pdu(0x0F, 0, 0, 0, 2), call(img, 1, pdu(0x0F, 0, 0, 0, 2, 1, 0x01)));
        ProcessImage out = new ProcessImage();
        img.collectOutputs(out, 3.2);
        assertEquals(1.0, out.value(Signal.FEED_VALVE_DEMAND), EXACT_TOL);
        assertEquals(-0.0125, out.value(Signal.LEVEL_INDICATED), EXACT_TOL);
        assertEquals(true, out.bool(Signal.PUMP_A_RUN));
        assertEquals(false, out.bool(Signal.FUEL_CUTOFF));
        assertEquals(Quality.GOOD, out.quality(Signal.FEED_VALVE_DEMAND));
        assertEquals(3.0, out.updatedS(Signal.FEED_VALVE_DEMAND), 0.0, "stamped with the last publish time");
        assertEquals(Quality.BAD, out.quality(Signal.PUMP_B_RUN), "not in the map");
        // feed_valve_demand has stale_after 0.5 s: a controller silent for longer shows BAD
        img.collectOutputs(out, 3.6);
        assertEquals(Quality.BAD, out.quality(Signal.FEED_VALVE_DEMAND));
        assertEquals(Quality.GOOD, out.quality(Signal.PUMP_A_RUN), "no age limit on this channel");
    }

    @Test
    void aNonFiniteFloatIsRefusedAndLeavesTheTableUntouched() {
        ServedImage img = image();
        // 0x7FC00000 is a quiet NaN (IEEE 754)
        assertArrayEquals(pdu(0x90, 3), call(img, 1, pdu(0x10, 0, 1, 0, 2, 4, 0x7F, 0xC0, 0, 0)));
        assertEquals(Double.NaN, img.writtenEng(Signal.LEVEL_INDICATED), 0.0);
    }
}
