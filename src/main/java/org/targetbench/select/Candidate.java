package org.targetbench.select;

import org.targetbench.score.Robustness;

/**
 * A detected feature of the reference view that could become a servo point, with what is known about it.
 *
 * @param id            index of the detection in the reference frame (strongest first)
 * @param u             pixel column, pixel-centre convention
 * @param v             pixel row
 * @param response      detector response
 * @param x             undistorted normalised x
 * @param y             undistorted normalised y
 * @param zM            depth in the reference camera frame, metres; NaN when its pixel ray misses the target plane
 * @param targetXMm     the point on the target, design millimetres (NaN when unknown)
 * @param targetYMm     the point on the target, design millimetres
 * @param featureId     the designed feature it matches, -1 when placed on the plane by its pixel ray
 * @param designed      false when the frame's true feature positions are known and none lies within the match radius
 *                      (likely a false detection); true when they are unknown
 * @param framesVisible other frames in which the point falls inside the image (denominator of repeatability)
 * @param framesFound   of those, frames in which it was detected again within epsilon
 * @param robustness    the figures the filters read
 */
public record Candidate(int id, double u, double v, double response, double x, double y, double zM, double targetXMm,
                        double targetYMm, int featureId, boolean designed, int framesVisible, int framesFound,
                        Robustness robustness) {
    /** This candidate with other robustness figures. */
    public Candidate withRobustness(Robustness r) {
        return new Candidate(id, u, v, response, x, y, zM, targetXMm, targetYMm, featureId, designed, framesVisible, framesFound, r);
    }
}
