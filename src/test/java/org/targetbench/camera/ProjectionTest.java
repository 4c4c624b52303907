package org.targetbench.camera;

import org.junit.jupiter.api.Test;
import org.targetbench.TestScenes;
import org.targetbench.target.TargetDesign;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

class ProjectionTest {
    /** Agreement of two exact computations of the same projection, pixels. */
    private static final double NUMERIC_PX = 1e-8;

    @Test
    void homographyBetweenViewsAgreesWithProjectingTargetPoints() {
        TargetDesign d = TestScenes.checkerboard();
        CameraModel cam = TestScenes.VGA;
        SplittableRandom rng = new SplittableRandom(5);
        Pose ref = Pose.facing(d.widthMm(), d.heightMm(), 0.35, 0, 0, 0, 0, 0);
        for (int k = 0; k < 10; k++) {
            Pose other = Pose.facing(d.widthMm(), d.heightMm(), 0.3 + 0.2 * rng.nextDouble(),
                    40 * rng.nextDouble() - 20, 40 * rng.nextDouble() - 20, 360 * rng.nextDouble(), 0.02 * rng.nextDouble(), 0);
            Homography h = Projection.referenceToFrame(cam, ref, other);
            for (int i = 0; i < 20; i++) {
                double x = rng.nextDouble() * d.widthMm(), y = rng.nextDouble() * d.heightMm();
                double[] a = Projection.projectTargetPoint(cam, ref, x, y);
                double[] b = Projection.projectTargetPoint(cam, other, x, y);
                double[] m = h.apply(a[0], a[1]);
                assertEquals(b[0], m[0], NUMERIC_PX);
                assertEquals(b[1], m[1], NUMERIC_PX);
            }
        }
    }

    @Test
    void facingPoseCentresTheTarget() {
        Pose p = Pose.facing(200, 100, 0.5, 0, 0, 0, 0, 0);
        double[] c = Projection.projectTargetPoint(TestScenes.VGA, p, 100, 50);
        assertEquals(TestScenes.VGA.cx(), c[0], NUMERIC_PX);
        assertEquals(TestScenes.VGA.cy(), c[1], NUMERIC_PX);
        // a 200 mm target at 0.5 m with f = 532 px spans 212.8 px
        double[] l = Projection.projectTargetPoint(TestScenes.VGA, p, 0, 50), r = Projection.projectTargetPoint(TestScenes.VGA, p, 200, 50);
        assertEquals(532 * 0.2 / 0.5, r[0] - l[0], NUMERIC_PX);
    }

    @Test
    void distortedCameraHasNoHomography() {
        CameraModel cam = new CameraModel(640, 480, 500, 500, 320, 240, -0.1, 0, 0, 0, 0);
        Pose p = Pose.facing(100, 100, 0.5, 0, 0, 0, 0, 0);
        assertThrows(IllegalArgumentException.class, () -> Projection.referenceToFrame(cam, p, p));
    }

    @Test
    void undistortionInvertsDistortion() {
        CameraModel cam = new CameraModel(640, 480, 500, 505, 322, 241, -0.25, 0.08, -0.01, 0.001, -0.0007);
        var toPx = cam.normalisedToPixel();
        var toN = cam.pixelToNormalised();
        var px = new georegression.struct.point.Point2D_F64();
        var back = new georegression.struct.point.Point2D_F64();
        for (double x = -0.5; x <= 0.5; x += 0.1)
            for (double y = -0.4; y <= 0.4; y += 0.1) {
                toPx.compute(x, y, px);
                toN.compute(px.x, px.y, back);
                assertEquals(x, back.x, 1e-7);
                assertEquals(y, back.y, 1e-7);
            }
    }

    @Test
    void homographyInverseAndComposition() {
        Homography h = new Homography(new double[]{0.9, -0.2, 30, 0.1, 1.1, -5, 1e-4, -2e-4, 1});
        Homography id = h.after(h.inverse());
        double[] p = id.apply(123, 45);
        assertEquals(123, p[0], 1e-9);
        assertEquals(45, p[1], 1e-9);
        assertThrows(IllegalArgumentException.class, () -> new Homography(new double[]{1, 2, 3, 2, 4, 6, 0, 0, 1}));
    }

    @Test
    void poseRejectsNonRotations() {
        var e = assertThrows(IllegalArgumentException.class, () -> new Pose(new double[]{1, 0, 0, 0, 1, 0, 0, 0, 2}, new double[]{0, 0, 1}));
        assertTrue(e.getMessage().contains("orthonormal"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new Pose(new double[]{1, 0, 0, 0, 1, 0, 0, 0, -1}, new double[]{0, 0, 1}));
    }
}
