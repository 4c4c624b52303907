package org.targetbench.pipeline;

import org.targetbench.camera.Calibration;
import org.targetbench.select.DesignedOptimum;
import org.targetbench.select.Selection;
import org.targetbench.target.FeatureKind;
import org.targetbench.servo.ControlLaw;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.RehearsalWarning;
import org.targetbench.servo.SetDiagnostics;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The one place where the typed reasons of a selection, the findings on a servo set and the warnings of a rehearsal
 * become sentences, for the console, the files and the workbench alike (the arm rehearsal's flags and warnings are
 * rendered beside it by {@link ArmWords}); a refused pick, which names files and options, is explained beside the results-folder reader
 * ({@code formats.PickRefusals}). Nothing parses these sentences back: code that needs a category reads the typed reason.
 */
public final class Reasons {
    /** The reason a point added to a set by hand carries. */
    public static final String ADDED_BY_HAND = "added by hand";
    /** The reason a chosen point taken out of the set by hand carries in the selection file. */
    public static final String REMOVED_BY_HAND = "taken out of the set by hand";

    /** The reason of a point added by hand although it failed a filter: the warning and the filter's sentence. */
    public static String addedByHandFailing(Selection.Rejected r) {
        return ADDED_BY_HAND + " although it failed a filter: " + rejected(r);
    }

    private Reasons() {}

    /** What a selection did: "chose k of n candidates (...)" or why no set was acceptable. */
    public static String selection(Selection s) {
        if (s.refusal().isPresent()) return refusal(s.refusal().get());
        return String.format(Locale.ROOT, "chose %d of %d candidates (%d passed the filters)", s.chosen().size(), s.candidates(), s.passed());
    }

    /** How a selection searched: "exhaustive search over n sets, m sets evaluated", "greedy + swap improvement, m sets evaluated". */
    public static String search(Selection.Search s) {
        return switch (s.kind()) {
            case NONE -> "none";
            case EXHAUSTIVE -> "exhaustive search over " + s.combinations() + " sets, " + s.evaluations() + " sets evaluated";
            case GREEDY_SWAP -> "greedy + swap improvement, " + s.evaluations() + " sets evaluated";
        };
    }

    /** Why no servo set was acceptable. */
    public static String refusal(Selection.Refusal r) {
        return switch (r.kind()) {
            case TOO_FEW_PASS -> String.format(Locale.ROOT, "no acceptable servo set: only %d of %d candidates pass the filters%s; %d are needed",
                    r.passed(), r.candidates(), r.filtered().isEmpty() ? "" : " (rejected: " + tally(r.filtered(), false) + ")", r.needed());
            case NOT_SEPARATED -> String.format(Locale.ROOT, "no acceptable servo set: no %d of the %d candidates that pass the filters are %.0f px apart",
                    r.needed(), r.passed(), r.minSeparationPx());
            case ILL_CONDITIONED -> String.format(Locale.ROOT, "no acceptable servo set: the best %d points have cond(L*) = %.3g > %.0f (bunched or nearly collinear); "
                    + "spread the target features wider in the reference view", r.needed(), r.condition(), r.maxCondition());
        };
    }

    /** Why a point was chosen. */
    public static String chosen(Selection.Chosen c) {
        Selection.ChosenWhy w = c.why();
        var r = c.candidate().robustness();
        List<String> parts = new ArrayList<>();
        r.repeatability().ifPresent(v -> parts.add(String.format(Locale.ROOT, "repeatability %.2f (>= %.2f)", v, w.minRepeatability())));
        r.trackSurvival().ifPresent(v -> parts.add(String.format(Locale.ROOT, "survival %.2f", v)));
        r.localisationErrorPx().ifPresent(v -> parts.add(String.format(Locale.ROOT, "localisation %.2f px (<= %.2f)", v, w.maxLocalisationPx())));
        r.jitterPx().ifPresent(v -> parts.add(String.format(Locale.ROOT, "jitter %.2f px", v)));
        return String.format(Locale.ROOT, "%s; without it the other %d points have cond(L*) %s instead of %.2f; nearest chosen point %.0f px away",
                parts.isEmpty() ? "no robustness measured" : String.join(", ", parts), w.others(), fmt(w.conditionWithout()), w.condition(), w.nearestPx());
    }

    /** Why a candidate was not chosen. */
    public static String rejected(Selection.Rejected r) {
        var c = r.candidate();
        return switch (r.why()) {
            case DEPTH_UNKNOWN -> "depth unknown: its pixel ray does not meet the target plane in front of the camera";
            case NOT_DESIGNED -> "not a designed target feature: no true feature within the match radius (a false detection)";
            case NEAR_BORDER -> String.format(Locale.ROOT, "too near the image border: %.1f px < %.0f px", r.value(), r.limit());
            case LOW_REPEATABILITY -> String.format(Locale.ROOT, "repeatability %.2f < %.2f (found again in %d of %d frames)", r.value(), r.limit(),
                    c.framesFound(), c.framesVisible());
            case LOW_SURVIVAL -> String.format(Locale.ROOT, "track survival %.2f < %.2f", r.value(), r.limit());
            case HIGH_LOCALISATION -> String.format(Locale.ROOT, "localisation error %.2f px > %.2f px", r.value(), r.limit());
            case HIGH_JITTER -> String.format(Locale.ROOT, "jitter %.2f px > %.2f px", r.value(), r.limit());
            case TOO_CLOSE -> String.format(Locale.ROOT, "passes the filters but lies %.1f px from chosen point %d (minimum separation %.0f px)",
                    r.value(), r.pointId(), r.limit());
            case NO_SEPARATED_SWAP -> "passes the filters but no swap with a chosen point keeps the separation";
            case WORSE_SWAP -> String.format(Locale.ROOT, "passes the filters; its best swap (for point %d) gives cond(L*) %s and objective %.3f, worse than %.3f",
                    r.pointId(), fmt(r.value()), r.swapObjective(), r.limit());
            case SET_REFUSED -> "passes the filters; " + r.refusal().map(Reasons::refusal).orElse("no acceptable servo set");
        };
    }

    /**
     * Why a better-conditioned set of the design's own features was not chosen, e.g. "designed features 48, 57, 70, 79
     * (L-corners) would give cond(L*) 37.96 instead of 66.37, but the xcorner detector found nothing on 48, 57, 70, 79
     * (L-corners): choose a detector that finds them". Feature ids are the design's, not candidate ids.
     */
    public static String betterDesigned(DesignedOptimum.Better b, String detector) {
        String set = String.format(Locale.ROOT, "designed features %s (%s) would give cond(L*) %.2f instead of %.2f", ids(b.featureIds()),
                kinds(new java.util.LinkedHashSet<>(b.kinds())), b.condition(), b.chosenCondition());
        return set + switch (b.why()) {
            case NOT_DETECTED -> String.format(Locale.ROOT, ", but the %s detector found nothing on %s (%s): choose a detector that finds them",
                    detector, ids(b.blocking()), kinds(b.blockingKinds()));
            case FILTERED -> String.format(Locale.ROOT, ", but the candidates on %s (%s) failed a filter (%s): see their rows for the figures",
                    ids(b.blocking()), kinds(b.blockingKinds()), b.filter().map(Reasons::filterName).orElse("a filter"));
            case OBJECTIVE -> ", but the chosen set scores better once image coverage is weighed in (objective log10 cond(L*) - w · coverage)";
            case SEARCH -> ", and it scores better on the objective too: the greedy search did not reach it; add its points by hand";
        };
    }

    private static String ids(List<Integer> ids) {
        List<String> s = new ArrayList<>();
        for (int i : ids) s.add(Integer.toString(i));
        return String.join(", ", s);
    }

    /** "L-corners and x-corners". */
    public static String kinds(java.util.Set<FeatureKind> ks) {
        List<String> s = new ArrayList<>();
        for (FeatureKind k : ks) s.add(switch (k) {
            case X_CORNER -> "x-corners";
            case CORNER -> "L-corners";
            case DOT_CENTRE -> "dot centres";
        });
        return String.join(" and ", s);
    }

    /** A short group name for a rejection, for one-line tallies. */
    public static String group(Selection.Why why) {
        return switch (why) {
            case TOO_CLOSE -> "too close to a chosen point";
            case NO_SEPARATED_SWAP, WORSE_SWAP, SET_REFUSED -> "passed the filters, not in the best set";
            case NOT_DESIGNED -> "not on a designed feature";
            case NEAR_BORDER -> "too near the border";
            case LOW_REPEATABILITY -> "low repeatability";
            case HIGH_LOCALISATION -> "poor localisation";
            case LOW_SURVIVAL -> "low track survival";
            case HIGH_JITTER -> "high jitter";
            case DEPTH_UNKNOWN -> "depth unknown";
        };
    }

    /** The name of a failed filter, as the refusal's tally gives it. */
    static String filterName(Selection.Why why) {
        return switch (why) {
            case DEPTH_UNKNOWN -> "depth unknown";
            case NOT_DESIGNED -> "not a designed target feature";
            case NEAR_BORDER -> "too near the image border";
            case LOW_REPEATABILITY -> "repeatability";
            case LOW_SURVIVAL -> "track survival";
            case HIGH_LOCALISATION -> "localisation error";
            case HIGH_JITTER -> "jitter";
            default -> group(why);
        };
    }

    /** "3 low repeatability, 2 too near the border" in first-seen order; group names or filter names. */
    public static String tally(Map<Selection.Why, Integer> counts, boolean groups) {
        Map<String, Integer> byName = new java.util.LinkedHashMap<>();
        counts.forEach((k, v) -> byName.merge(groups ? group(k) : filterName(k), v, Integer::sum));
        List<String> s = new ArrayList<>();
        byName.forEach((k, v) -> s.add(v + " " + k));
        return String.join(", ", s);
    }

    /** A finding on a servo set in plain words. */
    public static String finding(SetDiagnostics.Finding f) {
        List<Integer> ids = f.pointIds();
        return switch (f.kind()) {
            case TOO_FEW_POINTS -> "only " + f.count() + " point" + (f.count() == 1 ? "" : "s") + ": at least " + SetDiagnostics.MIN_POINTS
                    + " are needed (three points fit up to four camera poses, so the servo may settle at the wrong one)";
            case TOO_FEW_DISTINCT -> "only " + f.count() + " distinct points: at least " + SetDiagnostics.MIN_POINTS + " are needed";
            case DUPLICATE -> String.format(Locale.ROOT,
                    "points %d and %d are the same point (%.2f, %.2f) px: a duplicated point adds no information and makes L lose rank",
                    ids.get(0), ids.get(1), f.uPx(), f.vPx());
            case COLLINEAR -> String.format(Locale.ROOT,
                    "points %s lie on one line (minor/major spread %.4f < %.2f): the interaction matrix loses rank and the servo cannot control every motion",
                    String.join(", ", ids.stream().map(String::valueOf).toList()), f.value(), f.limit());
            case COINCIDENT -> String.format(Locale.ROOT,
                    "points %d and %d are only %.1f px apart: a tracker can confuse them and L is close to losing rank", ids.get(0), ids.get(1), f.value());
            case NEAR_SINGULAR -> String.format(Locale.ROOT,
                    "cond(L*) = %.3g > %.0f: the interaction matrix is near singular; some camera motions barely move the points, so image noise "
                            + "becomes large velocity commands; spread the points wider", f.value(), f.limit());
        };
    }

    /** A rehearsal warning in plain words. */
    public static String warning(RehearsalWarning w) {
        return switch (w.kind()) {
            case SET -> finding(w.finding().orElseThrow());
            case TURNED_ABOUT_AXIS -> String.format(Locale.ROOT, "starts may be turned by up to %.0f deg about the optical axis: near 180 deg the current-L law "
                    + "drives the camera back toward infinity (Chaumette 1998) and every law struggles; teach the reference closer to the start orientation", w.value());
            case FAR_RETREAT -> String.format(Locale.ROOT, "the camera retreated to %.2f times the reference distance from the target%s", w.value(),
                    w.law() == ControlLaw.CURRENT ? " (the current-L law under rotation about the optical axis; the mean law avoids most of it)" : "");
            case LOST_VIEW -> w.count() + " of " + w.runs() + " runs lost a point out of the field of view: shrink the start envelope, "
                    + "pick points nearer the image centre or use the current or mean law";
            case REDRAWN_STARTS -> w.count() + " drawn starts had a point out of view and were drawn again (more than one per run): the field of view, "
                    + "not the envelope, limits the starts, so the results cover a smaller envelope than asked";
            case TRACK_LOST -> w.count() + " of " + w.runs() + " runs lost a track according to the measured survival";
            case TIMED_OUT -> w.count() + " of " + w.runs() + " runs had not converged after " + w.value() + " s (too low a gain, noise or a local minimum)";
            case RETREAT_STOPPED -> w.count() + " of " + w.runs() + " runs backed away beyond " + w.value() + " times the reference distance and were stopped";
            case SINGULAR -> w.count() + " runs hit a singular interaction matrix";
            case LARGE_DEPTH_FACTOR -> "the depth error factor " + w.value() + " is large: the effective gain changes by that factor and the path bends";
        };
    }

    /** Every warning of a rehearsal in plain words, in order. */
    public static List<String> warnings(RehearsalResult r) {
        return r.warnings().stream().map(Reasons::warning).toList();
    }

    /** Why a camera calibration could not be made, in one line. */
    public static String calibrationFailure(Calibration.Failure f) {
        return switch (f.kind()) {
            case TOO_FEW_VIEWS -> "the board was found in " + f.found() + " of " + f.frames() + " frames; calibration needs at least " + f.minViews() + " views";
            case NOT_CONVERGED -> "the calibration did not converge (" + f.detail() + "); add views with the board tilted and in different parts of the image";
        };
    }

    private static String fmt(double v) {
        return Double.isInfinite(v) ? "infinite" : String.format(Locale.ROOT, "%.2f", v);
    }
}
