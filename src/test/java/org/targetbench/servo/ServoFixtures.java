package org.targetbench.servo;

import org.targetbench.score.Robustness;
import georegression.struct.point.Point2D_F64;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** Small servo sets for tests, built from target points and a known reference pose. Invented data. */
public final class ServoFixtures {
    private ServoFixtures() {}

    public static final CameraModel VGA = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);

    /** A set of the given target points (mm) seen from {@code pose}, every point projected exactly. */
    public static ServoSet set(CameraModel camera, Pose pose, double[][] targetMm) {
        List<ServoPoint> pts = new ArrayList<>();
        var toPx = camera.normalisedToPixel();
        Point2D_F64 px = new Point2D_F64();
        for (int i = 0; i < targetMm.length; i++) {
            double[] pc = pose.targetToCamera(targetMm[i][0], targetMm[i][1]);
            double x = pc[0] / pc[2], y = pc[1] / pc[2];
            toPx.compute(x, y, px);
            pts.add(new ServoPoint(i, px.x, px.y, x, y, pc[2], targetMm[i][0], targetMm[i][1], i, Robustness.none(), "test point"));
        }
        var c = ServoSet.conditioning(pts);
        return new ServoSet("test", "2026-01-01T00:00:00Z", camera, "test-target", "test design", Optional.of(pose), "known",
                "shi-tomasi", "{}", "{}", pts, c.condition(), c.sigmaMin());
    }

    /** A square of side {@code sideMm} centred on the optical axis, target seen square on from {@code distanceM}. */
    public static ServoSet centredSquare(double sideMm, double distanceM) {
        double w = 200;
        Pose pose = Pose.facing(w, w, distanceM, 0, 0, 0, 0, 0);
        double a = sideMm / 2, c = w / 2;
        return set(VGA, pose, new double[][]{{c - a, c - a}, {c + a, c - a}, {c + a, c + a}, {c - a, c + a}});
    }
}
