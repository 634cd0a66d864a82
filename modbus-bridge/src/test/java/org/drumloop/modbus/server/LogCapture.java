package org.drumloop.modbus.server;

import java.util.ArrayList;
import java.util.List;

import org.slf4j.LoggerFactory;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.AppenderBase;

/** Collects the lines logged by the Modbus server at WARN and INFO while it is open. */
public final class LogCapture extends AppenderBase<ILoggingEvent> implements AutoCloseable {
    private final Logger logger;
    private final Level before;
    private final List<String> lines = new ArrayList<>();

    public LogCapture() {
        logger = (Logger) LoggerFactory.getLogger(ImageServer.class);
        before = logger.getLevel();
        logger.setLevel(Level.INFO);
        setContext(logger.getLoggerContext());
        start();
        logger.addAppender(this);
    }

    @Override
    protected synchronized void append(ILoggingEvent e) {
        lines.add(e.getLevel() + " " + e.getFormattedMessage());
    }

    /** Lines so far. */
    public synchronized List<String> lines() { return new ArrayList<>(lines); }

    /** Lines so far that contain {@code text}. */
    public synchronized long count(String text) { return lines.stream().filter(l -> l.contains(text)).count(); }

    @Override
    public void close() {
        logger.detachAppender(this);
        logger.setLevel(before);
        stop();
    }
}
