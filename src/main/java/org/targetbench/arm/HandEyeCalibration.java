package org.targetbench.arm;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.SingularOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.decomposition.SingularValueDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Hand-eye calibration of an eye-in-hand camera: X (camera in flange) from flange poses in the robot base and target
 * poses in the camera, by the method of Park &amp; Martin [1].
 *
 * <p>With F_i the flange pose in the base and C_i the target pose in the camera at view i, the target is fixed in the
 * base: F_i X C_i = F_j X C_j, so A X = X B with A = F_j⁻¹ F_i and B = C_j C_i⁻¹ [1, eq. (1)]. Rotation: with α, β
 * the rotation vectors of R_A, R_B, α = R_X β; with M = Σ β αᵀ over all view pairs, R_X = (MᵀM)^(-1/2) Mᵀ [1, eq. (15)],
 * computed through the SVD of M. Translation: (R_A - I) t_X = R_X t_B - t_A stacked over the pairs, least squares
 * [1, eq. (10)].
 *
 * <p>Symmetric targets: a checkerboard with odd-by-odd or even-by-even squares looks the same turned by 180° about its
 * centre, so each view's target pose is known only up to that turn. The rotation angle of A equals that of B for the
 * right choice (conjugate rotations have equal angles) and in general differs for the wrong one; each view's choice
 * is the one that makes its motions to the views already decided most consistent. The first view fixes the target's
 * frame; both frames give the same X.
 *
 * <p>Per-view residuals: with X, each view gives its own target pose in the base, F_i X C_i; the residual is its
 * distance (angle and millimetres) from the median of all views; a view more than {@link #OUTLIER_FACTOR} times the
 * median residual (and above a small floor) is flagged an outlier (common practice, no source).
 *
 * <p>References: [1] F. C. Park, B. J. Martin, "Robot sensor calibration: solving AX = XB on the Euclidean group",
 * IEEE Trans. Robotics and Automation 10(5), 1994. [2] R. Y. Tsai, R. K. Lenz, "A new technique for fully autonomous
 * and efficient 3D robotics hand/eye calibration", IEEE Trans. Robotics and Automation 5(3), 1989 (the need for
 * rotations about at least two non-parallel axes).
 */
public final class HandEyeCalibration {
    public static final String METHOD = "Park & Martin 1994 (AX = XB over all view pairs)";
    /** A view whose residual is above this many times the median residual is an outlier (common practice, no source). */
    public static final double OUTLIER_FACTOR = 3;
    /** Residual floors below which no view is an outlier: degrees and millimetres. */
    public static final double OUTLIER_FLOOR_DEG = 0.05, OUTLIER_FLOOR_MM = 0.5;
    /** Relative motions whose rotation axes all lie within this angle of one line are degenerate [2], degrees. */
    public static final double DEGENERATE_AXIS_DEG = 2;
    /** Motions with rotations smaller than this carry no axis, degrees. */
    public static final double MIN_ROTATION_DEG = 0.5;

    /** Why a calibration could not be made; rendered by {@code pipeline.ArmWords.handEyeFailure}. */
    public enum Failure { TOO_FEW_VIEWS, ONE_ROTATION_AXIS, NO_SOLUTION }

    /**
     * A result or a typed failure with its numbers.
     *
     * @param views         views given
     * @param axisSpreadDeg ONE_ROTATION_AXIS: spread of the relative rotation axes, degrees; NaN when no view pair
     *                      rotates more than {@link #MIN_ROTATION_DEG}
     * @param detail        NO_SOLUTION: the numerical step that failed, as the linear algebra reports it; else empty
     */
    public record Outcome(HandEye handEye, Failure failure, int views, double axisSpreadDeg, String detail) {
        public boolean ok() { return handEye != null; }

        /** Fewer than three views were given. */
        public static Outcome tooFewViews(int views) {
            return failed(Failure.TOO_FEW_VIEWS, views, Double.NaN, "");
        }

        static Outcome failed(Failure f, int views, double axisSpreadDeg, String detail) {
            return new Outcome(null, f, views, axisSpreadDeg, detail);
        }
    }

    private HandEyeCalibration() {}

    /**
     * @param flangeInBase  F_i, 4 x 4 row major
     * @param targetInCamera C_i, 4 x 4 row major (P_camera = C P_target)
     * @param names         view names for the residuals
     * @param flip          the 180° turn of the target that leaves it looking the same (4 x 4, target frame), or null
     *                      when the target has no such symmetry
     */
    public static Outcome calibrate(List<double[]> flangeInBase, List<double[]> targetInCamera, List<String> names, double[] flip) {
        int n = flangeInBase.size();
        if (n != targetInCamera.size() || n != names.size()) throw new IllegalArgumentException("views, poses and names differ in number");
        if (n < 3) return Outcome.failed(Failure.TOO_FEW_VIEWS, n, Double.NaN, "");
        List<double[]> c = new ArrayList<>(targetInCamera);
        boolean[] flipped = new boolean[n];
        if (flip != null) {
            for (int i = 1; i < n; i++) {
                double keep = 0, turn = 0;
                double[] alt = Rigid.mul(targetInCamera.get(i), flip);
                for (int j = 0; j < i; j++) {
                    double[] a = Rigid.mul(Rigid.inverse(flangeInBase.get(j)), flangeInBase.get(i));
                    double angA = Rigid.angleBetween(a, Rigid.identity());
                    keep += Math.abs(angA - Rigid.angleBetween(Rigid.mul(c.get(j), Rigid.inverse(targetInCamera.get(i))), Rigid.identity()));
                    turn += Math.abs(angA - Rigid.angleBetween(Rigid.mul(c.get(j), Rigid.inverse(alt)), Rigid.identity()));
                }
                if (turn < keep) {
                    c.set(i, alt);
                    flipped[i] = true;
                }
            }
        }
        // rotation axes of the flange motions: degenerate when they all lie along one line [2]
        List<double[]> axes = new ArrayList<>();
        for (int i = 0; i < n; i++)
            for (int j = i + 1; j < n; j++) {
                double[] rv = Rigid.rotationVector(Rigid.mul(Rigid.inverse(flangeInBase.get(j)), flangeInBase.get(i)));
                double ang = norm(rv);
                if (Math.toDegrees(ang) > MIN_ROTATION_DEG) axes.add(new double[]{rv[0] / ang, rv[1] / ang, rv[2] / ang});
            }
        double spread = axisSpreadDeg(axes);
        if (axes.size() < 2 || spread < DEGENERATE_AXIS_DEG)
            return Outcome.failed(Failure.ONE_ROTATION_AXIS, n, axes.isEmpty() ? Double.NaN : spread, "");
        DMatrixRMaj m = new DMatrixRMaj(3, 3);
        List<double[][]> pairs = new ArrayList<>();
        for (int i = 0; i < n; i++)
            for (int j = i + 1; j < n; j++) {
                double[] a = Rigid.mul(Rigid.inverse(flangeInBase.get(j)), flangeInBase.get(i));
                double[] b = Rigid.mul(c.get(j), Rigid.inverse(c.get(i)));
                pairs.add(new double[][]{a, b});
                double[] al = Rigid.rotationVector(a), be = Rigid.rotationVector(b);
                for (int r = 0; r < 3; r++)
                    for (int s = 0; s < 3; s++) m.add(r, s, be[r] * al[s]); // M = Σ β αᵀ
            }
        // R_X = (MᵀM)^(-1/2) Mᵀ = V Uᵀ for M = U S Vᵀ (with a sign fix for a proper rotation)
        SingularValueDecomposition_F64<DMatrixRMaj> svd = DecompositionFactory_DDRM.svd(3, 3, true, true, false);
        if (!svd.decompose(m.copy())) return Outcome.failed(Failure.NO_SOLUTION, n, Double.NaN, "the SVD of M did not converge");
        DMatrixRMaj u = svd.getU(null, false), v = svd.getV(null, false);
        DMatrixRMaj rx = new DMatrixRMaj(3, 3);
        CommonOps_DDRM.multTransB(v, u, rx);
        if (CommonOps_DDRM.det(rx) < 0) {
            for (int r = 0; r < 3; r++) v.set(r, 2, -v.get(r, 2));
            CommonOps_DDRM.multTransB(v, u, rx);
        }
        double[] r = rx.data.clone();
        // translation: (R_A - I) t = R_X t_B - t_A
        DMatrixRMaj lhs = new DMatrixRMaj(3 * pairs.size(), 3), rhs = new DMatrixRMaj(3 * pairs.size(), 1);
        int row = 0;
        for (double[][] p : pairs) {
            double[] a = p[0], b = p[1];
            for (int i = 0; i < 3; i++) {
                for (int j = 0; j < 3; j++) lhs.set(row + i, j, a[i * 4 + j] - (i == j ? 1 : 0));
                double rtb = r[i * 3] * b[3] + r[i * 3 + 1] * b[7] + r[i * 3 + 2] * b[11];
                rhs.set(row + i, 0, rtb - a[i * 4 + 3]);
            }
            row += 3;
        }
        LinearSolverDense<DMatrixRMaj> ls = LinearSolverFactory_DDRM.leastSquares(lhs.numRows, 3);
        DMatrixRMaj t = new DMatrixRMaj(3, 1);
        if (!ls.setA(lhs)) return Outcome.failed(Failure.NO_SOLUTION, n, Double.NaN, "the translation equations are singular");
        ls.solve(rhs, t);
        double[] x = Rigid.of(r, t.data);
        // per-view residuals: each view's target pose in the base against the median
        double[][] targetInBase = new double[n][];
        for (int i = 0; i < n; i++) targetInBase[i] = Rigid.mul(Rigid.mul(flangeInBase.get(i), x), c.get(i));
        double[] med = medianPose(targetInBase);
        double[] rd = new double[n], td = new double[n];
        for (int i = 0; i < n; i++) {
            rd[i] = Math.toDegrees(Rigid.angleBetween(targetInBase[i], med));
            td[i] = Rigid.distance(targetInBase[i], med) * 1000;
        }
        double mr = median(rd), mt = median(td);
        List<HandEye.ViewResidual> views = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            boolean out = (rd[i] > OUTLIER_FACTOR * mr && rd[i] > OUTLIER_FLOOR_DEG) || (td[i] > OUTLIER_FACTOR * mt && td[i] > OUTLIER_FLOOR_MM);
            views.add(new HandEye.ViewResidual(names.get(i), rd[i], td[i], out, flipped[i]));
        }
        try {
            return new Outcome(new HandEye(Rigid.rotation(x), Rigid.translation(x), views, METHOD), null, n, Double.NaN, "");
        } catch (IllegalArgumentException e) {
            return Outcome.failed(Failure.NO_SOLUTION, n, Double.NaN, e.getMessage());
        }
    }

    /** The 180° turn about the normal through the target's centre (cx, cy) metres: T(c) Rz(π) T(-c). */
    public static double[] halfTurn(double cxM, double cyM) {
        return Rigid.mul(Rigid.trans(cxM, cyM, 0), Rigid.mul(Rigid.rotZ(Math.PI), Rigid.trans(-cxM, -cyM, 0)));
    }

    /** Largest angle between the lines of any two axes, degrees. */
    static double axisSpreadDeg(List<double[]> axes) {
        double worst = 0;
        for (int i = 0; i < axes.size(); i++)
            for (int j = i + 1; j < axes.size(); j++) {
                double[] a = axes.get(i), b = axes.get(j);
                double d = Math.abs(a[0] * b[0] + a[1] * b[1] + a[2] * b[2]);
                worst = Math.max(worst, Math.toDegrees(Math.acos(Math.min(1, d))));
            }
        return worst;
    }

    /** Element-wise median translation and the rotation of the view nearest to all others. */
    static double[] medianPose(double[][] poses) {
        int n = poses.length;
        double best = Double.POSITIVE_INFINITY;
        double[] pick = poses[0];
        for (double[] p : poses) {
            double s = 0;
            for (double[] q : poses) s += Rigid.angleBetween(p, q);
            if (s < best) { best = s; pick = p; }
        }
        double[] out = pick.clone();
        for (int k : new int[]{3, 7, 11}) {
            double[] v = new double[n];
            for (int i = 0; i < n; i++) v[i] = poses[i][k];
            out[k] = median(v);
        }
        return out;
    }

    static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        int n = s.length;
        return n % 2 == 1 ? s[n / 2] : 0.5 * (s[n / 2 - 1] + s[n / 2]);
    }

    private static double norm(double[] v) { return Math.sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2]); }
}
