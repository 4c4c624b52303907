package org.targetbench.app;

import org.targetbench.formats.PickRefusals;
import org.targetbench.source.FrameList;
import org.targetbench.formats.PickInputs;
import org.targetbench.pipeline.Reasons;
import org.targetbench.Version;
import org.targetbench.export.ServoWriters;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.CompareRun;
import org.targetbench.pipeline.PickRun;
import org.targetbench.pipeline.Progress;
import org.targetbench.score.Repeatability;
import org.targetbench.select.Candidate;
import org.targetbench.select.CandidateConfig;
import org.targetbench.select.SelectConfig;
import org.targetbench.camera.InteractionMatrix;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.SourceException;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Servo point choice for the workbench, through the runs the command line uses: the loaded frames are compared
 * ({@link CompareRun}) and picked from ({@link PickRun}) with exactly the input a saved results folder would give
 * ({@link PickInputs}); and hand edits of the chosen set, whose figures are recomputed the same way {@link ServoSet} does.
 */
final class ServoChoice {
    private ServoChoice() {}

    /** Compares the session's frames and picks {@code count} points; needs a rendered scene (for depths). */
    static PickRun.Result pick(List<org.targetbench.source.SourceFrame> frames, String reference, String sourceName,
                               Session.Scene scene, List<org.targetbench.detect.DetectorConfig> configs, int count, String detector) throws Exception {
        CompareResult cr = new CompareRun(configs, Repeatability.DEFAULT_EPSILON).run(new FrameList(sourceName, frames, reference), Progress.NONE);
        SelectConfig sc = new SelectConfig();
        sc.count = count;
        try {
            return PickRun.run(PickInputs.fromComparison(cr, frames, scene.camera(), scene.design(), scene.poses().get(0)), detector,
                    new CandidateConfig(), sc, Version.get(), ServoWriters.now());
        } catch (PickRun.Refused e) {
            throw new SourceException(PickRefusals.explain(e, new PickRefusals.Where(sourceName, "the frames' truth", PickInputs.POSES_LABEL, reference)));
        }
    }

    /** The set with the candidate {@code id} added or removed, figures recomputed; null when the set would be empty. */
    static ServoSet toggle(ServoSet set, List<Candidate> candidates, int id) {
        return toggle(set, candidates, List.of(), id);
    }

    /** The filter a candidate failed in the selection, or null when it passed them all. */
    static org.targetbench.select.Selection.Rejected failedFilter(List<org.targetbench.select.Selection.Rejected> rejected, int id) {
        for (var r : rejected) if (r.candidate().id() == id && r.why().isFilter()) return r;
        return null;
    }

    /**
     * The set with the candidate {@code id} added or removed, figures recomputed; null when the set would be empty. A
     * point added by hand that failed a filter carries that filter's sentence in its reason.
     */
    static ServoSet toggle(ServoSet set, List<Candidate> candidates, List<org.targetbench.select.Selection.Rejected> rejected, int id) {
        List<ServoPoint> pts = new ArrayList<>(set.points());
        boolean removed = pts.removeIf(p -> p.id() == id);
        if (!removed) {
            Candidate c = candidates.stream().filter(x -> x.id() == id).findFirst()
                    .orElseThrow(() -> new IllegalArgumentException("no candidate with id " + id));
            var failed = failedFilter(rejected, id);
            pts.add(ServoPoint.of(c, failed == null ? Reasons.ADDED_BY_HAND : Reasons.addedByHandFailing(failed)));
        }
        if (pts.isEmpty()) return null;
        return set.withPoints(pts);
    }

    /**
     * "NOTE: designed features ... would give cond(L*) ..., but ...": the better-conditioned set of the design's own
     * features the selection did not take, and why ({@link org.targetbench.select.DesignedOptimum}); null when there is
     * none or the set as it stands (hand edits included) is already as well conditioned.
     */
    static String betterDesignedNote(PickRun.Result pick, ServoSet set) {
        if (pick == null || set == null || pick.betterDesigned().isEmpty()) return null;
        var b = pick.betterDesigned().get();
        if (!(b.condition() < set.condition() * (1 - org.targetbench.select.DesignedOptimum.MARGIN))) return null;
        return "NOTE: " + Reasons.betterDesigned(b, pick.detector());
    }

    /** The candidate nearest to an image point within {@code radius} px, or null. */
    static Candidate nearest(List<Candidate> candidates, double x, double y, double radius) {
        return candidates.stream().filter(c -> Math.hypot(c.u() - x, c.v() - y) <= radius)
                .min(Comparator.comparingDouble(c -> Math.hypot(c.u() - x, c.v() - y))).orElse(null);
    }

    static SourceException noScene() {
        return new SourceException("choosing servo points needs the depth of each point: load the demo scene or render a target "
                + "from the Targets view (frame folders carry no reference pose in the workbench yet; use 'targetbench pick --from' "
                + "with --camera, --target and --poses for those)");
    }
}
