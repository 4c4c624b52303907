package org.targetbench.servo;

import org.targetbench.camera.InteractionMatrix;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * The image-based control law v = -λ L̂⁺ (s - s*) for k point features in undistorted normalised coordinates
 * [1, eqs. (4)-(5), from memory], with L̂ chosen by {@link ControlLaw}. The output is the camera twist
 * (vx, vy, vz in m/s, ωx, ωy, ωz in rad/s) in the camera frame; {@link TwistTransform} turns it into an end-effector
 * twist.
 *
 * <p>L̂⁺ e is computed as the least-squares solution of L̂ v = e by Householder QR (EJML), which equals the
 * Moore-Penrose pseudo-inverse when L̂ has full column rank; when the QR quality is poor (L̂ near rank deficient)
 * the SVD pseudo-inverse is used instead. Not thread safe: one instance per thread.
 *
 * <p>References: [1] F. Chaumette, S. Hutchinson, "Visual servo control, Part I: Basic approaches", IEEE RAM 13(4),
 * 2006. [2] E. Malis, ICRA 2004 (the mean of current and desired matrices).
 */
public final class ServoController {
    /** QR quality below which the SVD pseudo-inverse is used. */
    public static final double QR_QUALITY_TOL = 1e-9;

    private final ControlLaw law;
    private final double lambda;
    private final int k;
    private final double[] xStar;
    private final double[] yStar;
    private final DMatrixRMaj lStar;
    private final DMatrixRMaj lStarPinv;
    private final DMatrixRMaj lHat;
    private final DMatrixRMaj lWork;
    private final DMatrixRMaj e;
    private final DMatrixRMaj v = new DMatrixRMaj(6, 1);
    private final LinearSolverDense<DMatrixRMaj> qr;
    private final LinearSolverDense<DMatrixRMaj> pinv = LinearSolverFactory_DDRM.pseudoInverse(true);

    /**
     * @param xStar      desired normalised x of each point
     * @param yStar      desired normalised y
     * @param zStarEst   the depth estimate at the reference, metres (used for L*)
     * @param lambda     gain, 1/s, &gt; 0
     */
    public ServoController(double[] xStar, double[] yStar, double[] zStarEst, double lambda, ControlLaw law) {
        if (!(lambda > 0) || !Double.isFinite(lambda)) throw new IllegalArgumentException("gain lambda must be > 0 1/s, got " + lambda);
        if (xStar.length < 3) throw new IllegalArgumentException("the control law needs at least 3 points, got " + xStar.length);
        this.law = law;
        this.lambda = lambda;
        this.k = xStar.length;
        this.xStar = xStar.clone();
        this.yStar = yStar.clone();
        this.lStar = InteractionMatrix.stacked(xStar, yStar, zStarEst);
        this.lHat = new DMatrixRMaj(2 * k, 6);
        this.lWork = new DMatrixRMaj(2 * k, 6);
        this.e = new DMatrixRMaj(2 * k, 1);
        this.qr = LinearSolverFactory_DDRM.leastSquares(2 * k, 6);
        this.lStarPinv = new DMatrixRMaj(6, 2 * k);
        if (!pinv.setA(lStar.copy())) throw new IllegalArgumentException("the desired interaction matrix could not be decomposed");
        pinv.invert(lStarPinv);
    }

    public int pointCount() { return k; }

    /**
     * The commanded camera twist for the current features.
     *
     * @param x    current normalised x of each point (measured)
     * @param y    current normalised y
     * @param zEst current depth estimates, metres (unused by {@link ControlLaw#DESIRED})
     * @param out  receives (v, ω), 6 values
     * @return false when no finite command exists (L̂ could not be decomposed)
     */
    public boolean velocity(double[] x, double[] y, double[] zEst, double[] out) {
        for (int i = 0; i < k; i++) {
            e.data[2 * i] = x[i] - xStar[i];
            e.data[2 * i + 1] = y[i] - yStar[i];
        }
        if (law == ControlLaw.DESIRED) {
            CommonOps_DDRM.mult(lStarPinv, e, v);
        } else {
            for (int i = 0; i < k; i++) InteractionMatrix.pointRows(x[i], y[i], zEst[i], lHat.data, 2 * i);
            if (law == ControlLaw.MEAN) {
                // L̂ = ½ (L + L*), [2]
                double[] a = lHat.data, b = lStar.data;
                for (int i = 0; i < a.length; i++) a[i] = 0.5 * (a[i] + b[i]);
            }
            lWork.setTo(lHat);
            if (qr.setA(lWork) && qr.quality() > QR_QUALITY_TOL) {
                qr.solve(e, v);
            } else {
                lWork.setTo(lHat);
                if (!pinv.setA(lWork)) return false;
                pinv.solve(e, v);
            }
        }
        for (int i = 0; i < 6; i++) {
            out[i] = -lambda * v.data[i]; // v = -λ L̂⁺ e, eq. (5) of [1]
            if (!Double.isFinite(out[i])) return false;
        }
        return true;
    }
}
