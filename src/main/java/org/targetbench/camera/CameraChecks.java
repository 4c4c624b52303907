package org.targetbench.camera;

import org.targetbench.target.TargetDesign;

import java.util.Locale;
import java.util.Optional;

/**
 * Plausibility checks of cameras and poses read from files, each returning the problem as one sentence (empty when
 * the input is usable). A camera or pose that fails would render blank or folded frames whose truth does not match
 * them, so readers refuse it.
 *
 * <h2>Radial distortion (derived)</h2>
 * The radial part of the Brown-Conrady model, eqs. (1)-(2) of {@link CameraModel}, maps an undistorted normalised
 * radius r to the distorted radius
 * <pre>
 *   ρ(r) = r (1 + k1 r² + k2 r⁴ + k3 r⁶),     ρ'(r) = 1 + 3 k1 r² + 5 k2 r⁴ + 7 k3 r⁶.          (1)
 * </pre>
 * Every image pixel has one ray only if ρ is strictly increasing from the centre out to the radius that reaches the
 * farthest image corner, r_d = max over the four corners of ‖((u - cx) / fx, (v - cy) / fy)‖. So: walk r from 0
 * until ρ(r) = r_d; if ρ'(r) ≤ 0 on the way (the model turns back and folds the image into rings, e.g. k1 = -5 on a
 * 640 x 480, f = 600 px camera), or r_d is never reached within r ≤ {@value #MAX_RAY_RADIUS} (a corner more than about
 * 87° off the axis), the camera is refused. Tangential terms are small by construction and not checked.
 * In addition the radial magnification ρ(r) / r at that corner must lie within
 * [1/{@value #MAX_MAGNIFICATION}, {@value #MAX_MAGNIFICATION}] (our bound, common practice, no source: real lenses
 * described by this model stay well inside it; k1 = 1e6 gives about 76).
 *
 * <h2>Principal point</h2> inside the image, [-0.5, w - 0.5] x [-0.5, h - 0.5] in the pixel-centre convention.
 *
 * <h2>Poses</h2> every corner of the target page in front of the camera (Z ≥ {@value #MIN_DEPTH_M} m), and the page
 * turned less than {@value #EDGE_ON_DEG}° from facing the camera: the angle between the page normal and the line of
 * sight to the page centre (derived: at 90° the page projects to a line and the homography is singular; 85° keeps a
 * 5° margin, where the page is foreshortened to cos 85° ≈ 9 % of its width).
 */
public final class CameraChecks {
    /** Largest undistorted normalised radius searched for the image corner (tan 87° ≈ 19). */
    public static final double MAX_RAY_RADIUS = 19;
    /** Largest radial magnification ρ(r)/r (or its inverse) accepted at the image corner. */
    public static final double MAX_MAGNIFICATION = 4;
    /** Nearest a target corner may be to the camera plane, metres. */
    public static final double MIN_DEPTH_M = 0.001;
    /** Largest angle between the page normal and the line of sight, degrees. */
    public static final double EDGE_ON_DEG = 85;

    private CameraChecks() {}

    /** What makes {@code c} unusable, or empty. */
    public static Optional<String> problem(CameraModel c) {
        if (c.cx() < -0.5 || c.cx() > c.width() - 0.5 || c.cy() < -0.5 || c.cy() > c.height() - 0.5)
            return Optional.of(String.format(Locale.ROOT, "principal point (cx, cy) = (%.1f, %.1f) px lies outside the %d x %d image",
                    c.cx(), c.cy(), c.width(), c.height()));
        double rd = 0;
        for (double u : new double[]{-0.5, c.width() - 0.5})
            for (double v : new double[]{-0.5, c.height() - 0.5})
                rd = Math.max(rd, Math.hypot((u - c.cx()) / c.fx(), (v - c.cy()) / c.fy()));
        if (c.k1() == 0 && c.k2() == 0 && c.k3() == 0) return Optional.empty();
        String coeffs = String.format(Locale.ROOT, "k1=%s k2=%s k3=%s", c.k1(), c.k2(), c.k3());
        int steps = 200_000;
        double dr = MAX_RAY_RADIUS / steps;
        for (int i = 1; i <= steps; i++) {
            double r = i * dr, r2 = r * r;
            double slope = 1 + 3 * c.k1() * r2 + 5 * c.k2() * r2 * r2 + 7 * c.k3() * r2 * r2 * r2;
            double rho = r * (1 + c.k1() * r2 + c.k2() * r2 * r2 + c.k3() * r2 * r2 * r2);
            if (rho >= rd) {
                double mag = rho / r;
                if (mag > MAX_MAGNIFICATION || mag < 1 / MAX_MAGNIFICATION)
                    return Optional.of(String.format(Locale.ROOT, "radial distortion %s magnifies the image corner %.3g times; "
                            + "the accepted range is 1/%.0f..%.0f", coeffs, mag, MAX_MAGNIFICATION, MAX_MAGNIFICATION));
                return Optional.empty();
            }
            if (slope <= 0)
                return Optional.of(String.format(Locale.ROOT, "radial distortion %s folds the image: r(1+k1 r²+k2 r⁴+k3 r⁶) stops "
                        + "increasing at r = %.3f, before the image corner (distorted r = %.3f); it must increase out to the corner", coeffs, r, rd));
        }
        return Optional.of(String.format(Locale.ROOT, "radial distortion %s never reaches the image corner (distorted r = %.3f) "
                + "within %.0f° of the axis", coeffs, rd, Math.toDegrees(Math.atan(MAX_RAY_RADIUS))));
    }

    /** What makes {@code pose} of {@code design} unusable for rendering, or empty. */
    public static Optional<String> problem(Pose pose, TargetDesign design) {
        double w = design.widthMm(), h = design.heightMm();
        double minZ = Double.POSITIVE_INFINITY;
        for (double x : new double[]{0, w})
            for (double y : new double[]{0, h}) minZ = Math.min(minZ, pose.targetToCamera(x, y)[2]);
        if (minZ < MIN_DEPTH_M)
            return Optional.of(String.format(Locale.ROOT, "puts the target %s the camera (a page corner at Z = %.4f m; every corner must be at Z >= %.3f m)",
                    minZ <= 0 ? "behind" : "against", minZ, MIN_DEPTH_M));
        double[] centre = pose.targetToCamera(w / 2, h / 2);
        double[] n = {pose.r(0, 2), pose.r(1, 2), pose.r(2, 2)};
        double cos = Math.abs(n[0] * centre[0] + n[1] * centre[1] + n[2] * centre[2]) / Math.sqrt(centre[0] * centre[0] + centre[1] * centre[1] + centre[2] * centre[2]);
        double angle = Math.toDegrees(Math.acos(Math.min(1, cos)));
        if (angle > EDGE_ON_DEG)
            return Optional.of(String.format(Locale.ROOT, "shows the target nearly edge-on (%.1f° between the page normal and the line of sight; at most %.0f°)",
                    angle, EDGE_ON_DEG));
        return Optional.empty();
    }
}
