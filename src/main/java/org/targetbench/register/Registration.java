package org.targetbench.register;

import org.targetbench.camera.Homography;
import org.targetbench.camera.Pose;

import java.util.List;
import java.util.Optional;

/**
 * The registration of one frame to the design.
 *
 * @param note         registered or not, and why
 * @param pose         the target's pose in the camera frame, when intrinsics were given and the frame registered
 * @param designToImage design millimetres to pixels, when no intrinsics were given and the frame registered (with
 *                     intrinsics: the mapping to undistorted pixels through which the features are predicted, the general
 *                     planar mapping fitted after the pose, or K [r1 r2 t] of the pose when too few features matched;
 *                     see {@link FrameRegistrar})
 * @param featuresUsed designed features (or grid key points) matched and used in the fit; 0 when none
 * @param rmsPx        RMS reprojection residual of the used features, pixels; NaN when nothing was fitted
 * @param predicted    every designed feature predicted inside the image (lens distortion applied), id order; empty
 *                     when not registered
 */
public record Registration(RegistrationNote note, Optional<Pose> pose, Optional<Homography> designToImage,
                           int featuresUsed, double rmsPx, List<PredictedFeature> predicted) {
    public Registration {
        predicted = List.copyOf(predicted);
    }

    /** Whether the frame registered. */
    public boolean registered() { return note.registered(); }

    static Registration failed(RegistrationNote note, int used, double rms) {
        return new Registration(note, Optional.empty(), Optional.empty(), used, rms, List.of());
    }

    /**
     * A designed feature's predicted position.
     *
     * @param featureId the design's feature id
     * @param xMm       design x, millimetres
     * @param yMm       design y, millimetres
     * @param u         pixel x (pixel-centre convention)
     * @param v         pixel y
     * @param depthM    camera-frame depth, metres; NaN without intrinsics
     * @param kind      what the designed feature looks like (every kind is predicted; only x-corners are matched)
     */
    public record PredictedFeature(int featureId, double xMm, double yMm, double u, double v, double depthM,
                                   org.targetbench.target.FeatureKind kind) {}
}
