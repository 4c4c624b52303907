package org.targetbench.camera;

import georegression.geometry.ConvertRotation3D_F64;
import org.ejml.data.DMatrixRMaj;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetMetrics;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Will a camera resolve a printed target at a stand-off? Checked before printing, for the square-on view at the
 * stand-off and for the target tilted by up to a given angle about any axis in its plane (through its centre).
 *
 * <p>Sizes on the page become sizes in the image through the local scale of the target-to-image mapping: at a page
 * point the 2 x 2 Jacobian J of (x, y) mm -> (u, v) px (lens distortion included, central differences) maps a length
 * L in direction d to |J d| L pixels, at least σ_min(J) L [1, ch. 2.3]. The check takes the smallest σ_min over a grid
 * of page points and over the tried poses, so each size in pixels is the worst case.
 *
 * <p>Lines, in order, each pass, warn (passes by less than {@link FeasibilityConfig#warnMargin}) or fail:
 * <ol>
 *   <li>smallest feature in pixels against 2h + 2 for a window of half-size h: derived, the window (2h + 1 px) must
 *       fit inside one square (one feature);</li>
 *   <li>feature (corner) spacing in pixels against the same 2h + 2: derived, the window around one feature must not
 *       take in the next;</li>
 *   <li>quiet zone in pixels: below h + 1 px fails (derived: the window around an outermost feature must see only the
 *       page); for a checkerboard, a border narrower than one square warns (common practice in chessboard detection,
 *       no formal source);</li>
 *   <li>fraction of the image the square-on target fills, against {@link FeasibilityConfig#minFillFraction} and
 *       {@link FeasibilityConfig#maxFillFraction} (rules of thumb, no source; a warning at most);</li>
 *   <li>whether the whole page stays inside the image at every tried pose (fails otherwise);</li>
 *   <li>for dot designs, the worst perspective bias of the imaged dot centres over the tried poses ({@link DotBiasCheck};
 *       a warning at most).</li>
 * </ol>
 *
 * <p>Caveats: no blur, motion or depth-of-field model; a pose is the camera looking at the target's centre, so
 * off-centre views (which the arm will also make) need their own margin.
 *
 * <p>References: [1] R. Hartley, A. Zisserman, Multiple View Geometry in Computer Vision, 2nd ed., Cambridge
 * University Press, 2004.
 */
public final class Feasibility {
    /** Step of the central differences of the Jacobian, millimetres on the page. */
    private static final double STEP_MM = 0.05;
    /** Points per page edge when the page outline is projected (distortion bends the edges). */
    private static final int EDGE_SAMPLES = 24;

    private Feasibility() {}

    /**
     * @param standoffM distance from the camera to the target's centre along the optical axis, metres, &gt; 0
     * @param maxTiltDeg largest tilt of the target about an axis in its plane, degrees, 0 to 80
     * @throws IllegalArgumentException for a non-positive stand-off, a tilt outside 0..80 degrees or a bad config
     */
    public static FeasibilityReport check(TargetDesign design, CameraModel camera, double standoffM, double maxTiltDeg,
                                          FeasibilityConfig config) {
        config.checkValidity();
        if (!(standoffM > 0) || !Double.isFinite(standoffM)) throw new IllegalArgumentException("stand-off must be > 0 m, got " + standoffM);
        if (!(maxTiltDeg >= 0 && maxTiltDeg <= 80)) throw new IllegalArgumentException("tilt must be within 0..80 degrees, got " + maxTiltDeg);
        TargetMetrics m = TargetMetrics.of(design);
        int h = config.windowHalfSizePx;
        double window = 2 * h + 2;

        List<Pose> poses = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        poses.add(tilted(design, standoffM, 0, 0));
        labels.add("square on");
        if (maxTiltDeg > 0)
            for (int k = 0; k < config.tiltDirections; k++) {
                double phi = 360.0 * k / config.tiltDirections;
                poses.add(tilted(design, standoffM, phi, maxTiltDeg));
                labels.add(String.format(Locale.ROOT, "tilted %s deg about the page axis at %s deg from x", fmt(maxTiltDeg, 0), fmt(phi, 0)));
            }

        double q = design.quietZoneMm();
        double patternScale = Double.POSITIVE_INFINITY, pageScale = Double.POSITIVE_INFINITY;
        String patternWorst = labels.get(0);
        String outOfView = null;
        for (int i = 0; i < poses.size(); i++) {
            Pose pose = poses.get(i);
            double s = minScale(camera, pose, q, q, design.widthMm() - q, design.heightMm() - q, config.samplesPerSide);
            if (s < patternScale) { patternScale = s; patternWorst = labels.get(i); }
            pageScale = Math.min(pageScale, minScale(camera, pose, 0, 0, design.widthMm(), design.heightMm(), config.samplesPerSide));
            if (outOfView == null && !inView(camera, pose, outline(design))) outOfView = labels.get(i);
        }

        List<FeasibilityReport.Check> checks = new ArrayList<>();
        String win = "2h+2 = " + fmt(window, 0) + " px for a window of half-size h = " + h + " px";
        double featPx = m.smallestFeatureMm() * patternScale;
        checks.add(graded("smallest feature", featPx, window, config.warnMargin,
                m.smallestFeature() + " " + fmt(m.smallestFeatureMm(), 1) + " mm -> " + fmt(featPx, 1) + " px (worst: " + patternWorst + ")",
                ">= " + win, "derived: the window must fit inside one square"));
        if (Double.isNaN(m.featureSpacingMm())) {
            checks.add(new FeasibilityReport.Check("feature spacing", FeasibilityReport.Status.PASS, Double.NaN, "px",
                    "fewer than two features", ">= " + win, "derived: the window around one feature must not take in the next"));
        } else {
            double spacePx = m.featureSpacingMm() * patternScale;
            checks.add(graded("feature spacing", spacePx, window, config.warnMargin,
                    fmt(m.featureSpacingMm(), 1) + " mm -> " + fmt(spacePx, 1) + " px (worst: " + patternWorst + ")",
                    ">= " + win, "derived: the window around one feature must not take in the next"));
        }
        checks.add(quietZone(m, pageScale, h, config.warnMargin));

        double fill = fill(camera, poses.get(0), outline(design));
        FeasibilityReport.Status fillStatus = fill < config.minFillFraction || fill > config.maxFillFraction
                ? FeasibilityReport.Status.WARN : FeasibilityReport.Status.PASS;
        checks.add(new FeasibilityReport.Check("field of view filled", fillStatus, 100 * fill, "%",
                fmt(100 * fill, 1) + " % of the image (square on)",
                fmt(100 * config.minFillFraction, 0) + " % to " + fmt(100 * config.maxFillFraction, 0) + " %",
                "rule of thumb, common practice, no source"));
        checks.add(new FeasibilityReport.Check("target in view", outOfView == null ? FeasibilityReport.Status.PASS : FeasibilityReport.Status.FAIL,
                outOfView == null ? 1 : 0, "", outOfView == null ? "whole page inside the image at every pose tried"
                : "page leaves the image when " + outOfView, "whole page inside the image", "derived: geometry"));
        if (DotBias.hasDots(design)) checks.add(DotBiasCheck.check(design, camera, poses, labels, config.maxDotBiasPx));
        return new FeasibilityReport(design.id(), standoffM, maxTiltDeg, checks);
    }

    private static FeasibilityReport.Check quietZone(TargetMetrics m, double scale, int h, double warnMargin) {
        double px = m.quietZoneMm() * scale, min = h + 1;
        String measured = fmt(m.quietZoneMm(), 1) + " mm -> " + fmt(px, 1) + " px";
        if (px < min)
            return new FeasibilityReport.Check("quiet zone", FeasibilityReport.Status.FAIL, px, "px", measured, ">= h+1 = " + fmt(min, 0) + " px",
                    "derived: the window around an outermost feature must see only the page");
        if (m.isCheckerboard()) {
            boolean ok = m.quietZoneMm() >= m.squareMm() - 1e-9;
            return new FeasibilityReport.Check("quiet zone", ok ? FeasibilityReport.Status.PASS : FeasibilityReport.Status.WARN, px, "px", measured,
                    ">= one square (" + fmt(m.squareMm(), 1) + " mm) and >= h+1 = " + fmt(min, 0) + " px",
                    "common practice in chessboard detection, no formal source; h+1 derived");
        }
        return graded("quiet zone", px, min, warnMargin, measured, ">= h+1 = " + fmt(min, 0) + " px",
                "derived: the window around an outermost feature must see only the page");
    }

    private static FeasibilityReport.Check graded(String name, double value, double threshold, double warnMargin, String measured,
                                                  String thresholdText, String basis) {
        FeasibilityReport.Status s = value < threshold ? FeasibilityReport.Status.FAIL
                : value < threshold * warnMargin ? FeasibilityReport.Status.WARN : FeasibilityReport.Status.PASS;
        return new FeasibilityReport.Check(name, s, value, "px", measured, thresholdText, basis);
    }

    /** The target tilted by {@code tiltDeg} about the in-plane axis at {@code axisDeg} from its x axis, centred at the stand-off. */
    static Pose tilted(TargetDesign d, double standoffM, double axisDeg, double tiltDeg) {
        double a = Math.toRadians(axisDeg);
        DMatrixRMaj r = ConvertRotation3D_F64.rodriguesToMatrix(Math.cos(a), Math.sin(a), 0, Math.toRadians(tiltDeg), null);
        double[] rr = r.data;
        double cx = d.widthMm() / 2000, cy = d.heightMm() / 2000;
        return new Pose(rr.clone(), new double[]{-(rr[0] * cx + rr[1] * cy), -(rr[3] * cx + rr[4] * cy), standoffM - (rr[6] * cx + rr[7] * cy)});
    }

    /** Smallest singular value of the mm-to-px Jacobian over a grid of points in [x0, x1] x [y0, y1], px per mm. */
    private static double minScale(CameraModel cam, Pose pose, double x0, double y0, double x1, double y1, int n) {
        double best = Double.POSITIVE_INFINITY;
        for (int j = 0; j < n; j++)
            for (int i = 0; i < n; i++) {
                double x = x0 + (x1 - x0) * i / (n - 1), y = y0 + (y1 - y0) * j / (n - 1);
                double[] px = Projection.projectTargetPoint(cam, pose, x + STEP_MM, y), mx = Projection.projectTargetPoint(cam, pose, x - STEP_MM, y);
                double[] py = Projection.projectTargetPoint(cam, pose, x, y + STEP_MM), my = Projection.projectTargetPoint(cam, pose, x, y - STEP_MM);
                double a = (px[0] - mx[0]) / (2 * STEP_MM), c = (px[1] - mx[1]) / (2 * STEP_MM);
                double b = (py[0] - my[0]) / (2 * STEP_MM), d = (py[1] - my[1]) / (2 * STEP_MM);
                double s = a * a + b * b + c * c + d * d, det = a * d - b * c;
                double sigmaMin = Math.sqrt(Math.max(0, (s - Math.sqrt(Math.max(0, s * s - 4 * det * det))) / 2));
                if (Double.isNaN(sigmaMin)) return 0; // behind the camera
                best = Math.min(best, sigmaMin);
            }
        return best;
    }

    /** Points along the page's outline, clockwise from the top-left corner, millimetres. */
    private static List<double[]> outline(TargetDesign d) {
        double w = d.widthMm(), h = d.heightMm();
        double[][] corners = {{0, 0}, {w, 0}, {w, h}, {0, h}};
        List<double[]> pts = new ArrayList<>();
        for (int k = 0; k < 4; k++) {
            double[] a = corners[k], b = corners[(k + 1) % 4];
            for (int i = 0; i < EDGE_SAMPLES; i++) {
                double t = (double) i / EDGE_SAMPLES;
                pts.add(new double[]{a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])});
            }
        }
        return pts;
    }

    private static boolean inView(CameraModel cam, Pose pose, List<double[]> outline) {
        for (double[] p : outline) {
            double[] uv = Projection.projectTargetPoint(cam, pose, p[0], p[1]);
            if (Double.isNaN(uv[0]) || !cam.inImage(uv[0], uv[1])) return false;
        }
        return true;
    }

    /** Fraction of the image covered by the projected page outline, clipped to the image (Sutherland-Hodgman). */
    private static double fill(CameraModel cam, Pose pose, List<double[]> outline) {
        List<double[]> poly = new ArrayList<>();
        for (double[] p : outline) {
            double[] uv = Projection.projectTargetPoint(cam, pose, p[0], p[1]);
            if (Double.isNaN(uv[0])) return Double.NaN;
            poly.add(uv);
        }
        // image area [-0.5, w-0.5] x [-0.5, h-0.5] in the pixel-centre convention
        double lo = -0.5, hiX = cam.width() - 0.5, hiY = cam.height() - 0.5;
        poly = clip(poly, 0, lo, true);
        poly = clip(poly, 0, hiX, false);
        poly = clip(poly, 1, lo, true);
        poly = clip(poly, 1, hiY, false);
        double area = 0;
        for (int i = 0, j = poly.size() - 1; i < poly.size(); j = i++)
            area += poly.get(j)[0] * poly.get(i)[1] - poly.get(i)[0] * poly.get(j)[1];
        return Math.abs(area) / 2 / ((double) cam.width() * cam.height());
    }

    private static List<double[]> clip(List<double[]> in, int axis, double bound, boolean keepAbove) {
        List<double[]> out = new ArrayList<>();
        for (int i = 0; i < in.size(); i++) {
            double[] a = in.get(i), b = in.get((i + 1) % in.size());
            boolean ina = keepAbove ? a[axis] >= bound : a[axis] <= bound, inb = keepAbove ? b[axis] >= bound : b[axis] <= bound;
            if (ina) out.add(a);
            if (ina != inb) {
                double t = (bound - a[axis]) / (b[axis] - a[axis]);
                out.add(new double[]{a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])});
            }
        }
        return out;
    }

    static String fmt(double v, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "f", v);
    }
}
