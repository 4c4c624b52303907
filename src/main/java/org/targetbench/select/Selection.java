package org.targetbench.select;

import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The outcome of choosing servo points: the chosen points and the rejected candidates, each with its typed reason,
 * and the figures of the chosen set. When no acceptable set exists, {@code chosen} is empty and {@code refusal} says
 * why. Sentences are rendered from these reasons by {@code pipeline.Reasons}.
 *
 * @param candidates how many candidates were offered
 * @param passed     how many passed the filters
 * @param condition  scaled cond(L*) of the chosen set (NaN when refused)
 * @param sigmaMin   smallest singular value of the scaled L*
 * @param coverage   convex-hull area of the chosen points as a fraction of the image
 * @param objective  log10 cond(L*) - w · coverage
 * @param search     how the set was searched and how many sets were evaluated
 */
public record Selection(Outcome outcome, int candidates, int passed, Optional<Refusal> refusal, List<Chosen> chosen,
                        List<Rejected> rejected, double condition, double sigmaMin, double coverage, double objective,
                        Search search) {
    public Selection {
        chosen = List.copyOf(chosen);
        rejected = List.copyOf(rejected);
    }

    /**
     * How the set was searched.
     *
     * @param combinations EXHAUSTIVE: the sets searched; else 0
     * @param evaluations  sets whose objective was evaluated
     */
    public record Search(SearchKind kind, long combinations, long evaluations) {
        /** No search ran (the selection was refused first). */
        public static final Search NONE = new Search(SearchKind.NONE, 0, 0);
    }

    public enum SearchKind {
        /** No search ran. */
        NONE,
        /** Every combination of the passing candidates. */
        EXHAUSTIVE,
        /** Greedy starts, then swaps while the objective improves. */
        GREEDY_SWAP
    }

    public enum Outcome { SELECTED, NO_ACCEPTABLE_SET }

    /** Why no set was acceptable. */
    public enum RefusalKind {
        /** Fewer candidates passed the filters than points are needed. */
        TOO_FEW_PASS,
        /** No {@code needed} of the passing candidates are far enough apart. */
        NOT_SEPARATED,
        /** The best set's cond(L*) exceeds the limit. */
        ILL_CONDITIONED
    }

    /**
     * A refusal and its numbers.
     *
     * @param candidates      candidates offered
     * @param passed          candidates that passed the filters
     * @param needed          points asked for
     * @param filtered        per failed filter, how many candidates it rejected (in first-seen order)
     * @param minSeparationPx the separation asked for, pixels
     * @param condition       cond(L*) of the best set (ILL_CONDITIONED)
     * @param maxCondition    the condition limit
     */
    public record Refusal(RefusalKind kind, int candidates, int passed, int needed, Map<Why, Integer> filtered, double minSeparationPx, double condition,
                          double maxCondition) {
        public Refusal {
            filtered = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(filtered));
        }
    }

    /** Why a candidate was not chosen. */
    public enum Why {
        /** Its pixel ray does not meet the target plane in front of the camera. */
        DEPTH_UNKNOWN,
        /** No true feature within the match radius (a false detection). */
        NOT_DESIGNED,
        /** Nearer the border than the margin ({@code value} the distance, {@code limit} the margin). */
        NEAR_BORDER,
        /** Repeatability below the minimum ({@code framesFound} of {@code framesVisible}). */
        LOW_REPEATABILITY,
        /** Track survival below the minimum. */
        LOW_SURVIVAL,
        /** Localisation error above the maximum, pixels. */
        HIGH_LOCALISATION,
        /** Jitter above the maximum, pixels. */
        HIGH_JITTER,
        /** Passes the filters but lies {@code value} px from chosen point {@code pointId} ({@code limit} the separation). */
        TOO_CLOSE,
        /** Passes the filters but no swap with a chosen point keeps the separation. */
        NO_SEPARATED_SWAP,
        /** Passes the filters; its best swap (for {@code pointId}) gives cond {@code value}, objective {@code swapObjective} worse than {@code limit}. */
        WORSE_SWAP,
        /** Passes the filters, but the selection refused every set ({@link Rejected#refusal}). */
        SET_REFUSED;

        /** A failed filter (as opposed to losing the choice among candidates that passed). */
        public boolean isFilter() { return ordinal() <= HIGH_JITTER.ordinal(); }
    }

    /** A chosen point and why: its robustness against the limits, and what the set would be without it. */
    public record Chosen(Candidate candidate, ChosenWhy why) {}

    /**
     * Why a point was chosen.
     *
     * @param minRepeatability    the filter's minimum repeatability
     * @param maxLocalisationPx   the filter's maximum localisation error, pixels
     * @param others              how many other points are in the set
     * @param conditionWithout    cond(L*) of the set without this point (infinite when rank deficient)
     * @param condition           cond(L*) of the set
     * @param nearestPx           distance to the nearest other chosen point, pixels
     */
    public record ChosenWhy(double minRepeatability, double maxLocalisationPx, int others, double conditionWithout, double condition,
                            double nearestPx) {}

    /**
     * A candidate that was not chosen and why.
     *
     * @param value         the measured figure the reason is about (NaN when none)
     * @param limit         the limit it was held against (NaN when none)
     * @param pointId       the chosen point it relates to (-1 when none)
     * @param swapObjective objective of its best swap (WORSE_SWAP)
     * @param refusal       the refusal (SET_REFUSED)
     */
    public record Rejected(Candidate candidate, Why why, double value, double limit, int pointId, double swapObjective,
                           Optional<Refusal> refusal) {
        static Rejected of(Candidate c, Why why, double value, double limit) {
            return new Rejected(c, why, value, limit, -1, Double.NaN, Optional.empty());
        }
    }
}
