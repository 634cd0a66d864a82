package org.drumloop.modbus.client;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;

import org.drumloop.core.io.EngUnit;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.map.Channel;
import org.drumloop.modbus.map.DataType;
import org.drumloop.modbus.map.Table;
import org.drumloop.modbus.map.WordOrder;
import org.junit.jupiter.api.Test;

/** Grouping channels into requests within the AP-spec quantity limits (§6.1-6.4, §6.11, §6.12). */
class BatchTest {

    private static Channel reg(Signal s, int unit, int address, DataType type) {
        return new Channel(s, Table.INPUT_REGISTER, unit, address, type, type.is32() ? WordOrder.ABCD : null,
                0, 1000, 0, 100, EngUnit.KPA, false, Double.NaN, Double.NaN, 1.0, "", 1);
    }

    @Test
    void contiguousChannelsShareOneRequestAndGapsOrUnitsSplit() {
        List<Channel> cs = List.of(
                reg(Signal.LEVEL_DP_A, 1, 0, DataType.INT16),
                reg(Signal.LEVEL_DP_B, 1, 1, DataType.FLOAT32),
                reg(Signal.LEVEL_DP_C, 1, 3, DataType.UINT16),
                reg(Signal.STEAM_FLOW_DP, 1, 10, DataType.INT16),   // gap: new request
                reg(Signal.FEED_FLOW_DP, 2, 4, DataType.INT16));     // other unit: new request
        List<Batch> b = Batch.forReads(cs);
        assertEquals(3, b.size());
        assertEquals(0, b.get(0).address());
        assertEquals(4, b.get(0).quantity(), "int16 + float32 + uint16 = 4 registers");
        assertEquals(3, b.get(0).channels().size());
        assertEquals(10, b.get(1).address());
        assertEquals(2, b.get(2).unitId());
    }

    @Test
    void aLongRunSplitsAt125RegistersWithoutCuttingA32BitValue() {
        // 63 float32 in a row = 126 registers: one request of 62 floats (124 registers), then 1 float,
        // since cutting the 63rd float across two requests would tear its value (AP-spec §6.4: max 125)
        List<Channel> cs = new ArrayList<>();
        for (int k = 0; k < 63; k++) {
            cs.add(reg(Signal.LEVEL_DP_A, 1, 2 * k, DataType.FLOAT32));
        }
        List<Batch> b = Batch.forReads(cs);
        assertEquals(2, b.size());
        assertEquals(124, b.get(0).quantity());
        assertEquals(2, b.get(1).quantity());
        // writes stop at 123 registers (AP-spec §6.12): 61 floats = 122, then 2 floats
        List<Batch> w = Batch.forWrites(cs);
        assertEquals(122, w.get(0).quantity());
    }
}
