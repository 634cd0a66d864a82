package org.drumloop.modbus.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slf4j.LoggerFactory;
import org.slf4j.event.Level;

import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.read.ListAppender;

/** At most one line per interval and kind of problem, with the count of those not logged; on a clock the test moves. */
class ProblemLogTest {
    private static final long SECOND_NS = 1_000_000_000L;

    private final long[] nowNs = {0};
    private final Logger logger = (Logger) LoggerFactory.getLogger("problem-log-test");
    private final ListAppender<ILoggingEvent> lines = new ListAppender<>();
    private ProblemLog log;

    @BeforeEach
    void attach() {
        lines.start();
        logger.addAppender(lines);
        logger.setLevel(ch.qos.logback.classic.Level.INFO);
        log = new ProblemLog(logger, 1.0, () -> nowNs[0]);
    }

    @AfterEach
    void detach() {
        logger.detachAppender(lines);
    }

    private List<String> messages() {
        List<String> out = new ArrayList<>();
        for (ILoggingEvent e : lines.list) {
            out.add(e.getLevel() + " " + e.getFormattedMessage());
        }
        return out;
    }

    @Test
    void aBurstGivesTheFirstLineAtOnceAndTheCountOnceTheIntervalHasPassed() {
        ProblemLog.Kind bad = log.kind("bad headers", Level.WARN);
        for (int k = 0; k < 1000; k++) {
            nowNs[0] = k * 100_000L; // 1000 in 0.1 s
            bad.report("bad header from {}", "peer" + k);
        }
        log.flushDue();
        assertEquals(List.of("WARN bad header from peer0"), messages(), "the interval has not passed yet");
        nowNs[0] = SECOND_NS;
        log.flushDue();
        assertEquals(List.of("WARN bad header from peer0", "WARN 999 more bad headers not logged in the last 1.0 s"),
                messages());
        assertEquals(1000, bad.total());
    }

    @Test
    void theNextLineAfterTheIntervalCarriesTheCountAndKindsAreLimitedApart() {
        ProblemLog.Kind crc = log.kind("CRC errors", Level.WARN);
        ProblemLog.Kind idle = log.kind("idle closes", Level.INFO);
        crc.report("crc {}", 1);
        crc.report("crc {}", 2);
        idle.report("idle {}", 1);
        nowNs[0] = SECOND_NS + 1;
        crc.report("crc {}", 3);
        crc.report("crc {}", 4);
        log.flush();
        assertEquals(List.of("WARN crc 1", "INFO idle 1", "WARN crc 3 (and 1 more CRC errors not logged)",
                "WARN 1 more CRC errors not logged in the last 0.0 s"), messages());
    }
}
