package org.drumloop.modbus.server;

import java.io.DataInputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.net.SocketTimeoutException;

import org.drumloop.modbus.frame.Mbap;

/** A bare Modbus TCP client on a socket, for tests that need to send exactly the bytes they choose. */
final class RawClient implements AutoCloseable {
    private final Socket socket;
    private final DataInputStream in;
    private final OutputStream out;
    private int transaction;

    RawClient(int port) throws IOException {
        socket = new Socket();
        socket.connect(new InetSocketAddress("127.0.0.1", port), 2000);
        socket.setSoTimeout(5000);
        socket.setTcpNoDelay(true);
        in = new DataInputStream(socket.getInputStream());
        out = socket.getOutputStream();
    }

    void send(byte[] bytes) throws IOException {
        out.write(bytes);
        out.flush();
    }

    /** Send {@code pdu} to {@code unit} and return the answer's PDU (throws on a closed connection). */
    byte[] call(int unit, byte[] pdu) throws IOException {
        int tid = ++transaction & 0xFFFF;
        send(Mbap.frame(tid, unit, pdu));
        byte[] head = new byte[7];
        in.readFully(head);
        Mbap h = Mbap.decode(head, 0);
        if (h.transactionId() != tid || h.protocolId() != 0 || h.unitId() != unit) {
            throw new IOException("answer does not match the request: " + h);
        }
        byte[] body = new byte[h.pduLength()];
        in.readFully(body);
        return body;
    }

    /** FC 04 read of {@code qty} input registers from 0 of unit 1. */
    byte[] readInputRegisters(int qty) throws IOException {
        return call(1, new byte[] {4, 0, 0, 0, (byte) qty});
    }

    /** True when the server closed the connection (end of stream) within the read timeout. */
    boolean closedByServer() throws IOException {
        try {
            return in.read() < 0;
        } catch (SocketTimeoutException e) {
            return false;
        } catch (IOException e) {
            // reset by the server counts as closed
            return true;
        }
    }

    @Override
    public void close() throws IOException { socket.close(); }
}
