package org.targetbench.track;

import org.targetbench.Simd;

/**
 * The two per-window kernels of {@link TranslationLk} in their scalar form, and the switch to their vector twins
 * ({@link LkVectorKernels}).
 *
 * <p>Both sum over a (2r+1) x (2r+1) window in {@value #LANES} interleaved partial sums: column j of every row goes to
 * partial sum j mod {@value #LANES}, rows in order, and the partial sums are added in one fixed tree at the end
 * ({@link #reduce}). That is the order in which {@link LkVectorKernels} sums with {@value #LANES} float lanes, so both
 * give bit-identical results; the order is fixed by this class, never by the machine's vector length (derived: float
 * addition is not associative, so a sum's order is part of its output).
 *
 * <p>Sampling: one set of four bilinear weights (a0..a3 for the top-left, top-right, bottom-right and bottom-left
 * neighbour) for the whole window, since a translation shifts every window pixel by the same fraction; each sample is
 * ((a0 p00 + a1 p01) + a2 p11) + a3 p10, the same expression, in the same order, in both forms.
 */
final class LkKernels {
    /** Interleaved partial sums per quantity (the vector form's lane count). */
    static final int LANES = 8;
    /** Whether the vector twins run: the vector module present and vectors of at least {@value #LANES} floats. */
    static final boolean VECTOR = Simd.ENABLED && LkVectorKernels.usable();

    private LkKernels() {}

    /** Extra floats a window array needs after its last pixel: the vector form reads and writes whole lane groups. */
    static int slack() {
        return LANES;
    }

    /**
     * Floats the vector form reads past the window's bottom-right sample ({@code index0 + width * stride} is the
     * first index below the window's last row): the caller takes the vector-switched kernels only when the image's
     * array holds {@code index0 + width * stride + reach(width)} floats; lanes past a row's end read the next row's
     * (finite) pixels and are masked.
     */
    static int reach(int width) {
        return ((width + LANES - 1) / LANES) * LANES;
    }

    /**
     * Samples the image and both gradient images at the window (top-left pixel {@code index0}, row stride
     * {@code stride}, the three images sharing their layout) into t, tx and ty (row-major, row length {@code width})
     * and returns the sums Σ tx², Σ ty², Σ tx ty in {@code g[0..2]}. {@code acc}: 3 x {@value #LANES} scratch.
     */
    static void describe(float[] pi, float[] px, float[] py, int index0, int stride, int width,
                         float a0, float a1, float a2, float a3, float[] t, float[] tx, float[] ty, float[] acc, float[] g) {
        if (VECTOR && LkVectorKernels.handles(width)) {
            LkVectorKernels.describe(pi, px, py, index0, stride, width, a0, a1, a2, a3, t, tx, ty, acc, g);
            return;
        }
        describeScalar(pi, px, py, index0, stride, width, a0, a1, a2, a3, t, tx, ty, acc, g);
    }

    /**
     * The scalar twin of {@link LkVectorKernels#describe}: partial sum l takes columns l, l + 8, ... of every row, in
     * row order, the order of lane l; it is kept in locals, one partial sum after the other.
     */
    static void describeScalar(float[] pi, float[] px, float[] py, int index0, int stride, int width,
                               float a0, float a1, float a2, float a3, float[] t, float[] tx, float[] ty, float[] acc, float[] g) {
        for (int l = 0; l < LANES; l++) {
            float sxx = 0, syy = 0, sxy = 0;
            for (int i = 0; i < width; i++) {
                int index = index0 + i * stride, k = i * width;
                for (int j = l; j < width; j += LANES) {
                    int o = index + j, d = o + stride;
                    t[k + j] = a0 * pi[o] + a1 * pi[o + 1] + a2 * pi[d + 1] + a3 * pi[d];
                    float gx = a0 * px[o] + a1 * px[o + 1] + a2 * px[d + 1] + a3 * px[d];
                    float gy = a0 * py[o] + a1 * py[o + 1] + a2 * py[d + 1] + a3 * py[d];
                    tx[k + j] = gx;
                    ty[k + j] = gy;
                    sxx += gx * gx;
                    syy += gy * gy;
                    sxy += gx * gy;
                }
            }
            acc[l] = sxx;
            acc[LANES + l] = syy;
            acc[2 * LANES + l] = sxy;
        }
        g[0] = reduce(acc, 0);
        g[1] = reduce(acc, LANES);
        g[2] = reduce(acc, 2 * LANES);
    }

    /**
     * One Gauss-Newton iteration's sums of (1) in {@link TranslationLk}: samples the image at the window (top-left
     * pixel {@code index0}) and returns Σ (T - I) T_x, Σ (T - I) T_y and Σ |T - I| in {@code out[0..2]}.
     * {@code acc}: 3 x {@value #LANES} scratch.
     */
    static void trackSums(float[] p, int index0, int stride, int width, float a0, float a1, float a2, float a3,
                          float[] t, float[] tx, float[] ty, float[] acc, float[] out) {
        if (VECTOR && LkVectorKernels.handles(width)) {
            LkVectorKernels.trackSums(p, index0, stride, width, a0, a1, a2, a3, t, tx, ty, acc, out);
            return;
        }
        trackSumsScalar(p, index0, stride, width, a0, a1, a2, a3, t, tx, ty, acc, out);
    }

    /** The scalar twin of {@link LkVectorKernels#trackSums}, in the order of {@link #describeScalar}. */
    static void trackSumsScalar(float[] p, int index0, int stride, int width, float a0, float a1, float a2, float a3,
                                float[] t, float[] tx, float[] ty, float[] acc, float[] out) {
        for (int l = 0; l < LANES; l++) {
            float ex = 0, ey = 0, ab = 0;
            for (int i = 0; i < width; i++) {
                int index = index0 + i * stride, k = i * width;
                for (int j = l; j < width; j += LANES) {
                    int o = index + j;
                    float v = a0 * p[o] + a1 * p[o + 1] + a2 * p[o + stride + 1] + a3 * p[o + stride];
                    float d = t[k + j] - v;
                    ex += d * tx[k + j];
                    ey += d * ty[k + j];
                    ab += Math.abs(d);
                }
            }
            acc[l] = ex;
            acc[LANES + l] = ey;
            acc[2 * LANES + l] = ab;
        }
        out[0] = reduce(acc, 0);
        out[1] = reduce(acc, LANES);
        out[2] = reduce(acc, 2 * LANES);
    }

    /** The fixed addition tree over {@value #LANES} partial sums from {@code off}. */
    static float reduce(float[] a, int off) {
        return ((a[off] + a[off + 1]) + (a[off + 2] + a[off + 3])) + ((a[off + 4] + a[off + 5]) + (a[off + 6] + a[off + 7]));
    }
}
