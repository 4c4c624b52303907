package org.targetbench.perturb;

import boofcv.struct.image.GrayF32;

/**
 * What baseline JPEG compression does to a grey image, without the (lossless) entropy coding: 8 x 8 blocks, level
 * shift by 128, forward DCT-II, quantisation by the quality-scaled luminance table, dequantisation, inverse DCT, level
 * shift back, rounding and clipping to 0..255 (ITU-T T.81 | ISO/IEC 10918-1, 1992 [1], sec. A.3 and Annex K.1).
 * Quality scaling follows the Independent JPEG Group's libjpeg (jcparam.c [2]): s = 5000 / q for q &lt; 50,
 * s = 200 - 2 q otherwise; entry = clamp((base s + 50) / 100, 1, 255).
 *
 * <p>Caveats: the DCT is exact floating point where libjpeg uses integer approximations, so results differ from a
 * real encoder by about a grey level; edge blocks are padded by replicating the last row and column, as libjpeg does.
 *
 * <p>References: [1] ITU-T Recommendation T.81, 1992. [2] Independent JPEG Group, libjpeg 9, jcparam.c,
 * jpeg_quality_scaling.
 */
public final class JpegSimulation {
    /** ITU-T T.81 Annex K, Table K.1: luminance quantisation table, row major. */
    static final int[] LUMINANCE = {
            16, 11, 10, 16, 24, 40, 51, 61,
            12, 12, 14, 19, 26, 58, 60, 55,
            14, 13, 16, 24, 40, 57, 69, 56,
            14, 17, 22, 29, 51, 87, 80, 62,
            18, 22, 37, 56, 68, 109, 103, 77,
            24, 35, 55, 64, 81, 104, 113, 92,
            49, 64, 78, 87, 103, 121, 120, 101,
            72, 92, 95, 98, 112, 100, 103, 99};
    private static final double[][] COS = new double[8][8];

    static {
        for (int x = 0; x < 8; x++)
            for (int u = 0; u < 8; u++) COS[x][u] = Math.cos((2 * x + 1) * u * Math.PI / 16);
    }

    private JpegSimulation() {}

    /** Quantisation table for an IJG quality factor 1..100. */
    public static int[] table(int quality) {
        if (quality < 1 || quality > 100) throw new IllegalArgumentException("JPEG quality must be 1..100, got " + quality);
        int s = quality < 50 ? 5000 / quality : 200 - 2 * quality;
        int[] t = new int[64];
        for (int i = 0; i < 64; i++) t[i] = Math.max(1, Math.min(255, (LUMINANCE[i] * s + 50) / 100));
        return t;
    }

    /** The image as it comes out of a JPEG round trip at {@code quality}. */
    public static GrayF32 apply(GrayF32 in, int quality) {
        int[] q = table(quality);
        GrayF32 out = new GrayF32(in.width, in.height);
        double[] block = new double[64], coef = new double[64];
        for (int by = 0; by < in.height; by += 8)
            for (int bx = 0; bx < in.width; bx += 8) {
                for (int y = 0; y < 8; y++)
                    for (int x = 0; x < 8; x++) {
                        int sx = Math.min(in.width - 1, bx + x), sy = Math.min(in.height - 1, by + y);
                        block[y * 8 + x] = Math.max(0, Math.min(255, Math.rint(in.unsafe_get(sx, sy)))) - 128;
                    }
                forward(block, coef);
                for (int i = 0; i < 64; i++) coef[i] = Math.rint(coef[i] / q[i]) * q[i];
                inverse(coef, block);
                for (int y = 0; y < 8 && by + y < in.height; y++)
                    for (int x = 0; x < 8 && bx + x < in.width; x++)
                        out.unsafe_set(bx + x, by + y, (float) Math.max(0, Math.min(255, Math.rint(block[y * 8 + x] + 128))));
            }
        return out;
    }

    /**
     * F(u,v) = 1/4 C(u) C(v) Σ f(x,y) cos((2x+1)uπ/16) cos((2y+1)vπ/16), T.81 eq. A.3.3, computed separably
     * (rows, then columns).
     */
    static void forward(double[] f, double[] out) {
        double[] tmp = new double[64];
        for (int y = 0; y < 8; y++)
            for (int u = 0; u < 8; u++) {
                double s = 0;
                for (int x = 0; x < 8; x++) s += f[y * 8 + x] * COS[x][u];
                tmp[y * 8 + u] = s;
            }
        for (int v = 0; v < 8; v++)
            for (int u = 0; u < 8; u++) {
                double s = 0;
                for (int y = 0; y < 8; y++) s += tmp[y * 8 + u] * COS[y][v];
                out[v * 8 + u] = 0.25 * c(u) * c(v) * s;
            }
    }

    /** f(x,y) = 1/4 Σ C(u) C(v) F(u,v) cos((2x+1)uπ/16) cos((2y+1)vπ/16), T.81 eq. A.3.3, computed separably. */
    static void inverse(double[] coef, double[] out) {
        double[] tmp = new double[64];
        for (int v = 0; v < 8; v++)
            for (int x = 0; x < 8; x++) {
                double s = 0;
                for (int u = 0; u < 8; u++) s += c(u) * coef[v * 8 + u] * COS[x][u];
                tmp[v * 8 + x] = s;
            }
        for (int y = 0; y < 8; y++)
            for (int x = 0; x < 8; x++) {
                double s = 0;
                for (int v = 0; v < 8; v++) s += c(v) * tmp[v * 8 + x] * COS[y][v];
                out[y * 8 + x] = 0.25 * s;
            }
    }

    private static double c(int k) { return k == 0 ? 1 / Math.sqrt(2) : 1; }
}
