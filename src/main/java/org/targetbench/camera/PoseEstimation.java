package org.targetbench.camera;

import boofcv.abst.geo.Estimate1ofPnP;
import boofcv.abst.geo.RefinePnP;
import boofcv.factory.geo.EnumPNP;
import boofcv.factory.geo.FactoryMultiView;
import boofcv.struct.distort.Point2Transform2_F64;
import boofcv.struct.geo.Point2D3D;
import georegression.struct.point.Point2D_F64;
import georegression.struct.se.Se3_F64;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Pose of a planar target from a calibrated camera and known design points, with BoofCV's PnP: IPPE for the planar
 * case (Collins &amp; Bartoli 2014, "Infinitesimal plane-based pose estimation", IJCV 109(3)), then Levenberg-Marquardt
 * refinement of the reprojection error in normalised coordinates. Pixels are undistorted first.
 *
 * <p>Caveat: four or more non-collinear correspondences are needed; with few, noisy points a planar pose can flip
 * (two poses explain the image almost equally well), so check the reported reprojection RMS.
 */
public final class PoseEstimation {
    /** Name recorded with poses found here. */
    public static final String METHOD = "PnP: BoofCV IPPE (Collins & Bartoli 2014) + Levenberg-Marquardt refinement";
    /** Refinement convergence tolerance and iteration cap. */
    private static final double REFINE_TOL = 1e-10;
    private static final int REFINE_ITERATIONS = 200;

    private PoseEstimation() {}

    /**
     * An estimated pose and how well it explains the pixels.
     *
     * @param pose             target pose in the camera frame
     * @param reprojectionRmsPx RMS distance between the given pixels and the design points projected with the pose
     * @param points           number of correspondences used
     */
    public record Estimate(Pose pose, double reprojectionRmsPx, int points) {}

    /**
     * @param pixels   observed pixels {u, v}, pixel-centre convention (distorted, as the camera sees them)
     * @param targetMm the matching design points {X, Y} in millimetres on the plane z = 0
     * @return the pose, or empty when fewer than 4 points are given or the solver fails
     */
    public static Optional<Estimate> planar(CameraModel camera, List<double[]> pixels, List<double[]> targetMm) {
        if (pixels.size() != targetMm.size())
            throw new IllegalArgumentException("need as many pixels as target points, got " + pixels.size() + " and " + targetMm.size());
        if (pixels.size() < 4) return Optional.empty();
        Point2Transform2_F64 toNorm = camera.pixelToNormalised();
        List<Point2D3D> obs = new ArrayList<>();
        for (int i = 0; i < pixels.size(); i++) {
            Point2D3D p = new Point2D3D();
            toNorm.compute(pixels.get(i)[0], pixels.get(i)[1], p.observation);
            p.location.setTo(targetMm.get(i)[0] / 1000.0, targetMm.get(i)[1] / 1000.0, 0);
            obs.add(p);
        }
        Estimate1ofPnP pnp = FactoryMultiView.pnp_1(EnumPNP.IPPE, -1, 0);
        Se3_F64 first = new Se3_F64();
        if (!pnp.process(obs, first)) return Optional.empty();
        RefinePnP refine = FactoryMultiView.pnpRefine(REFINE_TOL, REFINE_ITERATIONS);
        Se3_F64 refined = new Se3_F64();
        Se3_F64 best = refine.fitModel(obs, first, refined) ? refined : first;
        Pose pose;
        try {
            pose = Pose.fromSe3(best);
        } catch (IllegalArgumentException e) {
            return Optional.empty();
        }
        Point2Transform2_F64 toPx = camera.normalisedToPixel();
        Point2D_F64 px = new Point2D_F64();
        double sum = 0;
        for (int i = 0; i < pixels.size(); i++) {
            double[] pc = pose.targetToCamera(targetMm.get(i)[0], targetMm.get(i)[1]);
            if (!(pc[2] > 0)) return Optional.empty();
            toPx.compute(pc[0] / pc[2], pc[1] / pc[2], px);
            double du = px.x - pixels.get(i)[0], dv = px.y - pixels.get(i)[1];
            sum += du * du + dv * dv;
        }
        return Optional.of(new Estimate(pose, Math.sqrt(sum / pixels.size()), pixels.size()));
    }
}
