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

    protected CornerConfig() {
        // designed corners are what these detectors are for: refine by default (under RefineConfig's keep rule)
        refine = new RefineConfig();
    }

    protected <T extends CornerConfig> T copyCornerTo(T other) {
        copyCommonTo(other);
        other.windowRadius = windowRadius;
        other.weighted = weighted;
        return other;
    }

    @Override public void checkValidity() {
        super.checkValidity();
        if (windowRadius < 1) throw new IllegalArgumentException(type().cliName() + ": windowRadius must be >= 1 px, got " + windowRadius);
    }
}
