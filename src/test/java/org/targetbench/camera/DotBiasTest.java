package org.targetbench.camera;

import org.junit.jupiter.api.Test;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The perspective bias of an imaged dot: the centre of the image conic H⁻ᵀ C H⁻¹ against the projection of the dot's
 * centre.
 *
 * <p>Worked value, derived: a circle of radius R whose centre is on the optical axis at depth Z, tilted by θ about an
 * axis in its plane, images to an ellipse symmetric about the tilt plane; its extreme points on that axis are the
 * images f R cosθ / (Z ± R sinθ) of the ends of the diameter in the tilt plane, so the ellipse centre lies
 * f R² sinθ cosθ / (Z² - R² sin²θ) from the principal point, where the centre projects. For the demo camera
 * (f = 532 px), a 20 mm dot (R = 10 mm) at Z = 250 mm tilted 45°: 532 · 50 / 62450 = 0.42594 px.
 */
class DotBiasTest {
    static final CameraModel DEMO = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);
    /** Derived above, pixels. */
    static final double WORKED_BIAS_PX = 532.0 * 100 * Math.sin(Math.PI / 4) * Math.cos(Math.PI / 4) / (250.0 * 250 - 100 * 0.5);

    static TargetDesign oneDot() {
        return TargetGenerators.dotGrid("dot20", 1, 1, 30, 20, 20);
    }

    @Test
    void conicCentreBiasMatchesTheDerivedValue() {
        TargetDesign d = oneDot();
        Pose pose = Pose.facing(d.widthMm(), d.heightMm(), 0.25, 45, 0, 0, 0, 0);
        List<DotBias.DotView> v = DotBias.view(d, DEMO, pose);
        assertEquals(1, v.size());
        assertEquals(0.42594, WORKED_BIAS_PX, 1e-5);
        assertEquals(WORKED_BIAS_PX, v.get(0).biasPx(), 1e-9);
        assertEquals(0, v.get(0).conicU() - v.get(0).trueU(), 1e-9, "tilt about x moves the centre along y only");
    }

    @Test
    void squareOnViewHasNoBias() {
        TargetDesign d = TargetGenerators.dotGrid("grid", 6, 8, 20, 10, 10);
        assertEquals(0, DotBias.worst(d, DEMO, Pose.facing(d.widthMm(), d.heightMm(), 0.26, 0, 0, 0, 0, 0)), 1e-9);
    }

    @Test
    void numericCentreForDistortedCamerasAgreesWithTheConicWhenDistortionVanishes() {
        CameraModel almost = new CameraModel(640, 480, 532, 532, 319.5, 239.5, 1e-12, 0, 0, 0, 0);
        assertTrue(almost.isDistorted());
        TargetDesign d = TargetGenerators.dotGrid("grid", 6, 8, 20, 10, 10);
        Pose pose = Pose.facing(d.widthMm(), d.heightMm(), 0.26, 30, -20, 10, 0.01, 0);
        List<DotBias.DotView> a = DotBias.view(d, DEMO, pose), b = DotBias.view(d, almost, pose);
        assertEquals(a.size(), b.size());
        for (int i = 0; i < a.size(); i++) {
            assertEquals(a.get(i).conicU(), b.get(i).conicU(), 1e-6);
            assertEquals(a.get(i).conicV(), b.get(i).conicV(), 1e-6);
        }
    }

    @Test
    void ellipseFitRecoversAKnownEllipse() {
        // x = 50 + 20 cos t cos 0.3 - 8 sin t sin 0.3, y = 40 + 20 cos t sin 0.3 + 8 sin t cos 0.3
        int n = 40;
        double[] xs = new double[n], ys = new double[n];
        for (int i = 0; i < n; i++) {
            double t = 2 * Math.PI * i / n;
            xs[i] = 50 + 20 * Math.cos(t) * Math.cos(0.3) - 8 * Math.sin(t) * Math.sin(0.3);
            ys[i] = 40 + 20 * Math.cos(t) * Math.sin(0.3) + 8 * Math.sin(t) * Math.cos(0.3);
        }
        double[] q = Conics.fitEllipse(xs, ys, n).orElseThrow();
        double[] c = Conics.centre(q), ax = Conics.semiAxes(q);
        assertEquals(50, c[0], 1e-9);
        assertEquals(40, c[1], 1e-9);
        assertEquals(20, ax[0], 1e-9);
        assertEquals(8, ax[1], 1e-9);
        for (int i = 0; i < n; i++) assertEquals(0, Conics.distance(q, xs[i], ys[i]), 1e-9);
    }
}
