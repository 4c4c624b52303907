package org.targetbench.camera;

import java.util.Arrays;

/**
 * A plane-to-plane projective map x' ~ H (x, y, 1)ᵀ between two images of the same plane, in the pixel-centre
 * convention of {@link CameraModel}. Immutable.
 *
 * <p>Reference: Hartley &amp; Zisserman, Multiple View Geometry, 2nd ed. 2004, sec. 2.3 and 13.1 (H = K [r1 r2 t]
 * for a plane z = 0).
 */
public final class Homography {
    /** Smallest |det H| (relative to the scale of H) accepted as invertible. */
    public static final double SINGULAR_TOL = 1e-12;

    private final double[] h;

    /** @param rowMajor the nine entries, row major */
    public Homography(double[] rowMajor) {
        if (rowMajor.length != 9) throw new IllegalArgumentException("homography needs 9 entries, got " + rowMajor.length);
        for (double v : rowMajor)
            if (!Double.isFinite(v)) throw new IllegalArgumentException("homography entries must be finite: " + Arrays.toString(rowMajor));
        double scale = 0;
        for (double v : rowMajor) scale = Math.max(scale, Math.abs(v));
        if (scale == 0 || Math.abs(det(rowMajor)) <= SINGULAR_TOL * scale * scale * scale)
            throw new IllegalArgumentException("homography is singular (det = " + det(rowMajor) + "): " + Arrays.toString(rowMajor));
        this.h = rowMajor.clone();
    }

    public static Homography identity() { return new Homography(new double[]{1, 0, 0, 0, 1, 0, 0, 0, 1}); }

    public static Homography translation(double dx, double dy) { return new Homography(new double[]{1, 0, dx, 0, 1, dy, 0, 0, 1}); }

    private static double det(double[] m) {
        return m[0] * (m[4] * m[8] - m[5] * m[7]) - m[1] * (m[3] * m[8] - m[5] * m[6]) + m[2] * (m[3] * m[7] - m[4] * m[6]);
    }

    public double get(int row, int col) { return h[row * 3 + col]; }
    public double[] toArray() { return h.clone(); }

    /** Maps (x, y); returns {x', y'}, or NaNs when the point maps to infinity. */
    public double[] apply(double x, double y) {
        double w = h[6] * x + h[7] * y + h[8];
        if (w == 0) return new double[]{Double.NaN, Double.NaN};
        return new double[]{(h[0] * x + h[1] * y + h[2]) / w, (h[3] * x + h[4] * y + h[5]) / w};
    }

    public Homography inverse() {
        double[] m = h, inv = new double[9];
        double d = det(m);
        inv[0] = (m[4] * m[8] - m[5] * m[7]) / d;
        inv[1] = (m[2] * m[7] - m[1] * m[8]) / d;
        inv[2] = (m[1] * m[5] - m[2] * m[4]) / d;
        inv[3] = (m[5] * m[6] - m[3] * m[8]) / d;
        inv[4] = (m[0] * m[8] - m[2] * m[6]) / d;
        inv[5] = (m[2] * m[3] - m[0] * m[5]) / d;
        inv[6] = (m[3] * m[7] - m[4] * m[6]) / d;
        inv[7] = (m[1] * m[6] - m[0] * m[7]) / d;
        inv[8] = (m[0] * m[4] - m[1] * m[3]) / d;
        return new Homography(inv).normalised();
    }

    /** this ∘ other: first other, then this. */
    public Homography after(Homography other) {
        double[] a = h, b = other.h, c = new double[9];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
                c[i * 3 + j] = a[i * 3] * b[j] + a[i * 3 + 1] * b[3 + j] + a[i * 3 + 2] * b[6 + j];
        return new Homography(c).normalised();
    }

    /** Same map scaled so that H[2][2] = 1 (or the Frobenius norm is 1 when H[2][2] is 0). */
    public Homography normalised() {
        double s = h[8];
        if (Math.abs(s) < 1e-15) {
            s = 0;
            for (double v : h) s += v * v;
            s = Math.sqrt(s);
        }
        double[] n = new double[9];
        for (int i = 0; i < 9; i++) n[i] = h[i] / s;
        return new Homography(n);
    }

    @Override public boolean equals(Object o) { return o instanceof Homography other && Arrays.equals(h, other.h); }
    @Override public int hashCode() { return Arrays.hashCode(h); }
    @Override public String toString() { return "Homography" + Arrays.toString(h); }
}
