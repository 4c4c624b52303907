package org.targetbench.camera;

import boofcv.struct.distort.Point2Transform2_F64;
import georegression.struct.point.Point2D_F64;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetFeature;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Projection of planar target points through a pose and a camera, and the plane-induced homography between two
 * views of the same target.
 */
public final class Projection {
    private Projection() {}

    /**
     * A target feature as seen in one image. {@code depthM} is the camera-frame Z in metres; {@code kind} what the
     * feature looks like, empty when unknown (a truth file that does not say), in which case every detector is judged on it.
     */
    public record ProjectedFeature(int featureId, double u, double v, double depthM, Optional<FeatureKind> kind) {
        public ProjectedFeature {
            kind = kind == null ? Optional.empty() : kind;
        }

        /** A feature of unknown kind. */
        public ProjectedFeature(int featureId, double u, double v, double depthM) {
            this(featureId, u, v, depthM, Optional.empty());
        }

        /** A feature of a known kind. */
        public ProjectedFeature(int featureId, double u, double v, double depthM, FeatureKind kind) {
            this(featureId, u, v, depthM, Optional.of(kind));
        }

        /** The same feature at another pixel. */
        public ProjectedFeature at(double u, double v) {
            return new ProjectedFeature(featureId, u, v, depthM, kind);
        }
    }

    /**
     * Pixel of each target feature that is drawn ({@link org.targetbench.target.FeatureVisibility}), lies in front of the
     * camera and inside the image, in feature-id order.
     */
    public static List<ProjectedFeature> visibleFeatures(TargetDesign design, CameraModel camera, Pose pose) {
        Point2Transform2_F64 toPixel = camera.normalisedToPixel();
        Point2D_F64 px = new Point2D_F64();
        List<ProjectedFeature> out = new ArrayList<>();
        for (TargetFeature f : design.features()) {
            if (!org.targetbench.target.FeatureVisibility.drawn(design, f)) continue; // hidden under a later shape: not truth
            double[] pc = pose.targetToCamera(f.xMm(), f.yMm());
            if (!(pc[2] > 0)) continue;
            toPixel.compute(pc[0] / pc[2], pc[1] / pc[2], px);
            if (camera.inImage(px.x, px.y)) out.add(new ProjectedFeature(f.id(), px.x, px.y, pc[2], f.kind()));
        }
        return out;
    }

    /**
     * Pixel of the target point (xMm, yMm) under a pose; NaNs when it is behind the camera.
     */
    public static double[] projectTargetPoint(CameraModel camera, Pose pose, double xMm, double yMm) {
        double[] pc = pose.targetToCamera(xMm, yMm);
        if (!(pc[2] > 0)) return new double[]{Double.NaN, Double.NaN};
        Point2D_F64 px = new Point2D_F64();
        camera.normalisedToPixel().compute(pc[0] / pc[2], pc[1] / pc[2], px);
        return new double[]{px.x, px.y};
    }

    /**
     * Homography from target millimetres to pixels of a distortion-free camera: H = K [r1 r2 t] diag(1e-3, 1e-3, 1)
     * (Hartley &amp; Zisserman 2004, eq. 13.1 with the plane z = 0).
     */
    public static Homography targetToImage(CameraModel camera, Pose pose) {
        double[] k = {camera.fx(), 0, camera.cx(), 0, camera.fy(), camera.cy(), 0, 0, 1};
        double[] m = {pose.r(0, 0) / 1000, pose.r(0, 1) / 1000, pose.t(0),
                pose.r(1, 0) / 1000, pose.r(1, 1) / 1000, pose.t(1),
                pose.r(2, 0) / 1000, pose.r(2, 1) / 1000, pose.t(2)};
        return new Homography(k).after(new Homography(m));
    }

    /**
     * Homography taking pixels of the reference view to pixels of another view of the same target, for a
     * distortion-free camera: H = H_frame H_ref⁻¹.
     *
     * @throws IllegalArgumentException when the camera has lens distortion (no homography exists then)
     */
    public static Homography referenceToFrame(CameraModel camera, Pose reference, Pose frame) {
        if (camera.isDistorted())
            throw new IllegalArgumentException("a homography between views exists only for distortion-free cameras; this one has k1="
                    + camera.k1() + " k2=" + camera.k2() + " k3=" + camera.k3() + " p1=" + camera.p1() + " p2=" + camera.p2());
        return targetToImage(camera, frame).after(targetToImage(camera, reference).inverse());
    }
}
