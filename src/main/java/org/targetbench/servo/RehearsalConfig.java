package org.targetbench.servo;

import java.util.Arrays;

/**
 * Settings of a servo rehearsal: the closed loop simulated from many start poses. Defaults are for a small cell with
 * the camera some 0.2-0.5 m from the target.
 */
public final class RehearsalConfig {
    /** Number of Monte-Carlo start poses, 1..100000. */
    public int starts = 200;
    /** Control gain λ, 1/s, &gt; 0: the error falls as e^(-λ t) near the goal. */
    public double lambda = 0.5;
    /** Which interaction matrix estimate the control law uses. */
    public ControlLaw law = ControlLaw.MEAN;
    /** Which depths the controller believes. */
    public DepthMode depthMode = DepthMode.TRUE;
    /** Factor on Z* for {@link DepthMode#SCALED}, &gt; 0 (1.2 = the controller thinks the target is 20 % further). */
    public double depthErrorFactor = 1.0;
    /**
     * Image noise standard deviation per coordinate, pixels, &gt;= 0; NaN = use each point's measured jitter (0 for a
     * point without one).
     */
    public double noiseSigmaPx = Double.NaN;
    /** Whether points are lost at random according to their measured track survival (when measured). */
    public boolean useSurvival = true;
    /** Control period (integration step), seconds, &gt; 0. */
    public double dtS = 0.01;
    /** Time after which a run that has not converged is stopped, seconds, &gt; dtS. */
    public double timeoutS = 20;
    /** A run has converged when the true image error falls below this RMS over points, pixels, &gt; 0. */
    public double convergedPx = 0.5;
    /** Start envelope: uniform offsets within ± these translations along the reference camera's x, y, z, millimetres. */
    public double[] envelopeMm = {20, 20, 20};
    /** Start envelope: uniform rotations within ± these angles about the reference camera's x, y, z, degrees. */
    public double[] envelopeDeg = {10, 10, 20};
    /** A run is stopped as retreating when the camera is this many times further from the target plane than at the reference. */
    public double retreatLimit = 5;
    /** Seed of the start poses, the noise and the losses; results depend on it and on nothing else. */
    public long seed = 1;
    /** Worker threads, &gt;= 1 (results do not depend on it). */
    public int threads = Runtime.getRuntime().availableProcessors();
    /** Runs whose time series are kept for charts. */
    public int tracedRuns = 12;
    /** Keep every n-th step of a traced run. */
    public int traceEvery = 5;

    /** Number of control steps before the timeout. */
    public int maxSteps() { return (int) Math.ceil(timeoutS / dtS - 1e-9); }

    public void checkValidity() {
        if (starts < 1 || starts > 100_000) throw new IllegalArgumentException("starts must be within 1..100000, got " + starts);
        if (!(lambda > 0) || !Double.isFinite(lambda)) throw new IllegalArgumentException("lambda must be > 0 1/s, got " + lambda);
        if (law == null || depthMode == null) throw new IllegalArgumentException("law and depth mode must be set");
        if (!(depthErrorFactor > 0) || !Double.isFinite(depthErrorFactor))
            throw new IllegalArgumentException("depth error factor must be > 0, got " + depthErrorFactor);
        if (!Double.isNaN(noiseSigmaPx) && !(noiseSigmaPx >= 0 && Double.isFinite(noiseSigmaPx)))
            throw new IllegalArgumentException("noise must be >= 0 px, got " + noiseSigmaPx);
        if (!(dtS > 0) || !Double.isFinite(dtS)) throw new IllegalArgumentException("dt must be > 0 s, got " + dtS);
        if (!(timeoutS > dtS) || !Double.isFinite(timeoutS)) throw new IllegalArgumentException("timeout must be > dt (" + dtS + " s), got " + timeoutS);
        if (maxSteps() > 1_000_000) throw new IllegalArgumentException("timeout / dt gives " + maxSteps() + " steps; at most 1000000");
        if (!(convergedPx > 0) || !Double.isFinite(convergedPx)) throw new IllegalArgumentException("convergence threshold must be > 0 px, got " + convergedPx);
        if (envelopeMm == null || envelopeMm.length != 3 || envelopeDeg == null || envelopeDeg.length != 3)
            throw new IllegalArgumentException("the envelope needs 3 translations and 3 rotations");
        for (double v : envelopeMm)
            if (!(v >= 0) || v > 10_000) throw new IllegalArgumentException("envelope translations must be within 0..10000 mm, got " + Arrays.toString(envelopeMm));
        for (double v : envelopeDeg)
            if (!(v >= 0) || v > 180) throw new IllegalArgumentException("envelope rotations must be within 0..180 deg, got " + Arrays.toString(envelopeDeg));
        if (!(retreatLimit > 1) || !Double.isFinite(retreatLimit)) throw new IllegalArgumentException("retreat limit must be > 1, got " + retreatLimit);
        if (threads < 1) throw new IllegalArgumentException("threads must be >= 1, got " + threads);
        if (tracedRuns < 0 || traceEvery < 1) throw new IllegalArgumentException("tracedRuns must be >= 0 and traceEvery >= 1, got " + tracedRuns + ", " + traceEvery);
    }

    public RehearsalConfig copy() {
        RehearsalConfig c = new RehearsalConfig();
        c.starts = starts;
        c.lambda = lambda;
        c.law = law;
        c.depthMode = depthMode;
        c.depthErrorFactor = depthErrorFactor;
        c.noiseSigmaPx = noiseSigmaPx;
        c.useSurvival = useSurvival;
        c.dtS = dtS;
        c.timeoutS = timeoutS;
        c.convergedPx = convergedPx;
        c.envelopeMm = envelopeMm.clone();
        c.envelopeDeg = envelopeDeg.clone();
        c.retreatLimit = retreatLimit;
        c.seed = seed;
        c.threads = threads;
        c.tracedRuns = tracedRuns;
        c.traceEvery = traceEvery;
        return c;
    }
}
