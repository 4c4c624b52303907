package org.targetbench.camera;

import org.junit.jupiter.api.Test;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The feasibility check against hand-computed pinhole numbers: a fronto-parallel plane at depth Z is imaged at f / Z
 * pixels per unit length everywhere (pinhole projection x = f X / Z; Hartley &amp; Zisserman 2004, ch. 6, from memory), and pass/warn/fail follow
 * the documented thresholds.
 */
class FeasibilityTest {
    /** Tolerance of the central-difference scale, px (derived: the pinhole scale is exact, so only rounding remains). */
    static final double PX_TOL = 1e-6;
    static final CameraModel CAM = CameraModel.pinhole(640, 480, 500, 500, 319.5, 239.5);

    private static FeasibilityReport.Check line(FeasibilityReport r, String name) {
        return r.checks().stream().filter(c -> c.name().equals(name)).findFirst().orElseThrow();
    }

    @Test
    void squareOnSizesAreFOverZ() {
        TargetDesign cb = TargetGenerators.checkerboard("cb", 7, 9, 15, 15);
        FeasibilityReport r = Feasibility.check(cb, CAM, 0.5, 0, new FeasibilityConfig());
        // 15 mm at 0.5 m with f = 500 px: 15 px; quiet zone 15 mm: 15 px
        assertEquals(15, line(r, "smallest feature").value(), PX_TOL);
        assertEquals(15, line(r, "feature spacing").value(), PX_TOL);
        assertEquals(15, line(r, "quiet zone").value(), PX_TOL);
        // page 165 x 135 mm -> 165 x 135 px of 640 x 480
        assertEquals(100.0 * 165 * 135 / (640 * 480), line(r, "field of view filled").value(), 1e-6);
        assertEquals(FeasibilityReport.Status.PASS, line(r, "smallest feature").status()); // 15 >= 1.25 x 10
        assertEquals(FeasibilityReport.Status.PASS, line(r, "target in view").status());
    }

    @Test
    void thresholdsGradePassWarnFail() {
        TargetDesign cb = TargetGenerators.checkerboard("cb", 7, 9, 15, 15);
        FeasibilityConfig cfg = new FeasibilityConfig(); // h = 4 px: threshold 2h + 2 = 10 px, warn below 12.5 px
        // 15 mm -> 11 px at Z = 500 * 15 / 11 mm: warn; -> 9 px: fail
        assertEquals(FeasibilityReport.Status.WARN, line(Feasibility.check(cb, CAM, 0.5 * 15 / 11, 0, cfg), "smallest feature").status());
        FeasibilityReport far = Feasibility.check(cb, CAM, 0.5 * 15 / 9, 0, cfg);
        assertEquals(FeasibilityReport.Status.FAIL, line(far, "smallest feature").status());
        assertEquals(FeasibilityReport.Status.FAIL, far.overall());
        assertEquals(FeasibilityReport.Status.WARN, line(far, "field of view filled").status()); // small in view
    }

    @Test
    void tiltShrinksFeaturesAndCanPushThePageOutOfView() {
        TargetDesign cb = TargetGenerators.checkerboard("cb", 7, 9, 15, 15);
        double square = line(Feasibility.check(cb, CAM, 0.3, 0, new FeasibilityConfig()), "smallest feature").value();
        FeasibilityReport tilted = Feasibility.check(cb, CAM, 0.3, 30, new FeasibilityConfig());
        double worst = line(tilted, "smallest feature").value();
        // at least foreshortened by cos 30 deg and farther away; never larger
        assertTrue(worst < square * Math.cos(Math.toRadians(30)), "tilted " + worst + " vs square on " + square);
        // close up the page no longer fits: 165 mm at 0.15 m is 550 px wide, tilted it leaves the 640 px image
        FeasibilityReport close = Feasibility.check(cb, CAM, 0.15, 30, new FeasibilityConfig());
        assertEquals(FeasibilityReport.Status.FAIL, line(close, "target in view").status());
    }

    @Test
    void checkerboardBorderBelowOneSquareWarns() {
        // common practice in chessboard detection, no formal source: a white border of at least one square
        TargetDesign thin = TargetGenerators.checkerboard("thin", 7, 9, 15, 8);
        FeasibilityReport.Check q = line(Feasibility.check(thin, CAM, 0.5, 0, new FeasibilityConfig()), "quiet zone");
        assertEquals(FeasibilityReport.Status.WARN, q.status());
        TargetDesign dots = TargetGenerators.dotGrid("dots", 4, 5, 20, 10, 8);
        assertEquals(FeasibilityReport.Status.PASS, line(Feasibility.check(dots, CAM, 0.5, 0, new FeasibilityConfig()), "quiet zone").status());
    }

    @Test
    void misuseIsRefusedWithNumbers() {
        TargetDesign cb = TargetGenerators.checkerboard("cb", 7, 9, 15, 15);
        var e = assertThrows(IllegalArgumentException.class, () -> Feasibility.check(cb, CAM, -0.2, 0, new FeasibilityConfig()));
        assertTrue(e.getMessage().contains("-0.2"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Feasibility.check(cb, CAM, 0.2, 85, new FeasibilityConfig()));
        assertTrue(e.getMessage().contains("85"), e.getMessage());
    }
}
