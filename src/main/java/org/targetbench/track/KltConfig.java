package org.targetbench.track;

/**
 * Settings of the pyramidal KLT point tracker ({@link KltTracker}). Lengths are in pixels of the full-resolution
 * frame unless stated; grey levels on the 8-bit scale 0..255.
 */
public final class KltConfig {
    /**
     * Half-width of the square tracking window, pixels: the window is (2r+1) x (2r+1) at every pyramid level.
     * 1..20. The default 7 (15 x 15) is common practice (no source); larger windows resist noise and blur better and
     * cost time in proportion to their area.
     */
    public int windowRadius = 7;
    /**
     * Pyramid levels including the full-resolution frame, each half the size of the one below; 1..8. With L levels
     * and radius r the tracker follows motions of up to roughly r 2^(L-1) pixels per frame (Bouguet 2000, sec. 2.4).
     */
    public int pyramidLevels = 4;
    /** Most Gauss-Newton iterations at each pyramid level; 1..100. */
    public int maxIterations = 20;
    /** Convergence: a level stops iterating once both components of the update are below this, pixels; > 0. */
    public double epsilon = 0.01;
    /** Track every point back to the previous frame and measure the forward-backward error (Kalal et al. 2010). */
    public boolean forwardBackward = true;
    /**
     * Largest accepted forward-backward error, pixels; a track whose return lands further than this from where it
     * started is ended as {@link TrackOutcome#LOST_FORWARD_BACKWARD}. Kalal, Mikolajczyk &amp; Matas (2010) reject
     * by the median error of the frame; a fixed threshold of 0.5-1 px is the usual choice for a fixed camera rig
     * (common practice, no source). The default 0.5 px keeps well-tracked corners (measured forward-backward errors
     * below 0.1 px on the demo scenario) and ends a track before it drifts by a visible amount.
     */
    public double fbThreshold = 0.5;
    /**
     * Largest accepted mean absolute difference between the converged window and its template, grey levels per
     * pixel, checked at every level (BoofCV's default, 25). Catches occlusion and sudden lighting change.
     */
    public double maxResidual = 25;
    /**
     * Smallest accepted texture: the smaller eigenvalue of the window's gradient matrix G = Σ ∇I ∇Iᵀ divided by the
     * number of window pixels, (grey levels / pixel)² (Shi &amp; Tomasi 1994). Below it the window cannot be located
     * in both directions and the track ends as {@link TrackOutcome#TOO_FLAT}. The default 2 sits above the gradient
     * noise of a flat patch with 1.5 grey levels of sensor noise (about 0.4) and far below a clean corner (hundreds).
     */
    public double minEigenvalue = 2;
    /**
     * Drift correction: after each frame-to-frame step, align the track's first template (affine warp, gain and bias;
     * Baker &amp; Matthews 2004, Matthews, Ishikawa &amp; Baker 2004) starting from the new position and keep the
     * corrected position when the alignment converges within {@link #maxCorrection}. Without it a frame-to-frame
     * tracker's position random-walks away from its feature over a long run. The residual check then measures the
     * window against the first template.
     */
    public boolean driftCorrection = true;
    /**
     * Largest correction the drift correction may apply in one frame, pixels; > 0. A larger one is not applied (the
     * frame-to-frame position stands). The default 1 px is several times the drift of a frame-to-frame tracker over
     * a few seconds (measured about 0.1-0.4 px) and well below a corner's distance to the next similar structure.
     */
    public double maxCorrection = 1.0;
    /** New tracks start no closer than this to each other or to a live track, pixels; >= 0. */
    public double minSpacing = 8;
    /** Whether tracks that die are replaced. */
    public RespawnPolicy respawn = RespawnPolicy.OFF;
    /** Tracks started on the first frame (strongest detections first), and the level {@link RespawnPolicy#TOP_UP} keeps. */
    public int maxTracks = 200;

    public KltConfig copy() {
        KltConfig c = new KltConfig();
        c.windowRadius = windowRadius; c.pyramidLevels = pyramidLevels; c.maxIterations = maxIterations; c.epsilon = epsilon;
        c.forwardBackward = forwardBackward; c.fbThreshold = fbThreshold; c.maxResidual = maxResidual;
        c.minEigenvalue = minEigenvalue; c.minSpacing = minSpacing; c.respawn = respawn; c.maxTracks = maxTracks;
        c.driftCorrection = driftCorrection; c.maxCorrection = maxCorrection;
        return c;
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (windowRadius < 1 || windowRadius > 20) throw new IllegalArgumentException("windowRadius must be 1..20 px, got " + windowRadius);
        if (pyramidLevels < 1 || pyramidLevels > 8) throw new IllegalArgumentException("pyramidLevels must be 1..8, got " + pyramidLevels);
        if (maxIterations < 1 || maxIterations > 100) throw new IllegalArgumentException("maxIterations must be 1..100, got " + maxIterations);
        if (!(epsilon > 0) || !Double.isFinite(epsilon)) throw new IllegalArgumentException("epsilon must be > 0 px, got " + epsilon);
        if (!(fbThreshold > 0)) throw new IllegalArgumentException("fbThreshold must be > 0 px, got " + fbThreshold);
        if (!(maxResidual > 0)) throw new IllegalArgumentException("maxResidual must be > 0 grey levels, got " + maxResidual);
        if (!(minEigenvalue >= 0) || !Double.isFinite(minEigenvalue))
            throw new IllegalArgumentException("minEigenvalue must be >= 0 (grey levels/px)², got " + minEigenvalue);
        if (!(minSpacing >= 0) || !Double.isFinite(minSpacing)) throw new IllegalArgumentException("minSpacing must be >= 0 px, got " + minSpacing);
        if (!(maxCorrection > 0) || !Double.isFinite(maxCorrection)) throw new IllegalArgumentException("maxCorrection must be > 0 px, got " + maxCorrection);
        if (respawn == null) throw new IllegalArgumentException("respawn policy must be set");
        if (maxTracks < 1 || maxTracks > 100_000) throw new IllegalArgumentException("maxTracks must be 1..100000, got " + maxTracks);
    }

    /** Smallest image side the pyramid needs: the coarsest level must still hold a window. */
    public int minImageSide() {
        return (2 * windowRadius + 1) << (pyramidLevels - 1);
    }
}
