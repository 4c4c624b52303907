package org.targetbench.target;

/** What kind of image feature a designed target point produces. */
public enum FeatureKind {
    /** Saddle point where four squares of alternating shade meet (checkerboard inner corner). */
    X_CORNER,
    /** Centre of a filled circle. */
    DOT_CENTRE,
    /** Ordinary L-shaped corner of a filled shape. */
    CORNER
}
