package org.targetbench.detect;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.targetbench.TestScenes;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetDesign;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Ground truth from synthetic renders: Shi-Tomasi (with its sub-pixel refinement) must find every checkerboard
 * x-corner of a clean render within {@value #TOLERANCE_PX} px of its true, analytically projected position.
 */
class RenderTruthTest {
    /** Required localisation of each x-corner, pixels (common practice, no source: half a pixel, the usual bar for a sub-pixel corner). */
    static final double TOLERANCE_PX = 0.5;

    @ParameterizedTest(name = "tiltX={0} tiltY={1} roll={2} distorted={3}")
    @CsvSource({"0,0,0,false", "0,0,17,false", "25,-10,5,false", "-35,20,-60,false", "10,10,30,true"})
    void shiTomasiFindsEveryXCorner(double tiltX, double tiltY, double roll, boolean distorted) {
        TargetDesign design = TestScenes.checkerboard();
        CameraModel cam = distorted
                ? new CameraModel(640, 480, 532, 530, 321.2, 238.7, -0.21, 0.05, 0, 0.0008, -0.0005)
                : TestScenes.VGA;
        var rendered = new SyntheticRenderer(cam, new RenderConfig())
                .render(design, Pose.facing(design.widthMm(), design.heightMm(), 0.35, tiltX, tiltY, roll, 0.004, -0.003));
        assertEquals(design.features().size(), rendered.features().size(), "every corner should be in view");
        // the x-corners (the board's outer L-corners are in the truth too, with their own kind)
        List<ProjectedFeature> truth = rendered.features().stream().filter(f -> f.kind().orElseThrow() == FeatureKind.X_CORNER).toList();
        assertFalse(truth.isEmpty());
        List<Detection> found = Detectors.create(DetectorType.SHI_TOMASI).detect(rendered.image());
        for (ProjectedFeature f : truth) {
            double best = Double.POSITIVE_INFINITY;
            for (Detection d : found) best = Math.min(best, Math.hypot(d.x() - f.u(), d.y() - f.v()));
            assertTrue(best <= TOLERANCE_PX, "x-corner " + f.featureId() + " at (" + f.u() + ", " + f.v() + ") nearest detection " + best + " px");
        }
    }
}
