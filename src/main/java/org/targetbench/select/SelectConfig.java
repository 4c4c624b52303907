package org.targetbench.select;

/**
 * Settings of choosing servo points. The robustness filters apply only to what was measured; the thresholds are rules
 * of thumb for sub-pixel point tracking on a clean target (common practice, no source).
 */
public final class SelectConfig {
    /** Number of servo points, 4..8. */
    public int count = 4;
    /** Hard filter: least per-point repeatability, 0..1. */
    public double minRepeatability = 0.7;
    /** Hard filter: least track survival, 0..1. */
    public double minTrackSurvival = 0.9;
    /** Hard filter: largest localisation error (RMS over frames), pixels. */
    public double maxLocalisationErrorPx = 0.5;
    /** Hard filter: largest jitter, pixels. */
    public double maxJitterPx = 0.3;
    /** Hard filter: least distance from the image border, pixels, so that a tracking window fits. */
    public double borderMarginPx = 16;
    /** Least pixel distance between two chosen points, so that tracking windows (up to this size) never overlap. */
    public double minSeparationPx = 24;
    /** Drop detections that are not on a designed feature when the true feature positions are known. */
    public boolean requireDesignedFeature = true;
    /**
     * Weight w of image coverage in the objective J = log10 cond(L*) - w · coverage (coverage = convex-hull area of the
     * chosen points as a fraction of the image, 0..1). With w = 1, widening the hull by a tenth of the image is worth
     * the same as a condition number 10^0.1 ≈ 1.26 times smaller. &gt;= 0.
     */
    public double coverageWeight = 1.0;
    /** A set whose scaled cond(L*) exceeds this is refused as near singular. */
    public double maxCondition = 1000;
    /** Search every set when the pool gives at most this many combinations; greedy plus swaps otherwise. */
    public long exhaustiveLimit = 100_000;

    public void checkValidity() {
        if (count < 4 || count > 8) throw new IllegalArgumentException("count must be within 4..8, got " + count);
        if (!(minRepeatability >= 0 && minRepeatability <= 1)) throw new IllegalArgumentException("minRepeatability must be within 0..1, got " + minRepeatability);
        if (!(minTrackSurvival >= 0 && minTrackSurvival <= 1)) throw new IllegalArgumentException("minTrackSurvival must be within 0..1, got " + minTrackSurvival);
        if (!(maxLocalisationErrorPx > 0)) throw new IllegalArgumentException("maxLocalisationErrorPx must be > 0 px, got " + maxLocalisationErrorPx);
        if (!(maxJitterPx > 0)) throw new IllegalArgumentException("maxJitterPx must be > 0 px, got " + maxJitterPx);
        if (!(borderMarginPx >= 0) || !Double.isFinite(borderMarginPx)) throw new IllegalArgumentException("borderMarginPx must be >= 0 px, got " + borderMarginPx);
        if (!(minSeparationPx >= 0) || !Double.isFinite(minSeparationPx)) throw new IllegalArgumentException("minSeparationPx must be >= 0 px, got " + minSeparationPx);
        if (!(coverageWeight >= 0) || !Double.isFinite(coverageWeight)) throw new IllegalArgumentException("coverageWeight must be >= 0, got " + coverageWeight);
        if (!(maxCondition > 1)) throw new IllegalArgumentException("maxCondition must be > 1, got " + maxCondition);
        if (exhaustiveLimit < 0) throw new IllegalArgumentException("exhaustiveLimit must be >= 0, got " + exhaustiveLimit);
    }

    public SelectConfig copy() {
        SelectConfig c = new SelectConfig();
        c.count = count;
        c.minRepeatability = minRepeatability;
        c.minTrackSurvival = minTrackSurvival;
        c.maxLocalisationErrorPx = maxLocalisationErrorPx;
        c.maxJitterPx = maxJitterPx;
        c.borderMarginPx = borderMarginPx;
        c.minSeparationPx = minSeparationPx;
        c.requireDesignedFeature = requireDesignedFeature;
        c.coverageWeight = coverageWeight;
        c.maxCondition = maxCondition;
        c.exhaustiveLimit = exhaustiveLimit;
        return c;
    }
}
