package org.drumloop.modbus.client;

import java.io.BufferedInputStream;
import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.net.SocketTimeoutException;

import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.frame.Mbap;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.map.Table;

/**
 * {@link MasterLink} over Modbus TCP on a plain socket, one request at a time. Every loss of the
 * connection surfaces as an {@link LinkException.Kind#IO} failure and every missed answer as a
 * {@link LinkException.Kind#TIMEOUT}, so the rig client's statistics and back-off see them (a
 * facade that silently reconnects inside a request would hide a dead peer as a slow answer).
 * Answers with another transaction id (late answers to timed-out requests) are skipped.
 * Buffers are preallocated; a request allocates nothing.
 */
public final class TcpMasterLink implements MasterLink {
    private final TcpEndpoint endpoint;
    private final int timeoutMs;
    private final byte[] req = new byte[Modbus.MAX_TCP_ADU];
    private final byte[] resp = new byte[Modbus.MAX_TCP_ADU];
    private Socket socket;
    private InputStream in;
    private OutputStream out;
    private int transaction;
    private volatile boolean connected;

    public TcpMasterLink(TcpEndpoint endpoint, int timeoutMs) {
        this.endpoint = endpoint;
        this.timeoutMs = timeoutMs;
    }

    @Override
    public synchronized void connect() throws LinkException {
        disconnect();
        Socket s = new Socket();
        try {
            s.setTcpNoDelay(true);
            s.connect(new InetSocketAddress(endpoint.host(), endpoint.port()), timeoutMs);
            s.setSoTimeout(timeoutMs);
            socket = s;
            in = new BufferedInputStream(s.getInputStream());
            out = s.getOutputStream();
            connected = true;
        } catch (IOException e) {
            try {
                s.close();
            } catch (IOException ignored) {
                // the socket never opened; nothing to release
            }
            throw new LinkException(LinkException.Kind.IO, 0, describe() + ": connect failed: " + e.getMessage(), e);
        }
    }

    @Override
    public synchronized void disconnect() {
        connected = false;
        if (socket != null) {
            try {
                socket.close();
            } catch (IOException ignored) {
                // closing a broken socket may fail; it is gone either way
            }
            socket = null;
        }
    }

    @Override
    public boolean isConnected() { return connected; }

    @Override
    public synchronized void readRegisters(Table table, int unitId, int address, int qty, int[] dst) throws LinkException {
        int fc = table == Table.INPUT_REGISTER ? Modbus.FC_READ_INPUT_REGISTERS : Modbus.FC_READ_HOLDING_REGISTERS;
        int n = readRequest(fc, address, qty);
        int len = transact(unitId, n);
        int bytes = resp[Modbus.MBAP_LENGTH + 1] & 0xFF;
        if (bytes != 2 * qty || len != 2 + bytes) {
            throw malformed();
        }
        for (int k = 0; k < qty; k++) {
            int o = Modbus.MBAP_LENGTH + 2 + 2 * k;
            dst[k] = ((resp[o] & 0xFF) << 8) | (resp[o + 1] & 0xFF);
        }
    }

    @Override
    public synchronized void readBits(Table table, int unitId, int address, int qty, int[] dst) throws LinkException {
        int fc = table == Table.DISCRETE_INPUT ? Modbus.FC_READ_DISCRETE_INPUTS : Modbus.FC_READ_COILS;
        int n = readRequest(fc, address, qty);
        int len = transact(unitId, n);
        int bytes = resp[Modbus.MBAP_LENGTH + 1] & 0xFF;
        if (bytes != (qty + 7) / 8 || len != 2 + bytes) {
            throw malformed();
        }
        for (int k = 0; k < qty; k++) {
            dst[k] = (resp[Modbus.MBAP_LENGTH + 2 + k / 8] >> (k % 8)) & 1;
        }
    }

    @Override
    public synchronized void writeRegisters(int unitId, int address, int qty, int[] values) throws LinkException {
        int p = Modbus.MBAP_LENGTH;
        req[p] = (byte) Modbus.FC_WRITE_MULTIPLE_REGISTERS;
        put16(p + 1, address);
        put16(p + 3, qty);
        req[p + 5] = (byte) (2 * qty);
        for (int k = 0; k < qty; k++) {
            put16(p + 6 + 2 * k, values[k]);
        }
        if (transact(unitId, 6 + 2 * qty) != 5) {
            throw malformed();
        }
    }

    @Override
    public synchronized void writeCoils(int unitId, int address, int qty, int[] bits) throws LinkException {
        int p = Modbus.MBAP_LENGTH;
        int bytes = (qty + 7) / 8;
        req[p] = (byte) Modbus.FC_WRITE_MULTIPLE_COILS;
        put16(p + 1, address);
        put16(p + 3, qty);
        req[p + 5] = (byte) bytes;
        for (int k = 0; k < bytes; k++) {
            req[p + 6 + k] = 0;
        }
        for (int k = 0; k < qty; k++) {
            if (bits[k] != 0) {
                req[p + 6 + k / 8] |= (byte) (1 << (k % 8));
            }
        }
        if (transact(unitId, 6 + bytes) != 5) {
            throw malformed();
        }
    }

    @Override
    public String describe() { return "tcp " + endpoint; }

    private int readRequest(int fc, int address, int qty) {
        int p = Modbus.MBAP_LENGTH;
        req[p] = (byte) fc;
        put16(p + 1, address);
        put16(p + 3, qty);
        return 5;
    }

    /** Send the PDU in {@code req} and wait for its answer; returns the answer's PDU length. */
    private int transact(int unitId, int pduLen) throws LinkException {
        if (!connected) {
            throw new LinkException(LinkException.Kind.IO, 0, describe() + ": not connected", null);
        }
        int fc = req[Modbus.MBAP_LENGTH] & 0xFF;
        transaction = (transaction + 1) & 0xFFFF;
        Mbap.encode(req, 0, transaction, unitId, pduLen);
        try {
            out.write(req, 0, Modbus.MBAP_LENGTH + pduLen);
            out.flush();
            while (true) {
                readFully(resp, 0, Modbus.MBAP_LENGTH);
                int tid = ((resp[0] & 0xFF) << 8) | (resp[1] & 0xFF);
                int length = ((resp[4] & 0xFF) << 8) | (resp[5] & 0xFF);
                int proto = ((resp[2] & 0xFF) << 8) | (resp[3] & 0xFF);
                if (proto != 0 || length < 2 || length > Modbus.MAX_PDU + 1) {
                    disconnect();
                    throw new LinkException(LinkException.Kind.IO, 0, describe() + ": not a Modbus answer", null);
                }
                int pdu = length - 1;
                readFully(resp, Modbus.MBAP_LENGTH, pdu);
                if (tid != transaction) {
                    continue;
                }
                int rfc = resp[Modbus.MBAP_LENGTH] & 0xFF;
                if (rfc == (fc | Modbus.EXCEPTION_FLAG)) {
                    int code = resp[Modbus.MBAP_LENGTH + 1] & 0xFF;
                    throw new LinkException(LinkException.Kind.EXCEPTION, code,
                            describe() + ": exception " + code + " (" + Modbus.exceptionName(code) + ")", null);
                }
                if (rfc != fc) {
                    throw malformed();
                }
                return pdu;
            }
        } catch (SocketTimeoutException e) {
            throw new LinkException(LinkException.Kind.TIMEOUT, 0, describe() + ": no answer within " + timeoutMs + " ms", e);
        } catch (IOException e) {
            disconnect();
            throw new LinkException(LinkException.Kind.IO, 0, describe() + ": " + e.getMessage(), e);
        }
    }

    private void readFully(byte[] b, int off, int len) throws IOException {
        int done = 0;
        while (done < len) {
            int n = in.read(b, off + done, len - done);
            if (n < 0) {
                throw new EOFException("connection closed by the server");
            }
            done += n;
        }
    }

    private void put16(int off, int v) {
        req[off] = (byte) (v >>> 8);
        req[off + 1] = (byte) v;
    }

    private LinkException malformed() {
        disconnect();
        return new LinkException(LinkException.Kind.IO, 0, describe() + ": malformed answer", null);
    }
}
