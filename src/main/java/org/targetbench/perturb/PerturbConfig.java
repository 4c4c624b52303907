package org.targetbench.perturb;

/** Fixed settings of the perturbations (the swept value is given per call). */
public final class PerturbConfig {
    /** Direction of motion blur, degrees from the image x axis towards y. */
    public double motionAngleDeg = 0;
    /**
     * Conversion gain of the simulated sensor in low light, electrons per grey level at full exposure (a small
     * machine-vision sensor with a full well near 1000 e⁻ over 255 levels; common practice, no source).
     */
    public double electronsPerGrey = 4;
    /** Read noise of the simulated sensor, electrons RMS (typical of CMOS machine-vision sensors; common practice, no source). */
    public double readNoiseElectrons = 3;
    /**
     * Horizontal field of view assumed when a tilt must be simulated by a homography warp of a frame whose camera
     * is unknown, degrees.
     */
    public double assumedFovDeg = 60;

    public PerturbConfig copy() {
        PerturbConfig c = new PerturbConfig();
        c.motionAngleDeg = motionAngleDeg;
        c.electronsPerGrey = electronsPerGrey;
        c.readNoiseElectrons = readNoiseElectrons;
        c.assumedFovDeg = assumedFovDeg;
        return c;
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (!Double.isFinite(motionAngleDeg)) throw new IllegalArgumentException("motionAngleDeg must be finite, got " + motionAngleDeg);
        if (!(electronsPerGrey > 0)) throw new IllegalArgumentException("electronsPerGrey must be > 0, got " + electronsPerGrey);
        if (!(readNoiseElectrons >= 0)) throw new IllegalArgumentException("readNoiseElectrons must be >= 0, got " + readNoiseElectrons);
        if (!(assumedFovDeg > 1 && assumedFovDeg < 170)) throw new IllegalArgumentException("assumedFovDeg must be within 1..170, got " + assumedFovDeg);
    }
}
