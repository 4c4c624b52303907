package org.targetbench.select;

/** Settings of building candidates from a reference view and the frames compared with it. */
public final class CandidateConfig {
    /** Radius within which a detection is taken as a designed feature (projected design point), pixels, &gt; 0. */
    public double featureMatchPx = 3.0;
    /** Radius within which a detection counts as finding a true feature for the localisation error, pixels, &gt; 0
     *  (the same 3 px as the comparison's localisation score). */
    public double localisationRadiusPx = 3.0;
    /** Re-detection radius for per-point repeatability, pixels, &gt; 0 (the comparison's epsilon). */
    public double epsilonPx = 1.5;

    public void checkValidity() {
        if (!(featureMatchPx > 0) || !Double.isFinite(featureMatchPx)) throw new IllegalArgumentException("featureMatchPx must be > 0 px, got " + featureMatchPx);
        if (!(localisationRadiusPx > 0) || !Double.isFinite(localisationRadiusPx))
            throw new IllegalArgumentException("localisationRadiusPx must be > 0 px, got " + localisationRadiusPx);
        if (!(epsilonPx > 0) || !Double.isFinite(epsilonPx)) throw new IllegalArgumentException("epsilonPx must be > 0 px, got " + epsilonPx);
    }

    public CandidateConfig copy() {
        CandidateConfig c = new CandidateConfig();
        c.featureMatchPx = featureMatchPx;
        c.localisationRadiusPx = localisationRadiusPx;
        c.epsilonPx = epsilonPx;
        return c;
    }
}
