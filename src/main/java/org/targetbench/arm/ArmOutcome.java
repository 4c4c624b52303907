package org.targetbench.arm;

/** How one rehearsed run on the arm ended. */
public enum ArmOutcome {
    /** The true image error fell below the convergence threshold. */
    CONVERGED("converged"),
    /** Still moving when the time ran out. */
    TIMEOUT("timeout"),
    /** A point left the image or passed behind the camera. */
    LEFT_FIELD_OF_VIEW("left-field-of-view"),
    /** A joint reached one of its position limits; a real controller stops there. */
    JOINT_LIMIT("joint-limit"),
    /** The camera moved further than the retreat limit from the target plane. */
    RETREATED("retreated"),
    /** The control law gave no finite command. */
    SINGULAR("singular");

    private final String label;

    ArmOutcome(String label) { this.label = label; }

    public String label() { return label; }
}
