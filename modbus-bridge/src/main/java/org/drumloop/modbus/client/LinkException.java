package org.drumloop.modbus.client;

/** A failed Modbus transaction, classified for statistics and recovery. */
public final class LinkException extends Exception {
    /** What went wrong. */
    public enum Kind {
        /** No answer within the timeout. */
        TIMEOUT,
        /** The server answered with a Modbus exception code. */
        EXCEPTION,
        /** The connection or port failed; reconnect. */
        IO
    }

    private final Kind kind;
    private final int code;

    public LinkException(Kind kind, int code, String message, Throwable cause) {
        super(message, cause);
        this.kind = kind;
        this.code = code;
    }

    public Kind kind() { return kind; }

    /** Modbus exception code for {@link Kind#EXCEPTION}, else 0. */
    public int code() { return code; }
}
