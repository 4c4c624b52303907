package org.targetbench.detect;

/** FAST segment-test corner detector settings (Rosten &amp; Drummond 2006). */
public final class FastConfig extends DetectorConfig {
    /** Grey-level difference a circle pixel needs from the centre to count as brighter or darker. */
    public int pixelTolerance = 20;
    /** Contiguous circle pixels (of 16) required, 9..12; 9 is FAST-9. */
    public int minContinuous = 9;

    public FastConfig() {
        // FAST responses are sparse and already thresholded by pixelTolerance; keep every segment-test corner.
        threshold = 0;
    }

    @Override public DetectorType type() { return DetectorType.FAST; }

    @Override public FastConfig copy() {
        FastConfig c = copyCommonTo(new FastConfig());
        c.pixelTolerance = pixelTolerance; c.minContinuous = minContinuous;
        return c;
    }

    @Override public void checkValidity() {
        super.checkValidity();
        if (pixelTolerance < 1 || pixelTolerance > 254) throw new IllegalArgumentException("fast: pixelTolerance must be 1..254 grey levels, got " + pixelTolerance);
        if (minContinuous < 9 || minContinuous > 12) throw new IllegalArgumentException("fast: minContinuous must be 9..12, got " + minContinuous);
    }
}
