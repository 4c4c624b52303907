package org.targetbench.score;

import org.targetbench.camera.Homography;
import org.targetbench.detect.Detection;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;

/**
 * Repeatability of a detector between a reference frame and another view of the same plane with a known homography,
 * after Schmid, Mohr &amp; Bauckhage 2000 [1], with these exact rules:
 * <ol>
 *   <li>P' = reference points p whose H·p falls inside the other frame, [0, w-1] x [0, h-1];</li>
 *   <li>Q' = frame points q whose H⁻¹·q falls inside the reference frame;</li>
 *   <li>matches = greedy one-to-one pairing of (p, q) in P' x Q' with ‖H·p − q‖ ≤ ε, taken in increasing distance
 *       order;</li>
 *   <li>r = matches / min(|P'|, |Q'|), undefined when that minimum is 0;</li>
 *   <li>ε defaults to {@value #DEFAULT_EPSILON} px.</li>
 * </ol>
 * Coordinates follow the pixel-centre convention.
 *
 * <p><b>Found again</b> (the one rule, used by compare, sweep, servo candidates and the shoot-out): a reference point
 * is found again in a view when it belongs to P' and is paired by rule 3, i.e. a detection of the view lies within ε of
 * its image H·p and is not claimed by a nearer reference point ({@link #foundAgain}). Repeatability is the count of
 * points found again over min(|P'|, |Q'|). Caveat: the greedy pairing is not an optimal assignment; ties in
 * distance are broken by reference index, then frame index, so results are deterministic.
 *
 * <p>Reference: [1] C. Schmid, R. Mohr, C. Bauckhage, "Evaluation of interest point detectors", IJCV 37(2), 2000.
 */
public final class Repeatability {
    /** Default match radius ε, pixels. */
    public static final double DEFAULT_EPSILON = 1.5;

    private Repeatability() {}

    /**
     * @param reference      points detected in the reference frame
     * @param frame          points detected in the other frame
     * @param h              maps reference pixels to frame pixels
     * @param referenceWidth  reference frame width, pixels (likewise the other sizes)
     * @param epsilon        match radius, pixels, &gt; 0
     */
    public static RepeatabilityResult score(List<Detection> reference, List<Detection> frame, Homography h,
                                            int referenceWidth, int referenceHeight, int frameWidth, int frameHeight,
                                            double epsilon) {
        return pair(reference, frame, h, referenceWidth, referenceHeight, frameWidth, frameHeight, epsilon).result;
    }

    /**
     * Which reference points are found again in the view (the rule in the class comment): entry i is 1 when
     * {@code reference.get(i)} is paired, 0 when it is in P' but unpaired, -1 when H·p falls outside the view.
     */
    public static int[] foundAgain(List<Detection> reference, List<Detection> frame, Homography h, int referenceWidth,
                                   int referenceHeight, int frameWidth, int frameHeight, double epsilon) {
        return pair(reference, frame, h, referenceWidth, referenceHeight, frameWidth, frameHeight, epsilon).found;
    }

    private record Paired(RepeatabilityResult result, int[] found) {}

    private static Paired pair(List<Detection> reference, List<Detection> frame, Homography h, int referenceWidth,
                               int referenceHeight, int frameWidth, int frameHeight, double epsilon) {
        if (!(epsilon > 0) || !Double.isFinite(epsilon))
            throw new IllegalArgumentException("epsilon must be > 0 px, got " + epsilon);
        Homography hInv = h.inverse();
        // rule 1: P' and the images H p
        List<double[]> pMapped = new ArrayList<>();
        int[] found = new int[reference.size()];
        int[] index = new int[reference.size()];
        for (int i = 0; i < reference.size(); i++) {
            Detection p = reference.get(i);
            double[] m = h.apply(p.x(), p.y());
            if (inside(m, frameWidth, frameHeight)) {
                index[pMapped.size()] = i;
                pMapped.add(m);
            } else {
                found[i] = -1;
            }
        }
        // rule 2: Q'
        List<double[]> q = new ArrayList<>();
        for (Detection d : frame) {
            if (inside(hInv.apply(d.x(), d.y()), referenceWidth, referenceHeight)) q.add(new double[]{d.x(), d.y()});
        }
        int n = Math.min(pMapped.size(), q.size());
        boolean[] usedA = greedyPairs(pMapped, q, epsilon);
        int matched = 0;
        for (int k = 0; k < usedA.length; k++)
            if (usedA[k]) {
                found[index[k]] = 1;
                matched++;
            }
        return new Paired(new RepeatabilityResult(n == 0 ? OptionalDouble.empty() : OptionalDouble.of(matched / (double) n),
                pMapped.size(), q.size(), matched), found);
    }

    /** Rule 3: greedy one-to-one pairing within ε in increasing distance order; returns the number of pairs. */
    static int greedyMatches(List<double[]> a, List<double[]> b, double epsilon) {
        int matched = 0;
        for (boolean u : greedyPairs(a, b, epsilon)) if (u) matched++;
        return matched;
    }

    /** Rule 3, per point of {@code a}: whether it was paired. */
    private static boolean[] greedyPairs(List<double[]> a, List<double[]> b, double epsilon) {
        double eps2 = epsilon * epsilon;
        List<long[]> pairs = new ArrayList<>();
        List<Double> dist = new ArrayList<>();
        // bucket b by a grid of cell size epsilon so the search stays near linear
        GridIndex grid = new GridIndex(b, epsilon);
        for (int i = 0; i < a.size(); i++) {
            double[] p = a.get(i);
            for (int j : grid.near(p[0], p[1])) {
                double dx = p[0] - b.get(j)[0], dy = p[1] - b.get(j)[1];
                double d2 = dx * dx + dy * dy;
                if (d2 <= eps2) {
                    pairs.add(new long[]{i, j});
                    dist.add(d2);
                }
            }
        }
        Integer[] order = new Integer[pairs.size()];
        for (int k = 0; k < order.length; k++) order[k] = k;
        Arrays.sort(order, (x, y) -> {
            int c = Double.compare(dist.get(x), dist.get(y));
            if (c != 0) return c;
            c = Long.compare(pairs.get(x)[0], pairs.get(y)[0]);
            return c != 0 ? c : Long.compare(pairs.get(x)[1], pairs.get(y)[1]);
        });
        boolean[] usedA = new boolean[a.size()], usedB = new boolean[b.size()];
        for (int k : order) {
            int i = (int) pairs.get(k)[0], j = (int) pairs.get(k)[1];
            if (usedA[i] || usedB[j]) continue;
            usedA[i] = usedB[j] = true;
        }
        return usedA;
    }

    private static boolean inside(double[] m, int w, int h) {
        return m[0] >= 0 && m[1] >= 0 && m[0] <= w - 1 && m[1] <= h - 1;
    }
}
