package org.targetbench.detect;

/** How a detector's {@code threshold} is read. */
public enum ThresholdMode {
    /** Fraction of the frame's strongest response, 0..1 (invariant to an affine change of intensity for corners). */
    RELATIVE,
    /** Absolute response, in the detector's own units. */
    ABSOLUTE
}
