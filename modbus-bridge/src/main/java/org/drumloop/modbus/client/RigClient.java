package org.drumloop.modbus.client;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.locks.LockSupport;

import org.drumloop.core.io.ProcessImage;
import org.drumloop.core.io.ProcessIo;
import org.drumloop.core.io.Quality;
import org.drumloop.modbus.SerialSettings;
import org.drumloop.modbus.TcpEndpoint;
import org.drumloop.modbus.frame.Modbus;
import org.drumloop.modbus.map.Channel;
import org.drumloop.modbus.map.ChannelMap;
import org.drumloop.modbus.map.Table;
import org.drumloop.modbus.stats.LinkStatistics;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * {@link ProcessIo} against a PLC or rig over Modbus (client/master). A poll thread reads the
 * input channels in contiguous batches, writes the outputs the scan handed over, retries
 * timeouts, and reconnects with exponential back-off after a lost connection.
 *
 * <p>The scan side never waits on the network: {@link #readInputs} copies the latest snapshot
 * under a short lock and marks every input not refreshed within its {@code stale_after_s} BAD
 * (the value's time stamp is moved back by its age); {@link #writeOutputs} copies the outputs and
 * wakes the poll thread. Neither allocates nor throws. The age of a sample is measured on the
 * monotonic clock of this process: the bridge stands at the edge of the firmware, where wall time
 * is real.
 */
public final class RigClient implements ProcessIo, AutoCloseable {
    private static final Logger LOG = LoggerFactory.getLogger(RigClient.class);

    /**
     * Polling and recovery settings.
     *
     * @param pollPeriodS time between poll cycles [s]
     * @param timeoutS answer timeout per request [s]
     * @param retries extra attempts after a timeout before the link is reset
     * @param backoffMinS first wait before reconnecting [s]; doubles up to {@code backoffMaxS}
     * @param backoffMaxS longest wait between reconnect attempts [s]
     */
    public record Options(double pollPeriodS, double timeoutS, int retries, double backoffMinS, double backoffMaxS) {
        public static Options defaults() { return new Options(0.05, 0.5, 1, 0.1, 5.0); }

        public Options {
            if (!(pollPeriodS > 0) || !(timeoutS > 0) || retries < 0 || !(backoffMinS > 0) || backoffMaxS < backoffMinS) {
                throw new IllegalArgumentException("bad link options");
            }
        }
    }

    private final MasterLink link;
    private final Options opts;
    private final LinkStatistics stats;
    private final Channel[] inputs;
    private final Channel[] outputs;
    private final List<Batch> readBatches;
    private final List<Batch> writeBatches;
    private final int[] inputIndex;
    private final int[] outputIndex;

    private final Object lock = new Object();
    private final double[] inEng;
    private final Quality[] inQuality;
    private final long[] inRefreshNs;
    private final double[] outEng;
    private boolean outputsValid;
    private long outputsSeq;

    private final int[] regs = new int[Math.max(Modbus.MAX_READ_BITS, Modbus.MAX_READ_REGISTERS)];
    private boolean everConnected;
    private long writtenSeq;
    private volatile boolean running;
    private volatile Thread poller;

    public RigClient(ChannelMap map, MasterLink link, Options opts) {
        this.link = link;
        this.opts = opts;
        this.stats = new LinkStatistics("client " + link.describe());
        List<Channel> in = map.inputs();
        List<Channel> out = map.outputs();
        inputs = in.toArray(new Channel[0]);
        outputs = out.toArray(new Channel[0]);
        readBatches = Batch.forReads(in);
        writeBatches = Batch.forWrites(out);
        inEng = new double[inputs.length];
        inQuality = new Quality[inputs.length];
        inRefreshNs = new long[inputs.length];
        java.util.Arrays.fill(inQuality, Quality.BAD);
        outEng = new double[outputs.length];
        inputIndex = new int[org.drumloop.core.io.Signal.count()];
        outputIndex = new int[org.drumloop.core.io.Signal.count()];
        java.util.Arrays.fill(inputIndex, -1);
        java.util.Arrays.fill(outputIndex, -1);
        for (int i = 0; i < inputs.length; i++) {
            inputIndex[inputs[i].signal().ordinal()] = i;
        }
        for (int i = 0; i < outputs.length; i++) {
            outputIndex[outputs[i].signal().ordinal()] = i;
        }
    }

    /** A client on Modbus TCP (our socket link, so that every lost connection is counted). */
    public static RigClient tcp(ChannelMap map, TcpEndpoint ep, Options opts) {
        return new RigClient(map, new TcpMasterLink(ep, (int) Math.ceil(opts.timeoutS() * 1000)), opts);
    }

    /** A client on Modbus RTU through j2mod and jSerialComm. */
    public static RigClient rtu(ChannelMap map, SerialSettings s, Options opts) {
        return new RigClient(map, J2modLink.rtu(s, (int) Math.ceil(opts.timeoutS() * 1000)), opts);
    }

    public LinkStatistics statistics() { return stats; }

    /** The read requests one poll cycle makes. */
    public List<Batch> readBatches() { return readBatches; }

    /** The write requests one output update makes. */
    public List<Batch> writeBatches() { return writeBatches; }

    /** Start the poll thread (connects in the background). */
    public void start() {
        running = true;
        Thread t = new Thread(this::pollLoop, "modbus-client-" + link.describe());
        t.setDaemon(true);
        poller = t;
        t.start();
    }

    @Override
    public void readInputs(ProcessImage in, double tS) {
        long now = System.nanoTime();
        synchronized (lock) {
            for (int i = 0; i < inputs.length; i++) {
                Channel c = inputs[i];
                if (inRefreshNs[i] == 0) {
                    in.setQuality(c.signal(), Quality.BAD);
                    continue;
                }
                double ageS = (now - inRefreshNs[i]) * 1e-9;
                Quality q = ageS > c.staleAfterS() ? Quality.BAD : inQuality[i];
                c.toImage(inEng[i], in, q, tS - ageS);
            }
        }
    }

    @Override
    public void writeOutputs(ProcessImage out, double tS) {
        synchronized (lock) {
            for (int i = 0; i < outputs.length; i++) {
                outEng[i] = outputs[i].engFromImage(out);
            }
            outputsValid = true;
            outputsSeq++;
        }
        Thread t = poller;
        if (t != null) {
            LockSupport.unpark(t);
        }
    }

    /** True when the input of this signal was refreshed within its age limit (for tests and screens). */
    public boolean isFresh(org.drumloop.core.io.Signal s) {
        int i = inputIndex[s.ordinal()];
        if (i < 0) {
            return false;
        }
        synchronized (lock) {
            return inRefreshNs[i] != 0 && (System.nanoTime() - inRefreshNs[i]) * 1e-9 <= inputs[i].staleAfterS();
        }
    }

    /**
     * Lockstep use, without the poll thread: write the outputs handed over since the last call,
     * then read every input batch, on the calling thread. It waits for the round trips, so it is
     * for runs paced by the bench (faster than real time, tests), never inside a live scan.
     */
    public void pollOnce() {
        if (poller != null) {
            throw new IllegalStateException("the poll thread is running; pollOnce is for lockstep use");
        }
        if (!link.isConnected() && !connectOnce()) {
            return;
        }
        writePending();
        readAll();
    }

    /**
     * Lockstep use, without the poll thread: write the outputs handed over since the last call, on
     * the calling thread (waits for the round trips).
     */
    public void flushOutputs() {
        if (poller != null) {
            throw new IllegalStateException("the poll thread is running; flushOutputs is for lockstep use");
        }
        if (link.isConnected() || connectOnce()) {
            writePending();
        }
    }

    private boolean connectOnce() {
        try {
            link.connect();
            if (everConnected) {
                stats.reconnect();
                LOG.info("{}: reconnected", link.describe());
            }
            everConnected = true;
            return true;
        } catch (LinkException e) {
            LOG.debug("{}: {}", link.describe(), e.getMessage());
            return false;
        }
    }

    private void readAll() {
        for (Batch b : readBatches) {
            if (!link.isConnected()) {
                break;
            }
            if (transact(b, regs, false)) {
                store(b, regs);
            }
        }
    }

    /** Write all outputs if the scan handed over new ones since the last write. */
    private void writePending() {
        long seq;
        synchronized (lock) {
            seq = outputsValid ? outputsSeq : 0;
        }
        if (seq == writtenSeq || !link.isConnected()) {
            return;
        }
        writtenSeq = seq;
        for (Batch b : writeBatches) {
            if (!link.isConnected()) {
                break;
            }
            encode(b, regs);
            transact(b, regs, true);
        }
    }

    private boolean outputsPending() {
        synchronized (lock) {
            return outputsValid && outputsSeq != writtenSeq;
        }
    }

    private void pollLoop() {
        double backoffS = opts.backoffMinS();
        long periodNs = (long) (opts.pollPeriodS() * 1e9);
        long next = System.nanoTime();
        while (running) {
            if (!link.isConnected()) {
                if (!connectOnce()) {
                    park((long) (backoffS * 1e9));
                    backoffS = Math.min(opts.backoffMaxS(), backoffS * 2);
                    continue;
                }
                backoffS = opts.backoffMinS();
            }
            long now = System.nanoTime();
            if (now - next >= 0) {
                next = now + periodNs;
                readAll();
            }
            writePending();
            long wait = next - System.nanoTime();
            if (wait > 0 && running && !outputsPending()) {
                LockSupport.parkNanos(this, wait);
            }
        }
        link.disconnect();
    }

    /** One request with retries; false when it failed (statistics updated, link reset on I/O loss). */
    private boolean transact(Batch b, int[] regs, boolean write) {
        for (int attempt = 0; attempt <= opts.retries(); attempt++) {
            stats.request();
            long t0 = System.nanoTime();
            try {
                if (write) {
                    if (b.table() == Table.COIL) {
                        link.writeCoils(b.unitId(), b.address(), b.quantity(), regs);
                    } else {
                        link.writeRegisters(b.unitId(), b.address(), b.quantity(), regs);
                    }
                } else if (b.table().isBits()) {
                    link.readBits(b.table(), b.unitId(), b.address(), b.quantity(), regs);
                } else {
                    link.readRegisters(b.table(), b.unitId(), b.address(), b.quantity(), regs);
                }
                stats.ok(System.nanoTime() - t0);
                return true;
            } catch (LinkException e) {
                switch (e.kind()) {
                    case EXCEPTION:
                        stats.exception(e.code());
                        LOG.debug("{}: exception {} on {} {}", link.describe(), e.code(), b.table().word(), b.address());
                        return false;
                    case TIMEOUT:
                        stats.timeout();
                        break;
                    default:
                        stats.ioError();
                        LOG.info("{}: link lost: {}", link.describe(), e.getMessage());
                        link.disconnect();
                        return false;
                }
            }
        }
        // timeouts exhausted the retries: the peer may be gone, start over with a fresh connection
        link.disconnect();
        return false;
    }

    private void store(Batch b, int[] regs) {
        long now = System.nanoTime();
        synchronized (lock) {
            for (Channel c : b.channels()) {
                int i = inputIndex[c.signal().ordinal()];
                int off = c.address() - b.address();
                double eng;
                if (c.isBool()) {
                    eng = regs[off] != 0 ? 1.0 : 0.0;
                    inQuality[i] = Quality.GOOD;
                } else {
                    double raw = org.drumloop.modbus.map.Scaling.readRaw(c.type(), c.order(), regs, off);
                    double unclamped = org.drumloop.modbus.map.Scaling.toEng(raw, c.rawLo(), c.rawHi(), c.engLo(), c.engHi());
                    inQuality[i] = c.classify(unclamped);
                    eng = c.engFromRaw(raw);
                }
                inEng[i] = eng;
                inRefreshNs[i] = now;
            }
        }
    }

    private void encode(Batch b, int[] regs) {
        synchronized (lock) {
            for (Channel c : b.channels()) {
                int i = outputIndex[c.signal().ordinal()];
                int off = c.address() - b.address();
                double eng = outEng[i];
                if (c.isBool()) {
                    regs[off] = eng >= 0.5 ? 1 : 0;
                } else {
                    double v = Double.isFinite(eng) ? org.drumloop.modbus.map.Scaling.clamp(eng, c.engLo(), c.engHi()) : c.engLo();
                    c.engToRegisters(v, regs, off);
                }
            }
        }
    }

    private void park(long ns) {
        long end = System.nanoTime() + ns;
        long left;
        while (running && (left = end - System.nanoTime()) > 0) {
            LockSupport.parkNanos(this, left);
        }
    }

    /** Stop polling and close the connection. */
    @Override
    public void close() {
        running = false;
        Thread t = poller;
        if (t != null) {
            LockSupport.unpark(t);
            try {
                t.join(5000);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
        link.disconnect();
    }

    /** Signals this client reads, for checks. */
    public List<org.drumloop.core.io.Signal> inputSignals() {
        List<org.drumloop.core.io.Signal> out = new ArrayList<>();
        for (Channel c : inputs) {
            out.add(c.signal());
        }
        return out;
    }
}
