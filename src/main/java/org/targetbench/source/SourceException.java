package org.targetbench.source;

/** A source could not deliver what it promised; the message is one user-facing line naming what and where. */
public class SourceException extends Exception {
    public SourceException(String message) { super(message); }
    public SourceException(String message, Throwable cause) { super(message, cause); }
}
