package org.targetbench.select;

import boofcv.struct.distort.Point2Transform2_F64;
import georegression.struct.point.Point2D_F64;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.score.Repeatability;
import org.targetbench.score.Robustness;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Candidates for servo points: the detections of one detector in the reference view, each with its robustness as far
 * as the comparison measured it, its depth and its place on the target.
 *
 * <ul>
 *   <li><b>Repeatability</b> of a point: over the other frames with a known homography H from the reference, the
 *   fraction in which some detection lies within epsilon of H p, counting only frames where H p falls inside the
 *   image (the per-point form of Schmid, Mohr &amp; Bauckhage 2000, IJCV 37(2)). Empty when no frame qualifies.</li>
 *   <li><b>Localisation error</b>: when true feature positions are known, the point is identified with the nearest
 *   true feature of the reference frame (within the localisation radius); in every frame that knows that feature's
 *   true pixel, the distance from it to the nearest detection within the radius is taken; the RMS is reported.</li>
 *   <li><b>Depth and target point</b>, from the reference pose: the nearest designed feature projected within
 *   {@link CandidateConfig#featureMatchPx} gives the target point and its depth; otherwise the pixel ray is intersected
 *   with the target plane z = 0.</li>
 * </ul>
 * Track survival and jitter are not measured by a comparison and stay empty.
 */
public final class Candidates {
    private Candidates() {}

    /** One frame's detections and truth. */
    public record Frame(String name, List<Detection> detections, Optional<Homography> fromReference, List<ProjectedFeature> truePoints) {
        public Frame {
            detections = List.copyOf(detections);
            truePoints = List.copyOf(truePoints);
        }
    }

    /**
     * @param reference     the reference frame
     * @param others        the other frames
     * @param design        the target design (may be null: then only ray-plane depths)
     * @param referencePose the target pose in the reference camera frame
     */
    public static List<Candidate> build(Frame reference, List<Frame> others, CameraModel camera, TargetDesign design,
                                        Pose referencePose, CandidateConfig config) {
        return build(reference, others, camera, design, referencePose, config, false);
    }

    /**
     * As {@link #build(Frame, List, CameraModel, TargetDesign, Pose, CandidateConfig)}; with
     * {@code undistortedHomographies} the frames' homographies map between undistorted images (registered truth under
     * lens distortion, where no homography exists between raw frames): the repeatability count then undistorts both
     * frames' detections with the intrinsics (eqs. 1-3 of {@link CameraModel} inverted) and applies the image-region
     * rules in undistorted pixels, as the comparison does. Everything else stays in raw pixels.
     */
    public static List<Candidate> build(Frame reference, List<Frame> others, CameraModel camera, TargetDesign design,
                                        Pose referencePose, CandidateConfig config, boolean undistortedHomographies) {
        config.checkValidity();
        int w = camera.width(), h = camera.height();
        Point2Transform2_F64 toNorm = camera.pixelToNormalised();
        List<ProjectedFeature> designed = design == null ? List.of() : Projection.visibleFeatures(design, camera, referencePose);
        List<Candidate> out = new ArrayList<>();
        List<Detection> ref = reference.detections();
        List<Detection> refForRepeat = undistortedHomographies ? undistorted(ref, camera) : ref;
        // found again: the one rule of Repeatability (one-to-one pairing within epsilon), per frame with a homography
        List<int[]> foundAgain = new ArrayList<>();
        for (Frame f : others)
            foundAgain.add(f.fromReference().isEmpty() ? null
                    : Repeatability.foundAgain(refForRepeat, undistortedHomographies ? undistorted(f.detections(), camera) : f.detections(),
                    f.fromReference().get(), w, h, w, h, config.epsilonPx));
        for (int id = 0; id < ref.size(); id++) {
            Detection d = ref.get(id);
            // repeatability over frames with a homography
            int visible = 0, found = 0;
            for (int[] fa : foundAgain) {
                if (fa == null || fa[id] < 0) continue;
                visible++;
                if (fa[id] > 0) found++;
            }
            OptionalDouble rep = visible == 0 ? OptionalDouble.empty() : OptionalDouble.of(found / (double) visible);
            // localisation against true features
            OptionalDouble loc = OptionalDouble.empty();
            boolean isDesigned = true;
            if (!reference.truePoints().isEmpty()) {
                ProjectedFeature tf = nearestFeature(reference.truePoints(), d.x(), d.y(), config.localisationRadiusPx);
                if (tf == null) {
                    isDesigned = false;
                } else {
                    double sum = 0;
                    int n = 0;
                    List<Frame> all = new ArrayList<>();
                    all.add(reference);
                    all.addAll(others);
                    for (Frame f : all)
                        for (ProjectedFeature p : f.truePoints())
                            if (p.featureId() == tf.featureId()) {
                                double dist = nearest(f.detections(), p.u(), p.v());
                                if (dist <= config.localisationRadiusPx) {
                                    sum += dist * dist;
                                    n++;
                                }
                            }
                    if (n > 0) loc = OptionalDouble.of(Math.sqrt(sum / n));
                }
            }
            Point2D_F64 nrm = new Point2D_F64();
            toNorm.compute(d.x(), d.y(), nrm);
            double z = Double.NaN, tx = Double.NaN, ty = Double.NaN;
            int featureId = -1;
            ProjectedFeature df = nearestFeature(designed, d.x(), d.y(), config.featureMatchPx);
            if (df != null) {
                featureId = df.featureId();
                tx = design.features().get(featureId).xMm();
                ty = design.features().get(featureId).yMm();
                z = df.depthM();
            } else {
                double[] hit = rayOnPlane(referencePose, nrm.x, nrm.y);
                if (hit != null) {
                    tx = hit[0];
                    ty = hit[1];
                    z = hit[2];
                }
            }
            Robustness rb = new Robustness(rep, OptionalDouble.empty(), loc, OptionalDouble.empty());
            out.add(new Candidate(id, d.x(), d.y(), d.response(), nrm.x, nrm.y, z, tx, ty, featureId, isDesigned, visible, found, rb));
        }
        return out;
    }

    /**
     * Intersects the ray through normalised (x, y) with the target plane z = 0: P_c = λ (x, y, 1), and the plane's
     * points satisfy r3 · (P_c - t) = 0 with r3 the third column of R, so λ = (r3 · t) / (r3 · (x, y, 1)).
     *
     * @return {X mm, Y mm, Z m} on the target, or null when the ray misses the plane in front of the camera
     */
    public static double[] rayOnPlane(Pose pose, double x, double y) {
        double r13 = pose.r(0, 2), r23 = pose.r(1, 2), r33 = pose.r(2, 2);
        double num = r13 * pose.t(0) + r23 * pose.t(1) + r33 * pose.t(2);
        double den = r13 * x + r23 * y + r33;
        if (Math.abs(den) < 1e-12) return null;
        double lambda = num / den;
        if (!(lambda > 0)) return null;
        double[] pc = {lambda * x - pose.t(0), lambda * y - pose.t(1), lambda - pose.t(2)};
        // P_t = Rᵀ (P_c - t)
        double xt = pose.r(0, 0) * pc[0] + pose.r(1, 0) * pc[1] + pose.r(2, 0) * pc[2];
        double yt = pose.r(0, 1) * pc[0] + pose.r(1, 1) * pc[1] + pose.r(2, 1) * pc[2];
        return new double[]{xt * 1000, yt * 1000, lambda};
    }

    /** Detections moved to undistorted pixels, K applied to the undistorted normalised coordinates. */
    private static List<Detection> undistorted(List<Detection> pts, CameraModel c) {
        Point2Transform2_F64 t = c.pixelToNormalised();
        Point2D_F64 n = new Point2D_F64();
        List<Detection> out = new ArrayList<>(pts.size());
        for (Detection p : pts) {
            t.compute(p.x(), p.y(), n);
            out.add(new Detection(c.fx() * n.x + c.cx(), c.fy() * n.y + c.cy(), p.response(), p.scale()));
        }
        return out;
    }

    private static double nearest(List<Detection> dets, double x, double y) {
        double best = Double.POSITIVE_INFINITY;
        for (Detection q : dets) best = Math.min(best, Math.hypot(q.x() - x, q.y() - y));
        return best;
    }

    private static ProjectedFeature nearestFeature(List<ProjectedFeature> fs, double x, double y, double radius) {
        ProjectedFeature best = null;
        double bd = radius;
        for (ProjectedFeature f : fs) {
            double d = Math.hypot(f.u() - x, f.v() - y);
            if (d <= bd) {
                bd = d;
                best = f;
            }
        }
        return best;
    }
}
