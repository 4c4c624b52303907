package org.targetbench.detect;

/**
 * Dot-centre detector settings ({@link DotDetector}). The common {@code threshold} applies to the dot contrast in grey
 * levels (relative to the strongest dot by default); {@code nmsRadius} is the smallest distance between two reported
 * centres, pixels.
 */
public final class DotConfig extends DetectorConfig {
    /** Which dots are sought. */
    public enum Polarity {
        /** Dark dots on a light page (printed ink). */
        DARK_ON_LIGHT,
        /** Light dots on a dark background (retro-reflective or back-lit dots). */
        LIGHT_ON_DARK
    }

    /** How the centre of an accepted dot is measured. */
    public enum CentreMethod {
        /** Grey-weighted centroid of the dot's pixels (weights: contrast against the local page level). */
        CENTROID,
        /** Centre of the direct least-squares ellipse (Fitzgibbon, Pilu &amp; Fisher 1999) through sub-pixel edge points. */
        ELLIPSE
    }

    public Polarity polarity = Polarity.DARK_ON_LIGHT;
    public CentreMethod centre = CentreMethod.ELLIPSE;
    /**
     * Half-size of the local-mean window of the adaptive threshold, pixels (window side 2r+1). Make it at least the
     * radius of the largest dot expected; holes left inside a larger dot are filled anyway.
     */
    public int windowRadius = 25;
    /** A pixel is ink when it is darker (or lighter, by polarity) than its local mean by at least this, grey levels. */
    public double minContrast = 20;
    /** Smallest dot area, pixels. */
    public int minAreaPx = 12;
    /** Largest dot area, pixels. */
    public int maxAreaPx = 40_000;
    /** Smallest convexity: pixel count over the lattice points inside the convex hull of the dot's pixels (Pick's theorem), 0..1. */
    public double minConvexity = 0.85;
    /** Largest RMS distance of the edge points from their fitted ellipse, as a fraction of the mean semi-axis. */
    public double maxEllipseError = 0.05;
    /** Largest ratio of the fitted ellipse's axes (6 lets a dot tilt by about 80 degrees). */
    public double maxAspect = 6;

    public DotConfig() {
        threshold = 0.2;
        nmsRadius = 2;
    }

    @Override public DetectorType type() { return DetectorType.DOTS; }

    @Override public DotConfig copy() {
        DotConfig c = copyCommonTo(new DotConfig());
        c.polarity = polarity; c.centre = centre; c.windowRadius = windowRadius; c.minContrast = minContrast;
        c.minAreaPx = minAreaPx; c.maxAreaPx = maxAreaPx; c.minConvexity = minConvexity; c.maxEllipseError = maxEllipseError;
        c.maxAspect = maxAspect;
        return c;
    }

    @Override public void checkValidity() {
        super.checkValidity();
        if (polarity == null || centre == null) throw new IllegalArgumentException("dots: polarity and centre method must be set, got " + polarity + ", " + centre);
        if (windowRadius < 2 || windowRadius > 500) throw new IllegalArgumentException("dots: windowRadius must be 2..500 px, got " + windowRadius);
        if (!(minContrast > 0) || minContrast > 255) throw new IllegalArgumentException("dots: minContrast must be within (0, 255] grey levels, got " + minContrast);
        if (minAreaPx < 4 || maxAreaPx <= minAreaPx) throw new IllegalArgumentException("dots: areas must satisfy 4 <= minAreaPx < maxAreaPx, got " + minAreaPx + ", " + maxAreaPx);
        if (!(minConvexity >= 0 && minConvexity <= 1)) throw new IllegalArgumentException("dots: minConvexity must be within 0..1, got " + minConvexity);
        if (!(maxEllipseError > 0) || !Double.isFinite(maxEllipseError)) throw new IllegalArgumentException("dots: maxEllipseError must be > 0, got " + maxEllipseError);
        if (!(maxAspect >= 1) || !Double.isFinite(maxAspect)) throw new IllegalArgumentException("dots: maxAspect must be >= 1, got " + maxAspect);
    }
}
