package org.targetbench.detect;

import boofcv.struct.image.GrayF32;

/**
 * Sub-pixel saddle point of an x-corner by a quadric fit (Lucchese &amp; Mitra 2002 [1]): on the Gaussian-blurred
 * frame, I(x, y) ≈ a x² + b xy + c y² + d x + e y + f is fitted by least squares to the samples within the radius
 * about the current estimate, and the estimate moves to the quadric's stationary point, the solution of
 * <pre>
 *   [2a  b] [x]     [d]
 *   [ b 2c] [y] = - [e]                                                        (1)
 * </pre>
 * which must be a saddle (4ac - b² &lt; 0). The samples are taken by bilinear interpolation on a grid centred on the
 * estimate, and (1) is iterated until the step is below {@value #CONVERGED_PX} px: a blurred ideal x-junction (any
 * angle between its lines) is point-symmetric about its saddle, so a window centred there fits no linear term and the
 * fixed point is the saddle itself (derived).
 *
 * <p>The least-squares solution for a fixed grid is a constant 6 x N matrix, computed once per radius.
 *
 * <p>Reference: [1] L. Lucchese, S. K. Mitra, "Using saddle points for subpixel feature detection in camera
 * calibration targets", Asia-Pacific Conference on Circuits and Systems, 2002.
 */
final class SaddleRefinement {
    static final double CONVERGED_PX = 0.005;
    static final int MAX_ITERATIONS = 20;

    private final int radius;
    private final int[] gx, gy;
    /** Rows: d, e, a, b, c coefficients (f is not needed) as weights over the samples. */
    private final double[][] solve;

    SaddleRefinement(int radius) {
        this.radius = radius;
        int n = 0;
        for (int j = -radius; j <= radius; j++) for (int i = -radius; i <= radius; i++) if (i * i + j * j <= radius * radius) n++;
        gx = new int[n];
        gy = new int[n];
        n = 0;
        for (int j = -radius; j <= radius; j++) for (int i = -radius; i <= radius; i++) if (i * i + j * j <= radius * radius) { gx[n] = i; gy[n] = j; n++; }
        // normal equations (AᵀA) p = Aᵀ s with rows [x², xy, y², x, y, 1]
        double[][] ata = new double[6][6];
        double[][] rows = new double[n][];
        for (int k = 0; k < n; k++) {
            double x = gx[k], y = gy[k];
            rows[k] = new double[]{x * x, x * y, y * y, x, y, 1};
            for (int r = 0; r < 6; r++) for (int c = 0; c < 6; c++) ata[r][c] += rows[k][r] * rows[k][c];
        }
        double[][] inv = invert(ata);
        solve = new double[6][n];
        for (int r = 0; r < 6; r++)
            for (int k = 0; k < n; k++) {
                double v = 0;
                for (int c = 0; c < 6; c++) v += inv[r][c] * rows[k][c];
                solve[r][k] = v;
            }
    }

    /** The saddle near (x0, y0) in the blurred frame, or null when there is none within the radius. */
    double[] refine(GrayF32 blurred, double x0, double y0) {
        double qx = x0, qy = y0;
        double[] s = new double[gx.length];
        for (int it = 0; it < MAX_ITERATIONS; it++) {
            if (qx - radius < 0 || qy - radius < 0 || qx + radius > blurred.width - 1 || qy + radius > blurred.height - 1) return null;
            for (int k = 0; k < gx.length; k++) s[k] = bilinear(blurred, qx + gx[k], qy + gy[k]);
            double a = dot(solve[0], s), b = dot(solve[1], s), c = dot(solve[2], s), d = dot(solve[3], s), e = dot(solve[4], s);
            double det = 4 * a * c - b * b;
            if (!(det < 0)) return null; // not a saddle
            double dx = (-d * 2 * c + b * e) / det, dy = (-2 * a * e + b * d) / det;
            double step = Math.hypot(dx, dy);
            if (step > radius) dx *= radius / step; // keep each step within the window
            if (step > radius) dy *= radius / step;
            qx += dx;
            qy += dy;
            if (Math.hypot(qx - x0, qy - y0) > radius) return null;
            if (step < CONVERGED_PX) return new double[]{qx, qy};
        }
        return new double[]{qx, qy};
    }

    private static double dot(double[] a, double[] b) {
        double v = 0;
        for (int i = 0; i < a.length; i++) v += a[i] * b[i];
        return v;
    }

    private static double bilinear(GrayF32 img, double x, double y) {
        int x0 = (int) Math.floor(x), y0 = (int) Math.floor(y);
        int x1 = Math.min(x0 + 1, img.width - 1), y1 = Math.min(y0 + 1, img.height - 1);
        double fx = x - x0, fy = y - y0;
        double a = img.unsafe_get(x0, y0), b = img.unsafe_get(x1, y0), c = img.unsafe_get(x0, y1), d = img.unsafe_get(x1, y1);
        return (a * (1 - fx) + b * fx) * (1 - fy) + (c * (1 - fx) + d * fx) * fy;
    }

    private static double[][] invert(double[][] m) {
        int n = m.length;
        double[][] a = new double[n][2 * n];
        for (int i = 0; i < n; i++) { System.arraycopy(m[i], 0, a[i], 0, n); a[i][n + i] = 1; }
        for (int c = 0; c < n; c++) {
            int p = c;
            for (int r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
            double[] t = a[c]; a[c] = a[p]; a[p] = t;
            double v = a[c][c];
            for (int j = 0; j < 2 * n; j++) a[c][j] /= v;
            for (int r = 0; r < n; r++) {
                if (r == c) continue;
                double f = a[r][c];
                for (int j = 0; j < 2 * n; j++) a[r][j] -= f * a[c][j];
            }
        }
        double[][] out = new double[n][n];
        for (int i = 0; i < n; i++) System.arraycopy(a[i], n, out[i], 0, n);
        return out;
    }
}
