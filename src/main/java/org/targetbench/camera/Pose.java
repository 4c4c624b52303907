package org.targetbench.camera;

import georegression.geometry.ConvertRotation3D_F64;
import georegression.struct.EulerType;
import georegression.struct.se.Se3_F64;
import org.ejml.data.DMatrixRMaj;

import java.util.Arrays;

/**
 * Rigid pose of the target in the camera frame: a target point P_t (metres) maps to P_c = R P_t + t.
 * Immutable; R is a proper rotation (checked to 1e-6).
 */
public final class Pose {
    /** Allowed deviation of RᵀR from the identity and of det R from 1. */
    public static final double ROTATION_TOL = 1e-6;

    private final double[] r;
    private final double[] t;

    /**
     * @param rowMajorR 3x3 rotation, row major
     * @param t         translation, metres
     */
    public Pose(double[] rowMajorR, double[] t) {
        if (rowMajorR.length != 9 || t.length != 3)
            throw new IllegalArgumentException("pose needs 9 rotation and 3 translation values, got " + rowMajorR.length + " and " + t.length);
        for (double v : rowMajorR) if (!Double.isFinite(v)) throw new IllegalArgumentException("rotation must be finite: " + Arrays.toString(rowMajorR));
        for (double v : t) if (!Double.isFinite(v)) throw new IllegalArgumentException("translation must be finite: " + Arrays.toString(t));
        double[] q = rowMajorR;
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++) {
                double dot = q[i] * q[j] + q[3 + i] * q[3 + j] + q[6 + i] * q[6 + j];
                if (Math.abs(dot - (i == j ? 1 : 0)) > ROTATION_TOL)
                    throw new IllegalArgumentException("R is not orthonormal: (RᵀR)[" + i + "][" + j + "] = " + dot);
            }
        double det = q[0] * (q[4] * q[8] - q[5] * q[7]) - q[1] * (q[3] * q[8] - q[5] * q[6]) + q[2] * (q[3] * q[7] - q[4] * q[6]);
        if (Math.abs(det - 1) > ROTATION_TOL) throw new IllegalArgumentException("R must be a proper rotation, det = " + det);
        this.r = rowMajorR.clone();
        this.t = t.clone();
    }

    /**
     * Pose from Euler angles (radians, rotations about the target's x, then y, then z axes as seen from the camera,
     * XYZ convention of georegression) and a translation in metres.
     */
    public static Pose fromEulerXYZ(double rx, double ry, double rz, double tx, double ty, double tz) {
        DMatrixRMaj m = ConvertRotation3D_F64.eulerToMatrix(EulerType.XYZ, rx, ry, rz, null);
        return new Pose(m.data.clone(), new double[]{tx, ty, tz});
    }

    /**
     * Camera looking straight at the centre of a target page of {@code widthMm} x {@code heightMm} from
     * {@code distanceM}, then the target tilted about its own centre by {@code tiltXDeg} about the page's x axis,
     * {@code tiltYDeg} about the page's y axis and turned by {@code rollDeg} in its plane; the target centre is
     * offset by (offsetX, offsetY) metres in the camera frame.
     */
    public static Pose facing(double widthMm, double heightMm, double distanceM, double tiltXDeg, double tiltYDeg,
                              double rollDeg, double offsetXM, double offsetYM) {
        DMatrixRMaj m = ConvertRotation3D_F64.eulerToMatrix(EulerType.XYZ,
                Math.toRadians(tiltXDeg), Math.toRadians(tiltYDeg), Math.toRadians(rollDeg), null);
        double[] rr = m.data;
        double cxT = widthMm / 2000.0, cyT = heightMm / 2000.0;
        // P_c = R (P_t - c) + (off, d)  =>  t = (off, d) - R c
        double[] t = {
                offsetXM - (rr[0] * cxT + rr[1] * cyT),
                offsetYM - (rr[3] * cxT + rr[4] * cyT),
                distanceM - (rr[6] * cxT + rr[7] * cyT)};
        return new Pose(rr.clone(), t);
    }

    public double[] rotation() { return r.clone(); }
    public double[] translation() { return t.clone(); }
    public double r(int row, int col) { return r[row * 3 + col]; }
    public double t(int i) { return t[i]; }

    /** Camera-frame coordinates (metres) of the target point (x, y, 0) given in millimetres. */
    public double[] targetToCamera(double xMm, double yMm) {
        double x = xMm / 1000.0, y = yMm / 1000.0;
        return new double[]{r[0] * x + r[1] * y + t[0], r[3] * x + r[4] * y + t[1], r[6] * x + r[7] * y + t[2]};
    }

    public Se3_F64 toSe3() {
        Se3_F64 se = new Se3_F64();
        se.R.setData(r.clone());
        se.T.setTo(t[0], t[1], t[2]);
        return se;
    }

    public static Pose fromSe3(Se3_F64 se) {
        return new Pose(se.R.data.clone(), new double[]{se.T.x, se.T.y, se.T.z});
    }

    @Override public boolean equals(Object o) {
        return o instanceof Pose p && Arrays.equals(r, p.r) && Arrays.equals(t, p.t);
    }
    @Override public int hashCode() { return Arrays.hashCode(r) * 31 + Arrays.hashCode(t); }
    @Override public String toString() { return "Pose[R=" + Arrays.toString(r) + ", t=" + Arrays.toString(t) + " m]"; }
}
