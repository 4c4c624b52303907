package org.targetbench.servo;

import org.ejml.data.DMatrixRMaj;

/**
 * The 6 x 6 velocity twist transformation between two rigidly attached frames, such as the camera and the robot's
 * end effector on an eye-in-hand cell.
 *
 * <p>Given the pose of frame b in frame a as (R, t), meaning P_a = R P_b + t, a twist (v, ω) of the rigid body
 * expressed in b becomes, in a [1, 2]:
 * <pre>
 *   V = [ R   [t]× R ]        (v_a, ω_a) = V (v_b, ω_b)
 *       [ 0     R    ]
 * </pre>
 * with [t]× the skew matrix of t. For the hand-eye transform (the camera pose in the end-effector frame,
 * e_R_c and e_t_c), V maps a camera twist to the end-effector twist, which is what a robot controller takes. The inverse
 * is [[Rᵀ, -Rᵀ[t]×], [0, Rᵀ]].
 *
 * <p>Caveat: V changes the frame in which a twist is written, not the point about which it turns; both twists describe
 * the same motion of the same rigid body.
 *
 * <p>References: [1] F. Chaumette, S. Hutchinson, "Visual servo control, Part I: Basic approaches", IEEE Robotics
 * &amp; Automation Magazine 13(4), 2006 (eye-in-hand twist transformation, from memory). [2] R. Murray, Z. Li,
 * S. Sastry, "A Mathematical Introduction to Robotic Manipulation", CRC 1994, the adjoint map of sec. 2.4 (from memory).
 */
public final class TwistTransform {
    private TwistTransform() {}

    /**
     * @param rowMajorR rotation of frame b in frame a, row major 3 x 3
     * @param t         origin of frame b in frame a, metres
     * @return V, 6 x 6
     */
    public static DMatrixRMaj of(double[] rowMajorR, double[] t) {
        check(rowMajorR, t);
        double[] r = rowMajorR;
        DMatrixRMaj v = new DMatrixRMaj(6, 6);
        // [t]x R
        double[] tx = {0, -t[2], t[1], t[2], 0, -t[0], -t[1], t[0], 0};
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++) {
                double s = 0;
                for (int k = 0; k < 3; k++) s += tx[i * 3 + k] * r[k * 3 + j];
                v.set(i, j, r[i * 3 + j]);
                v.set(i, j + 3, s);
                v.set(i + 3, j + 3, r[i * 3 + j]);
            }
        return v;
    }

    /** The inverse of {@link #of}: the transform for the pose of a in b, (Rᵀ, -Rᵀ t). */
    public static DMatrixRMaj inverse(double[] rowMajorR, double[] t) {
        check(rowMajorR, t);
        double[] rt = new double[9];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++) rt[i * 3 + j] = rowMajorR[j * 3 + i];
        double[] ti = new double[3];
        for (int i = 0; i < 3; i++) ti[i] = -(rt[i * 3] * t[0] + rt[i * 3 + 1] * t[1] + rt[i * 3 + 2] * t[2]);
        return of(rt, ti);
    }

    private static void check(double[] r, double[] t) {
        if (r.length != 9 || t.length != 3)
            throw new IllegalArgumentException("twist transform needs a 3x3 rotation and a 3-vector, got " + r.length + " and " + t.length + " values");
        for (double v : r) if (!Double.isFinite(v)) throw new IllegalArgumentException("rotation must be finite");
        for (double v : t) if (!Double.isFinite(v)) throw new IllegalArgumentException("translation must be finite");
    }
}
