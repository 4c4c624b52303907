package org.targetbench.export;

/** Results could not be written; the message is one user-facing line. */
public class OutputException extends Exception {
    public OutputException(String message) { super(message); }
}
