package org.targetbench.cli;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Lets Ctrl-C (SIGINT) or SIGTERM stop a long run early while keeping what is done: while open, a shutdown hook asks
 * the run to stop ({@link #cancelled()} turns true) and then waits, up to {@value #GRACE_SECONDS} s, until
 * {@link #close()} says the finished part has been written and moved into the output folder; the JVM then exits with
 * 130. The workers are not raced: they finish their current unit (a sweep cell, a compare frame, a demo stage), the
 * command writes complete files for the completed units and commits them, and only then is the hook released.
 * Open one job per command, around everything it writes.
 */
final class SweepJob implements AutoCloseable {
    /** Exit code of a run stopped by Ctrl-C whose partial results were written (128 + SIGINT). */
    static final int EXIT_CANCELLED = 130;
    static final long GRACE_SECONDS = 60;

    private final AtomicBoolean cancel = new AtomicBoolean();
    private final CountDownLatch written = new CountDownLatch(1);
    private final Thread hook;

    SweepJob() {
        // ImageIO's disk cache registers a shutdown hook for every stream it opens, which the JVM refuses once shutdown
        // has begun ("Shutdown in progress"); without the cache, charts and overlays can still be written after Ctrl-C.
        javax.imageio.ImageIO.setUseCache(false);
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

    /** The one line a stopped run prints: what it kept, with counts, and where. */
    static String stoppedLine(int done, int total, String units, java.nio.file.Path where) {
        return "Stopped by Ctrl-C: kept " + done + " of " + total + " " + units + ", written to " + where;
    }

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
