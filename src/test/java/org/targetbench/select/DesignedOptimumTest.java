package org.targetbench.select;

import org.junit.jupiter.api.Test;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.score.Robustness;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The typed reason a better-conditioned designed set was not chosen, on ideal candidates placed exactly on a 9 x 7
 * checkerboard's designed features seen square on (the demo's geometry): the reason follows what the candidates lack.
 */
class DesignedOptimumTest {
    static final TargetDesign DESIGN = TargetGenerators.checkerboard("cb", 7, 9, 15, 15);
    static final CameraModel CAMERA = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);
    static final Pose POSE = Pose.facing(DESIGN.widthMm(), DESIGN.heightMm(), 0.25, 0, 0, 0, 0, 0);
    /** Localisation error given to candidates that must fail the filter, pixels (above the default 0.5 px limit). */
    static final double POOR_LOCALISATION_PX = 0.9;

    static List<Candidate> designed() {
        return DesignedOptimum.designedPoints(DESIGN, CAMERA, POSE);
    }

    static boolean boardCorner(Candidate c) {
        double x = c.targetXMm(), y = c.targetYMm();
        return (x == 15 || x == 15 + 9 * 15) && (y == 15 || y == 15 + 7 * 15);
    }

    static Robustness measured(double locPx) {
        return new Robustness(OptionalDouble.of(1.0), OptionalDouble.empty(), OptionalDouble.of(locPx), OptionalDouble.empty());
    }

    static Optional<DesignedOptimum.Better> run(List<Candidate> candidates) {
        SelectConfig c = new SelectConfig();
        Selection s = ServoPointSelector.select(candidates, CAMERA.width(), CAMERA.height(), c);
        assertEquals(Selection.Outcome.SELECTED, s.outcome());
        return DesignedOptimum.check(s, candidates, designed(), DESIGN, CAMERA.width(), CAMERA.height(), c);
    }

    @Test
    void everyDesignedFeatureDetectedWellGivesNothingToReport() {
        List<Candidate> all = new ArrayList<>();
        for (Candidate d : designed()) all.add(d.withRobustness(measured(0.1)));
        assertEquals(80, all.size());
        assertTrue(run(all).isEmpty(), "the choice is the optimum (the four outer board corners)");
    }

    @Test
    void lCornersNotDetectedAreNamed() {
        List<Candidate> inner = new ArrayList<>();
        for (Candidate d : designed())
            if (DESIGN.features().get(d.featureId()).kind() == FeatureKind.X_CORNER) inner.add(d.withRobustness(measured(0.1)));
        DesignedOptimum.Better b = run(inner).orElseThrow();
        assertEquals(DesignedOptimum.Why.NOT_DETECTED, b.why());
        assertEquals(Set.of(FeatureKind.CORNER), b.blockingKinds());
        assertTrue(b.condition() < b.chosenCondition());
        assertTrue(b.filter().isEmpty());
    }

    @Test
    void outerCornersThatFailAFilterAreNamedWithTheFilter() {
        List<Candidate> all = new ArrayList<>();
        for (Candidate d : designed()) all.add(d.withRobustness(measured(boardCorner(d) ? POOR_LOCALISATION_PX : 0.1)));
        DesignedOptimum.Better b = run(all).orElseThrow();
        assertEquals(DesignedOptimum.Why.FILTERED, b.why());
        assertEquals(Optional.of(Selection.Why.HIGH_LOCALISATION), b.filter());
        assertEquals(4, b.blocking().size(), "the four board corners: " + b.blocking());
        for (int f : b.blocking()) assertEquals(FeatureKind.CORNER, DESIGN.features().get(f).kind());
    }
}
