package org.targetbench.camera;

import org.targetbench.target.FeatureKind;
import org.targetbench.target.Shape;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetFeature;

import java.util.ArrayList;
import java.util.List;

/**
 * Perspective bias of printed dots: the centre of the imaged dot is not the image of the dot's centre.
 *
 * <p>The truth for a dot is the projection of its centre. What a dot detector measures is the centre of the imaged
 * outline (an ellipse fit) or of the imaged area (a grey-weighted centroid); both are the centre of the imaged conic.
 * For a circle C on the target plane and the plane-to-image homography H of a distortion-free camera, the imaged
 * outline is exactly the conic C' = H⁻ᵀ C H⁻¹ ({@link Conics#transform}), whose centre differs from H c whenever the
 * plane is tilted: the bias grows with the dot's size, the tilt and the distance from the principal point
 * (Heikkilä 2000 [1], sec. 3, who also gives the correction).
 *
 * <p>With lens distortion the outline is no longer a conic; it is then taken numerically: {@value #OUTLINE_SAMPLES}
 * points of the dot's rim are projected through the full camera model and the centre of their direct least-squares
 * ellipse ({@link Conics#fitEllipse}) is the imaged centre, which is what an ellipse-fitting detector measures.
 *
 * <p>Reference: [1] J. Heikkilä, "Geometric camera calibration using circular control points", IEEE TPAMI 22(10),
 * 2000.
 */
public final class DotBias {
    /** Rim points projected for a distorted camera. */
    public static final int OUTLINE_SAMPLES = 360;

    private DotBias() {}

    /** One dot in one view: the projected centre (truth), the imaged conic's centre and their difference, pixels. */
    public record DotView(int featureId, double trueU, double trueV, double conicU, double conicV) {
        /** Length of the bias, pixels. */
        public double biasPx() { return Math.hypot(conicU - trueU, conicV - trueV); }
    }

    /**
     * Centre {u, v} of the image of the circle of radius {@code rMm} about ({@code xMm}, {@code yMm}) on the target,
     * pixels; NaNs when part of the rim is behind the camera.
     */
    public static double[] imagedCentre(CameraModel camera, Pose pose, double xMm, double yMm, double rMm) {
        if (!camera.isDistorted()) {
            // H = K [r1 r2 t + R c] maps metres on the target plane, origin at the dot's centre, to pixels: well scaled
            double[] c = pose.targetToCamera(xMm, yMm);
            double[] m = {pose.r(0, 0), pose.r(0, 1), c[0], pose.r(1, 0), pose.r(1, 1), c[1], pose.r(2, 0), pose.r(2, 1), c[2]};
            double[] h = new double[9];
            for (int j = 0; j < 3; j++) {
                h[j] = camera.fx() * m[j] + camera.cx() * m[6 + j];
                h[3 + j] = camera.fy() * m[3 + j] + camera.cy() * m[6 + j];
                h[6 + j] = m[6 + j];
            }
            double[] q = Conics.transform(Conics.circle(0, 0, rMm / 1000), h);
            if (!Conics.isEllipse(q)) return new double[]{Double.NaN, Double.NaN};
            return Conics.centre(q);
        }
        double[] xs = new double[OUTLINE_SAMPLES], ys = new double[OUTLINE_SAMPLES];
        for (int i = 0; i < OUTLINE_SAMPLES; i++) {
            double a = 2 * Math.PI * i / OUTLINE_SAMPLES;
            double[] uv = Projection.projectTargetPoint(camera, pose, xMm + rMm * Math.cos(a), yMm + rMm * Math.sin(a));
            if (Double.isNaN(uv[0])) return new double[]{Double.NaN, Double.NaN};
            xs[i] = uv[0];
            ys[i] = uv[1];
        }
        return Conics.fitEllipse(xs, ys, OUTLINE_SAMPLES).map(Conics::centre).orElse(new double[]{Double.NaN, Double.NaN});
    }

    /** The circles of a design whose centre is a designed dot feature, by feature id; empty for a design without dots. */
    public static List<double[]> dots(TargetDesign design) {
        List<double[]> out = new ArrayList<>();
        for (TargetFeature f : design.features()) {
            if (f.kind() != FeatureKind.DOT_CENTRE) continue;
            for (Shape s : design.drawing())
                if (s instanceof Shape.Circle c && Math.abs(c.cx() - f.xMm()) < 1e-9 && Math.abs(c.cy() - f.yMm()) < 1e-9) {
                    out.add(new double[]{f.id(), c.cx(), c.cy(), c.r()});
                    break;
                }
        }
        return out;
    }

    /** True when the design has dot features. */
    public static boolean hasDots(TargetDesign design) {
        for (TargetFeature f : design.features()) if (f.kind() == FeatureKind.DOT_CENTRE) return true;
        return false;
    }

    /** Every dot of the design whose projected centre lies inside the image at this pose. */
    public static List<DotView> view(TargetDesign design, CameraModel camera, Pose pose) {
        List<DotView> out = new ArrayList<>();
        for (double[] d : dots(design)) {
            double[] t = Projection.projectTargetPoint(camera, pose, d[1], d[2]);
            if (Double.isNaN(t[0]) || !camera.inImage(t[0], t[1])) continue;
            double[] c = imagedCentre(camera, pose, d[1], d[2], d[3]);
            if (Double.isNaN(c[0])) continue;
            out.add(new DotView((int) d[0], t[0], t[1], c[0], c[1]));
        }
        return out;
    }

    /** Largest bias over the dots visible at this pose, pixels; 0 when none is visible. */
    public static double worst(TargetDesign design, CameraModel camera, Pose pose) {
        double w = 0;
        for (DotView v : view(design, camera, pose)) w = Math.max(w, v.biasPx());
        return w;
    }
}
