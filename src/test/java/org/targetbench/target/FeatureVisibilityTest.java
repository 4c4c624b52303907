package org.targetbench.target;

import org.junit.jupiter.api.Test;
import org.targetbench.TestScenes;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** Features hidden under a later shape are not truth (render-time visibility); every generated design is fully drawn. */
class FeatureVisibilityTest {
    @Test
    void aLaterShapeHidesTheFeaturesItCovers() {
        TargetDesign cb = TestScenes.checkerboard();
        assertEquals(cb.features().size(), FeatureVisibility.drawnCount(cb));
        // a grey patch painted last over the left half of the board
        List<Shape> drawing = new ArrayList<>(cb.drawing());
        drawing.add(new Shape.Rect(0, 0, cb.widthMm() / 2, cb.heightMm(), 0.5));
        TargetDesign covered = new TargetDesign("covered", null, cb.widthMm(), cb.heightMm(), cb.quietZoneMm(), drawing, cb.features(), "custom", null);
        long left = cb.features().stream().filter(f -> f.xMm() < cb.widthMm() / 2 - FeatureVisibility.RING_MM).count();
        long onEdge = cb.features().stream().filter(f -> Math.abs(f.xMm() - cb.widthMm() / 2) <= FeatureVisibility.RING_MM).count();
        assertEquals(cb.features().size() - left - onEdge, FeatureVisibility.drawnCount(covered) - onEdge, 0.0 + onEdge);
        Pose p = Pose.facing(cb.widthMm(), cb.heightMm(), 0.35, 0, 0, 0, 0, 0);
        var truth = Projection.visibleFeatures(covered, TestScenes.VGA, p);
        for (var f : truth) assertTrue(cb.features().get(f.featureId()).xMm() >= cb.widthMm() / 2 - FeatureVisibility.RING_MM, "hidden feature in truth: " + f);
        assertFalse(truth.isEmpty());
    }

    @Test
    void everyGeneratedPatternIsFullyDrawn() throws Exception {
        List<TargetDesign> designs = new ArrayList<>(List.of(TargetGenerators.checkerboard("cb", 5, 6, 10, 8),
                TargetGenerators.dotGrid("dots", 4, 5, 12, 3, 8), TargetGenerators.squareGrid("sq", 3, 4, 5, 9, 8),
                TargetGenerators.markerGrid("mk", 2, 3, 20, 40, 10)));
        for (String n : new String[]{"fixture-cb15", "fixture-dots20", "fixture-mk25-sparse", "fixture-sq5-dense", "fixture-xc10"})
            designs.add(org.targetbench.source.TargetFile.read(java.nio.file.Path.of("target-designs", n, "target.json")));
        for (TargetDesign d : designs)
            assertEquals(d.features().size(), FeatureVisibility.drawnCount(d), d.id());
    }
}
