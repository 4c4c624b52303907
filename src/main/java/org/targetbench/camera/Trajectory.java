package org.targetbench.camera;

/**
 * A camera path around a target over time: the target's pose in the camera frame at each moment. Implementations are
 * pure functions of time (and of their seed), so a frame can be re-rendered at any instant, for example within an
 * exposure.
 */
@FunctionalInterface
public interface Trajectory {
    /** Pose of the target in the camera frame at {@code seconds} from the start (>= 0). */
    Pose at(double seconds);
}
