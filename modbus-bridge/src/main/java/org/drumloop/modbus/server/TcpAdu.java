package org.drumloop.modbus.server;

import org.drumloop.modbus.frame.Mbap;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.stats.LinkStatistics;

/** Serving one whole Modbus TCP ADU (MBAP header + PDU) from a buffer; shared by the TCP transports. */
final class TcpAdu {
    private TcpAdu() {}

    /**
     * Answer the request ADU in {@code req[0..7+pdu)} (its header already checked plausible) into
     * {@code resp}, count it in {@code stats}, and return the response ADU's length. A unit id
     * without channels answers exception 0x0B (gateway target failed to respond).
     */
    static int answer(ServedImage image, byte[] req, byte[] resp, LinkStatistics stats) {
        long t0 = System.nanoTime();
        int unit = req[6] & 0xFF;
        int n = image.handle(unit, req, Modbus.MBAP_LENGTH, Mbap.pduLength(req, 0), resp, Modbus.MBAP_LENGTH);
        if (n < 0) {
            n = ServedImage.exception(resp, Modbus.MBAP_LENGTH, req[Modbus.MBAP_LENGTH] & 0xFF,
                    Modbus.EX_GATEWAY_TARGET_NO_RESPONSE);
        }
        int code = (resp[Modbus.MBAP_LENGTH] & Modbus.EXCEPTION_FLAG) != 0 ? resp[Modbus.MBAP_LENGTH + 1] & 0xFF : 0;
        stats.served(code, System.nanoTime() - t0);
        // echo the transaction id and unit id; protocol 0; the response's length
        Mbap.encode(resp, 0, ((req[0] & 0xFF) << 8) | (req[1] & 0xFF), unit, n);
        return Modbus.MBAP_LENGTH + n;
    }
}
