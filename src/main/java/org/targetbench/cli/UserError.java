package org.targetbench.cli;

/** Bad user input (an option, a file, a device): reported as one line with exit code 2. */
public class UserError extends RuntimeException {
    public UserError(String message) { super(message); }
}
