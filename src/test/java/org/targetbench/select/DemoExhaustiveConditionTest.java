package org.targetbench.select;

import org.junit.jupiter.api.Test;
import org.targetbench.camera.InteractionMatrix;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.formats.PickInputs;
import org.targetbench.pipeline.CompareRun;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.PickRun;
import org.targetbench.pipeline.Progress;
import org.targetbench.score.Repeatability;
import org.targetbench.source.FrameList;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.SyntheticSource;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The automatic choice on the demo scene against an exhaustive search over every 4-point set. Two searches:
 * <ol>
 *   <li>over the candidates matched to a designed feature (the inner x-corners of the demo checkerboard): the automatic
 *       set must be at least as well conditioned as the best of them, within {@link #COND_TOL};</li>
 *   <li>over those plus the four outermost candidates that match no designed feature (the board's outer L-corners,
 *       which the checkerboard's truth model does not list): when a set with such a point conditions better, every point
 *       of it the selector left out must carry a filter reason, so the better set was refused by a named filter and
 *       not missed by the search.</li>
 * </ol>
 * cond(L*) is computed as {@code ServoSet.conditioning} does (scaled interaction matrix, derived in
 * {@code InteractionMatrix}). Runs the same compare and pick runs as the command line on the Shi-Tomasi detections.
 */
class DemoExhaustiveConditionTest {
    /** Relative slack on cond(L*) against the exhaustive optimum (numerical noise only; the selector scores an objective). */
    static final double COND_TOL = 1e-6;

    @Test
    void theAutomaticChoiceIsAtLeastAsWellConditionedAsAnyFourDesignedCornersAndBetterSetsAreRefusedByAFilter() throws Exception {
        List<SourceFrame> frames = new ArrayList<>();
        String ref;
        try (SyntheticSource s = DemoScenario.source()) {
            ref = s.referenceName();
            Optional<SourceFrame> f;
            while ((f = s.next()).isPresent()) frames.add(f.get());
        }
        List<DetectorConfig> configs = List.of(DetectorConfig.defaults(DetectorType.SHI_TOMASI));
        var cr = new CompareRun(configs, Repeatability.DEFAULT_EPSILON).run(new FrameList("demo", frames, ref), Progress.NONE);
        SelectConfig sc = new SelectConfig();
        PickRun.Result r = PickRun.run(PickInputs.fromComparison(cr, frames, DemoScenario.camera(), DemoScenario.target(), DemoScenario.poses().get(0)),
                null, new CandidateConfig(), sc, "test", "2026-01-01T00:00:00Z");
        Selection sel = r.selection();
        assertEquals(Selection.Outcome.SELECTED, sel.outcome());
        double auto = cond(sel.chosen().stream().map(Selection.Chosen::candidate).toList());
        assertEquals(sel.condition(), auto, 1e-9 * auto, "the same cond(L*) as the selector reports");

        List<Candidate> designed = r.candidates().stream().filter(c -> c.featureId() >= 0).toList();
        assertTrue(designed.size() >= 40, "the demo's inner corners are candidates: " + designed.size());
        Best d = exhaustive(designed);
        assertTrue(auto <= d.cond * (1 + COND_TOL), "automatic cond(L*) " + auto + " vs best designed 4-set " + d.cond + " " + ids(d.set));

        // the outermost undesigned candidates, one per diagonal direction (the board's outer corners)
        List<Candidate> undesigned = r.candidates().stream().filter(c -> c.featureId() < 0).toList();
        List<Comparator<Candidate>> dirs = List.of(Comparator.comparingDouble(c -> c.u() + c.v()), Comparator.comparingDouble(c -> c.u() - c.v()),
                Comparator.comparingDouble(c -> -c.u() + c.v()), Comparator.comparingDouble(c -> -c.u() - c.v()));
        List<Candidate> pool = new ArrayList<>(designed);
        for (var dir : dirs) undesigned.stream().min(dir).filter(c -> !pool.contains(c)).ifPresent(pool::add);
        Best all = exhaustive(pool);
        if (all.cond < auto * (1 - COND_TOL)) {
            Map<Integer, Selection.Rejected> why = new HashMap<>();
            for (Selection.Rejected x : sel.rejected()) why.put(x.candidate().id(), x);
            List<Integer> chosen = sel.chosen().stream().map(c -> c.candidate().id()).toList();
            boolean refusedByFilter = false;
            for (Candidate c : all.set) {
                if (chosen.contains(c.id())) continue;
                Selection.Rejected x = why.get(c.id());
                assertNotNull(x, "every candidate has a reason: " + c.id());
                if (x.why().isFilter()) refusedByFilter = true;
                if (c.featureId() < 0) assertEquals(Selection.Why.NOT_DESIGNED, x.why(), "outer corner " + c.id() + " is refused as undesigned");
            }
            assertTrue(refusedByFilter, "a better-conditioned set " + ids(all.set) + " (cond " + all.cond + " < " + auto + ") was refused by a filter");
        }
    }

    record Best(double cond, List<Candidate> set) {}

    static Best exhaustive(List<Candidate> c) {
        int n = c.size();
        double best = Double.POSITIVE_INFINITY;
        int[] arg = null;
        for (int a = 0; a < n; a++)
            for (int b = a + 1; b < n; b++)
                for (int e = b + 1; e < n; e++)
                    for (int f = e + 1; f < n; f++) {
                        double k = cond(List.of(c.get(a), c.get(b), c.get(e), c.get(f)));
                        if (k < best) { best = k; arg = new int[]{a, b, e, f}; }
                    }
        return new Best(best, List.of(c.get(arg[0]), c.get(arg[1]), c.get(arg[2]), c.get(arg[3])));
    }

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

    static String ids(List<Candidate> s) { return s.stream().map(c -> "#" + c.id()).toList().toString(); }
}
