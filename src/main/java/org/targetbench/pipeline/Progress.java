package org.targetbench.pipeline;

/** Receives progress of long work. Called from worker threads; implementations must be thread safe. */
@FunctionalInterface
public interface Progress {
    /** @param done units finished, @param total all units (-1 when unknown), @param what short description */
    void update(int done, int total, String what);

    Progress NONE = (d, t, w) -> {};
}
