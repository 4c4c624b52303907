package org.targetbench.camera;

import java.util.SplittableRandom;

/**
 * Random deviates for simulated sensor noise, from a caller's seeded generator (so results are reproducible).
 *
 * <p>References: [1] G. Marsaglia, T. A. Bray, "A convenient method for generating normal variables", SIAM Review
 * 6(3), 1964 (polar method). [2] D. E. Knuth, The Art of Computer Programming vol. 2, 3rd ed. 1997, sec. 3.4.1
 * (Poisson by products of uniforms).
 */
public final class SensorNoise {
    /** Mean above which a Poisson deviate is drawn from its normal approximation. */
    public static final double POISSON_NORMAL_ABOVE = 30;

    private SensorNoise() {}

    /** Standard normal deviate, polar method [1]. */
    public static double gaussian(SplittableRandom rng) {
        double a, b, s;
        do {
            a = 2 * rng.nextDouble() - 1;
            b = 2 * rng.nextDouble() - 1;
            s = a * a + b * b;
        } while (s >= 1 || s == 0);
        return a * Math.sqrt(-2 * Math.log(s) / s);
    }

    /** Poisson deviate: products of uniforms [2] up to {@value #POISSON_NORMAL_ABOVE}, the rounded normal approximation above. */
    public static double poisson(SplittableRandom rng, double mean) {
        if (mean <= 0) return 0;
        if (mean < POISSON_NORMAL_ABOVE) {
            double l = Math.exp(-mean), p = 1;
            int k = 0;
            do {
                k++;
                p *= rng.nextDouble();
            } while (p > l);
            return k - 1;
        }
        return Math.max(0, Math.rint(mean + Math.sqrt(mean) * gaussian(rng)));
    }
}
