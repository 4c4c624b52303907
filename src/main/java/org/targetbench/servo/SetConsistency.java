package org.targetbench.servo;

import georegression.struct.point.Point2D_F64;
import org.targetbench.camera.CameraModel;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * A servo set stores each point twice: as the reference pixel (u, v) and as undistorted normalised coordinates
 * (x, y). The controller runs on (x, y), people edit (u, v); the two must say the same thing through the set's own
 * camera, or the rehearsal and the cell servo to a place nobody chose. Projecting (x, y) through the camera's
 * eqs. (1)-(3) ({@link CameraModel}) must land within {@value #TOLERANCE_PX} px of (u, v) (half a pixel: far above
 * the round-off of a set this tool wrote, far below any hand edit that matters; common practice, no source).
 */
public final class SetConsistency {
    /** Largest distance between (u, v) and the projection of (x, y), pixels. */
    public static final double TOLERANCE_PX = 0.5;

    private SetConsistency() {}

    /** The first point whose u,v and x,y disagree, as a sentence; empty when all agree. */
    public static Optional<String> problem(CameraModel camera, List<ServoPoint> points) {
        var toPixel = camera.normalisedToPixel();
        Point2D_F64 px = new Point2D_F64();
        for (int i = 0; i < points.size(); i++) {
            ServoPoint p = points.get(i);
            toPixel.compute(p.x(), p.y(), px);
            double d = Math.hypot(px.x - p.u(), px.y - p.v());
            if (!(d <= TOLERANCE_PX))
                return Optional.of(String.format(Locale.ROOT, "points[%d] (id %d): u,v = (%.2f, %.2f) px but x,y = (%.5f, %.5f) projects to "
                        + "(%.2f, %.2f) px through the set's camera, %.2f px away (at most %.1f px); fix or recompute one of them",
                        i, p.id(), p.u(), p.v(), p.x(), p.y(), px.x, px.y, d, TOLERANCE_PX));
        }
        return Optional.empty();
    }
}
