package org.targetbench.detect;

import java.util.Locale;

/**
 * Settings of the sub-pixel refinement stage ({@link SubpixelRefiner}), which any detector's points can go through.
 * Lengths in pixels.
 *
 * <p>Rule for keeping a refinement (so that it cannot cost repeatability on natural texture): the refined point is
 * used only when the iteration converged, moved it no more than {@link #maxShiftPx}, and the window is corner-like:
 * the structure tensor's smaller eigenvalue at least {@link #minEigenRatio} of the larger (both directions
 * constrained; Förstner &amp; Gülch 1987 use the same roundness measure to accept a point) and the gradients' lines
 * pass within {@link #maxFitRmsPx} of the refined point. Otherwise the detector's own point stands.
 *
 * <p>Blurred corners (real photographs). The misfit of a true corner is not 0 but the width of its edges: every
 * gradient of a blurred edge lies on a line parallel to the edge, up to about one blur width away from it, so the
 * misfit grows with the blur (derived). On the photos left01..14 of Debian's {@code opencv-doc} (optics plus JPEG) the
 * board's x-corners fit to 0.8-1.2 px with the default window, all above {@link #maxFitRmsPx}, and raising that
 * bound alone admits texture (Graffiti graf1 -> graf3, Shi-Tomasi 500 points: repeatability 0.609 unrefined, 0.596 at
 * 0.7 px, 0.563 at 1.0 px, 0.537 at 1.2 px). So a point whose misfit lies between {@link #maxFitRmsPx} and
 * {@link #maxBlurredFitRmsPx} is kept only when it is also a corner at twice the window radius: refined again from the
 * detector's point with a window of radius 2r, it converges, is corner-like (eigen ratio and misfit bounds as before)
 * and lands within {@link #maxScaleDisagreementPx} of the first result. A corner is one point at every window size;
 * on texture the point the equations find depends on what the window holds (derived; the bounds are set on the data
 * named above, no source). The first (radius r) result is the one kept.
 */
public final class RefineConfig {
    /** Whether points are refined at all. */
    public boolean enabled = true;
    /** Half-size of the refinement window, pixels (side 2r+1); 1..20. */
    public int windowRadius = 4;
    /** Most iterations; 1..100. */
    public int maxIterations = 10;
    /** Convergence: the iteration stops once the point moves less than this, pixels; > 0. */
    public double epsilon = 0.01;
    /**
     * Largest accepted move from the detector's point, pixels; > 0. A Gaussian-window corner response peaks up to
     * about 1.3 px from a designed x-corner under strong tilt (measured on renders; more at 40° tilt), so the default
     * 3 px leaves room; the fit rule ({@link #maxFitRmsPx}) is what rejects texture (no source).
     */
    public double maxShiftPx = 3;
    /**
     * Smallest ratio of the structure tensor's eigenvalues λmin/λmax over the window for a refinement to be kept;
     * 0..1. An x-corner or L-corner of a printed target gives about 0.3-1; the default 0.3 (Förstner &amp; Gülch's
     * roundness q = 4 det / tr² of about 0.7; common practice, no source).
     */
    public double minEigenRatio = 0.3;
    /**
     * Largest accepted misfit of (1) of {@link SubpixelRefiner}, pixels: the weighted RMS distance of the window's
     * gradient lines from the refined point. Every gradient of an ideal corner points across a line through it (0 px;
     * the blur of a rendered or printed edge makes it about 0.5-0.7 px); natural texture has no such point. Default
     * 0.7 px, set on the renders and the Graffiti pair (see RefinementStageTest and GrafRepeatabilityTest): every
     * designed x-corner of the renders is refined to within 0.15 px RMS, and the Graffiti repeatability of
     * Shi-Tomasi drops by 0.012 (0.609 to 0.596; keeping every refinement drops it to 0.455). No source.
     */
    public double maxFitRmsPx = 0.7;
    /**
     * Largest misfit of a blurred corner, pixels, kept only when a window of twice the radius agrees (see the class
     * comment); a value not above {@link #maxFitRmsPx} switches this path off. Default 1.2 px: the x-corners of the
     * opencv-doc photos fit to 0.8-1.2 px (measured, see ChessboardPhotoRegistrationTest); no source.
     */
    public double maxBlurredFitRmsPx = 1.2;
    /**
     * Largest distance between a blurred corner refined with the window and with one of twice the radius, pixels; > 0.
     * Default 0.5 px: on the opencv-doc photos the two differ by up to about 0.4 px (the larger window sees the lens
     * curvature and perspective of the edges); the Graffiti repeatability is the same at 0.2-0.7 px. No source.
     */
    public double maxScaleDisagreementPx = 0.5;

    /** Refinement switched off. */
    public static RefineConfig off() {
        RefineConfig c = new RefineConfig();
        c.enabled = false;
        return c;
    }

    public RefineConfig copy() {
        RefineConfig c = new RefineConfig();
        c.enabled = enabled; c.windowRadius = windowRadius; c.maxIterations = maxIterations; c.epsilon = epsilon;
        c.maxShiftPx = maxShiftPx; c.minEigenRatio = minEigenRatio; c.maxFitRmsPx = maxFitRmsPx;
        c.maxBlurredFitRmsPx = maxBlurredFitRmsPx; c.maxScaleDisagreementPx = maxScaleDisagreementPx;
        return c;
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (windowRadius < 1 || windowRadius > 20) throw new IllegalArgumentException("refine: windowRadius must be 1..20 px, got " + windowRadius);
        if (maxIterations < 1 || maxIterations > 100) throw new IllegalArgumentException("refine: maxIterations must be 1..100, got " + maxIterations);
        if (!(epsilon > 0) || !Double.isFinite(epsilon)) throw new IllegalArgumentException("refine: epsilon must be > 0 px, got " + epsilon);
        if (!(maxShiftPx > 0) || !Double.isFinite(maxShiftPx)) throw new IllegalArgumentException("refine: maxShiftPx must be > 0 px, got " + maxShiftPx);
        if (!(maxFitRmsPx > 0)) throw new IllegalArgumentException("refine: maxFitRmsPx must be > 0 px, got " + maxFitRmsPx);
        if (!(maxBlurredFitRmsPx >= 0)) throw new IllegalArgumentException("refine: maxBlurredFitRmsPx must be >= 0 px, got " + maxBlurredFitRmsPx);
        if (!(maxScaleDisagreementPx > 0) || !Double.isFinite(maxScaleDisagreementPx)) throw new IllegalArgumentException("refine: maxScaleDisagreementPx must be > 0 px, got " + maxScaleDisagreementPx);
        if (!(minEigenRatio >= 0 && minEigenRatio <= 1)) throw new IllegalArgumentException("refine: minEigenRatio must be 0..1, got " + minEigenRatio);
    }

    /** Short state for rankings, reports and exports, e.g. "off" or "r4, <=0.75 px, corner-like >=0.3". */
    public String describe() {
        if (!enabled) return "off";
        String blurred = maxBlurredFitRmsPx > maxFitRmsPx ? String.format(Locale.ROOT, " (blurred <=%s px if r%d agrees within %s px)",
                trim(maxBlurredFitRmsPx), 2 * windowRadius, trim(maxScaleDisagreementPx)) : "";
        return String.format(Locale.ROOT, "r%d, shift <=%s px, eigen ratio >=%s, fit <=%s px%s", windowRadius, trim(maxShiftPx),
                trim(minEigenRatio), trim(maxFitRmsPx), blurred);
    }

    @Override public String toString() { return describe(); }

    private static String trim(double v) {
        return v == Math.rint(v) ? String.valueOf((long) v) : String.valueOf(v);
    }
}
