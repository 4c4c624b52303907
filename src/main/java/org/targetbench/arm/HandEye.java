package org.targetbench.arm;

import java.util.Arrays;
import java.util.List;

/**
 * The hand-eye transform X of an eye-in-hand cell: the camera frame in the flange frame, P_flange = R · P_camera + t.
 * Immutable.
 *
 * @param rotation     R, row major 3 x 3, a proper rotation
 * @param translationM t, metres
 * @param views        per-view residuals of the calibration that produced it (empty when entered by hand)
 * @param method       how it was obtained ("entered", a calibration method)
 */
public record HandEye(double[] rotation, double[] translationM, List<ViewResidual> views, String method) {
    /** Allowed deviation of RᵀR from I and det R from 1. */
    public static final double RIGID_TOL = 1e-6;

    /**
     * One calibration view's fit.
     *
     * @param view       view index or frame name
     * @param rotationDeg  rotation residual of A X against X B for the motion from the first view, degrees
     * @param translationMm translation residual of the same, millimetres
     * @param outlier    whether the view is flagged as an outlier (residual above 3 times the median, common practice, no source)
     * @param flipped    whether the target pose of this view was turned by 180° to resolve a symmetric target
     */
    public record ViewResidual(String view, double rotationDeg, double translationMm, boolean outlier, boolean flipped) {}

    public HandEye {
        if (rotation == null || translationM == null || rotation.length != 9 || translationM.length != 3)
            throw new IllegalArgumentException("a hand-eye transform needs a 3x3 rotation and a 3-vector translation");
        for (double v : translationM) if (!Double.isFinite(v)) throw new IllegalArgumentException("hand-eye translation must be finite: " + Arrays.toString(translationM));
        if (!Rigid.isRotation(rotation, RIGID_TOL))
            throw new IllegalArgumentException("the hand-eye rotation is not a proper rotation (R^T R = I, det R = 1 to " + RIGID_TOL + "): " + Arrays.toString(rotation));
        rotation = rotation.clone();
        translationM = translationM.clone();
        views = views == null ? List.of() : List.copyOf(views);
        if (method == null) method = "entered";
    }

    public static HandEye of(double[] transform) {
        return new HandEye(Rigid.rotation(transform), Rigid.translation(transform), List.of(), "entered");
    }

    @Override public double[] rotation() { return rotation.clone(); }
    @Override public double[] translationM() { return translationM.clone(); }

    /** X as a 4 x 4 transform (camera to flange). */
    public double[] transform() { return Rigid.of(rotation, translationM); }

    /** The demo mount: the camera 60 mm off the flange axis and 40 mm forward, optical axis along the flange z. Invented. */
    public static HandEye demo() {
        return new HandEye(new double[]{1, 0, 0, 0, 1, 0, 0, 0, 1}, new double[]{0, 0.060, 0.040}, List.of(), "demo mount (invented)");
    }

    /** This transform moved by a rotation vector (degrees, camera frame) and a translation (millimetres, flange frame). */
    public HandEye perturbed(double[] rotDeg, double[] transMm) {
        double[] e = Rigid.fromRotationVector(Math.toRadians(rotDeg[0]), Math.toRadians(rotDeg[1]), Math.toRadians(rotDeg[2]));
        double[] x = Rigid.mul(transform(), e);
        x[3] += transMm[0] / 1000;
        x[7] += transMm[1] / 1000;
        x[11] += transMm[2] / 1000;
        return new HandEye(Rigid.rotation(x), Rigid.translation(x), List.of(), method + " with injected error");
    }
}
