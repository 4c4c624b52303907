package org.targetbench.bench;

/**
 * One detector call on one of the bench frames. Implementations are not thread safe: the all-cores measurement
 * creates one per thread.
 */
@FunctionalInterface
interface FrameTask {
    /**
     * Runs the detector on frame {@code frame}.
     *
     * @return the number of points found; the timing code accumulates it so the call cannot be optimised away
     */
    int detect(int frame);
}
