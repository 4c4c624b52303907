package org.targetbench.servo;

import org.targetbench.camera.InteractionMatrix;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;

import java.util.List;
import java.util.Optional;

/**
 * The reference feature set that is loaded into a servo controller: which points to servo on, where each sits in the
 * reference image, how deep it is, and what was measured about it. Immutable. File layouts: docs/formats.md.
 *
 * @param toolVersion     version of the tool that made the set
 * @param created         creation time, ISO 8601 UTC
 * @param camera          intrinsics, distortion and image size of the camera that takes the reference image
 * @param targetId        id of the target design
 * @param targetDesign    what the design is and where it came from (name and file)
 * @param referencePose   target pose in the reference camera frame, when known or estimated
 * @param poseMethod      how the reference pose was obtained (e.g. "known (poses.json pose 0)" or a PnP method)
 * @param detector        detector that found the points
 * @param detectorConfig  its settings, JSON text ("{}" when unknown)
 * @param trackerConfig   tracker settings, JSON text ("{}" when none)
 * @param points          the points, in servo order
 * @param condition       cond(L*) with translational columns scaled by the mean Z*, see {@link InteractionMatrix}
 * @param sigmaMin        smallest singular value of that scaled L*
 */
public record ServoSet(String toolVersion, String created, CameraModel camera, String targetId, String targetDesign,
                       Optional<Pose> referencePose, String poseMethod, String detector, String detectorConfig,
                       String trackerConfig, List<ServoPoint> points, double condition, double sigmaMin) {
    public ServoSet {
        points = List.copyOf(points);
        if (camera == null) throw new IllegalArgumentException("a servo set needs the camera intrinsics");
    }

    /** Mean reference depth Z* of the points, metres. */
    public double meanDepth() {
        return points.stream().mapToDouble(ServoPoint::zM).average().orElse(Double.NaN);
    }

    /** Figures of the scaled L* of some points: {cond, sigmaMin}. */
    /** This set with other points, its cond(L*) and sigma_min recomputed for them. */
    public ServoSet withPoints(List<ServoPoint> pts) {
        InteractionMatrix.Conditioning k = conditioning(pts);
        return new ServoSet(toolVersion, created, camera, targetId, targetDesign, referencePose, poseMethod, detector, detectorConfig,
                trackerConfig, pts, k.condition(), k.sigmaMin());
    }

    public static InteractionMatrix.Conditioning conditioning(List<ServoPoint> pts) {
        double[] x = new double[pts.size()], y = new double[pts.size()], z = new double[pts.size()];
        double zs = 0;
        for (int i = 0; i < pts.size(); i++) {
            x[i] = pts.get(i).x();
            y[i] = pts.get(i).y();
            z[i] = pts.get(i).zM();
            zs += z[i];
        }
        return InteractionMatrix.conditioning(InteractionMatrix.stacked(x, y, z), zs / pts.size());
    }
}
