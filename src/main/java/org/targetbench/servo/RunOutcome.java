package org.targetbench.servo;

/** How one rehearsed run ended. */
public enum RunOutcome {
    /** The true image error fell below the convergence threshold. */
    CONVERGED("converged"),
    /** Still moving when the time ran out. */
    TIMEOUT("timeout"),
    /** A point left the image or passed behind the camera; a real controller would lose its track. */
    LEFT_FIELD_OF_VIEW("left-field-of-view"),
    /** A point's track was dropped at random according to its measured survival. */
    TRACK_LOST("track-lost"),
    /** The camera moved further than the retreat limit from the target plane. */
    RETREATED("retreated"),
    /** The control law gave no finite command (a singular L̂). */
    SINGULAR("singular");

    private final String label;

    RunOutcome(String label) { this.label = label; }

    /** Name used in files. */
    public String label() { return label; }
}
