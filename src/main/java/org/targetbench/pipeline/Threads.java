package org.targetbench.pipeline;

import boofcv.concurrency.BoofConcurrency;

/**
 * Thread policy of the pipelines: they run independent frames and cells on their own worker pools, one worker per
 * core. BoofCV would also split single images across its own thread pool; on top of frame-level workers that only
 * adds hand-offs and contention (measured: about a fifth of a sweep's time went to BoofCV's pool), so it is switched
 * off for the process once a pipeline starts.
 */
public final class Threads {
    private Threads() {}

    /** Turns BoofCV's per-image multi-threading off (process-wide, idempotent). */
    public static void coarseOnly() {
        BoofConcurrency.USE_CONCURRENT = false;
    }

}
