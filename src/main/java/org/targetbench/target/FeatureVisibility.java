package org.targetbench.target;

/**
 * Whether a designed feature is actually drawn, after every shape is painted in order (a later shape covers an
 * earlier one, {@link TargetDesign#reflectance}). A feature hidden under a later shape is not truth: a detector cannot
 * find it and scoring against it would make every detector look worse.
 *
 * <p>Rule (derived from what each kind looks like): a corner ({@link FeatureKind#X_CORNER}, {@link FeatureKind#CORNER})
 * is drawn when the reflectance on a ring of radius {@value #RING_MM} mm around it varies by at least
 * {@value #MIN_CONTRAST} (it sits where shades meet); a dot centre ({@link FeatureKind#DOT_CENTRE}) is drawn when its
 * surroundings out to {@value #DOT_SEARCH_MM} mm are not all of the centre's reflectance (the dot still has an edge).
 */
public final class FeatureVisibility {
    /** Radius of the ring sampled around a corner, millimetres. */
    public static final double RING_MM = 0.2;
    /** Least reflectance difference on the ring that shows an edge (0 = black, 1 = white). */
    public static final double MIN_CONTRAST = 0.25;
    /** Farthest ring sampled around a dot centre, millimetres. */
    public static final double DOT_SEARCH_MM = 30;
    private static final int SAMPLES = 16;

    private FeatureVisibility() {}

    /** True when {@code f} of {@code d} is visible as drawn. */
    public static boolean drawn(TargetDesign d, TargetFeature f) {
        if (f.kind() == FeatureKind.DOT_CENTRE) {
            double centre = d.reflectance(f.xMm(), f.yMm());
            if (Double.isNaN(centre)) return false;
            for (double r = RING_MM; r <= DOT_SEARCH_MM; r *= 1.5)
                for (int k = 0; k < SAMPLES; k++) {
                    double a = 2 * Math.PI * k / SAMPLES;
                    double v = d.reflectance(f.xMm() + r * Math.cos(a), f.yMm() + r * Math.sin(a));
                    if (!Double.isNaN(v) && Math.abs(v - centre) >= MIN_CONTRAST) return true;
                }
            return false;
        }
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < SAMPLES; k++) {
            double a = 2 * Math.PI * (k + 0.5) / SAMPLES;
            double v = d.reflectance(f.xMm() + RING_MM * Math.cos(a), f.yMm() + RING_MM * Math.sin(a));
            if (Double.isNaN(v)) continue;
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        return hi - lo >= MIN_CONTRAST;
    }

    /** How many of the design's features are drawn. */
    public static int drawnCount(TargetDesign d) {
        int n = 0;
        for (TargetFeature f : d.features()) if (drawn(d, f)) n++;
        return n;
    }
}
