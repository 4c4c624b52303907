package org.targetbench.source;

/**
 * Settings of the synthetic renderer. Grey levels are on the 8-bit scale 0..255.
 */
public final class RenderConfig {
    /** Sub-samples per pixel along each axis (n x n per pixel, box filter). At least 4. */
    public int supersample = 4;
    /** Grey level seen where no target is (the fixture plate behind the target). */
    public double backgroundGrey = 110;
    /** Grey level of white page (reflectance 1). */
    public double paperGrey = 220;
    /** Grey level of black ink (reflectance 0). */
    public double inkGrey = 30;
    /** Standard deviation of additive Gaussian sensor noise, grey levels; 0 for none. */
    public double noiseSigma = 0;
    /** Seed of the sensor noise. */
    public long noiseSeed = 1;
    /** Round to whole grey levels and clip to 0..255, as an 8-bit sensor does. */
    public boolean quantise = true;

    public RenderConfig copy() {
        RenderConfig c = new RenderConfig();
        c.supersample = supersample; c.backgroundGrey = backgroundGrey; c.paperGrey = paperGrey; c.inkGrey = inkGrey;
        c.noiseSigma = noiseSigma; c.noiseSeed = noiseSeed; c.quantise = quantise;
        return c;
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (supersample < 4 || supersample > 16) throw new IllegalArgumentException("supersample must be 4..16 per axis, got " + supersample);
        for (double g : new double[]{backgroundGrey, paperGrey, inkGrey})
            if (!(g >= 0 && g <= 255)) throw new IllegalArgumentException("grey levels must be within 0..255, got background=" + backgroundGrey + " paper=" + paperGrey + " ink=" + inkGrey);
        if (!(noiseSigma >= 0) || !Double.isFinite(noiseSigma)) throw new IllegalArgumentException("noiseSigma must be >= 0 grey levels, got " + noiseSigma);
    }
}
