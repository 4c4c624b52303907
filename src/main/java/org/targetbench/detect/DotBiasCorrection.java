package org.targetbench.detect;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.DotBias;
import org.targetbench.camera.Pose;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.List;

/**
 * Optional correction of the perspective bias of dot centres when the pose of the target is known (from a render, or
 * from frame-to-design registration): each detection is moved by the bias of the dot it belongs to,
 * p' = p - (c_conic - c_projected), where c_conic is the centre of the imaged dot and c_projected the image of the
 * dot's centre ({@link DotBias}). This is the correction of Heikkilä 2000 [1] (sec. 3, the distortion of the
 * projected circle centre, computed from the pose and the circle's radius), done here exactly through the image conic
 * rather than with his first-order expansion.
 *
 * <p>A detection is matched to the dot whose imaged centre is nearest, within {@link #MATCH_RADIUS_PX}; detections that match no dot are returned unchanged.
 *
 * <p>Caveat: an error in the pose becomes an error in the correction; the bias is typically a fraction of a pixel, so
 * a pose good to a few degrees and millimetres corrects it to a few hundredths of a pixel.
 *
 * <p>Reference: [1] J. Heikkilä, "Geometric camera calibration using circular control points", IEEE TPAMI 22(10),
 * 2000.
 */
public final class DotBiasCorrection {
    /** Largest distance of a detection from an imaged dot centre to be corrected as that dot, pixels. */
    public static final double MATCH_RADIUS_PX = 3;

    private DotBiasCorrection() {}

    /** The detections with the dot bias removed, in the same order. */
    public static List<Detection> correct(List<Detection> detections, TargetDesign design, CameraModel camera, Pose pose) {
        List<DotBias.DotView> dots = DotBias.view(design, camera, pose);
        List<Detection> out = new ArrayList<>(detections.size());
        for (Detection d : detections) {
            DotBias.DotView best = null;
            double bestDist = MATCH_RADIUS_PX;
            for (DotBias.DotView v : dots) {
                double dist = Math.hypot(d.x() - v.conicU(), d.y() - v.conicV());
                if (dist <= bestDist) { bestDist = dist; best = v; }
            }
            out.add(best == null ? d : new Detection(d.x() - (best.conicU() - best.trueU()), d.y() - (best.conicV() - best.trueV()),
                    d.response(), d.scale()));
        }
        return List.copyOf(out);
    }
}
