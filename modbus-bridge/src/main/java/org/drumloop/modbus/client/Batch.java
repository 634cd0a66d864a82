package org.drumloop.modbus.client;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.map.Channel;
import org.drumloop.modbus.map.Table;

/**
 * One request's worth of channels: same unit and table, addresses contiguous (no gaps, since a
 * server may refuse unmapped addresses with exception 02), at most the protocol's quantity limit.
 *
 * @param table Modbus table
 * @param unitId unit id
 * @param address first address
 * @param quantity registers or bits
 * @param channels the channels inside, in address order
 */
public record Batch(Table table, int unitId, int address, int quantity, List<Channel> channels) {

    /** Group channels into as few read requests as FC 1-4 limits allow (2000 bits, 125 registers). */
    public static List<Batch> forReads(List<Channel> channels) {
        return group(channels, Modbus.MAX_READ_BITS, Modbus.MAX_READ_REGISTERS);
    }

    /** Group channels into as few write requests as FC 15/16 limits allow (1968 coils, 123 registers). */
    public static List<Batch> forWrites(List<Channel> channels) {
        return group(channels, Modbus.MAX_WRITE_COILS, Modbus.MAX_WRITE_REGISTERS);
    }

    static List<Batch> group(List<Channel> channels, int maxBits, int maxRegs) {
        List<Channel> sorted = new ArrayList<>(channels);
        sorted.sort(Comparator.comparingInt(Channel::unitId).thenComparing(Channel::table)
                .thenComparingInt(Channel::address));
        List<Batch> out = new ArrayList<>();
        List<Channel> cur = new ArrayList<>();
        for (Channel c : sorted) {
            if (!cur.isEmpty()) {
                Channel first = cur.get(0);
                Channel last = cur.get(cur.size() - 1);
                int limit = c.table().isBits() ? maxBits : maxRegs;
                boolean joins = c.unitId() == first.unitId() && c.table() == first.table()
                        && c.address() == last.lastAddress() + 1 && c.lastAddress() - first.address() + 1 <= limit;
                if (!joins) {
                    out.add(close(cur));
                    cur = new ArrayList<>();
                }
            }
            cur.add(c);
        }
        if (!cur.isEmpty()) {
            out.add(close(cur));
        }
        return out;
    }

    private static Batch close(List<Channel> cs) {
        Channel first = cs.get(0);
        Channel last = cs.get(cs.size() - 1);
        return new Batch(first.table(), first.unitId(), first.address(), last.lastAddress() - first.address() + 1,
                List.copyOf(cs));
    }
}
