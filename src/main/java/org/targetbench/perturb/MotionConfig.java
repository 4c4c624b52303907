package org.targetbench.perturb;

/**
 * Settings of a synthetic motion sequence ({@link MotionSource}): timing and the per-frame effects applied after
 * rendering. Grey levels on the 8-bit scale.
 */
public final class MotionConfig {
    /** Frames in the sequence; 1..1,000,000. */
    public int frames = 150;
    /** Frame rate, frames per second; frame i is taken at t = i / fps. */
    public double fps = 30;
    /**
     * Exposure time, milliseconds: each frame is blurred along the image motion of the target centre during the
     * exposure (t ± exposure/2); 0 for no motion blur. Must be shorter than a frame interval.
     */
    public double exposureMs = 8;
    /** Sensor noise, standard deviation in grey levels, added after blur; 0 for none. */
    public double noiseSigma = 1.5;
    /**
     * Lighting drift: the cell light's gain varies as 1 + a sin(2πt / period); a is this fraction (0 for steady light,
     * 0.2 for ±20%); 0..0.9.
     */
    public double lightingDrift = 0;
    /** Period of the lighting drift, seconds. */
    public double lightingPeriodS = 4;
    /** Seed of the noise. */
    public long seed = 1;

    public MotionConfig copy() {
        MotionConfig c = new MotionConfig();
        c.frames = frames; c.fps = fps; c.exposureMs = exposureMs; c.noiseSigma = noiseSigma;
        c.lightingDrift = lightingDrift; c.lightingPeriodS = lightingPeriodS; c.seed = seed;
        return c;
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (frames < 1 || frames > 1_000_000) throw new IllegalArgumentException("frames must be 1..1000000, got " + frames);
        if (!(fps > 0 && fps <= 1000)) throw new IllegalArgumentException("fps must be within (0, 1000], got " + fps);
        if (!(exposureMs >= 0) || !(exposureMs < 1000 / fps))
            throw new IllegalArgumentException("exposure must be >= 0 ms and shorter than a frame (" + 1000 / fps + " ms), got " + exposureMs + " ms");
        if (!(noiseSigma >= 0 && noiseSigma <= 64)) throw new IllegalArgumentException("noise must be 0..64 grey levels, got " + noiseSigma);
        if (!(lightingDrift >= 0 && lightingDrift <= 0.9)) throw new IllegalArgumentException("lighting drift must be 0..0.9, got " + lightingDrift);
        if (!(lightingPeriodS > 0) || !Double.isFinite(lightingPeriodS))
            throw new IllegalArgumentException("lighting period must be > 0 s, got " + lightingPeriodS);
    }
}
