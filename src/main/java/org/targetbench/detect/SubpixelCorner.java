package org.targetbench.detect;

import boofcv.struct.image.GrayF32;

/**
 * Sub-pixel corner refinement by gradient orthogonality (Förstner &amp; Gülch 1987 [1]; the method of OpenCV's
 * cornerSubPix): at the true corner q every image gradient g_i in the window is orthogonal to p_i - q, so q solves
 * <pre>
 *   (Σ w_i g_i g_iᵀ) q = Σ w_i g_i g_iᵀ p_i                                   (1)
 * </pre>
 * with Gaussian weights w_i (σ = radius / 2). The window is re-centred and (1) solved again until q moves less than
 * {@value #CONVERGED_PX} px or {@value #MAX_ITERATIONS} times. Works for L-corners and x-corners alike.
 *
 * <p>Caveat: a result that strays farther than the window radius from the start, or an ill-conditioned system (a
 * straight edge), returns the start unchanged.
 *
 * <p>Reference: [1] W. Förstner, E. Gülch, "A fast operator for detection and precise location of distinct points,
 * corners and centres of circular features", ISPRS Intercommission Workshop, Interlaken, 1987.
 */
final class SubpixelCorner {
    static final double CONVERGED_PX = 0.01;
    static final int MAX_ITERATIONS = 10;
    /** Smallest det/trace² of the system matrix accepted (a straight edge gives 0). */
    static final double MIN_CONDITION = 1e-4;

    private SubpixelCorner() {}

    /** Refined {x, y} of the corner near (x0, y0), given Sobel gradients dx, dy of the frame. */
    static double[] refine(GrayF32 dx, GrayF32 dy, double x0, double y0, int radius) {
        double qx = x0, qy = y0;
        double s2 = 2 * Math.pow(radius / 2.0, 2);
        for (int it = 0; it < MAX_ITERATIONS; it++) {
            int cx = (int) Math.round(qx), cy = (int) Math.round(qy);
            double a = 0, b = 0, c = 0, r1 = 0, r2 = 0;
            for (int j = -radius; j <= radius; j++) {
                int py = cy + j;
                if (py < 0 || py >= dx.height) continue;
                for (int i = -radius; i <= radius; i++) {
                    int px = cx + i;
                    if (px < 0 || px >= dx.width) continue;
                    double gx = dx.unsafe_get(px, py), gy = dy.unsafe_get(px, py);
                    double w = Math.exp(-(i * i + j * j) / s2);
                    double gxx = w * gx * gx, gxy = w * gx * gy, gyy = w * gy * gy;
                    a += gxx; b += gxy; c += gyy;
                    r1 += gxx * px + gxy * py;
                    r2 += gxy * px + gyy * py;
                }
            }
            double det = a * c - b * b, tr = a + c;
            if (!(tr > 0) || det < MIN_CONDITION * tr * tr) return new double[]{x0, y0};
            double nx = (c * r1 - b * r2) / det, ny = (a * r2 - b * r1) / det;
            double shift = Math.hypot(nx - qx, ny - qy);
            qx = nx;
            qy = ny;
            if (Math.hypot(qx - x0, qy - y0) > radius) return new double[]{x0, y0};
            if (shift < CONVERGED_PX) break;
        }
        return new double[]{qx, qy};
    }
}
