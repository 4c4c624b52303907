package org.targetbench.detect;

/**
 * Settings shared by every detector. Each detector has its own subclass with its particular parameters.
 */
public abstract class DetectorConfig {
    /** Most points kept per frame, strongest first; at least 1. */
    public int maxFeatures = 500;
    /** Non-maximum suppression radius, pixels: a kept point is the strongest within this radius. At least 1. */
    public int nmsRadius = 3;
    /** Response threshold, read according to {@link #thresholdMode}. */
    public double threshold = 0.01;
    /** How {@link #threshold} is read; relative by default. */
    public ThresholdMode thresholdMode = ThresholdMode.RELATIVE;
    /**
     * Absolute floor on the response, in the detector's units, applied on top of a relative threshold: below it a
     * response is numerical noise (a flat frame must give no points). 0 for none.
     */
    public double minResponse = 0;
    /**
     * Sub-pixel refinement of the detected points, a stage of its own ({@link SubpixelRefiner}); off by default, on
     * by default for the structure-tensor corners ({@link CornerConfig}).
     */
    public RefineConfig refine = RefineConfig.off();

    public abstract DetectorType type();

    /** A deep copy. */
    public abstract DetectorConfig copy();

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (maxFeatures < 1) throw new IllegalArgumentException(type().cliName() + ": maxFeatures must be >= 1, got " + maxFeatures);
        if (nmsRadius < 1) throw new IllegalArgumentException(type().cliName() + ": nmsRadius must be >= 1 px, got " + nmsRadius);
        if (!Double.isFinite(threshold) || threshold < 0)
            throw new IllegalArgumentException(type().cliName() + ": threshold must be finite and >= 0, got " + threshold);
        if (!Double.isFinite(minResponse) || minResponse < 0)
            throw new IllegalArgumentException(type().cliName() + ": minResponse must be finite and >= 0, got " + minResponse);
        if (refine == null) throw new IllegalArgumentException(type().cliName() + ": refinement settings must be set");
        refine.checkValidity();
        if (thresholdMode == ThresholdMode.RELATIVE && threshold > 1)
            throw new IllegalArgumentException(type().cliName() + ": a relative threshold must be within 0..1, got " + threshold);
    }

    protected <T extends DetectorConfig> T copyCommonTo(T other) {
        other.maxFeatures = maxFeatures;
        other.nmsRadius = nmsRadius;
        other.threshold = threshold;
        other.thresholdMode = thresholdMode;
        other.minResponse = minResponse;
        other.refine = refine.copy();
        return other;
    }

    /** Default configuration of a detector. */
    public static DetectorConfig defaults(DetectorType type) {
        return switch (type) {
            case HARRIS -> new HarrisConfig();
            case SHI_TOMASI -> new ShiTomasiConfig();
            case FAST -> new FastConfig();
            case SURF -> new SurfConfig();
            case SIFT -> new SiftConfig();
            case DOTS -> new DotConfig();
            case XCORNER -> new XCornerConfig();
        };
    }
}
