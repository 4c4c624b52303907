package org.targetbench.arm;

import java.util.List;

/**
 * The gain sweep for one set, arm and latency: the largest swept gain that converged from every start without an
 * oscillation flag, beside the discrete-time bound.
 *
 * <p>Near convergence with the exact interaction matrix the image error obeys e[k+1] = e[k] - g e[k-d] with g = λT
 * and d the latency in periods; that recursion is stable if and only if 0 &lt; g &lt; 2 cos(dπ/(2d+1)) [1] (which gives
 * 2 for d = 0, 1 for d = 1 and 0.618 for d = 2). An oscillation-free gain is smaller than the bound.
 *
 * <p>References: [1] S. A. Levin, R. M. May, "A note on difference-delay equations", Theoretical Population Biology 9,
 * 1976.
 *
 * @param latencyFrames d
 * @param periodS       T, seconds
 * @param rows          one row per swept gain
 * @param bestLambda    the largest λ (1/s) that converged from every start without oscillation, NaN when none did
 */
public record GainAdvice(int latencyFrames, double periodS, List<Row> rows, double bestLambda) {
    /**
     * @param lambda       gain, 1/s
     * @param converged    runs that converged
     * @param runs         runs
     * @param oscillating  runs flagged as oscillating
     */
    public record Row(double lambda, int converged, int runs, int oscillating) {
        public boolean clean() { return converged == runs && oscillating == 0; }
    }

    public GainAdvice {
        rows = List.copyOf(rows);
    }

    /** The bound on g = λT of [1]: 2 cos(dπ/(2d+1)). */
    public static double boundOnGain(int d) {
        if (d < 0) throw new IllegalArgumentException("latency must be >= 0 periods, got " + d);
        return 2 * Math.cos(d * Math.PI / (2 * d + 1));
    }

    /** The same bound as a gain λ, 1/s. */
    public double boundLambda() { return boundOnGain(latencyFrames) / periodS; }
}
