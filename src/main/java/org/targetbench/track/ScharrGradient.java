package org.targetbench.track;

import boofcv.struct.image.GrayF32;
import org.targetbench.Simd;

/**
 * Image gradient in grey levels per pixel with Scharr's 3 x 3 derivative kernel, normalised:
 * ∂I/∂x ≈ ([3 10 3]ᵀ / 16) ⊗ ([-1 0 1] / 2) and the transpose for ∂I/∂y (Scharr 2000 [1]; the kernel OpenCV's pyramidal
 * Lucas-Kanade uses, there unnormalised). The scale matters: the Gauss-Newton step of Lucas-Kanade is divided by the
 * gradient's scale, so an unnormalised kernel (BoofCV's float Sobel is twice the true derivative) halves every step
 * and needs several times the iterations to converge. Pixels outside the image repeat the nearest border pixel.
 *
 * <p>[1] H. Scharr, "Optimale Operatoren in der digitalen Bildverarbeitung", PhD thesis, Universität Heidelberg, 2000.
 */
final class ScharrGradient {
    private static final float SIDE = 3f / 32f, CENTRE = 10f / 32f;
    /** Whether the interior of each row runs through {@link ScharrVector} (identical output, checked by a test). */
    static final boolean VECTOR = Simd.ENABLED;

    private ScharrGradient() {}

    static void compute(GrayF32 in, GrayF32 dx, GrayF32 dy) {
        compute(in, dx, dy, VECTOR);
    }

    /** {@link #compute(GrayF32, GrayF32, GrayF32)} with the vector form on or off (for the equality test). */
    static void compute(GrayF32 in, GrayF32 dx, GrayF32 dy, boolean vector) {
        int w = in.width, h = in.height;
        dx.reshape(w, h);
        dy.reshape(w, h);
        float[] d = in.data;
        float[] ox = dx.data, oy = dy.data;
        int x0 = 1;
        if (vector) {
            // the interior in whole vectors, then the scalar loop finishes each row from x0
            ScharrVector.interior(d, in.startIndex, in.stride, w, h, ox, dx.startIndex, dx.stride, oy, dy.startIndex, dy.stride, SIDE, CENTRE);
            x0 = ScharrVector.end(w);
        }
        for (int y = 0; y < h; y++) {
            int rowU = in.startIndex + Math.max(0, y - 1) * in.stride;
            int row = in.startIndex + y * in.stride;
            int rowD = in.startIndex + Math.min(h - 1, y + 1) * in.stride;
            int ix = dx.startIndex + y * dx.stride, iy = dy.startIndex + y * dy.stride;
            // interior columns without border tests (the hot loop), then the two border columns
            for (int x = x0; x < w - 1; x++) {
                float ul = d[rowU + x - 1], ur = d[rowU + x + 1], dl = d[rowD + x - 1], dr = d[rowD + x + 1];
                ox[ix + x] = SIDE * (ur - ul + dr - dl) + CENTRE * (d[row + x + 1] - d[row + x - 1]);
                oy[iy + x] = SIDE * (dl - ul + dr - ur) + CENTRE * (d[rowD + x] - d[rowU + x]);
            }
            edge(d, ox, oy, 0, w, rowU, row, rowD, ix, iy);
            if (w > 1) edge(d, ox, oy, w - 1, w, rowU, row, rowD, ix, iy);
        }
    }

    /** One border column, where the neighbour outside the image repeats the border pixel. */
    private static void edge(float[] d, float[] ox, float[] oy, int x, int w, int rowU, int row, int rowD, int ix, int iy) {
        int xl = Math.max(0, x - 1), xr = Math.min(w - 1, x + 1);
        ox[ix + x] = SIDE * (d[rowU + xr] - d[rowU + xl] + d[rowD + xr] - d[rowD + xl]) + CENTRE * (d[row + xr] - d[row + xl]);
        oy[iy + x] = SIDE * (d[rowD + xl] - d[rowU + xl] + d[rowD + xr] - d[rowU + xr]) + CENTRE * (d[rowD + x] - d[rowU + x]);
    }
}
