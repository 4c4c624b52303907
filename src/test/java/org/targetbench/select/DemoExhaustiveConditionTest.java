package org.targetbench.select;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.targetbench.camera.InteractionMatrix;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.formats.PickInputs;
import org.targetbench.pipeline.CompareRun;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.PickRun;
import org.targetbench.pipeline.Progress;
import org.targetbench.pipeline.Reasons;
import org.targetbench.score.Repeatability;
import org.targetbench.source.FrameList;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.SyntheticSource;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The automatic 4-point choice on the demo scene against the best 4-point set of the design's own corners, found by
 * exhaustive search over every designed feature in view at the reference pose (the 48 inner x-corners and the 32 outer
 * L-corners of the checkerboard, at their exact pixels). Either the automatic set is at least as well conditioned
 * (within {@link #COND_TOL}), or the pick names a better designed set and a typed reason for not taking it
 * ({@link DesignedOptimum}, rendered in the servo view by {@link Reasons#betterDesigned}), and the reason is true of the
 * candidates. Run on the same compare and pick runs as the command line, for a detector that finds L-corners
 * (Shi-Tomasi: the choice reaches the optimum, the four outer board corners) and for the x-corner detector (it cannot
 * see L-corners: the better set is explained as not detected).
 *
 * <p>cond(L*) is the condition number of the scaled stacked point interaction matrix at the reference pose
 * (Chaumette &amp; Hutchinson 2006, eq. (11); the scaling is derived in {@code InteractionMatrix}).
 */
class DemoExhaustiveConditionTest {
    /**
     * Relative slack between cond(L*) at detected pixels (the choice) and at exact designed pixels (the search): the
     * chosen points lie within their localisation error, about 0.15 px, of the truth over a spread of about 290 px,
     * which moves cond(L*) by well under 1e-3 (derived).
     */
    static final double COND_TOL = 2e-3;
    /** cond(L*) of the four outer board corners at the demo reference pose (measured here with this code, 37.96; pins the figure against silent change). */
    static final double OUTER_CORNERS_COND = 37.96, OUTER_CORNERS_TOL = 0.01;

    static List<SourceFrame> frames;
    static String reference;
    static Best optimum;

    @BeforeAll
    static void render() throws Exception {
        frames = new ArrayList<>();
        try (SyntheticSource s = DemoScenario.source()) {
            reference = s.referenceName();
            Optional<SourceFrame> f;
            while ((f = s.next()).isPresent()) frames.add(f.get());
        }
        List<Candidate> designed = DesignedOptimum.designedPoints(DemoScenario.target(), DemoScenario.camera(), DemoScenario.poses().get(0));
        assertEquals(80, designed.size(), "48 inner x-corners and 32 outer L-corners in view");
        optimum = exhaustive(designed);
    }

    @Test
    void theExhaustiveOptimumIsTheFourOuterBoardCorners() {
        TargetDesign d = DemoScenario.target();
        for (Candidate c : optimum.set) assertEquals(FeatureKind.CORNER, d.features().get(c.featureId()).kind(), "an outer L-corner: " + ids(optimum.set));
        assertEquals(OUTER_CORNERS_COND, optimum.cond, OUTER_CORNERS_TOL);
    }

    @Test
    void aDetectorThatFindsLCornersChoosesTheOptimum() throws Exception {
        PickRun.Result r = pick(DetectorType.SHI_TOMASI);
        double auto = checkAgainstOptimum(r);
        assertTrue(auto <= optimum.cond * (1 + COND_TOL), "Shi-Tomasi reaches the optimum: " + auto + " vs " + optimum.cond);
        assertTrue(r.betterDesigned().isEmpty(), "nothing better to report");
    }

    @Test
    void theXCornerDetectorExplainsWhyTheBetterSetWasNotTaken() throws Exception {
        PickRun.Result r = pick(DetectorType.XCORNER);
        double auto = checkAgainstOptimum(r);
        assertTrue(auto > optimum.cond * (1 + COND_TOL), "inner x-corners only: " + auto);
        DesignedOptimum.Better b = r.betterDesigned().orElseThrow();
        assertEquals(DesignedOptimum.Why.NOT_DETECTED, b.why());
        assertEquals(Set.of(FeatureKind.CORNER), b.blockingKinds(), "the x-corner detector does not find L-corners");
        assertTrue(Reasons.betterDesigned(b, r.detector()).contains("L-corners"));
    }

    /** The disjunction for any pick: as well conditioned as the optimum, or a better designed set named with a reason that holds. Returns the automatic cond(L*). */
    static double checkAgainstOptimum(PickRun.Result r) {
        Selection sel = r.selection();
        assertEquals(Selection.Outcome.SELECTED, sel.outcome());
        double auto = cond(sel.chosen().stream().map(Selection.Chosen::candidate).toList());
        assertEquals(sel.condition(), auto, 1e-9 * auto, "the same cond(L*) as the selector reports");
        if (auto <= optimum.cond * (1 + COND_TOL)) return auto;
        DesignedOptimum.Better b = r.betterDesigned().orElseThrow(() -> new AssertionError("cond " + auto + " > optimum " + optimum.cond
                + " " + ids(optimum.set) + " and no reason given"));
        assertEquals(optimum.cond, b.condition(), optimum.cond * COND_TOL, "the reported set is the optimum " + ids(optimum.set) + ", not " + b.featureIds());
        Map<Integer, List<Candidate>> onFeature = new HashMap<>();
        for (Candidate c : r.candidates()) if (c.featureId() >= 0) onFeature.computeIfAbsent(c.featureId(), k -> new ArrayList<>()).add(c);
        Map<Integer, Selection.Rejected> why = new HashMap<>();
        for (Selection.Rejected x : sel.rejected()) why.put(x.candidate().id(), x);
        assertFalse(b.blocking().isEmpty() && b.why() != DesignedOptimum.Why.OBJECTIVE, "a reason names its features");
        for (int f : b.blocking()) {
            switch (b.why()) {
                case NOT_DETECTED -> assertNull(onFeature.get(f), "no candidate on feature " + f);
                case FILTERED -> assertTrue(onFeature.get(f).stream().anyMatch(c -> why.containsKey(c.id()) && why.get(c.id()).why().isFilter()),
                        "a candidate on feature " + f + " failed a filter");
                default -> fail("no blocking features for " + b.why());
            }
        }
        assertNotEquals(DesignedOptimum.Why.SEARCH, b.why(), "the search reaches every eligible better set");
        return auto;
    }

    static PickRun.Result pick(DetectorType t) throws Exception {
        var cr = new CompareRun(List.of(DetectorConfig.defaults(t)), Repeatability.DEFAULT_EPSILON)
                .run(new FrameList("demo", frames, reference), Progress.NONE);
        return PickRun.run(PickInputs.fromComparison(cr, frames, DemoScenario.camera(), DemoScenario.target(), DemoScenario.poses().get(0)),
                null, new CandidateConfig(), new SelectConfig(), "test", "2026-01-01T00:00:00Z");
    }

    record Best(double cond, List<Candidate> set) {}

    /** Every 4-point set, cond(L*) only, no constraint. */
    static Best exhaustive(List<Candidate> c) {
        int n = c.size();
        InteractionMatrix.Workspace ws = new InteractionMatrix.Workspace();
        double[] x = new double[4], y = new double[4], z = new double[4];
        double best = Double.POSITIVE_INFINITY;
        int[] arg = null, idx = new int[4];
        for (idx[0] = 0; idx[0] < n; idx[0]++)
            for (idx[1] = idx[0] + 1; idx[1] < n; idx[1]++)
                for (idx[2] = idx[1] + 1; idx[2] < n; idx[2]++)
                    for (idx[3] = idx[2] + 1; idx[3] < n; idx[3]++) {
                        double zs = 0;
                        for (int i = 0; i < 4; i++) {
                            Candidate p = c.get(idx[i]);
                            x[i] = p.x();
                            y[i] = p.y();
                            z[i] = p.zM();
                            zs += z[i];
                        }
                        var k = ws.conditioning(x, y, z, 4, zs / 4);
                        if (k.rank() == 6 && k.condition() < best) {
                            best = k.condition();
                            arg = idx.clone();
                        }
                    }
        return new Best(best, List.of(c.get(arg[0]), c.get(arg[1]), c.get(arg[2]), c.get(arg[3])));
    }

    /** cond(L*) as {@code ServoSet} computes it (allocating path, independent of the search's workspace). */
    static double cond(List<Candidate> pts) {
        double[] x = new double[pts.size()], y = new double[pts.size()], z = new double[pts.size()];
        double zs = 0;
        for (int i = 0; i < pts.size(); i++) {
            x[i] = pts.get(i).x();
            y[i] = pts.get(i).y();
            z[i] = pts.get(i).zM();
            zs += z[i];
        }
        var k = InteractionMatrix.conditioning(InteractionMatrix.stacked(x, y, z), zs / pts.size());
        return k.rank() < 6 ? Double.POSITIVE_INFINITY : k.condition();
    }

    static String ids(List<Candidate> s) { return s.stream().map(c -> "feature " + c.featureId()).toList().toString(); }
}
