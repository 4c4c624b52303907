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
    /** Floats of the scratch ({@code acc}) the kernels take: partial sums, then one row's terms for the scalar route. */
    static final int SCRATCH = 3 * LANES + 3 * 16;
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
     * and returns the sums Σ tx², Σ ty², Σ tx ty in {@code g[0..2]}. {@code acc}: {@value #SCRATCH} floats of scratch.
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
        if (width >= 9 && width <= 16 && acc.length >= SCRATCH) {
            // as trackSumsScalar: each row's terms into scratch (zero past the row's end), column l before l + 8
            java.util.Arrays.fill(acc, 3 * LANES, SCRATCH, 0f);
            float xx0 = 0, yy0 = 0, xy0 = 0, xx1 = 0, yy1 = 0, xy1 = 0, xx2 = 0, yy2 = 0, xy2 = 0, xx3 = 0, yy3 = 0, xy3 = 0, xx4 = 0, yy4 = 0, xy4 = 0, xx5 = 0, yy5 = 0, xy5 = 0, xx6 = 0, yy6 = 0, xy6 = 0, xx7 = 0, yy7 = 0, xy7 = 0;
            for (int i = 0; i < width; i++) {
                int index = index0 + i * stride, k = i * width;
                for (int j = 0; j < width; j++) {
                    int o = index + j, d = o + stride;
                    t[k + j] = a0 * pi[o] + a1 * pi[o + 1] + a2 * pi[d + 1] + a3 * pi[d];
                    float gx = a0 * px[o] + a1 * px[o + 1] + a2 * px[d + 1] + a3 * px[d];
                    float gy = a0 * py[o] + a1 * py[o + 1] + a2 * py[d + 1] + a3 * py[d];
                    tx[k + j] = gx;
                    ty[k + j] = gy;
                    acc[24 + j] = gx * gx;
                    acc[40 + j] = gy * gy;
                    acc[56 + j] = gx * gy;
                }
                xx0 += acc[24]; xx0 += acc[32]; yy0 += acc[40]; yy0 += acc[48]; xy0 += acc[56]; xy0 += acc[64];
                xx1 += acc[25]; xx1 += acc[33]; yy1 += acc[41]; yy1 += acc[49]; xy1 += acc[57]; xy1 += acc[65];
                xx2 += acc[26]; xx2 += acc[34]; yy2 += acc[42]; yy2 += acc[50]; xy2 += acc[58]; xy2 += acc[66];
                xx3 += acc[27]; xx3 += acc[35]; yy3 += acc[43]; yy3 += acc[51]; xy3 += acc[59]; xy3 += acc[67];
                xx4 += acc[28]; xx4 += acc[36]; yy4 += acc[44]; yy4 += acc[52]; xy4 += acc[60]; xy4 += acc[68];
                xx5 += acc[29]; xx5 += acc[37]; yy5 += acc[45]; yy5 += acc[53]; xy5 += acc[61]; xy5 += acc[69];
                xx6 += acc[30]; xx6 += acc[38]; yy6 += acc[46]; yy6 += acc[54]; xy6 += acc[62]; xy6 += acc[70];
                xx7 += acc[31]; xx7 += acc[39]; yy7 += acc[47]; yy7 += acc[55]; xy7 += acc[63]; xy7 += acc[71];
            }
            acc[0] = xx0; acc[1] = xx1; acc[2] = xx2; acc[3] = xx3; acc[4] = xx4; acc[5] = xx5; acc[6] = xx6; acc[7] = xx7;
            acc[8] = yy0; acc[9] = yy1; acc[10] = yy2; acc[11] = yy3; acc[12] = yy4; acc[13] = yy5; acc[14] = yy6; acc[15] = yy7;
            acc[16] = xy0; acc[17] = xy1; acc[18] = xy2; acc[19] = xy3; acc[20] = xy4; acc[21] = xy5; acc[22] = xy6; acc[23] = xy7;
            g[0] = reduce(acc, 0);
            g[1] = reduce(acc, LANES);
            g[2] = reduce(acc, 2 * LANES);
            return;
        }
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
     * {@code acc}: {@value #SCRATCH} floats of scratch.
     */
    static void trackSums(float[] p, int index0, int stride, int width, float a0, float a1, float a2, float a3,
                          float[] t, float[] tx, float[] ty, float[] acc, float[] out) {
        if (VECTOR && LkVectorKernels.handles(width)) {
            LkVectorKernels.trackSums(p, index0, stride, width, a0, a1, a2, a3, t, tx, ty, acc, out);
            return;
        }
        trackSumsScalar(p, index0, stride, width, a0, a1, a2, a3, t, tx, ty, acc, out);
    }

    /**
     * The scalar twin of {@link LkVectorKernels#trackSums}, in the order of {@link #describeScalar}. Windows 9 to 16
     * pixels wide (the default 15) take a faster route: each row's terms into scratch (zero past the row's end), then
     * into eight partial sums per quantity, column l before column l + 8, the order of lane l.
     */
    static void trackSumsScalar(float[] p, int index0, int stride, int width, float a0, float a1, float a2, float a3,
                                float[] t, float[] tx, float[] ty, float[] acc, float[] out) {
        if (width >= 9 && width <= 16 && acc.length >= SCRATCH) {
            java.util.Arrays.fill(acc, 3 * LANES, SCRATCH, 0f);
            float e0 = 0, f0 = 0, g0 = 0, e1 = 0, f1 = 0, g1 = 0, e2 = 0, f2 = 0, g2 = 0, e3 = 0, f3 = 0, g3 = 0, e4 = 0, f4 = 0, g4 = 0, e5 = 0, f5 = 0, g5 = 0, e6 = 0, f6 = 0, g6 = 0, e7 = 0, f7 = 0, g7 = 0;
            for (int i = 0; i < width; i++) {
                int index = index0 + i * stride, k = i * width;
                float pXY = p[index], pXy = p[index + stride];
                for (int j = 0; j < width; j++, index++) {
                    float pxY = p[index + 1], pxy = p[index + stride + 1];
                    float d = t[k + j] - (a0 * pXY + a1 * pxY + a2 * pxy + a3 * pXy);
                    acc[24 + j] = d * tx[k + j];
                    acc[40 + j] = d * ty[k + j];
                    acc[56 + j] = Math.abs(d);
                    pXY = pxY;
                    pXy = pxy;
                }
                e0 += acc[24]; e0 += acc[32]; f0 += acc[40]; f0 += acc[48]; g0 += acc[56]; g0 += acc[64];
                e1 += acc[25]; e1 += acc[33]; f1 += acc[41]; f1 += acc[49]; g1 += acc[57]; g1 += acc[65];
                e2 += acc[26]; e2 += acc[34]; f2 += acc[42]; f2 += acc[50]; g2 += acc[58]; g2 += acc[66];
                e3 += acc[27]; e3 += acc[35]; f3 += acc[43]; f3 += acc[51]; g3 += acc[59]; g3 += acc[67];
                e4 += acc[28]; e4 += acc[36]; f4 += acc[44]; f4 += acc[52]; g4 += acc[60]; g4 += acc[68];
                e5 += acc[29]; e5 += acc[37]; f5 += acc[45]; f5 += acc[53]; g5 += acc[61]; g5 += acc[69];
                e6 += acc[30]; e6 += acc[38]; f6 += acc[46]; f6 += acc[54]; g6 += acc[62]; g6 += acc[70];
                e7 += acc[31]; e7 += acc[39]; f7 += acc[47]; f7 += acc[55]; g7 += acc[63]; g7 += acc[71];
            }
            acc[0] = e0; acc[1] = e1; acc[2] = e2; acc[3] = e3; acc[4] = e4; acc[5] = e5; acc[6] = e6; acc[7] = e7;
            acc[8] = f0; acc[9] = f1; acc[10] = f2; acc[11] = f3; acc[12] = f4; acc[13] = f5; acc[14] = f6; acc[15] = f7;
            acc[16] = g0; acc[17] = g1; acc[18] = g2; acc[19] = g3; acc[20] = g4; acc[21] = g5; acc[22] = g6; acc[23] = g7;
            out[0] = reduce(acc, 0);
            out[1] = reduce(acc, LANES);
            out[2] = reduce(acc, 2 * LANES);
            return;
        }
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
