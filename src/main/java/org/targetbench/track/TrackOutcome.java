package org.targetbench.track;

/**
 * What happened to a track on one frame. Every outcome but {@link #STARTED} and {@link #TRACKED} ends the track; the
 * reason a track died is data, never an exception.
 */
public enum TrackOutcome {
    /** The track was started on this frame (seeded from a detection or a given point). */
    STARTED("started"),
    /** Tracked and passed every check. */
    TRACKED("tracked"),
    /** The forward-backward error exceeded {@link KltConfig#fbThreshold}, or tracking back failed (Kalal et al. 2010). */
    LOST_FORWARD_BACKWARD("lost_fb"),
    /** The window moved off the image (its centre left the image, or the whole window at some pyramid level). */
    LEFT_IMAGE("left_image"),
    /** After convergence the window still differed from its template by more than {@link KltConfig#maxResidual}. */
    RESIDUAL_TOO_LARGE("residual"),
    /** An iteration ran away by more than a window width at some pyramid level (no consistent minimum). */
    DIVERGED("diverged"),
    /**
     * The window no longer holds enough texture to be tracked: the smaller eigenvalue of its gradient matrix fell
     * below {@link KltConfig#minEigenvalue} (Shi &amp; Tomasi 1994), as happens under strong blur.
     */
    TOO_FLAT("flat");

    private final String csvName;

    TrackOutcome(String csvName) { this.csvName = csvName; }

    /** Name used in CSV and JSON files. */
    public String csvName() { return csvName; }

    /** True for the outcomes that end a track. */
    public boolean isLoss() { return this != STARTED && this != TRACKED; }
}
