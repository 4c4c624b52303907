package org.targetbench.cli;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Lets Ctrl-C stop a long run early while keeping what is done: while open, a shutdown hook asks the run to stop
 * ({@link #cancelled()} turns true) and then waits, up to {@value #GRACE_SECONDS} s, until {@link #close()} says the
 * finished part has been written.
 */
final class SweepJob implements AutoCloseable {
    /** Exit code of a run stopped by Ctrl-C whose partial results were written (128 + SIGINT). */
    static final int EXIT_CANCELLED = 130;
    static final long GRACE_SECONDS = 60;

    private final AtomicBoolean cancel = new AtomicBoolean();
    private final CountDownLatch written = new CountDownLatch(1);
    private final Thread hook;

    SweepJob() {
        hook = new Thread(() -> {
            cancel.set(true);
            try {
                written.await(GRACE_SECONDS, TimeUnit.SECONDS);
            } catch (InterruptedException ignored) {
                Thread.currentThread().interrupt();
            }
        }, "targetbench-ctrl-c");
        Runtime.getRuntime().addShutdownHook(hook);
    }

    boolean cancelled() { return cancel.get(); }

    @Override
    public void close() {
        written.countDown();
        try {
            Runtime.getRuntime().removeShutdownHook(hook);
        } catch (IllegalStateException shuttingDown) {
            // the JVM is exiting after Ctrl-C; the hook returns now that the latch is released
        }
    }
}
