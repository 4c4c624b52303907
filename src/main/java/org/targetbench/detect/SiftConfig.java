package org.targetbench.detect;

/** Difference-of-Gaussian (SIFT detector stage) settings (Lowe 2004). */
public final class SiftConfig extends DetectorConfig {
    /** Blur of the first scale of each octave, pixels (Lowe 2004 uses 1.6). */
    public double sigma0 = 1.6;
    /** Scales per octave in which extrema are sought (Lowe 2004 uses 3). */
    public int scalesPerOctave = 3;
    /**
     * First octave; -1 doubles the image first, as Lowe 2004 recommends (about twice the stable points at the finest
     * scales, at about four times the cost). 0, the default, keeps the bench fast enough for sweeps on a laptop.
     */
    public int firstOctave = 0;
    /** Last octave. */
    public int lastOctave = 5;
    /** Edge-response limit r on the Hessian ratio (Lowe 2004 uses 10). */
    public double edgeRatio = 10;

    public SiftConfig() {
        threshold = 0.02;
        nmsRadius = 1;
        // half a grey level of DoG contrast: below that an extremum is quantisation noise (common practice, no source)
        minResponse = 0.5;
    }

    @Override public DetectorType type() { return DetectorType.SIFT; }

    @Override public SiftConfig copy() {
        SiftConfig c = copyCommonTo(new SiftConfig());
        c.sigma0 = sigma0; c.scalesPerOctave = scalesPerOctave; c.firstOctave = firstOctave; c.lastOctave = lastOctave; c.edgeRatio = edgeRatio;
        return c;
    }

    @Override public void checkValidity() {
        super.checkValidity();
        if (!(sigma0 > 0)) throw new IllegalArgumentException("sift: sigma0 must be > 0 px, got " + sigma0);
        if (scalesPerOctave < 1) throw new IllegalArgumentException("sift: scalesPerOctave must be >= 1, got " + scalesPerOctave);
        if (firstOctave < -1 || lastOctave <= firstOctave) throw new IllegalArgumentException("sift: octaves must satisfy -1 <= first < last, got " + firstOctave + ".." + lastOctave);
        if (!(edgeRatio > 1)) throw new IllegalArgumentException("sift: edgeRatio must be > 1, got " + edgeRatio);
    }
}
