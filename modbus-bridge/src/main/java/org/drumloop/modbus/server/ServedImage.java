package org.drumloop.modbus.server;

import java.util.List;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.Quality;
import org.drumloop.core.io.Signal;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.map.Channel;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.map.Scaling;
import org.drumloop.modbus.map.Table;
import org.drumloop.modbus.stats.ProblemLog;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.event.Level;

/**
 * The Modbus tables a server shows for one channel map, and the request handler over them.
 * Transport-free: TCP and RTU servers hand it PDUs.
 *
 * <p>Access rules: every address a request touches must belong to a mapped channel, else
 * exception 02 (Illegal Data Address). Writes must touch only channels the controller writes
 * ({@code from_controller}); a write to an input channel is refused with exception 02 as well,
 * because for a writer that address is not part of the writable address space (exception 03 is
 * reserved by the protocol for malformed request fields such as a quantity or byte count out of
 * range). A multi-register write must cover whole 32-bit channels. Written values are clamped to
 * the channel's engineering range and clamps are logged (once a second per channel at most, with
 * counts); a non-finite float is refused with 03.
 * FC 1, 2, 3, 4, 5, 6, 15 and 16 are served; any other function answers exception 01.
 *
 * <p>Thread-safe: network threads and the plant loop meet on one short lock; {@link #publishInputs}
 * and {@link #collectOutputs} hold it only to copy values, and allocate nothing.
 */
public final class ServedImage {
    private static final Logger LOG = LoggerFactory.getLogger(ServedImage.class);

    private final Object lock = new Object();
    private final UnitBank[] units = new UnitBank[256];
    private final Channel[] channels;
    private final ProblemLog.Kind[] clampLog;
    private final double[] outEng;
    private final double[] outWrittenS;
    private final int[] scratch = new int[2];
    private double lastPublishS = 0.0;

    public ServedImage(ChannelMap map) { this(map, new ProblemLog(LOG)); }

    /** Clamped writes are logged through {@code problems}: one line a second per channel at most, with counts. */
    public ServedImage(ChannelMap map, ProblemLog problems) {
        List<Channel> list = map.channels();
        channels = list.toArray(new Channel[0]);
        clampLog = new ProblemLog.Kind[channels.length];
        for (int i = 0; i < channels.length; i++) {
            clampLog[i] = problems.kind("clamped writes to " + channels[i].signal().tag(), Level.WARN);
        }
        outEng = new double[channels.length];
        outWrittenS = new double[channels.length];
        java.util.Arrays.fill(outWrittenS, Double.NaN);
        for (int i = 0; i < channels.length; i++) {
            Channel c = channels[i];
            UnitBank u = units[c.unitId()];
            if (u == null) {
                u = units[c.unitId()] = new UnitBank();
            }
            TableBank t = u.table(c.table());
            for (int a = c.address(); a <= c.lastAddress(); a++) {
                t.owner[a] = i;
            }
        }
    }

    /** True when some channel lives on this unit id. */
    public boolean serves(int unitId) { return unitId >= 0 && unitId < 256 && units[unitId] != null; }

    /**
     * Copy the to-controller signals of {@code in} into the tables (loop currents for mA channels;
     * a channel whose value is not finite shows the bottom of its raw type, which a reader sees as
     * a failure). Also sets the time base for write stamps.
     */
    public void publishInputs(ProcessImage in, double tS) {
        synchronized (lock) {
            lastPublishS = tS;
            for (int i = 0; i < channels.length; i++) {
                Channel c = channels[i];
                if (!c.signal().isInput()) {
                    continue;
                }
                TableBank t = units[c.unitId()].table(c.table());
                double eng = c.engFromImage(in);
                if (c.isBool()) {
                    t.value[c.address()] = eng >= 0.5 ? 1 : 0;
                } else if (Double.isFinite(eng)) {
                    c.engToRegisters(eng, t.value, c.address());
                } else {
                    Scaling.writeRaw(c.type(), c.order(), c.type().minRaw(), t.value, c.address());
                }
            }
        }
    }

    /**
     * Copy the latest written from-controller values into {@code out}. A channel never written is
     * left BAD; one not written for longer than its stale_after is marked BAD; otherwise GOOD with
     * the time of the write.
     */
    public void collectOutputs(ProcessImage out, double tS) {
        synchronized (lock) {
            for (int i = 0; i < channels.length; i++) {
                Channel c = channels[i];
                if (c.signal().isInput()) {
                    continue;
                }
                double w = outWrittenS[i];
                if (Double.isNaN(w)) {
                    out.setQuality(c.signal(), Quality.BAD);
                    continue;
                }
                Quality q = tS - w > c.staleAfterS() ? Quality.BAD : Quality.GOOD;
                c.toImage(outEng[i], out, q, w);
            }
        }
    }

    /** Latest written engineering value of an output signal, or NaN when never written. */
    public double writtenEng(Signal s) {
        synchronized (lock) {
            for (int i = 0; i < channels.length; i++) {
                if (channels[i].signal() == s) {
                    return Double.isNaN(outWrittenS[i]) ? Double.NaN : outEng[i];
                }
            }
            return Double.NaN;
        }
    }

    /**
     * Serve one request PDU. Writes the response PDU into {@code resp} from {@code respOff} and
     * returns its length, or -1 when no channel lives on {@code unitId} (the transport decides:
     * TCP answers exception 0x0B, RTU stays silent).
     */
    public int handle(int unitId, byte[] req, int off, int len, byte[] resp, int respOff) {
        if (!serves(unitId)) {
            return -1;
        }
        if (len < 1) {
            return exception(resp, respOff, 0, Modbus.EX_ILLEGAL_FUNCTION);
        }
        int fc = req[off] & 0xFF;
        UnitBank u = units[unitId];
        synchronized (lock) {
            switch (fc) {
                case Modbus.FC_READ_COILS: return readBits(u.peek(Table.COIL), req, off, len, resp, respOff, fc);
                case Modbus.FC_READ_DISCRETE_INPUTS: return readBits(u.peek(Table.DISCRETE_INPUT), req, off, len, resp, respOff, fc);
                case Modbus.FC_READ_HOLDING_REGISTERS: return readRegs(u.peek(Table.HOLDING_REGISTER), req, off, len, resp, respOff, fc);
                case Modbus.FC_READ_INPUT_REGISTERS: return readRegs(u.peek(Table.INPUT_REGISTER), req, off, len, resp, respOff, fc);
                case Modbus.FC_WRITE_SINGLE_COIL: return writeCoil(u.peek(Table.COIL), req, off, len, resp, respOff);
                case Modbus.FC_WRITE_SINGLE_REGISTER: return writeRegister(u.peek(Table.HOLDING_REGISTER), req, off, len, resp, respOff);
                case Modbus.FC_WRITE_MULTIPLE_COILS: return writeCoils(u.peek(Table.COIL), req, off, len, resp, respOff);
                case Modbus.FC_WRITE_MULTIPLE_REGISTERS: return writeRegisters(u.peek(Table.HOLDING_REGISTER), req, off, len, resp, respOff);
                default: return exception(resp, respOff, fc, Modbus.EX_ILLEGAL_FUNCTION);
            }
        }
    }

    private int readBits(TableBank t, byte[] req, int off, int len, byte[] resp, int ro, int fc) {
        if (len != 5) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        int start = u16(req, off + 1);
        int qty = u16(req, off + 3);
        if (qty < 1 || qty > Modbus.MAX_READ_BITS) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        if (!mapped(t, start, qty, false)) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_ADDRESS);
        }
        int bytes = (qty + 7) / 8;
        resp[ro] = (byte) fc;
        resp[ro + 1] = (byte) bytes;
        for (int k = 0; k < bytes; k++) {
            resp[ro + 2 + k] = 0;
        }
        for (int k = 0; k < qty; k++) {
            if (t.value[start + k] != 0) {
                resp[ro + 2 + k / 8] |= (byte) (1 << (k % 8));
            }
        }
        return 2 + bytes;
    }

    private int readRegs(TableBank t, byte[] req, int off, int len, byte[] resp, int ro, int fc) {
        if (len != 5) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        int start = u16(req, off + 1);
        int qty = u16(req, off + 3);
        if (qty < 1 || qty > Modbus.MAX_READ_REGISTERS) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        if (!mapped(t, start, qty, false)) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_ADDRESS);
        }
        resp[ro] = (byte) fc;
        resp[ro + 1] = (byte) (2 * qty);
        for (int k = 0; k < qty; k++) {
            int v = t.value[start + k];
            resp[ro + 2 + 2 * k] = (byte) (v >>> 8);
            resp[ro + 3 + 2 * k] = (byte) v;
        }
        return 2 + 2 * qty;
    }

    private int writeCoil(TableBank t, byte[] req, int off, int len, byte[] resp, int ro) {
        int fc = Modbus.FC_WRITE_SINGLE_COIL;
        if (len != 5) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        int addr = u16(req, off + 1);
        int v = u16(req, off + 3);
        if (v != Modbus.COIL_ON && v != Modbus.COIL_OFF) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        if (!mapped(t, addr, 1, true)) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_ADDRESS);
        }
        applyBit(t, addr, v == Modbus.COIL_ON);
        return echo(req, off, resp, ro);
    }

    private int writeRegister(TableBank t, byte[] req, int off, int len, byte[] resp, int ro) {
        int fc = Modbus.FC_WRITE_SINGLE_REGISTER;
        if (len != 5) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        int addr = u16(req, off + 1);
        if (!mapped(t, addr, 1, true) || !wholeChannels(t, addr, 1)) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_ADDRESS);
        }
        scratch[0] = u16(req, off + 3);
        int i = t.owner[addr];
        double eng = channels[i].engFromRegisters(scratch, 0);
        if (!Double.isFinite(eng)) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        applyRegisters(t, i, eng);
        return echo(req, off, resp, ro);
    }

    private int writeCoils(TableBank t, byte[] req, int off, int len, byte[] resp, int ro) {
        int fc = Modbus.FC_WRITE_MULTIPLE_COILS;
        if (len < 6) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        int start = u16(req, off + 1);
        int qty = u16(req, off + 3);
        int bc = req[off + 5] & 0xFF;
        if (qty < 1 || qty > Modbus.MAX_WRITE_COILS || bc != (qty + 7) / 8 || len != 6 + bc) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        if (!mapped(t, start, qty, true)) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_ADDRESS);
        }
        for (int k = 0; k < qty; k++) {
            applyBit(t, start + k, (req[off + 6 + k / 8] & (1 << (k % 8))) != 0);
        }
        return echo(req, off, resp, ro);
    }

    private int writeRegisters(TableBank t, byte[] req, int off, int len, byte[] resp, int ro) {
        int fc = Modbus.FC_WRITE_MULTIPLE_REGISTERS;
        if (len < 6) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        int start = u16(req, off + 1);
        int qty = u16(req, off + 3);
        int bc = req[off + 5] & 0xFF;
        if (qty < 1 || qty > Modbus.MAX_WRITE_REGISTERS || bc != 2 * qty || len != 6 + bc) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
        }
        if (!mapped(t, start, qty, true) || !wholeChannels(t, start, qty)) {
            return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_ADDRESS);
        }
        // decode every channel first so that a refused value leaves the table untouched
        for (int a = start; a < start + qty; a += channels[t.owner[a]].width()) {
            Channel c = channels[t.owner[a]];
            for (int w = 0; w < c.width(); w++) {
                scratch[w] = u16(req, off + 6 + 2 * (a - start + w));
            }
            if (!Double.isFinite(c.engFromRegisters(scratch, 0))) {
                return exception(resp, ro, fc, Modbus.EX_ILLEGAL_DATA_VALUE);
            }
        }
        for (int a = start; a < start + qty; a += channels[t.owner[a]].width()) {
            int i = t.owner[a];
            Channel c = channels[i];
            for (int w = 0; w < c.width(); w++) {
                scratch[w] = u16(req, off + 6 + 2 * (a - start + w));
            }
            applyRegisters(t, i, c.engFromRegisters(scratch, 0));
        }
        return echo(req, off, resp, ro);
    }

    private void applyBit(TableBank t, int addr, boolean on) {
        int i = t.owner[addr];
        t.value[addr] = on ? 1 : 0;
        outEng[i] = on ? 1.0 : 0.0;
        outWrittenS[i] = lastPublishS;
    }

    private void applyRegisters(TableBank t, int i, double eng) {
        Channel c = channels[i];
        double clamped = Scaling.clamp(eng, c.engLo(), c.engHi());
        if (clamped != eng) {
            clampLog[i].report("{} written as {} {}, outside {}..{}: clamped to {}", c.signal().tag(), eng,
                    c.engUnit().symbol(), c.engLo(), c.engHi(), clamped);
        }
        c.engToRegisters(clamped, t.value, c.address());
        outEng[i] = clamped;
        outWrittenS[i] = lastPublishS;
    }

    /** Every address in range belongs to a channel (an output channel when {@code write}). */
    private boolean mapped(TableBank t, int start, int qty, boolean write) {
        if (t == null || start + qty > 65536) {
            return false;
        }
        for (int a = start; a < start + qty; a++) {
            int i = t.owner[a];
            if (i < 0 || (write && channels[i].signal().isInput())) {
                return false;
            }
        }
        return true;
    }

    /** The range starts and ends on channel boundaries. */
    private boolean wholeChannels(TableBank t, int start, int qty) {
        Channel first = channels[t.owner[start]];
        Channel last = channels[t.owner[start + qty - 1]];
        return first.address() == start && last.lastAddress() == start + qty - 1;
    }

    private static int echo(byte[] req, int off, byte[] resp, int ro) {
        System.arraycopy(req, off, resp, ro, 5);
        return 5;
    }

    /** Write an exception PDU (function + 0x80, code); returns 2. */
    public static int exception(byte[] resp, int ro, int fc, int code) {
        resp[ro] = (byte) (fc | Modbus.EXCEPTION_FLAG);
        resp[ro + 1] = (byte) code;
        return 2;
    }

    private static int u16(byte[] b, int off) { return ((b[off] & 0xFF) << 8) | (b[off + 1] & 0xFF); }

    /** The four tables of one unit id; a table without channels stays null. */
    private static final class UnitBank {
        private final TableBank[] tables = new TableBank[Table.values().length];

        TableBank peek(Table t) { return tables[t.ordinal()]; }

        TableBank table(Table t) {
            TableBank b = tables[t.ordinal()];
            if (b == null) {
                b = tables[t.ordinal()] = new TableBank();
            }
            return b;
        }
    }

    /** Values (registers 0..0xFFFF or bits 0/1) and the owning channel index per address (-1: none). */
    private static final class TableBank {
        final int[] value = new int[65536];
        final int[] owner = new int[65536];

        TableBank() { java.util.Arrays.fill(owner, -1); }
    }
}
