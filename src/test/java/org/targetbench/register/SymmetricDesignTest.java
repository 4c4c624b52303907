package org.targetbench.register;

import org.junit.jupiter.api.Test;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Orientation of symmetric designs: a 9 x 7-square checkerboard (odd by odd) looks the same turned half a turn, so a
 * first frame can only assume the upright turn (and says so); following frames keep the turn by continuity even when
 * the board has turned past a quarter turn, where the upright assumption would pick the wrong one. A 10 x 7 board is
 * not symmetric: the image decides.
 */
class SymmetricDesignTest {
    /** Predictions must land on the true pixel of the same feature id, pixels. */
    static final double SAME_FEATURE_PX = 0.2;
    static final CameraModel CAMERA = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);

    private static double worst(TargetDesign d, Pose pose, Registration r) {
        Map<Integer, double[]> truth = new HashMap<>();
        for (var f : Projection.visibleFeatures(d, CAMERA, pose)) truth.put(f.featureId(), new double[]{f.u(), f.v()});
        double w = 0;
        for (var p : r.predicted()) {
            double[] t = truth.get(p.featureId());
            if (t != null) w = Math.max(w, Math.hypot(t[0] - p.u(), t[1] - p.v()));
        }
        return w;
    }

    @Test
    void anOddByOddBoardKeepsItsTurnByContinuity() {
        TargetDesign d = TargetGenerators.checkerboard("sym", 7, 9, 15, 15);
        SyntheticRenderer r = new SyntheticRenderer(CAMERA, new RenderConfig());
        FrameRegistrar reg = new FrameRegistrar(d, Optional.of(CAMERA), new RegisterConfig());
        List<Double> rolls = List.of(0.0, 30.0, 60.0, 90.0, 120.0, 150.0);
        for (int i = 0; i < rolls.size(); i++) {
            Pose pose = Pose.facing(d.widthMm(), d.heightMm(), 0.32, 10, -5, rolls.get(i), 0, 0);
            Registration res = reg.register(r.render(d, pose).image());
            assertTrue(res.registered(), "roll " + rolls.get(i) + ": " + res.note());
            assertEquals(i == 0 ? RegistrationNote.ORIENTATION_ASSUMED : RegistrationNote.ORIENTATION_BY_CONTINUITY, res.note(), "roll " + rolls.get(i));
            assertTrue(worst(d, pose, res) < SAME_FEATURE_PX, "roll " + rolls.get(i) + ": features swapped");
        }
    }

    @Test
    void anEvenByOddBoardIsDecidedByTheImage() {
        TargetDesign d = TargetGenerators.checkerboard("asym", 7, 10, 15, 15);
        SyntheticRenderer r = new SyntheticRenderer(CAMERA, new RenderConfig());
        Pose pose = Pose.facing(d.widthMm(), d.heightMm(), 0.35, 10, 5, 170, 0, 0);
        Registration res = new FrameRegistrar(d, Optional.of(CAMERA), new RegisterConfig()).register(r.render(d, pose).image());
        assertEquals(RegistrationNote.OK, res.note());
        assertTrue(worst(d, pose, res) < SAME_FEATURE_PX, "features swapped");
    }
}
