package org.targetbench.target;

/**
 * What kind of image feature a designed target point produces. Readers that can only use some kinds say so: the
 * registration matches x-corners ({@code register}), a design-matched detector is scored on the kind it is built for
 * ({@code detect.DetectorType#finds}), the dot-centre bias applies to dot centres only ({@code camera.DotBias}).
 */
public enum FeatureKind {
    /** Saddle point where four squares of alternating shade meet (checkerboard inner corner, x-corner marker centre). */
    X_CORNER,
    /** Centre of a filled circle. */
    DOT_CENTRE,
    /**
     * L-corner: the corner of a filled shape against a plain background (one dark quadrant, or one light, around the
     * point), e.g. a corner of a separate square or an outer corner of a checkerboard's boundary square against its
     * margin.
     */
    CORNER
}
