package org.targetbench.register;

/**
 * Settings of frame-to-design registration ({@link FrameRegistrar}).
 */
public final class RegisterConfig {
    /**
     * Largest RMS reprojection residual of the matched features for a frame to count as registered, pixels. A frame
     * above it is marked and left out of every score. 1 px is common practice for a calibration view (no source):
     * clean views of a flat print register at a few hundredths of a pixel, a bent print or a wrong camera model shows
     * as several tenths and more.
     */
    public double maxRmsPx = 1.0;
    /** Fewest designed features matched for a registration (4 fix a homography; one more checks it). */
    public int minFeatures = 5;
    /** Least share (0..1] of the designed features predicted inside the image that must be matched. */
    public double minInViewFraction = 0.6;
    /** Search radius around the previous frame's predictions when following a target, pixels. */
    public double followRadiusPx = 15;
    /** Final match radius between a detected and a predicted feature, pixels. */
    public double matchRadiusPx = 2.5;
    /**
     * Least difference of photometric agreement (correlation of design reflectance with the image, -1..1) between
     * the best orientation of a symmetric point layout and the next one for the image itself to decide it.
     */
    public double orientationMargin = 0.2;
    /**
     * Least correlation (-1..1) of the design's reflectance, sampled over the page through the registration, with the
     * frame's grey levels. Refuses a layout found inside another pattern (a marker grid inside a checkerboard); a
     * printed page under uneven light scores well above it (common practice, no source).
     */
    public double minPhotometric = 0.75;
    /**
     * Strongest x-corner candidates kept for the global search (at least twice the designed features are kept).
     */
    public int maxCandidates = 40;

    public RegisterConfig copy() {
        RegisterConfig c = new RegisterConfig();
        c.maxRmsPx = maxRmsPx;
        c.minFeatures = minFeatures;
        c.minInViewFraction = minInViewFraction;
        c.followRadiusPx = followRadiusPx;
        c.matchRadiusPx = matchRadiusPx;
        c.orientationMargin = orientationMargin;
        c.maxCandidates = maxCandidates;
        c.minPhotometric = minPhotometric;
        return c;
    }

    public void checkValidity() {
        if (!(maxRmsPx > 0) || !Double.isFinite(maxRmsPx)) throw new IllegalArgumentException("maxRmsPx must be positive, got " + maxRmsPx);
        if (minFeatures < 4) throw new IllegalArgumentException("minFeatures must be at least 4, got " + minFeatures);
        if (!(minInViewFraction > 0 && minInViewFraction <= 1))
            throw new IllegalArgumentException("minInViewFraction must be in (0, 1], got " + minInViewFraction);
        if (!(followRadiusPx > 0)) throw new IllegalArgumentException("followRadiusPx must be positive, got " + followRadiusPx);
        if (!(matchRadiusPx > 0)) throw new IllegalArgumentException("matchRadiusPx must be positive, got " + matchRadiusPx);
        if (!(orientationMargin >= 0 && orientationMargin <= 2))
            throw new IllegalArgumentException("orientationMargin must be in [0, 2], got " + orientationMargin);
        if (!(minPhotometric >= -1 && minPhotometric <= 1)) throw new IllegalArgumentException("minPhotometric must be in [-1, 1], got " + minPhotometric);
        if (maxCandidates < 4) throw new IllegalArgumentException("maxCandidates must be at least 4, got " + maxCandidates);
    }
}
