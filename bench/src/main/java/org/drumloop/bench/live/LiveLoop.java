package org.drumloop.bench.live;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.locks.LockSupport;

/**
 * Runs a {@link LiveSession} on its own thread, paced against absolute deadlines
 * ({@code deadline_k = anchor + k·period/speed}, never sleep-after-work), applies queued actions
 * at scan boundaries and publishes a snapshot after every scan through a {@link TripleBuffer}, so
 * the page's readers can never hold the scan up.
 *
 * <p>Nothing is allocated per scan unless an action or event arrives.
 */
public final class LiveLoop {
    /** Actions waiting for the next scan boundary; a full queue refuses more (HTTP 503). */
    static final int QUEUE_CAPACITY = 256;
    /** Falling this many periods behind restarts the schedule instead of racing to catch up. */
    static final int MAX_BEHIND_PERIODS = 5;

    private final LiveSession session;
    private final ArrayBlockingQueue<LiveAction> actions = new ArrayBlockingQueue<>(QUEUE_CAPACITY);
    private final ConcurrentLinkedQueue<LiveEvent> events = new ConcurrentLinkedQueue<>();
    private final TripleBuffer<LiveSnapshot> snapshots;
    private final ScanTiming timing = new ScanTiming();
    private final List<String> log = new ArrayList<>();
    private final LiveSession.Sink sink = this::event;
    private final ConcurrentLinkedQueue<CompletableFuture<List<String>>> scenarioRequests = new ConcurrentLinkedQueue<>();
    private final Thread thread;
    private volatile double speed;
    private volatile boolean paused;
    private volatile boolean scheduleChanged;
    private volatile boolean running;
    private volatile double timeS;
    private volatile Thread listener;
    private volatile long listenerPeriodNs;
    private long lastSignalNs;
    private long eventSeq;
    private long scans;

    public LiveLoop(LiveSession session, double speed) {
        if (!(speed > 0) || !Double.isFinite(speed)) {
            throw new IllegalArgumentException("speed must be a positive number");
        }
        this.session = session;
        this.speed = speed;
        int n = session.info().interlocks().size();
        this.snapshots = new TripleBuffer<>(() -> new LiveSnapshot(n));
        this.thread = new Thread(this::run, "live-scan");
        this.thread.setDaemon(true);
        this.thread.setPriority(Thread.MAX_PRIORITY);
        LiveSnapshot first = snapshots.back();
        session.fill(first);
        first.publishedNanos = System.nanoTime();
        snapshots.publish();
    }

    public LiveSession session() {
        return session;
    }

    public void start() {
        running = true;
        thread.start();
    }

    /** Stop the loop and wait for its thread to end. */
    public void stop() throws InterruptedException {
        running = false;
        LockSupport.unpark(thread);
        thread.join(5_000);
    }

    /** Queue an action for the next scan boundary; false when the queue is full. */
    public boolean submit(LiveAction a) {
        return actions.offer(a);
    }

    /**
     * The session so far as scenario file lines, taken by the loop thread at the next scan
     * boundary (directly when the loop is not running).
     */
    public CompletableFuture<List<String>> scenarioLines() {
        CompletableFuture<List<String>> f = new CompletableFuture<>();
        if (!running) {
            f.complete(session.scenarioLines());
        } else {
            scenarioRequests.add(f);
        }
        return f;
    }

    /** Actions waiting for the next scan boundary. */
    int queued() {
        return actions.size();
    }

    public void setPaused(boolean p) {
        paused = p;
        scheduleChanged = true;
    }

    public boolean paused() {
        return paused;
    }

    public void setSpeed(double s) {
        if (!(s > 0) || !Double.isFinite(s)) {
            throw new IllegalArgumentException("speed must be a positive number");
        }
        speed = s;
        scheduleChanged = true;
    }

    public double speed() {
        return speed;
    }

    /**
     * Wake {@code t} (with {@link LockSupport#unpark}) right after a publish, at most once per
     * {@code periodNs}: readers then do their work just after a scan, a whole period before the
     * next deadline, instead of at a random phase that may collide with it.
     */
    void setPublishListener(Thread t, long periodNs) {
        listenerPeriodNs = periodNs;
        listener = t;
    }

    /** Simulated time of the last scan [s]. */
    public double timeS() {
        return timeS;
    }

    public ScanTiming timing() {
        return timing;
    }

    /**
     * The newest snapshot. One reader thread only (the broadcaster): the returned object is that
     * reader's until its next call.
     */
    LiveSnapshot latest() {
        return snapshots.latest();
    }

    /** Take the events logged since the last call (reader side). */
    void drainEvents(List<LiveEvent> into) {
        for (LiveEvent e = events.poll(); e != null; e = events.poll()) {
            into.add(e);
        }
    }

    /** The actions applied so far as timed scenario statements ({@code at T s ...}). */
    public List<String> actionLog() {
        synchronized (log) {
            return List.copyOf(log);
        }
    }

    private void event(double tS, String tag, String kind, String message) {
        events.add(new LiveEvent(++eventSeq, tS, tag, kind, message));
    }

    private void run() {
        double periodS = session.info().scanPeriodS();
        long anchor = System.nanoTime();
        long k = 0;
        while (running) {
            if (scheduleChanged) {
                scheduleChanged = false;
                anchor = System.nanoTime();
                k = 0;
            }
            long periodNs = (long) (periodS * 1e9 / speed);
            long deadline = anchor + k * periodNs;
            long now = System.nanoTime();
            while (now < deadline && running && !scheduleChanged) {
                LockSupport.parkNanos(deadline - now);
                now = System.nanoTime();
            }
            if (!running) {
                break;
            }
            if (scheduleChanged) {
                continue;
            }
            long late = now - deadline;
            k++;
            if (late > MAX_BEHIND_PERIODS * periodNs) {
                timing.overrun();
                anchor = now;
                k = 1;
            } else {
                timing.record(late);
            }
            scanOnce();
        }
        for (CompletableFuture<List<String>> f = scenarioRequests.poll(); f != null; f = scenarioRequests.poll()) {
            f.completeExceptionally(new IllegalStateException("the loop has stopped"));
        }
    }

    /**
     * One iteration of the loop at a scan boundary: queued actions, the scan (unless paused),
     * events, snapshot, wake the broadcaster, hand over a requested scenario. Allocates nothing
     * unless an action, event or request is there.
     */
    void scanOnce() {
        if (!paused) {
            applyActions();
            session.scan();
            scans++;
            timeS = session.timeS();
        } else if (!actions.isEmpty()) {
            applyActions(); // operator actions while paused take effect at the next scan
        }
        session.drainEvents(sink);
        LiveSnapshot s = snapshots.back();
        session.fill(s);
        s.scan = scans;
        s.publishedNanos = System.nanoTime();
        snapshots.publish();
        Thread l = listener;
        // 0.8 of the period: a scan that starts a little early must not skip a whole period
        if (l != null && s.publishedNanos - lastSignalNs >= listenerPeriodNs - listenerPeriodNs / 5) {
            lastSignalNs = s.publishedNanos;
            LockSupport.unpark(l);
        }
        if (!scenarioRequests.isEmpty()) {
            for (CompletableFuture<List<String>> f = scenarioRequests.poll(); f != null; f = scenarioRequests.poll()) {
                f.complete(session.scenarioLines());
            }
        }
    }

    private void applyActions() {
        for (LiveAction a = actions.poll(); a != null; a = actions.poll()) {
            double tS = session.timeS();
            session.apply(a);
            String line = "at " + LiveAction.fmt(tS) + " s " + a.scenarioStatement();
            synchronized (log) {
                log.add(line);
            }
        }
    }
}
