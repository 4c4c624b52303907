package org.targetbench.select;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.score.Robustness;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * The best-conditioned set of the design's own features against the automatic choice: a choice among detections can
 * only be as good as the detector lets it be, so when the design itself offers a k-point set with a smaller cond(L*)
 * than the chosen one, the selection says which and why it was not taken (typed, {@link Why}).
 *
 * <p>The designed points are every designed feature (inner x-corners and outer L-corners of a checkerboard alike) drawn
 * and in view at the reference pose ({@link Projection#visibleFeatures}), at their exact pixels and depths. The search
 * is the selector's own ({@link ServoPointSelector}) with the same border margin and separation, on cond(L*) alone
 * (coverage weight 0), and no robustness filter (nothing was measured on an ideal point): exhaustive up to
 * {@link SelectConfig#exhaustiveLimit} sets, greedy with swaps beyond. cond(L*) is the condition number of the scaled
 * stacked point interaction matrix at the reference pose (Chaumette &amp; Hutchinson 2006, eq. (11); scaling in
 * {@code camera.InteractionMatrix}).
 */
public final class DesignedOptimum {
    /** Relative margin by which the designed set must beat the chosen one before it is reported (detected pixels lie within a few tenths of a pixel of the exact ones; derived). */
    public static final double MARGIN = 0.01;

    private DesignedOptimum() {}

    /** Why the better-conditioned designed set was not chosen; the first that applies, in this order. */
    public enum Why {
        /** Some of its features have no candidate: the detector found nothing on them (e.g. L-corners for the x-corner detector). */
        NOT_DETECTED,
        /** Every feature has a candidate, but one failed a filter ({@link Better#filter}). */
        FILTERED,
        /** Every feature has an eligible candidate; the chosen set scores better on the objective (log10 cond(L*) - w · coverage). */
        OBJECTIVE,
        /** Every feature has an eligible candidate and the set scores better on the objective too: the greedy search did not reach it. */
        SEARCH
    }

    /**
     * A better-conditioned designed set.
     *
     * @param condition        its cond(L*) at the exact designed pixels
     * @param chosenCondition  cond(L*) of the chosen set
     * @param featureIds       its designed features
     * @param kinds            their kinds, in the same order
     * @param why              why the selection did not take it
     * @param blocking         the features that decided {@code why} (no candidate, or the candidate that failed a filter); empty for OBJECTIVE and SEARCH
     * @param blockingKinds    the kinds of the blocking features (distinct)
     * @param filter           FILTERED: the filter the first blocking candidate failed
     */
    public record Better(double condition, double chosenCondition, List<Integer> featureIds, List<FeatureKind> kinds, Why why,
                         List<Integer> blocking, Set<FeatureKind> blockingKinds, Optional<Selection.Why> filter) {
        public Better {
            featureIds = List.copyOf(featureIds);
            kinds = List.copyOf(kinds);
            blocking = List.copyOf(blocking);
            blockingKinds = java.util.Collections.unmodifiableSet(new LinkedHashSet<>(blockingKinds));
        }
    }

    /** The design's features in view at the pose, as ideal candidates (id = feature id, nothing measured). */
    public static List<Candidate> designedPoints(TargetDesign design, CameraModel camera, Pose pose) {
        List<Candidate> out = new ArrayList<>();
        Robustness none = new Robustness(OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty());
        for (ProjectedFeature f : Projection.visibleFeatures(design, camera, pose)) {
            var t = design.features().get(f.featureId());
            double[] pc = pose.targetToCamera(t.xMm(), t.yMm());
            out.add(new Candidate(f.featureId(), f.u(), f.v(), 0, pc[0] / pc[2], pc[1] / pc[2], pc[2], t.xMm(), t.yMm(), f.featureId(),
                    true, 0, 0, none));
        }
        return out;
    }

    /**
     * The better-conditioned designed set, when there is one (by more than {@link #MARGIN}).
     *
     * @param selection  the automatic choice (nothing to say when it was refused)
     * @param candidates the candidates it chose from
     * @param designed   the design's points ({@link #designedPoints})
     * @param design     the design (for the kinds)
     */
    public static Optional<Better> check(Selection selection, List<Candidate> candidates, List<Candidate> designed, TargetDesign design,
                                         int width, int height, SelectConfig config) {
        if (selection.outcome() != Selection.Outcome.SELECTED || designed.size() < selection.chosen().size()) return Optional.empty();
        SelectConfig ideal = config.copy();
        ideal.count = selection.chosen().size();
        ideal.coverageWeight = 0;
        ideal.requireDesignedFeature = false;
        ideal.maxCondition = Double.MAX_VALUE;
        Selection best = ServoPointSelector.select(designed, width, height, ideal);
        if (best.outcome() != Selection.Outcome.SELECTED || !(best.condition() < selection.condition() * (1 - MARGIN))) return Optional.empty();

        Map<Integer, Candidate> byFeature = new HashMap<>();
        for (Candidate c : candidates)
            if (c.featureId() >= 0) byFeature.merge(c.featureId(), c, (a, b) -> a.response() >= b.response() ? a : b);
        Map<Integer, Selection.Rejected> rejected = new HashMap<>();
        for (Selection.Rejected r : selection.rejected()) rejected.put(r.candidate().id(), r);
        List<Integer> ids = new ArrayList<>();
        List<FeatureKind> kinds = new ArrayList<>();
        List<Integer> missing = new ArrayList<>(), filtered = new ArrayList<>();
        Set<FeatureKind> missingKinds = new LinkedHashSet<>(), filteredKinds = new LinkedHashSet<>();
        Selection.Why firstFilter = null;
        List<Candidate> asCandidates = new ArrayList<>();
        List<Selection.Chosen> byId = new ArrayList<>(best.chosen());
        byId.sort(java.util.Comparator.comparingInt(ch -> ch.candidate().featureId()));
        for (Selection.Chosen ch : byId) {
            int f = ch.candidate().featureId();
            FeatureKind k = design.features().get(f).kind();
            ids.add(f);
            kinds.add(k);
            Candidate c = byFeature.get(f);
            if (c == null) {
                missing.add(f);
                missingKinds.add(k);
                continue;
            }
            asCandidates.add(c);
            Selection.Rejected r = rejected.get(c.id());
            if (r != null && r.why().isFilter()) {
                filtered.add(f);
                filteredKinds.add(k);
                if (firstFilter == null) firstFilter = r.why();
            }
        }
        Why why;
        List<Integer> blocking;
        Set<FeatureKind> blockingKinds;
        if (!missing.isEmpty()) {
            why = Why.NOT_DETECTED;
            blocking = missing;
            blockingKinds = missingKinds;
            firstFilter = null;
        } else if (!filtered.isEmpty()) {
            why = Why.FILTERED;
            blocking = filtered;
            blockingKinds = filteredKinds;
        } else {
            double theirs = objective(asCandidates, width, height, config);
            why = theirs < selection.objective() ? Why.SEARCH : Why.OBJECTIVE;
            blocking = List.of();
            blockingKinds = Set.of();
        }
        return Optional.of(new Better(best.condition(), selection.condition(), ids, kinds, why, blocking, blockingKinds, Optional.ofNullable(firstFilter)));
    }

    /** The selector's objective of exactly these candidates (the selector's own evaluation: all of them, one set). */
    private static double objective(List<Candidate> set, int width, int height, SelectConfig config) {
        SelectConfig one = config.copy();
        one.count = set.size();
        one.requireDesignedFeature = false;
        one.maxCondition = Double.MAX_VALUE;
        one.minSeparationPx = 0;
        one.borderMarginPx = 0;
        Selection s = ServoPointSelector.select(set.stream().map(c -> c.withRobustness(new Robustness(OptionalDouble.empty(),
                OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty()))).toList(), width, height, one);
        return s.outcome() == Selection.Outcome.SELECTED ? s.objective() : Double.POSITIVE_INFINITY;
    }
}
