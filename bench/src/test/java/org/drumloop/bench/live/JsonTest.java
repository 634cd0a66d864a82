package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** The command parser's JSON reader and the writer's escaping, against RFC 8259 examples. */
class JsonTest {
    @Test
    void readsEveryScalarKindOfAFlatObject() throws Exception {
        Map<String, Object> m = Json.parseObject(" {\"s\":\"a\\\"b\\u00e9\\n\",\"n\":-12.5e1,\"t\":true,\"f\":false,\"z\":null} ");
        assertEquals("a\"b\u00e9\n", m.get("s"));
        // -12.5e1 = -125 exactly (RFC 8259 §6 number grammar: int frac exp)
        assertEquals(-125.0, (Double) m.get("n"), 0.0, "exact in binary floating point");
        assertEquals(Boolean.TRUE, m.get("t"));
        assertEquals(Boolean.FALSE, m.get("f"));
        assertEquals(Json.NULL, m.get("z"));
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "[]", "{", "{\"a\"}", "{\"a\":}", "{\"a\":01}", "{\"a\":1.}", "{\"a\":.5}", "{\"a\":+1}",
        "{\"a\":1,}", "{\"a\":1 \"b\":2}", "{\"a\":\"x\ny\"}", "{\"a\":1,\"a\":2}", "{\"a\":[1]}", "{\"a\":tru}", "{} x"})
    void refusesWhatRfc8259OrAFlatCommandDoesNotAllow(String text) {
        assertThrows(Json.ParseException.class, () -> Json.parseObject(text));
    }

    @Test
    void writesStringsThatCannotBreakOutOfTheirPlace() {
        StringBuilder b = new StringBuilder();
        Json.str(b, "</script><b>\"x\\\u0001");
        assertEquals("\"\\u003c/script\\u003e\\u003cb\\u003e\\\"x\\\\\\u0001\"", b.toString());
    }

    @Test
    void writesNumbersRoundedAndNonFiniteAsNull() {
        assertEquals("1.23", Json.num(new StringBuilder(), 1.2345, 2).toString());
        assertEquals("-3", Json.num(new StringBuilder(), -3.0004, 2).toString());
        assertEquals("null", Json.num(new StringBuilder(), Double.NaN, 2).toString());
        assertEquals("null", Json.num(new StringBuilder(), Double.POSITIVE_INFINITY, 2).toString());
    }
}
