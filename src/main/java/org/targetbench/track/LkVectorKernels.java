package org.targetbench.track;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * The vector twins of {@link LkKernels} (Java Vector API, incubator module {@code jdk.incubator.vector}): eight float
 * lanes, lane j summing column j mod 8 of every row, so the result is bit-identical to the scalar form, which keeps
 * the same eight partial sums (see {@link LkKernels}). Touch only behind {@link LkKernels#VECTOR}.
 *
 * <p>A row of the window is read in two groups of eight columns, for windows 9 to 16 pixels wide (radius 4 to 7;
 * 7 is the default); other widths take the scalar form ({@link #handles}). The lanes past the
 * window's last column read real, finite pixels (of the next row when the window touches the right border; the caller
 * keeps {@link LkKernels#reach} floats of the array past the window) and are zeroed by a mask before any sum, so they add nothing; the samples they write past a row's end are overwritten by the
 * next row or land in the window arrays' slack ({@link LkKernels#slack}). Each kernel is one loop over the rows with
 * the groups written out: C2 on Java 17 keeps vectors in registers across one loop's back edge, but boxes them
 * (allocates) across a nested loop's.
 *
 * <p>Every vector class of the tracker uses this one shape (256 bits): on Java 17 two shapes in one JVM pollute the
 * Vector API's type profiles and C2 boxes every vector (see {@link ScharrVector}).
 */
final class LkVectorKernels {
    private static final VectorSpecies<Float> S = FloatVector.SPECIES_256;
    /** Eight ones then eight zeros: the mask of the first r lanes is read from offset 8 - r. */
    private static final float[] MASK = {1, 1, 1, 1, 1, 1, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0};

    private LkVectorKernels() {}

    /** True when the machine's preferred vectors hold at least eight floats (otherwise eight lanes would be emulated). */
    static boolean usable() {
        return FloatVector.SPECIES_PREFERRED.length() >= LkKernels.LANES && S.length() == LkKernels.LANES;
    }

    /** Whether these kernels take a window {@code width} pixels wide: two groups of eight columns (radius 4..7). */
    static boolean handles(int width) {
        return width >= 9 && width <= 16;
    }

    /** ((a0 p00 + a1 p01) + a2 p11) + a3 p10 for eight columns from {@code o}, the weights broadcast. */
    private static FloatVector sample(float[] p, int o, int stride, FloatVector a0, FloatVector a1, FloatVector a2, FloatVector a3) {
        return FloatVector.fromArray(S, p, o).mul(a0).add(FloatVector.fromArray(S, p, o + 1).mul(a1))
                .add(FloatVector.fromArray(S, p, o + stride + 1).mul(a2)).add(FloatVector.fromArray(S, p, o + stride).mul(a3));
    }

    /**
     * See {@link LkKernels#describe}; {@link #handles} the width. The images are sampled by one loop, then the sums
     * taken, rather than all in one loop body: C2 stops inlining the Vector API's calls in a method that large, and
     * then boxes every vector (measured: tens of kB allocated per call and slower than the scalar form).
     */
    static void describe(float[] pi, float[] px, float[] py, int index0, int stride, int width,
                         float a0, float a1, float a2, float a3, float[] t, float[] tx, float[] ty, float[] acc, float[] g) {
        FloatVector w0 = FloatVector.broadcast(S, a0), w1 = FloatVector.broadcast(S, a1), w2 = FloatVector.broadcast(S, a2),
                w3 = FloatVector.broadcast(S, a3);
        // the three images one after the other, through one copy of the sampling loop (rows written in order, so a
        // row's spill past its end is overwritten by the next row)
        for (int image = 0; image < 3; image++) {
            float[] p = image == 0 ? pi : image == 1 ? px : py, out = image == 0 ? t : image == 1 ? tx : ty;
            for (int i = 0, k = 0, o = index0; i < width; i++, k += width, o += stride) {
                sample(p, o, stride, w0, w1, w2, w3).intoArray(out, k);
                sample(p, o + 8, stride, w0, w1, w2, w3).intoArray(out, k + 8);
            }
        }
        FloatVector sxx = FloatVector.zero(S), syy = sxx, sxy = sxx;
        FloatVector m = FloatVector.fromArray(S, MASK, 16 - width);
        for (int k = 0, n = width * width; k < n; k += width) {
            FloatVector gx = FloatVector.fromArray(S, tx, k), gy = FloatVector.fromArray(S, ty, k);
            sxx = sxx.add(gx.mul(gx));
            syy = syy.add(gy.mul(gy));
            sxy = sxy.add(gx.mul(gy));
            // second group: columns 8..15, the lanes past the row masked
            FloatVector hx = FloatVector.fromArray(S, tx, k + 8).mul(m), hy = FloatVector.fromArray(S, ty, k + 8).mul(m);
            sxx = sxx.add(hx.mul(hx));
            syy = syy.add(hy.mul(hy));
            sxy = sxy.add(hx.mul(hy));
        }
        sxx.intoArray(acc, 0);
        syy.intoArray(acc, 8);
        sxy.intoArray(acc, 16);
        g[0] = LkKernels.reduce(acc, 0);
        g[1] = LkKernels.reduce(acc, 8);
        g[2] = LkKernels.reduce(acc, 16);
    }

    /** See {@link LkKernels#trackSums}; {@link #handles} the width. */
    static void trackSums(float[] p, int index0, int stride, int width, float a0, float a1, float a2, float a3,
                          float[] t, float[] tx, float[] ty, float[] acc, float[] out) {
        FloatVector ex = FloatVector.zero(S), ey = ex, ab = ex;
        FloatVector w0 = FloatVector.broadcast(S, a0), w1 = FloatVector.broadcast(S, a1), w2 = FloatVector.broadcast(S, a2),
                w3 = FloatVector.broadcast(S, a3);
        FloatVector m = FloatVector.fromArray(S, MASK, 16 - width);
        for (int i = 0, k = 0, o = index0; i < width; i++, k += width, o += stride) {
            FloatVector e = FloatVector.fromArray(S, t, k).sub(sample(p, o, stride, w0, w1, w2, w3));
            ex = ex.add(e.mul(FloatVector.fromArray(S, tx, k)));
            ey = ey.add(e.mul(FloatVector.fromArray(S, ty, k)));
            ab = ab.add(e.abs());
            // second group: columns 8..15, the lanes past the row masked
            FloatVector f = FloatVector.fromArray(S, t, k + 8).sub(sample(p, o + 8, stride, w0, w1, w2, w3)).mul(m);
            ex = ex.add(f.mul(FloatVector.fromArray(S, tx, k + 8)));
            ey = ey.add(f.mul(FloatVector.fromArray(S, ty, k + 8)));
            ab = ab.add(f.abs());
        }
        ex.intoArray(acc, 0);
        ey.intoArray(acc, 8);
        ab.intoArray(acc, 16);
        out[0] = LkKernels.reduce(acc, 0);
        out[1] = LkKernels.reduce(acc, 8);
        out[2] = LkKernels.reduce(acc, 16);
    }
}
