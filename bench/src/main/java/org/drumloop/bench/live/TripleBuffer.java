package org.drumloop.bench.live;

import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Supplier;

/**
 * Lock-free hand-over of the latest value from one writer thread to one reader thread: the
 * writer fills its private back buffer and swaps it with the shared middle one; the reader swaps
 * its front buffer with the middle one when that holds something newer. Neither side ever waits
 * for the other and nothing is allocated after construction, so the scan loop can publish every
 * scan without being slowed by readers.
 */
final class TripleBuffer<T> {
    private static final int FRESH = 4;
    private final List<T> buffers;
    /** Index of the middle buffer, plus {@link #FRESH} when the writer put something new there. */
    private final AtomicInteger middle = new AtomicInteger(1);
    private int back = 0;
    private int front = 2;

    TripleBuffer(Supplier<T> factory) {
        buffers = List.of(factory.get(), factory.get(), factory.get());
    }

    /** Writer: the buffer to fill next. */
    T back() {
        return get(back);
    }

    /** Writer: make the filled back buffer the newest value. */
    void publish() {
        back = middle.getAndSet(back | FRESH) & 3;
    }

    /** Reader: the newest published value (or the previous one when nothing new arrived). */
    T latest() {
        if ((middle.get() & FRESH) != 0) {
            front = middle.getAndSet(front) & 3;
        }
        return get(front);
    }

    private T get(int i) {
        return buffers.get(i);
    }
}
