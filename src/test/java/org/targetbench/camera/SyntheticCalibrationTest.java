package org.targetbench.camera;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Calibration on rendered views of a checkerboard with a white border, seen by a camera with known intrinsics and
 * lens distortion: ground truth by construction.
 */
class SyntheticCalibrationTest {
    /** The true camera: 640 x 480, slightly unequal focal lengths, off-centre principal point, barrel distortion. */
    static final CameraModel TRUE = new CameraModel(640, 480, 610.0, 606.0, 324.3, 236.8, -0.12, 0.05, 0, 0.0005, -0.0004);
    /** Allowed relative error of fx and fy on noise-free synthetic views (common practice, no source). */
    static final double F_TOL = 0.005;
    /** Allowed error of cx and cy, px (common practice, no source). */
    static final double C_TOL_PX = 1.0;
    /** Sensor noise of the renders, grey levels, and its seed. */
    static final double NOISE = 1.0;
    static final long SEED = 7;

    /** Largest mean offset of detected corners from the true ones, px, after the BoofCV convention correction (common practice, no source). */
    static final double MEAN_OFFSET_TOL_PX = 0.05;

    static TargetDesign board;
    static List<Pose> poses;

    @BeforeAll
    static void scene() {
        // 10 x 7 squares of 20 mm (9 x 6 inner corners) with a one-square white border: 240 x 180 mm
        board = TargetGenerators.checkerboard("calib-board", 7, 10, 20, 20);
        double w = board.widthMm(), h = board.heightMm();
        poses = new ArrayList<>();
        double[][] views = { // distance m, tilt x, tilt y, roll deg, offset x, offset y m: the board near the edges and corners, tilted
                {0.42, 0, 0, 0, 0, 0}, {0.40, 35, 0, 0, 0, 0.02}, {0.40, -35, 0, 5, 0, -0.02}, {0.40, 0, 40, 0, 0.03, 0},
                {0.40, 0, -40, -5, -0.03, 0}, {0.42, 25, 25, 10, 0.05, 0.035}, {0.42, -25, 25, -10, -0.05, 0.035},
                {0.42, 25, -25, 15, 0.05, -0.035}, {0.42, -25, -25, -15, -0.05, -0.035}, {0.50, 10, -10, 90, 0, 0},
                {0.38, 20, 10, 30, 0.01, 0}, {0.40, -10, 20, -30, 0, -0.01}};
        for (double[] v : views) poses.add(Pose.facing(w, h, v[0], v[1], v[2], v[3], v[4], v[5]));
    }

    private static List<Optional<double[]>> detectAll(Calibration cal, CameraModel camera, List<Pose> ps) {
        RenderConfig rc = new RenderConfig();
        rc.noiseSigma = NOISE;
        SyntheticRenderer r = new SyntheticRenderer(camera, rc);
        List<Optional<double[]>> found = new ArrayList<>();
        for (int i = 0; i < ps.size(); i++) found.add(cal.detect(r.render(board, ps.get(i), SEED + i).image()));
        return found;
    }

    private static List<String> names(int n) {
        List<String> names = new ArrayList<>();
        for (int i = 0; i < n; i++) names.add("view_" + i);
        return names;
    }

    @Test
    void detectedCornersFollowThePixelCentreConvention() {
        CameraModel pinhole = CameraModel.pinhole(640, 480, TRUE.fx(), TRUE.fy(), TRUE.cx(), TRUE.cy());
        Calibration cal = new Calibration(new Calibration.Board(9, 6, 20), new CalibrationConfig());
        SyntheticRenderer r = new SyntheticRenderer(pinhole, new RenderConfig());
        for (Pose p : poses.subList(0, 4)) {
            SyntheticRenderer.Rendered view = r.render(board, p);
            double[] d = cal.detect(view.image()).orElseThrow();
            double sx = 0, sy = 0;
            for (int k = 0; k < d.length / 2; k++) {
                double best = Double.MAX_VALUE, bx = 0, by = 0;
                for (var f : view.features()) {
                    double dx = d[2 * k] - f.u(), dy = d[2 * k + 1] - f.v();
                    if (dx * dx + dy * dy < best) { best = dx * dx + dy * dy; bx = dx; by = dy; }
                }
                sx += bx;
                sy += by;
            }
            int n = d.length / 2;
            assertEquals(0, sx / n, MEAN_OFFSET_TOL_PX, "mean x offset");
            assertEquals(0, sy / n, MEAN_OFFSET_TOL_PX, "mean y offset");
        }
    }

    @Test
    void recoversKnownIntrinsics() {
        Calibration cal = new Calibration(new Calibration.Board(9, 6, 20), new CalibrationConfig());
        List<Optional<double[]>> found = detectAll(cal, TRUE, poses);
        assertTrue(found.stream().filter(Optional::isPresent).count() >= 10, "views found: " + found.stream().filter(Optional::isPresent).count());
        CalibrationResult r = assertInstanceOf(CalibrationResult.class, cal.solve(640, 480, names(poses.size()), found));
        CameraModel c = r.camera();
        assertEquals(TRUE.fx(), c.fx(), F_TOL * TRUE.fx(), "fx");
        assertEquals(TRUE.fy(), c.fy(), F_TOL * TRUE.fy(), "fy");
        assertEquals(TRUE.cx(), c.cx(), C_TOL_PX, "cx");
        assertEquals(TRUE.cy(), c.cy(), C_TOL_PX, "cy");
        assertTrue(r.outliers().isEmpty(), "no outliers among consistent views: " + r.outliers());
    }

    @Test
    void aViewFromAnotherLensIsFlaggedAndTooFewViewsFail() {
        Calibration cal = new Calibration(new Calibration.Board(9, 6, 20), new CalibrationConfig());
        List<Optional<double[]>> found = detectAll(cal, TRUE, poses.subList(0, 9));
        // the last view through a lens zoomed by 4 %: no single camera explains it
        CameraModel zoomed = new CameraModel(640, 480, TRUE.fx() * 1.04, TRUE.fy() * 1.04, TRUE.cx(), TRUE.cy(), TRUE.k1(), TRUE.k2(), 0, TRUE.p1(), TRUE.p2());
        found.addAll(detectAll(cal, zoomed, List.of(poses.get(5))));
        CalibrationResult r = assertInstanceOf(CalibrationResult.class, cal.solve(640, 480, names(found.size()), found));
        assertEquals(List.of("view_9"), r.outliers().stream().map(CalibrationResult.View::name).toList());

        Calibration.Outcome few = cal.solve(640, 480, names(2), found.subList(0, 2));
        Calibration.Failure f = assertInstanceOf(Calibration.Failure.class, few);
        assertEquals(Calibration.Failure.Kind.TOO_FEW_VIEWS, f.kind());
        assertEquals(3, f.minViews());
    }
}
