package org.drumloop.modbus.client;

import java.net.SocketTimeoutException;
import java.util.Locale;

import com.ghgande.j2mod.modbus.ModbusException;
import com.ghgande.j2mod.modbus.ModbusSlaveException;
import com.ghgande.j2mod.modbus.facade.AbstractModbusMaster;
import com.ghgande.j2mod.modbus.facade.ModbusSerialMaster;
import com.ghgande.j2mod.modbus.procimg.InputRegister;
import com.ghgande.j2mod.modbus.procimg.Register;
import com.ghgande.j2mod.modbus.procimg.SimpleRegister;
import com.ghgande.j2mod.modbus.util.BitVector;
import com.ghgande.j2mod.modbus.util.SerialParameters;
import com.fazecast.jSerialComm.SerialPort;

import org.drumloop.modbus.SerialSettings;
import org.drumloop.modbus.map.Table;

/**
 * {@link MasterLink} on j2mod's serial master facade (Modbus RTU; TCP uses our own
 * {@link TcpMasterLink}). j2mod types stay in this class.
 * j2mod's own retries and reconnects are switched off: {@link RigClient} retries, reconnects
 * and counts, so the statistics see every attempt.
 */
public final class J2modLink implements MasterLink {
    private final AbstractModbusMaster master;
    private final String name;
    private volatile boolean connected;

    private J2modLink(AbstractModbusMaster master, String name) {
        this.master = master;
        this.name = name;
        master.setRetries(0);
    }

    /** An RTU master on a serial line. */
    public static J2modLink rtu(SerialSettings s, int timeoutMs) {
        SerialParameters p = new SerialParameters();
        p.setPortName(s.device());
        p.setBaudRate(s.baud());
        p.setDatabits(8);
        p.setStopbits(s.stopBits() == 2 ? SerialPort.TWO_STOP_BITS : SerialPort.ONE_STOP_BIT);
        p.setParity(switch (s.parity()) {
            case NONE -> SerialPort.NO_PARITY;
            case EVEN -> SerialPort.EVEN_PARITY;
            case ODD -> SerialPort.ODD_PARITY;
        });
        p.setEncoding("rtu");
        p.setEcho(false);
        return new J2modLink(new ModbusSerialMaster(p, timeoutMs), "rtu " + s.device());
    }

    @Override
    public void connect() throws LinkException {
        try {
            master.connect();
            connected = master.isConnected();
            if (!connected) {
                throw new LinkException(LinkException.Kind.IO, 0, name + ": not connected", null);
            }
        } catch (LinkException e) {
            throw e;
        } catch (Exception e) {
            connected = false;
            throw new LinkException(LinkException.Kind.IO, 0, name + ": connect failed: " + e.getMessage(), e);
        }
    }

    @Override
    public void disconnect() {
        connected = false;
        try {
            master.disconnect();
        } catch (RuntimeException e) {
            // a half-open socket may throw while closing; it is closed either way
        }
    }

    @Override
    public boolean isConnected() { return connected; }

    @Override
    public void readRegisters(Table table, int unitId, int address, int qty, int[] out) throws LinkException {
        try {
            InputRegister[] r = table == Table.INPUT_REGISTER
                    ? master.readInputRegisters(unitId, address, qty)
                    : master.readMultipleRegisters(unitId, address, qty);
            if (r == null || r.length < qty) {
                throw new LinkException(LinkException.Kind.IO, 0, name + ": short answer", null);
            }
            for (int k = 0; k < qty; k++) {
                out[k] = r[k].getValue() & 0xFFFF;
            }
        } catch (ModbusException e) {
            throw classify(e);
        } catch (RuntimeException e) {
            throw new LinkException(LinkException.Kind.IO, 0, name + ": " + e, e);
        }
    }

    @Override
    public void readBits(Table table, int unitId, int address, int qty, int[] out) throws LinkException {
        try {
            BitVector v = table == Table.DISCRETE_INPUT
                    ? master.readInputDiscretes(unitId, address, qty)
                    : master.readCoils(unitId, address, qty);
            if (v == null) {
                throw new LinkException(LinkException.Kind.IO, 0, name + ": short answer", null);
            }
            for (int k = 0; k < qty; k++) {
                out[k] = v.getBit(k) ? 1 : 0;
            }
        } catch (ModbusException e) {
            throw classify(e);
        } catch (RuntimeException e) {
            throw new LinkException(LinkException.Kind.IO, 0, name + ": " + e, e);
        }
    }

    @Override
    public void writeRegisters(int unitId, int address, int qty, int[] values) throws LinkException {
        try {
            Register[] r = new Register[qty];
            for (int k = 0; k < qty; k++) {
                r[k] = new SimpleRegister(values[k]);
            }
            master.writeMultipleRegisters(unitId, address, r);
        } catch (ModbusException e) {
            throw classify(e);
        } catch (RuntimeException e) {
            throw new LinkException(LinkException.Kind.IO, 0, name + ": " + e, e);
        }
    }

    @Override
    public void writeCoils(int unitId, int address, int qty, int[] bits) throws LinkException {
        try {
            BitVector v = new BitVector(qty);
            for (int k = 0; k < qty; k++) {
                v.setBit(k, bits[k] != 0);
            }
            master.writeMultipleCoils(unitId, address, v);
        } catch (ModbusException e) {
            throw classify(e);
        } catch (RuntimeException e) {
            throw new LinkException(LinkException.Kind.IO, 0, name + ": " + e, e);
        }
    }

    @Override
    public String describe() { return name; }

    private LinkException classify(ModbusException e) {
        if (e instanceof ModbusSlaveException se) {
            return new LinkException(LinkException.Kind.EXCEPTION, se.getType(), name + ": " + e.getMessage(), e);
        }
        for (Throwable t = e; t != null; t = t.getCause()) {
            String m = String.valueOf(t.getMessage()).toLowerCase(Locale.ROOT);
            if (t instanceof SocketTimeoutException || m.contains("timeout") || m.contains("timed out")) {
                return new LinkException(LinkException.Kind.TIMEOUT, 0, name + ": timeout", e);
            }
        }
        return new LinkException(LinkException.Kind.IO, 0, name + ": " + e.getMessage(), e);
    }
}
