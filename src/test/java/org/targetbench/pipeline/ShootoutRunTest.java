package org.targetbench.pipeline;

import org.junit.jupiter.api.Test;
import org.targetbench.TestScenes;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.Perturbation;
import org.targetbench.target.TargetDesign;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/** ShootoutRun called directly on two designs, with a minimal sweep. */
class ShootoutRunTest {
    static SweepConfig sweep(double epsilon) {
        SweepConfig c = new SweepConfig();
        c.detectors.add(DetectorConfig.defaults(DetectorType.SHI_TOMASI));
        c.parameters.add(Perturbation.GAUSSIAN_NOISE);
        c.levels = 2;
        c.syntheticFrames = 1;
        c.epsilon = epsilon;
        return c;
    }

    @Test
    void ranksDesignsAndItsEpsilonReachesTheRobustPoints() throws Exception {
        List<TargetDesign> designs = List.of(DemoScenario.target(), TestScenes.checkerboard());
        List<ShootoutRun.Entry> wide = new ShootoutRun(DemoScenario.camera(), DemoScenario.STANDOFF_M, 20, sweep(1.5), Map.of())
                .run(designs, DemoScenario.lighting(), Progress.NONE, () -> false);
        assertEquals(2, wide.size());
        assertEquals(List.of(1, 2), wide.stream().map(ShootoutRun.Entry::rank).toList());
        for (ShootoutRun.Entry e : wide) {
            assertTrue(e.robustPoints() <= e.points(), e.design().id());
            assertTrue(e.robustPoints() > 0, e.design().id());
        }
        // a match radius far below the detectors' sub-pixel error finds almost nothing again
        List<ShootoutRun.Entry> tight = new ShootoutRun(DemoScenario.camera(), DemoScenario.STANDOFF_M, 20, sweep(0.001), Map.of())
                .run(designs, DemoScenario.lighting(), Progress.NONE, () -> false);
        for (ShootoutRun.Entry t : tight) {
            ShootoutRun.Entry w = wide.stream().filter(x -> x.design().id().equals(t.design().id())).findFirst().orElseThrow();
            assertTrue(t.robustPoints() < w.robustPoints(), t.design().id() + ": " + t.robustPoints() + " vs " + w.robustPoints());
        }
    }
}
