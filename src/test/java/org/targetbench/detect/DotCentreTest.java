package org.targetbench.detect;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.DotBias;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The dot detector's centres against the analytic centre of the imaged conic, and with bias correction against the
 * projected dot centre, on a supersampled render of the worked case of {@code camera.DotBiasTest}: a 20 mm dot tilted
 * 45 degrees about the page x axis, 250 mm from the camera on the optical axis, f = 532 px (the demo camera; a 201 x 201
 * crop around the principal point keeps the render cheap).
 *
 * <p>Derived: the analytic conic centre lies f R² sinθ cosθ / (Z² - R² sin²θ) = 0.4259 px from the projected centre.
 * Measured (16 x 16 supersampling, no noise, no quantisation): the ellipse-fit centre lands 0.008 px from the analytic
 * conic centre (0.434 px from the projected centre) and, with the correction on, 0.008 px from the projected centre;
 * the grey-weighted centroid 0.0005 px and 0.0005 px. Tolerance 0.05 px.
 */
class DotCentreTest {
    /** Tolerance of the detected centre, pixels (common practice, no source; measured 0.008 px, above). */
    static final double TOL_PX = 0.05;
    static final CameraModel CAMERA = CameraModel.pinhole(201, 201, 532, 532, 100, 100);

    static TargetDesign oneDot() {
        return TargetGenerators.dotGrid("dot20", 1, 1, 30, 20, 20);
    }

    @Test
    void ellipseFitLandsOnTheConicCentreAndCorrectionOnTheProjectedCentre() {
        check(DotConfig.CentreMethod.ELLIPSE);
    }

    @Test
    void greyCentroidLandsOnTheConicCentreAndCorrectionOnTheProjectedCentre() {
        check(DotConfig.CentreMethod.CENTROID);
    }

    private static void check(DotConfig.CentreMethod method) {
        TargetDesign d = oneDot();
        Pose pose = Pose.facing(d.widthMm(), d.heightMm(), 0.25, 45, 0, 0, 0, 0);
        RenderConfig rc = new RenderConfig();
        rc.supersample = 16;
        rc.quantise = false;
        GrayF32 img = new SyntheticRenderer(CAMERA, rc).render(d, pose).image();
        DotConfig c = new DotConfig();
        c.centre = method;
        List<Detection> found = Detectors.create(c).detect(img);
        assertEquals(1, found.size(), "one dot: " + found);
        double[] conic = DotBias.imagedCentre(CAMERA, pose, d.features().get(0).xMm(), d.features().get(0).yMm(), 10);
        double[] truth = Projection.projectTargetPoint(CAMERA, pose, d.features().get(0).xMm(), d.features().get(0).yMm());
        Detection p = found.get(0);
        double toConic = Math.hypot(p.x() - conic[0], p.y() - conic[1]);
        Detection q = DotBiasCorrection.correct(found, d, CAMERA, pose).get(0);
        double toTruth = Math.hypot(q.x() - truth[0], q.y() - truth[1]);
        assertTrue(toConic <= TOL_PX, method + ": " + toConic + " px from the conic centre");
        assertTrue(toTruth <= TOL_PX, method + ": corrected centre " + toTruth + " px from the projected centre");
    }
}
