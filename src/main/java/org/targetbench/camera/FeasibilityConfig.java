package org.targetbench.camera;

/**
 * Settings of the printed-target feasibility check ({@link Feasibility}).
 */
public final class FeasibilityConfig {
    /**
     * Half-size h of the corner refinement / tracking window, pixels (window side 2h + 1). The default is the corner
     * detectors' sub-pixel refinement radius ({@code detect.RefineConfig#windowRadius}).
     */
    public int windowHalfSizePx = 4;
    /**
     * A value that passes its threshold by less than this factor is reported as a warning (rule of thumb, common
     * practice, no source: it leaves room for focus blur and for poses a little beyond the stated ones).
     */
    public double warnMargin = 1.25;
    /**
     * Below this fraction of the image area the target is reported as small in view (rule of thumb, common practice, no
     * source: the points crowd together and image-based servoing loses depth and rotation sensitivity).
     */
    public double minFillFraction = 0.10;
    /**
     * Above this fraction of the image area the target is reported as filling the view (rule of thumb, common practice,
     * no source: little room is left for the arm to move before points leave the image).
     */
    public double maxFillFraction = 0.60;
    /**
     * Dot designs: a perspective bias of the imaged dot centre ({@link DotBias}) above this, pixels, at any tried pose
     * is reported as a warning (never a failure; rule of thumb, common practice, no source: a tenth of a pixel is the
     * localisation dot detectors are used for). Set it to the servo's error budget.
     */
    public double maxDotBiasPx = 0.1;
    /** Number of tilt-axis directions, evenly spaced in the target plane, at which the full tilt is tried. */
    public int tiltDirections = 8;
    /** Sample points per side of the pattern area at which the local image scale is measured. */
    public int samplesPerSide = 9;

    public FeasibilityConfig copy() {
        FeasibilityConfig c = new FeasibilityConfig();
        c.windowHalfSizePx = windowHalfSizePx; c.warnMargin = warnMargin; c.minFillFraction = minFillFraction;
        c.maxFillFraction = maxFillFraction; c.tiltDirections = tiltDirections; c.samplesPerSide = samplesPerSide;
        c.maxDotBiasPx = maxDotBiasPx;
        return c;
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (windowHalfSizePx < 1 || windowHalfSizePx > 50) throw new IllegalArgumentException("windowHalfSizePx must be 1..50 px, got " + windowHalfSizePx);
        if (!(warnMargin >= 1) || !Double.isFinite(warnMargin)) throw new IllegalArgumentException("warnMargin must be >= 1, got " + warnMargin);
        if (!(minFillFraction >= 0 && minFillFraction < maxFillFraction && maxFillFraction <= 1))
            throw new IllegalArgumentException("fill fractions must satisfy 0 <= min < max <= 1, got min=" + minFillFraction + " max=" + maxFillFraction);
        if (tiltDirections < 1 || tiltDirections > 360) throw new IllegalArgumentException("tiltDirections must be 1..360, got " + tiltDirections);
        if (!(maxDotBiasPx > 0) || !Double.isFinite(maxDotBiasPx)) throw new IllegalArgumentException("maxDotBiasPx must be > 0 px, got " + maxDotBiasPx);
        if (samplesPerSide < 2 || samplesPerSide > 100) throw new IllegalArgumentException("samplesPerSide must be 2..100, got " + samplesPerSide);
    }
}
