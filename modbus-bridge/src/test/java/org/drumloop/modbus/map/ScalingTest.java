package org.drumloop.modbus.map;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Register encodings and linear scaling against check values: IEEE-754 bit patterns and the four
 * word orders (computed for 123.456f = 0x42F6E979), and common 4-20 mA converter conventions.
 */
class ScalingTest {
    /** Linear scaling of exactly representable values: a few ulps of double arithmetic. */
    private static final double EXACT_TOL = 1e-9;

    @ParameterizedTest
    @CsvSource({
        // order, register 1, register 2 for A B C D = 42 F6 E9 79 (123.456f); source: computed,
        // the Modbus spec fixes byte order inside a register, not register order (from memory)
        "ABCD, 0x42F6, 0xE979",
        "CDAB, 0xE979, 0x42F6",
        "BADC, 0xF642, 0x79E9",
        "DCBA, 0x79E9, 0xF642",
    })
    void float123_456InEachWordOrder(WordOrder order, String r1, String r2) {
        int reg1 = Integer.decode(r1);
        int reg2 = Integer.decode(r2);
        int[] regs = new int[2];
        Scaling.writeRaw(DataType.FLOAT32, order, 123.456f, regs, 0);
        assertEquals(reg1, regs[0]);
        assertEquals(reg2, regs[1]);
        // compare bit patterns, not decimals: 123.456f decodes as 123.45600128173828 (computed)
        assertEquals(0x42F6E979, Scaling.join32(reg1, reg2, order));
        assertEquals(Float.floatToIntBits(123.456f),
                Float.floatToIntBits((float) Scaling.readRaw(DataType.FLOAT32, order, regs, 0)));
    }

    @ParameterizedTest
    @CsvSource({
        // value, bit pattern; source: IEEE 754 binary32 patterns as computed in the check values
        "4.0, 0x40800000",
        "20.0, 0x41A00000",
        "100.0, 0x42C80000",
        "-1.0, 0xBF800000",
    })
    void floatBitPatterns(float v, String bits) {
        int[] regs = new int[2];
        Scaling.writeRaw(DataType.FLOAT32, WordOrder.ABCD, v, regs, 0);
        assertEquals((int) Long.parseLong(bits.substring(2), 16), (regs[0] << 16) | regs[1]);
    }

    @ParameterizedTest
    @CsvSource({
        // type, order, raw, registers; source: two's complement and unsigned 16/32-bit encodings (definition)
        "INT16, ABCD, -1, 0xFFFF, 0",
        "INT16, ABCD, -32768, 0x8000, 0",
        "INT16, ABCD, 32767, 0x7FFF, 0",
        "UINT16, ABCD, 65535, 0xFFFF, 0",
        "INT32, ABCD, -2, 0xFFFF, 0xFFFE",
        "INT32, CDAB, 65536, 0x0000, 0x0001",
        "INT32, BADC, 258, 0x0000, 0x0201",
        "UINT32, DCBA, 4294967295, 0xFFFF, 0xFFFF",
        "UINT32, ABCD, 2147483648, 0x8000, 0x0000",
    })
    void integerTypesEncodeAndDecode(DataType type, WordOrder order, double raw, String r1, String r2) {
        int[] regs = new int[2];
        Scaling.writeRaw(type, order, raw, regs, 0);
        assertEquals(Integer.decode(r1).intValue(), regs[0]);
        if (type.is32()) {
            assertEquals(Integer.decode(r2).intValue(), regs[1]);
        }
        assertEquals(raw, Scaling.readRaw(type, order, regs, 0), 0.0, "integers round-trip exactly");
    }

    @Test
    void integerWritesSaturateAtTheTypeLimits() {
        // a converter clips rather than wraps (common practice): 40000 in int16 must read 32767, not negative
        int[] regs = new int[2];
        Scaling.writeRaw(DataType.INT16, null, 40000, regs, 0);
        assertEquals(32767.0, Scaling.readRaw(DataType.INT16, null, regs, 0), 0.0);
        Scaling.writeRaw(DataType.UINT16, null, -5, regs, 0);
        assertEquals(0.0, Scaling.readRaw(DataType.UINT16, null, regs, 0), 0.0);
    }

    @ParameterizedTest
    @CsvSource({
        // convention, rawLo, rawHi, mA, counts; source: 4-20 mA conventions table (common practice,
        // counts computed): 12-bit 0-20 mA -> 0..4095 means 4 mA = 819, 12 mA = 2457, 3.6 mA = 737.1
        "0, 4095, 0, 20, 4, 819",
        "0, 4095, 0, 20, 12, 2457",
        "0, 4095, 0, 20, 20, 4095",
        "0, 4095, 0, 20, 3.6, 737.1",
        // 12-bit 4-20 mA -> 0..4095: 12 mA = 2047.5, 3.6 mA = -102.4 (clips in hardware)
        "0, 4095, 4, 20, 12, 2047.5",
        "0, 4095, 4, 20, 3.6, -102.375",
        // 16-bit 0-20 mA -> 0..65535: 4 mA = 13107, 12 mA = 39321, 3.6 mA = 11796.3
        "0, 65535, 0, 20, 4, 13107",
        "0, 65535, 0, 20, 12, 39321",
        "0, 65535, 0, 20, 3.6, 11796.3",
        // signed 16-bit with headroom N = 27648: 12 mA = N/2, 3.6 mA = -0.025 N, 21 mA = 1.0625 N
        "0, 27648, 4, 20, 12, 13824",
        "0, 27648, 4, 20, 3.6, -691.2",
        "0, 27648, 4, 20, 21.0, 29376",
    })
    void fourToTwentyMilliampConventions(double rawLo, double rawHi, double engLo, double engHi, double mA, double counts) {
        assertEquals(counts, Scaling.toRaw(mA, rawLo, rawHi, engLo, engHi), 0.051, "table gives counts to one decimal");
        assertEquals(mA, Scaling.toEng(Scaling.toRaw(mA, rawLo, rawHi, engLo, engHi), rawLo, rawHi, engLo, engHi), EXACT_TOL);
    }

    @Test
    void levelRangeExampleOfTheCheckValues() {
        // source: check values §3 example, range -300..+300 mm: 12 mA -> 0 mm, 8 mA -> -150 mm, 20.5 mA -> +318.75 mm
        assertEquals(0.0, Scaling.toEng(12, 4, 20, -300, 300), EXACT_TOL);
        assertEquals(-150.0, Scaling.toEng(8, 4, 20, -300, 300), EXACT_TOL);
        assertEquals(318.75, Scaling.toEng(20.5, 4, 20, -300, 300), EXACT_TOL);
    }

    @ParameterizedTest
    @CsvSource({
        "INT16, -32768, 32767", "UINT16, 0, 65535", "INT32, -100000, 100000", "UINT32, 0, 4000000000",
    })
    void engineeringToRegistersAndBackIsWithinOneCount(DataType type, double rawLo, double rawHi) {
        // property: eng -> raw (rounded to a count) -> eng differs by at most half a count of span
        double engLo = -250.0;
        double engHi = 750.0;
        double halfCountEng = 0.5 * (engHi - engLo) / (rawHi - rawLo);
        int[] regs = new int[2];
        for (double frac = 0.0; frac <= 1.0; frac += 0.125) {
            double eng = engLo + frac * (engHi - engLo);
            Scaling.writeRaw(type, WordOrder.CDAB, Scaling.toRaw(eng, rawLo, rawHi, engLo, engHi), regs, 0);
            double back = Scaling.toEng(Scaling.readRaw(type, WordOrder.CDAB, regs, 0), rawLo, rawHi, engLo, engHi);
            assertEquals(eng, back, halfCountEng + EXACT_TOL, type + " at " + frac);
        }
    }

    /** Every numeric type in every word order: raw range ends and mid-scale map to eng ends and mid-scale. */
    static java.util.stream.Stream<org.junit.jupiter.params.provider.Arguments> typesAndOrders() {
        java.util.List<org.junit.jupiter.params.provider.Arguments> out = new java.util.ArrayList<>();
        for (DataType t : DataType.values()) {
            if (t == DataType.BOOL) {
                continue;
            }
            for (WordOrder o : t.is32() ? WordOrder.values() : new WordOrder[] {WordOrder.ABCD}) {
                out.add(org.junit.jupiter.params.provider.Arguments.of(t, o));
            }
        }
        return out.stream();
    }

    @org.junit.jupiter.params.ParameterizedTest
    @org.junit.jupiter.params.provider.MethodSource("typesAndOrders")
    void rangeEndsAndMidScaleForEveryTypeAndWordOrder(DataType type, WordOrder order) {
        // raw ranges chosen per type so that ends and middle are whole counts: linear scaling (closed form)
        double rawLo = type == DataType.INT16 || type == DataType.INT32 ? -20000 : (type == DataType.FLOAT32 ? -300.0 : 4000);
        double rawHi = type == DataType.INT16 || type == DataType.INT32 ? 20000 : (type == DataType.FLOAT32 ? 300.0 : 20000);
        double engLo = -300.0;
        double engHi = 300.0;
        int[] regs = new int[2];
        double[][] cases = {{rawLo, engLo}, {(rawLo + rawHi) / 2, 0.0}, {rawHi, engHi}};
        for (double[] c : cases) {
            Scaling.writeRaw(type, order, Scaling.toRaw(c[1], rawLo, rawHi, engLo, engHi), regs, 0);
            double raw = Scaling.readRaw(type, order, regs, 0);
            assertEquals(c[0], raw, 0.0, "whole counts and these floats are exact");
            assertEquals(c[1], Scaling.toEng(raw, rawLo, rawHi, engLo, engHi), EXACT_TOL);
        }
    }

    @Test
    void clampLimitsToTheRangeAndKeepsNaN() {
        assertEquals(0.0, Scaling.clamp(-3, 0, 100), 0.0);
        assertEquals(100.0, Scaling.clamp(130, 0, 100), 0.0);
        assertEquals(42.0, Scaling.clamp(42, 0, 100), 0.0);
        assertEquals(Double.NaN, Scaling.clamp(Double.NaN, 0, 100), 0.0);
    }
}
