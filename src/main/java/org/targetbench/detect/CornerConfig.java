package org.targetbench.detect;

/** Settings shared by the structure-tensor corner detectors (Harris, Shi-Tomasi). */
public abstract class CornerConfig extends DetectorConfig {
    /** Radius of the structure-tensor window, pixels (window side 2r+1). */
    public int windowRadius = 2;
    /**
     * Gaussian-weighted window instead of a box. On by default: with a box window an ideal x-corner gives a flat
     * plateau of equal response, which neither non-maximum suppression nor a peak fit can place.
     */
    public boolean weighted = true;
    /**
     * Radius of the gradient-orthogonality sub-pixel refinement window, pixels; 0 turns refinement off and keeps the
     * parabola-fitted response peak.
     */
    public int refineRadius = 4;

    protected <T extends CornerConfig> T copyCornerTo(T other) {
        copyCommonTo(other);
        other.windowRadius = windowRadius;
        other.weighted = weighted;
        other.refineRadius = refineRadius;
        return other;
    }

    @Override public void checkValidity() {
        super.checkValidity();
        if (windowRadius < 1) throw new IllegalArgumentException(type().cliName() + ": windowRadius must be >= 1 px, got " + windowRadius);
        if (refineRadius < 0 || refineRadius > 20) throw new IllegalArgumentException(type().cliName() + ": refineRadius must be 0..20 px, got " + refineRadius);
    }
}
