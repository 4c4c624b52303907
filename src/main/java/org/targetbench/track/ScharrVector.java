package org.targetbench.track;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * The vector form of the interior of {@link ScharrGradient} (Java Vector API, incubator module
 * {@code jdk.incubator.vector}): the same expressions, in the same order, lane by lane, so the output is identical to
 * the scalar loop, whatever the lane count (no sums across pixels). Touch only behind {@link ScharrGradient#VECTOR}.
 *
 * <p>Eight lanes ({@code SPECIES_256}), the shape of {@link LkVectorKernels}: on Java 17, vectors of two shapes in one
 * JVM pollute the type profiles of the Vector API's shared code and C2 then boxes every vector (measured: with
 * {@code SPECIES_PREFERRED}, 512 bits on this machine, the tracker allocated 14-34 MB per frame and ran twice as slow;
 * with one shape, nothing). One method over all rows, with no vector carried from one iteration to the next.
 */
final class ScharrVector {
    private static final VectorSpecies<Float> S = FloatVector.SPECIES_256;

    private ScharrVector() {}

    /** First column the scalar loop fills in every row of an image {@code w} wide: this fills 1 .. end - 1. */
    static int end(int w) {
        int n = S.length();
        return w < 2 ? 1 : 1 + ((w - 2) / n) * n;
    }

    /**
     * Fills columns 1 .. {@link #end}(w) - 1 of every row (rows clamped at the top and bottom as in
     * {@link ScharrGradient#compute}).
     */
    static void interior(float[] d, int start, int stride, int w, int h, float[] ox, int oxStart, int oxStride,
                         float[] oy, int oyStart, int oyStride, float side, float centre) {
        int n = S.length(), end = end(w);
        for (int y = 0; y < h; y++) {
            int rowU = start + Math.max(0, y - 1) * stride, row = start + y * stride, rowD = start + Math.min(h - 1, y + 1) * stride;
            int ix = oxStart + y * oxStride, iy = oyStart + y * oyStride;
            for (int x = 1; x < end; x += n) {
                FloatVector ul = FloatVector.fromArray(S, d, rowU + x - 1), ur = FloatVector.fromArray(S, d, rowU + x + 1);
                FloatVector dl = FloatVector.fromArray(S, d, rowD + x - 1), dr = FloatVector.fromArray(S, d, rowD + x + 1);
                FloatVector l = FloatVector.fromArray(S, d, row + x - 1), r = FloatVector.fromArray(S, d, row + x + 1);
                FloatVector u = FloatVector.fromArray(S, d, rowU + x), b = FloatVector.fromArray(S, d, rowD + x);
                ur.sub(ul).add(dr).sub(dl).mul(side).add(r.sub(l).mul(centre)).intoArray(ox, ix + x);
                dl.sub(ul).add(dr).sub(ur).mul(side).add(b.sub(u).mul(centre)).intoArray(oy, iy + x);
            }
        }
    }
}
