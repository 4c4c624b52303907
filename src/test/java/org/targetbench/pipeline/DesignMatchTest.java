package org.targetbench.pipeline;

import org.junit.jupiter.api.Test;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.detect.DetectorType;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/** Which detector each design is matched with, and the per-view dot-bias table. */
class DesignMatchTest {
    @Test
    void eachPatternHasItsMatchedDetector() {
        assertEquals(Optional.of(DetectorType.XCORNER), DesignMatch.matched(TargetGenerators.checkerboard("cb", 7, 9, 15, 15)));
        assertEquals(Optional.of(DetectorType.DOTS), DesignMatch.matched(TargetGenerators.dotGrid("d", 6, 8, 20, 10, 10)));
        assertEquals(Optional.of(DetectorType.XCORNER), DesignMatch.matched(TargetGenerators.xCornerField("x", 4, 40, 10, 180, 130, 10, 1)));
        assertEquals(Optional.of(DetectorType.XCORNER), DesignMatch.matched(TargetGenerators.markerGrid("m", 2, 3, 25, 60, 15)));
        assertEquals(Optional.empty(), DesignMatch.matched(TargetGenerators.squareGrid("s", 7, 10, 5, 10, 8)),
                "L-corners: the generic corner detectors are the match");
        assertTrue(DetectorType.DOTS.designMatched() && DetectorType.XCORNER.designMatched() && !DetectorType.HARRIS.designMatched());
    }

    @Test
    void dotBiasTableHasOneRowPerViewAndNoneWithoutDots() {
        CameraModel cam = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);
        TargetDesign dots = TargetGenerators.dotGrid("d", 6, 8, 20, 10, 10);
        List<Pose> poses = List.of(Pose.facing(dots.widthMm(), dots.heightMm(), 0.26, 0, 0, 0, 0, 0),
                Pose.facing(dots.widthMm(), dots.heightMm(), 0.26, 30, 0, 0, 0, 0));
        List<DotBiasTable.Row> rows = DotBiasTable.forPoses(dots, cam, List.of("a", "b"), poses);
        assertEquals(2, rows.size());
        assertEquals(48, rows.get(0).dots());
        assertEquals(0, rows.get(0).worstBiasPx(), 1e-9);
        assertTrue(rows.get(1).worstBiasPx() > 0.05 && rows.get(1).worstBiasPx() >= rows.get(1).meanBiasPx());
        assertEquals(rows.get(1).worstBiasPx(), DotBiasTable.worst(rows));
        assertEquals(List.of(), DotBiasTable.forPoses(TargetGenerators.checkerboard("cb", 7, 9, 15, 15), cam, List.of("a", "b"), poses));
    }
}
