package org.targetbench.pipeline;

import boofcv.concurrency.BoofConcurrency;

/**
 * Thread policy of the pipelines: they run independent frames and cells on their own worker pools, whose size each run
 * is given ({@link CompareRun}'s {@code threads}, {@link SweepConfig#threads}). BoofCV would also split single images
 * across its own thread pool; on top of frame-level workers that only adds hand-offs and contention (measured: about a
 * fifth of a sweep's time went to BoofCV's pool). That switch is BoofCV's and process-wide, so the runs never touch
 * it: the shells (the command line's {@code Main}, the workbench's entry point) choose it once at start-up with
 * {@link #coarseOnly()}, before any detector is built. Results do not depend on it.
 */
public final class Threads {
    private Threads() {}

    /** Turns BoofCV's per-image multi-threading off (process-wide, idempotent). */
    public static void coarseOnly() {
        BoofConcurrency.USE_CONCURRENT = false;
    }

}
