package org.targetbench.pipeline;

import org.targetbench.select.Selection;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The one place where the typed reasons of a selection become sentences, for the console, the files and the workbench
 * alike; a refused pick, which names files and options, is explained beside the results-folder reader
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

    private static String fmt(double v) {
        return Double.isInfinite(v) ? "infinite" : String.format(Locale.ROOT, "%.2f", v);
    }
}
