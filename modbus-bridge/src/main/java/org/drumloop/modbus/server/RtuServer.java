package org.drumloop.modbus.server;

import java.io.IOException;

import org.drumloop.modbus.SerialLine;
import org.drumloop.modbus.SerialSettings;
import org.drumloop.modbus.frame.Crc16;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.frame.RtuFrameParser;
import org.drumloop.modbus.frame.RtuFrames;
import org.drumloop.modbus.stats.LinkStatistics;
import org.drumloop.modbus.stats.ProblemLog;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.event.Level;

/**
 * Modbus RTU slave transport of an {@link ImageServer} on a serial line. Frames end by their
 * length (known from the function code and byte count) and CRC; a silence of at least the frame
 * gap drops a partial frame (noise, a lost byte) so the parser resynchronises on the next frame.
 * The gap is t3.5 of the baud rate (serial guide §2.5.1.1) but at least {@link #MIN_GAP_S}:
 * user-space time stamps of serial reads are only good to about a millisecond, and USB adapters
 * and pseudo-terminals deliver bytes in bursts. Frames for another address are ignored; address 0
 * (broadcast) is executed without a reply.
 */
final class RtuServer implements AutoCloseable {
    /** Smallest frame gap used, whatever the baud rate [s]. */
    static final double MIN_GAP_S = 0.010;
    private static final Logger LOG = LoggerFactory.getLogger(RtuServer.class);

    private final ServedImage image;
    private final LinkStatistics stats;
    private final SerialLine line;
    private final long gapNs;
    private final Thread worker;
    private final ProblemLog problems;
    private final ProblemLog.Kind crcLog;
    private final ProblemLog.Kind droppedLog;
    private volatile boolean open = true;

    RtuServer(ServedImage image, LinkStatistics stats, SerialSettings settings, ProblemLog problems) throws IOException {
        this.image = image;
        this.stats = stats;
        this.problems = problems;
        this.crcLog = problems.kind("frames with a bad CRC", Level.WARN);
        this.droppedLog = problems.kind("partial or overlong frames dropped", Level.WARN);
        double gapS = Math.max(RtuFrames.t35S(settings.baud()), MIN_GAP_S);
        this.gapNs = (long) (gapS * 1e9);
        this.line = SerialLine.open(settings, (int) Math.ceil(gapS * 1000));
        worker = new Thread(this::loop, "modbus-rtu-" + settings.device());
        worker.setDaemon(true);
        worker.start();
    }

    private void loop() {
        RtuFrameParser parser = new RtuFrameParser(true);
        byte[] in = new byte[Modbus.MAX_RTU_ADU];
        byte[] resp = new byte[Modbus.MAX_RTU_ADU];
        long lastByteNs = System.nanoTime();
        long nextFlushNs = lastByteNs;
        while (open) {
            int n = line.read(in, 0, in.length);
            long now = System.nanoTime();
            if (n < 0) {
                if (open) {
                    stats.ioError();
                    LOG.warn("serial read failed on {}", line.settings().device());
                }
                return;
            }
            if (n == 0 || now - lastByteNs >= gapNs) {
                outcome(parser.silence(), parser, resp);
            }
            if (now - nextFlushNs >= 0) {
                problems.flushDue();
                nextFlushNs = now + 1_000_000_000L;
            }
            if (n == 0) {
                continue;
            }
            lastByteNs = now;
            for (int k = 0; k < n; k++) {
                outcome(parser.feed(in[k]), parser, resp);
            }
        }
    }

    /** Act on what the parser made of a byte or a silence. */
    private void outcome(RtuFrameParser.Result r, RtuFrameParser parser, byte[] resp) {
        switch (r) {
            case FRAME -> answer(parser, resp);
            case BAD_CRC -> {
                stats.crcError();
                crcLog.report("{}: frame with a bad CRC ({} bytes) ignored", stats.name(), parser.length());
            }
            case DROPPED, OVERFLOW -> {
                stats.badFrame();
                droppedLog.report("{}: {} frame dropped", stats.name(), r == RtuFrameParser.Result.DROPPED
                        ? "partial" : "overlong");
            }
            default -> { }
        }
    }

    private void answer(RtuFrameParser parser, byte[] resp) {
        byte[] f = parser.buffer();
        int len = parser.length();
        int address = f[0] & 0xFF;
        boolean broadcast = address == 0;
        if (!broadcast && !image.serves(address)) {
            return;
        }
        long t0 = System.nanoTime();
        if (broadcast) {
            stats.request();
            for (int u = 1; u < 248; u++) {
                if (image.serves(u)) {
                    image.handle(u, f, 1, len - 3, resp, 1);
                }
            }
            return;
        }
        int n = image.handle(address, f, 1, len - 3, resp, 1);
        stats.served((resp[1] & Modbus.EXCEPTION_FLAG) != 0 ? resp[2] & 0xFF : 0, System.nanoTime() - t0);
        resp[0] = (byte) address;
        Crc16.append(resp, 0, n + 1);
        if (!line.write(resp, 0, n + 3)) {
            stats.ioError();
        }
    }

    @Override
    public void close() {
        open = false;
        try {
            worker.join(2000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        line.close();
        problems.flush();
    }
}
