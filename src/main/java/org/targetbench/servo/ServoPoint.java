package org.targetbench.servo;


import org.targetbench.score.Robustness;
/**
 * One point of a servo reference set.
 *
 * @param id         the point's id within the set's candidates (the index of the detection in the reference frame)
 * @param u          reference pixel column, pixel-centre convention
 * @param v          reference pixel row
 * @param x          undistorted normalised x of (u, v)
 * @param y          undistorted normalised y
 * @param zM         depth in the reference camera frame, metres, &gt; 0
 * @param targetXMm  the point on the target, design x, millimetres
 * @param targetYMm  the point on the target, design y, millimetres
 * @param featureId  the designed feature it was matched to, or -1 when it was placed by intersecting its pixel ray with
 *                   the target plane
 * @param robustness measured robustness figures
 * @param reason     why the point was chosen, in words
 */
public record ServoPoint(int id, double u, double v, double x, double y, double zM, double targetXMm, double targetYMm,
                         int featureId, Robustness robustness, String reason) {
    public ServoPoint {
        for (double d : new double[]{u, v, x, y, targetXMm, targetYMm})
            if (!Double.isFinite(d)) throw new IllegalArgumentException("point " + id + ": coordinates must be finite, got u=" + u + " v=" + v
                    + " x=" + x + " y=" + y + " X=" + targetXMm + " Y=" + targetYMm);
        if (!(zM > 0) || !Double.isFinite(zM)) throw new IllegalArgumentException("point " + id + ": depth Z must be finite and > 0 m, got " + zM);
        if (reason == null) reason = "";
    }

    /** A chosen candidate as a servo point, with why it is in the set. */
    public static ServoPoint of(org.targetbench.select.Candidate c, String reason) {
        return new ServoPoint(c.id(), c.u(), c.v(), c.x(), c.y(), c.zM(), c.targetXMm(), c.targetYMm(), c.featureId(), c.robustness(), reason);
    }

    /** This point with other robustness figures. */
    public ServoPoint withRobustness(Robustness r) {
        return new ServoPoint(id, u, v, x, y, zM, targetXMm, targetYMm, featureId, r, reason);
    }
}
