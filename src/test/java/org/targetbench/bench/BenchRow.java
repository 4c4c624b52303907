package org.targetbench.bench;

import org.targetbench.detect.DetectorType;

import java.util.Optional;

/**
 * Measurements of one detector.
 *
 * @param type       our detector
 * @param ours       ours, one thread (BoofCV's internal threading off)
 * @param oursAll    ours, one detector per thread on every core
 * @param openCv     the OpenCV counterpart, one thread, or empty
 * @param openCvNote why there is no OpenCV counterpart, or empty
 */
record BenchRow(DetectorType type, Timing.Single ours, Timing.Throughput oursAll, Optional<Timing.Single> openCv,
                Optional<String> openCvNote) {
    /** Single-thread rate the real-time corner detectors must reach on a VGA frame, frames per second. */
    static final double GOAL_FPS = 100;

    /** Whether {@link #GOAL_FPS} applies: the corner detectors meant for servoing at camera rate. */
    boolean hasGoal() {
        return type == DetectorType.HARRIS || type == DetectorType.SHI_TOMASI || type == DetectorType.FAST;
    }

    boolean goalMet() { return ours.framesPerSecond() >= GOAL_FPS; }

    /** Our median time over OpenCV's median time; above 1 means ours is slower. */
    Optional<Double> ratio() { return openCv.map(cv -> ours.medianMs() / cv.medianMs()); }
}
