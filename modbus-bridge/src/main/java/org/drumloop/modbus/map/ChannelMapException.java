package org.drumloop.modbus.map;

import java.util.List;

import org.drumloop.core.config.ConfigException;
import org.drumloop.core.config.ConfigProblems;

/** A channel map with problems; carries all of them, each as {@code file:line: key: message}. */
public final class ChannelMapException extends ConfigProblems {
    public ChannelMapException(List<ConfigException> problems) {
        super(problems);
    }
}
