package org.targetbench.arm;

/** Warnings about one run on the arm; never a clearance. Their sentences live in {@code pipeline.ArmWords}. */
public enum ArmFlag {
    /** A joint reached a position limit. */
    JOINT_LIMIT_REACHED,
    /** Joint 5 changed sign (the wrist passed through its singularity) or manipulability fell below the singular level. */
    WRIST_SINGULARITY_CROSSED,
    /** Damped least squares was active (manipulability below the damping threshold) at some time. */
    DAMPING_ACTIVE,
    /** Joint speeds were scaled down to their limits for more than half of the run. */
    SPEED_LIMITED_MOST,
    /** The image error grew, against its value one oscillation cycle earlier, for several control periods in a row. */
    OSCILLATION,
    /** A point left the camera's view. */
    TARGET_LEFT_VIEW,
    /** The camera reached the reference view but the joints did not reach the reference joints. */
    OTHER_CONFIGURATION
}
