package org.targetbench.camera;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.SingularOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.SingularValueDecomposition_F64;
import org.targetbench.camera.CameraModel;

/**
 * The interaction matrix (image Jacobian) L of image points, which links the velocity of a point feature to the
 * camera's velocity twist (v, ω) expressed in the camera frame: ṡ = L (v, ω) [1, eq. (2), from memory].
 *
 * <p>For a point with undistorted normalised coordinates x = X/Z, y = Y/Z and depth Z (metres) [1, eq. (11)]:
 * <pre>
 *   L = [ -1/Z   0    x/Z   x y     -(1 + x²)   y ]
 *       [  0    -1/Z  y/Z   1 + y²  -x y       -x ]                          (11)
 * </pre>
 * k points give a 2k x 6 matrix by stacking. The pixel-unit form for a distortion-free camera (or undistorted
 * pixels) is diag(fx, fy) L, since u = fx x + cx, v = fy y + cy.
 *
 * <p><b>Conditioning.</b> The translational columns of L carry units of 1/m, the rotational ones none, so a raw
 * condition number depends on the unit of length. {@link #conditioning} therefore scales the translational columns by
 * a reference depth Z* (the mean desired depth of the set): L_s = L diag(Z*, Z*, Z*, 1, 1, 1), which is unit free.
 * cond(L_s) = σ_max / σ_min and σ_min of L_s are the figures reported for a servo set. A large condition number or
 * a small σ_min means some camera motions barely move the points, so image noise turns into large velocity
 * commands [2, 3].
 *
 * <p>Caveats: the points must be undistorted before use (L holds for the pinhole projection only); Z is the depth of
 * the point in the current camera frame and must be positive.
 *
 * <p>References: [1] F. Chaumette, S. Hutchinson, "Visual servo control, Part I: Basic approaches", IEEE Robotics
 * &amp; Automation Magazine 13(4), 2006. [2] J. Feddema, C. Lee, O. Mitchell, "Weighted selection of image features
 * for resolved rate visual feedback control", IEEE Trans. Robotics and Automation 7(1), 1991 (condition number of the
 * image Jacobian as a selection measure, from memory). [3] B. Nelson, P. Khosla, "Strategies for increasing the
 * tracking region of an eye-in-hand system by singularity and joint limit avoidance", IJRR 14(3), 1995 (resolvability,
 * from memory).
 */
public final class InteractionMatrix {
    /** Singular values below this fraction of the largest count as zero when the rank is taken. */
    public static final double RANK_TOL = 1e-9;

    private InteractionMatrix() {}

    /**
     * Writes the two rows of eq. (11) for one point into {@code out} (row major, 6 columns) starting at row
     * {@code row}.
     */
    public static void pointRows(double x, double y, double z, double[] out, int row) {
        if (!(z > 0) || !Double.isFinite(z) || !Double.isFinite(x) || !Double.isFinite(y))
            throw new IllegalArgumentException("a point needs finite x, y and a depth Z > 0 m, got x=" + x + " y=" + y + " Z=" + z);
        double iz = 1 / z;
        int o = row * 6;
        // eq. (11), first row
        out[o] = -iz;
        out[o + 1] = 0;
        out[o + 2] = x * iz;
        out[o + 3] = x * y;
        out[o + 4] = -(1 + x * x);
        out[o + 5] = y;
        // eq. (11), second row
        out[o + 6] = 0;
        out[o + 7] = -iz;
        out[o + 8] = y * iz;
        out[o + 9] = 1 + y * y;
        out[o + 10] = -x * y;
        out[o + 11] = -x;
    }

    /** L of one point, 2 x 6, eq. (11). */
    public static DMatrixRMaj point(double x, double y, double z) {
        DMatrixRMaj m = new DMatrixRMaj(2, 6);
        pointRows(x, y, z, m.data, 0);
        return m;
    }

    /** L of k points stacked, 2k x 6, rows 2i and 2i+1 for point i. */
    public static DMatrixRMaj stacked(double[] x, double[] y, double[] z) {
        if (x.length != y.length || x.length != z.length)
            throw new IllegalArgumentException("x, y and Z need the same length, got " + x.length + ", " + y.length + ", " + z.length);
        DMatrixRMaj m = new DMatrixRMaj(2 * x.length, 6);
        for (int i = 0; i < x.length; i++) pointRows(x[i], y[i], z[i], m.data, 2 * i);
        return m;
    }

    /**
     * Pixel-unit L of k points, diag(fx, fy, ...) L: the derivative of undistorted pixel coordinates (u, v) with
     * respect to the camera twist. The inputs are still the undistorted normalised coordinates and depths.
     */
    public static DMatrixRMaj pixel(CameraModel camera, double[] x, double[] y, double[] z) {
        DMatrixRMaj m = stacked(x, y, z);
        for (int r = 0; r < m.numRows; r++) {
            double f = (r % 2 == 0) ? camera.fx() : camera.fy();
            for (int c = 0; c < 6; c++) m.data[r * 6 + c] *= f;
        }
        return m;
    }

    /**
     * Singular-value figures of L with its translational columns scaled by {@code zRef} (metres), see the class
     * notes. {@code zRef} = 1 gives the figures of L itself.
     */
    public static Conditioning conditioning(DMatrixRMaj l, double zRef) {
        if (l.numCols != 6) throw new IllegalArgumentException("L must have 6 columns, got " + l.numCols);
        checkDepth(zRef);
        DMatrixRMaj s = l.copy();
        scaleTranslation(s, zRef);
        return figures(s, DecompositionFactory_DDRM.svd(s.numRows, 6, false, false, true));
    }

    private static void checkDepth(double zRef) {
        if (!(zRef > 0) || !Double.isFinite(zRef)) throw new IllegalArgumentException("reference depth must be > 0 m, got " + zRef);
    }

    private static void scaleTranslation(DMatrixRMaj s, double zRef) {
        for (int r = 0; r < s.numRows; r++)
            for (int c = 0; c < 3; c++) s.data[r * 6 + c] *= zRef;
    }

    private static Conditioning figures(DMatrixRMaj s, SingularValueDecomposition_F64<DMatrixRMaj> svd) {
        if (!svd.decompose(s)) return new Conditioning(Double.POSITIVE_INFINITY, 0, 0, 0);
        double[] sv = svd.getSingularValues();
        int n = svd.numberOfSingularValues();
        double max = 0;
        for (int i = 0; i < n; i++) max = Math.max(max, sv[i]);
        int rank = SingularOps_DDRM.rank(svd, max * RANK_TOL);
        // a 2k x 6 matrix with 2k < 6 has fewer than six singular values: the missing ones are zero
        double min = n < 6 ? 0 : Double.POSITIVE_INFINITY;
        for (int i = 0; i < n; i++) min = Math.min(min, sv[i]);
        double cond = (min <= max * RANK_TOL) ? Double.POSITIVE_INFINITY : max / min;
        return new Conditioning(cond, min, max, rank);
    }

    /**
     * Reusable matrices and decompositions for evaluating many point sets, as a selection search does: the same
     * figures as {@link #conditioning(DMatrixRMaj, double)} on {@link #stacked}, without allocating per set. Not
     * thread safe: one per thread.
     */
    public static final class Workspace {
        private final java.util.Map<Integer, DMatrixRMaj> matrices = new java.util.HashMap<>();
        private final java.util.Map<Integer, SingularValueDecomposition_F64<DMatrixRMaj>> svds = new java.util.HashMap<>();

        /** Figures of the stacked L of the first {@code n} points, translational columns scaled by {@code zRef}. */
        public Conditioning conditioning(double[] x, double[] y, double[] z, int n, double zRef) {
            checkDepth(zRef);
            DMatrixRMaj s = matrices.computeIfAbsent(n, k -> new DMatrixRMaj(2 * k, 6));
            for (int i = 0; i < n; i++) pointRows(x[i], y[i], z[i], s.data, 2 * i);
            scaleTranslation(s, zRef);
            return figures(s, svds.computeIfAbsent(n, k -> DecompositionFactory_DDRM.svd(2 * k, 6, false, false, true)));
        }
    }

    /**
     * Singular-value figures of a matrix.
     *
     * @param condition σ_max / σ_min (infinite when L is rank deficient)
     * @param sigmaMin  smallest of the six singular values
     * @param sigmaMax  largest singular value
     * @param rank      number of singular values above {@link #RANK_TOL} σ_max
     */
    public record Conditioning(double condition, double sigmaMin, double sigmaMax, int rank) {}
}
