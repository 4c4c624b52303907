package org.targetbench.track;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * The vector form of one row of {@link ScharrGradient}'s interior (Java Vector API, incubator module
 * {@code jdk.incubator.vector}): the same expressions, in the same order, lane by lane, so the output is identical to
 * the scalar loop, whatever the lane count (no sums across pixels). Touch only behind {@link ScharrGradient#VECTOR}.
 */
final class ScharrVector {
    private static final VectorSpecies<Float> S = FloatVector.SPECIES_PREFERRED;

    private ScharrVector() {}

    /**
     * Fills columns 1 .. of one output row in whole vectors and returns the first column it did not fill (the scalar
     * loop finishes the row). Indices as in {@link ScharrGradient#compute}.
     */
    static int row(float[] d, float[] ox, float[] oy, int w, int rowU, int row, int rowD, int ix, int iy, float side, float centre) {
        int n = S.length(), x = 1;
        FloatVector vs = FloatVector.broadcast(S, side), vc = FloatVector.broadcast(S, centre);
        for (; x + n <= w - 1; x += n) {
            FloatVector ul = FloatVector.fromArray(S, d, rowU + x - 1), ur = FloatVector.fromArray(S, d, rowU + x + 1);
            FloatVector dl = FloatVector.fromArray(S, d, rowD + x - 1), dr = FloatVector.fromArray(S, d, rowD + x + 1);
            FloatVector l = FloatVector.fromArray(S, d, row + x - 1), r = FloatVector.fromArray(S, d, row + x + 1);
            FloatVector u = FloatVector.fromArray(S, d, rowU + x), b = FloatVector.fromArray(S, d, rowD + x);
            vs.mul(ur.sub(ul).add(dr).sub(dl)).add(vc.mul(r.sub(l))).intoArray(ox, ix + x);
            vs.mul(dl.sub(ul).add(dr).sub(ur)).add(vc.mul(b.sub(u))).intoArray(oy, iy + x);
        }
        return x;
    }
}
