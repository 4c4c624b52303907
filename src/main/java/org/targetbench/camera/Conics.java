package org.targetbench.camera;

import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

import java.util.Optional;

/**
 * Conics in the image plane: the image of a circle under a plane-to-image homography, a conic's centre, and the
 * direct least-squares ellipse fit.
 *
 * <p>A conic is given by its six coefficients {a, b, c, d, e, f} of a x² + b xy + c y² + d x + e y + f = 0, or as
 * the symmetric matrix C = [[a, b/2, d/2], [b/2, c, e/2], [d/2, e/2, f]] with xᵀ C x = 0 for homogeneous x.
 *
 * <ul>
 *   <li>Image of a conic: a point conic C on a plane maps under x' ~ H x to C' = H⁻ᵀ C H⁻¹ [1, sec. 2.2.3, result
 *       2.13].</li>
 *   <li>Centre: the pole of the line at infinity, solving [[a, b/2], [b/2, c]] (x, y)ᵀ = -(d/2, e/2)ᵀ [1, sec. 2.8.1,
 *       derived from the pole-polar relation].</li>
 *   <li>Ellipse fit: the direct least-squares fit of Fitzgibbon, Pilu &amp; Fisher [2], minimising the algebraic
 *       distance subject to 4ac - b² = 1, in the numerically stable form of Halíř &amp; Flusser [3] (eqs. 11-18 there),
 *       on coordinates centred and scaled to unit mean distance first.</li>
 * </ul>
 *
 * <p>References: [1] R. Hartley, A. Zisserman, Multiple View Geometry in Computer Vision, 2nd ed., 2004.
 * [2] A. Fitzgibbon, M. Pilu, R. Fisher, "Direct least square fitting of ellipses", IEEE TPAMI 21(5), 1999.
 * [3] R. Halíř, J. Flusser, "Numerically stable direct least squares fitting of ellipses", WSCG 1998.
 */
public final class Conics {
    private Conics() {}

    /** Point conic of the circle of radius r about (cx, cy): (x - cx)² + (y - cy)² - r² = 0. */
    public static double[] circle(double cx, double cy, double r) {
        return new double[]{1, 0, 1, -2 * cx, -2 * cy, cx * cx + cy * cy - r * r};
    }

    /** Image of a point conic under x' ~ H x: C' = H⁻ᵀ C H⁻¹ [1, result 2.13]. */
    public static double[] transform(double[] conic, Homography h) {
        return transform(conic, h.toArray());
    }

    /**
     * Image of a point conic under x' ~ H x for H given row major: C' = H⁻ᵀ C H⁻¹ [1, result 2.13]; NaNs for a
     * singular H.
     */
    public static double[] transform(double[] conic, double[] h) {
        double[] c = matrix(conic);
        double det = h[0] * (h[4] * h[8] - h[5] * h[7]) - h[1] * (h[3] * h[8] - h[5] * h[6]) + h[2] * (h[3] * h[7] - h[4] * h[6]);
        if (det == 0 || !Double.isFinite(det)) return new double[]{Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN};
        double[] hi = {
                (h[4] * h[8] - h[5] * h[7]) / det, (h[2] * h[7] - h[1] * h[8]) / det, (h[1] * h[5] - h[2] * h[4]) / det,
                (h[5] * h[6] - h[3] * h[8]) / det, (h[0] * h[8] - h[2] * h[6]) / det, (h[2] * h[3] - h[0] * h[5]) / det,
                (h[3] * h[7] - h[4] * h[6]) / det, (h[1] * h[6] - h[0] * h[7]) / det, (h[0] * h[4] - h[1] * h[3]) / det};
        double[] t = new double[9], out = new double[9];
        // t = C H⁻¹
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
                t[i * 3 + j] = c[i * 3] * hi[j] + c[i * 3 + 1] * hi[3 + j] + c[i * 3 + 2] * hi[6 + j];
        // out = H⁻ᵀ t
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
                out[i * 3 + j] = hi[i] * t[j] + hi[3 + i] * t[3 + j] + hi[6 + i] * t[6 + j];
        return coefficients(out);
    }

    /** Centre {x, y} of a central conic; NaNs for a parabola (4ac - b² = 0). */
    public static double[] centre(double[] q) {
        double a = q[0], b = q[1] / 2, c = q[2], d = q[3] / 2, e = q[4] / 2;
        double det = a * c - b * b;
        if (Math.abs(det) < 1e-300) return new double[]{Double.NaN, Double.NaN};
        return new double[]{(b * e - c * d) / det, (b * d - a * e) / det};
    }

    /** True when the conic is a real ellipse (4ac - b² &gt; 0 and a non-empty locus). */
    public static boolean isEllipse(double[] q) {
        if (4 * q[0] * q[2] - q[1] * q[1] <= 0) return false;
        double[] ax = semiAxes(q);
        return ax[0] > 0 && ax[1] > 0 && Double.isFinite(ax[0]);
    }

    /**
     * Semi-axes {major, minor} of an ellipse, pixels (or the conic's units): with the centre value
     * f₀ = q(centre) and the eigenvalues λ of [[a, b/2], [b/2, c]], the axes are sqrt(-f₀ / λ).
     */
    public static double[] semiAxes(double[] q) {
        double[] c0 = centre(q);
        double f0 = q[0] * c0[0] * c0[0] + q[1] * c0[0] * c0[1] + q[2] * c0[1] * c0[1] + q[3] * c0[0] + q[4] * c0[1] + q[5];
        double a = q[0], b = q[1] / 2, c = q[2];
        double m = (a + c) / 2, r = Math.sqrt(((a - c) / 2) * ((a - c) / 2) + b * b);
        double l1 = m + r, l2 = m - r;
        double s1 = Math.sqrt(-f0 / l1), s2 = Math.sqrt(-f0 / l2);
        return new double[]{Math.max(s1, s2), Math.min(s1, s2)};
    }

    /**
     * First-order (Sampson) distance of a point from a conic, |q(x)| / |∇q(x)|, in the point's units.
     */
    public static double distance(double[] q, double x, double y) {
        double v = q[0] * x * x + q[1] * x * y + q[2] * y * y + q[3] * x + q[4] * y + q[5];
        double gx = 2 * q[0] * x + q[1] * y + q[3], gy = q[1] * x + 2 * q[2] * y + q[4];
        double g = Math.hypot(gx, gy);
        return g == 0 ? Double.POSITIVE_INFINITY : Math.abs(v) / g;
    }

    /**
     * Direct least-squares ellipse through n ≥ 6 points [2, 3]; empty when the points are degenerate (collinear, too
     * few) or no ellipse solution exists.
     */
    public static Optional<double[]> fitEllipse(double[] xs, double[] ys, int n) {
        if (n < 6) return Optional.empty();
        double mx = 0, my = 0;
        for (int i = 0; i < n; i++) { mx += xs[i]; my += ys[i]; }
        mx /= n; my /= n;
        double s = 0;
        for (int i = 0; i < n; i++) s += Math.hypot(xs[i] - mx, ys[i] - my);
        s /= n;
        if (!(s > 0)) return Optional.empty();
        // scatter matrices S1 = D1ᵀD1, S2 = D1ᵀD2, S3 = D2ᵀD2 with D1 = [x², xy, y²], D2 = [x, y, 1]  ([3] eq. 11-13)
        double[] s1 = new double[9], s2 = new double[9], s3 = new double[9];
        double[] d1 = new double[3], d2 = new double[3];
        for (int i = 0; i < n; i++) {
            double x = (xs[i] - mx) / s, y = (ys[i] - my) / s;
            d1[0] = x * x; d1[1] = x * y; d1[2] = y * y;
            d2[0] = x; d2[1] = y; d2[2] = 1;
            for (int r = 0; r < 3; r++)
                for (int c = 0; c < 3; c++) {
                    s1[r * 3 + c] += d1[r] * d1[c];
                    s2[r * 3 + c] += d1[r] * d2[c];
                    s3[r * 3 + c] += d2[r] * d2[c];
                }
        }
        double[] s3i = invert3(s3);
        if (s3i == null) return Optional.empty();
        // T = -S3⁻¹ S2ᵀ ; M = S1 + S2 T  ([3] eq. 14-15)
        double[] tm = new double[9];
        for (int r = 0; r < 3; r++)
            for (int c = 0; c < 3; c++) {
                double v = 0;
                for (int k = 0; k < 3; k++) v += s3i[r * 3 + k] * s2[c * 3 + k];
                tm[r * 3 + c] = -v;
            }
        double[] m = new double[9];
        for (int r = 0; r < 3; r++)
            for (int c = 0; c < 3; c++) {
                double v = s1[r * 3 + c];
                for (int k = 0; k < 3; k++) v += s2[r * 3 + k] * tm[k * 3 + c];
                m[r * 3 + c] = v;
            }
        // premultiply by C1⁻¹ = [[0, 0, 1/2], [0, -1, 0], [1/2, 0, 0]]  ([3] eq. 16)
        double[] mm = {m[6] / 2, m[7] / 2, m[8] / 2, -m[3], -m[4], -m[5], m[0] / 2, m[1] / 2, m[2] / 2};
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(3, true);
        if (!eig.decompose(new DMatrixRMaj(3, 3, true, mm))) return Optional.empty();
        // the solution satisfies the ellipse constraint and has the only non-negative eigenvalue (Fitzgibbon et al. [2],
        // sec. 4); numerically, the largest eigenvalue among the eigenvectors with 4ac - b² > 0
        double[] a1 = null;
        double bestValue = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < eig.getNumberOfEigenvalues(); k++) {
            Complex_F64 ev = eig.getEigenvalue(k);
            DMatrixRMaj v = eig.getEigenVector(k);
            if (v == null || Math.abs(ev.imaginary) > 1e-12 * Math.max(1, Math.abs(ev.real))) continue;
            double cond = 4 * v.get(0) * v.get(2) - v.get(1) * v.get(1); // [3] eq. 17: the ellipse constraint
            if (cond > 0 && ev.real > bestValue) { bestValue = ev.real; a1 = new double[]{v.get(0), v.get(1), v.get(2)}; }
        }
        if (a1 == null) return Optional.empty();
        double[] a2 = new double[3];
        for (int r = 0; r < 3; r++) a2[r] = tm[r * 3] * a1[0] + tm[r * 3 + 1] * a1[1] + tm[r * 3 + 2] * a1[2];
        // undo the normalisation: x' = N x with N = [[1/s, 0, -mx/s], [0, 1/s, -my/s], [0, 0, 1]], C = Nᵀ C' N
        double[] cn = matrix(new double[]{a1[0], a1[1], a1[2], a2[0], a2[1], a2[2]});
        double[] nm = {1 / s, 0, -mx / s, 0, 1 / s, -my / s, 0, 0, 1};
        double[] t = new double[9], out = new double[9];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
                t[i * 3 + j] = cn[i * 3] * nm[j] + cn[i * 3 + 1] * nm[3 + j] + cn[i * 3 + 2] * nm[6 + j];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
                out[i * 3 + j] = nm[i] * t[j] + nm[3 + i] * t[3 + j] + nm[6 + i] * t[6 + j];
        double[] q = coefficients(out);
        for (double v : q) if (!Double.isFinite(v)) return Optional.empty();
        return isEllipse(q) ? Optional.of(q) : Optional.empty();
    }

    private static double[] matrix(double[] q) {
        return new double[]{q[0], q[1] / 2, q[3] / 2, q[1] / 2, q[2], q[4] / 2, q[3] / 2, q[4] / 2, q[5]};
    }

    private static double[] coefficients(double[] c) {
        return new double[]{c[0], c[1] + c[3], c[4], c[2] + c[6], c[5] + c[7], c[8]};
    }

    private static double[] invert3(double[] m) {
        double det = m[0] * (m[4] * m[8] - m[5] * m[7]) - m[1] * (m[3] * m[8] - m[5] * m[6]) + m[2] * (m[3] * m[7] - m[4] * m[6]);
        double scale = 0;
        for (double v : m) scale = Math.max(scale, Math.abs(v));
        if (!(Math.abs(det) > 1e-12 * scale * scale * scale)) return null;
        return new double[]{
                (m[4] * m[8] - m[5] * m[7]) / det, (m[2] * m[7] - m[1] * m[8]) / det, (m[1] * m[5] - m[2] * m[4]) / det,
                (m[5] * m[6] - m[3] * m[8]) / det, (m[0] * m[8] - m[2] * m[6]) / det, (m[2] * m[3] - m[0] * m[5]) / det,
                (m[3] * m[7] - m[4] * m[6]) / det, (m[1] * m[6] - m[0] * m[7]) / det, (m[0] * m[4] - m[1] * m[3]) / det};
    }
}
