package org.drumloop.bench.live;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;

import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;

/** The lock-free hand-over between the scan loop and the broadcaster. */
class TripleBufferTest {
    static final class Box {
        long a;
        long b;
    }

    @Test
    void theReaderSeesTheNewestPublishedValueAndKeepsItUntilANewerOne() {
        TripleBuffer<Box> t = new TripleBuffer<>(Box::new);
        t.back().a = 1;
        t.publish();
        t.back().a = 2;
        t.publish();
        Box r = t.latest();
        assertEquals(2, r.a, "older publications are skipped");
        assertSame(r, t.latest(), "nothing new: the reader keeps its buffer");
        assertNotSame(r, t.back(), "the writer never fills the buffer the reader holds");
    }

    @Test
    void aReaderNeverSeesAHalfWrittenValueWhileTheWriterRunsFlatOut() throws Exception {
        TripleBuffer<Box> t = new TripleBuffer<>(Box::new);
        AtomicBoolean stop = new AtomicBoolean();
        Thread writer = new Thread(() -> {
            for (long i = 1; !stop.get(); i++) {
                Box b = t.back();
                b.a = i;
                b.b = -i;
                t.publish();
            }
        });
        writer.start();
        long last = 0;
        for (int k = 0; k < 2_000_000; k++) {
            Box r = t.latest();
            assertEquals(r.a, -r.b, "both fields from one publication");
            assertEquals(true, r.a >= last, "values never go back in time");
            last = r.a;
        }
        stop.set(true);
        writer.join();
    }
}
