package org.targetbench.select;

import java.util.List;

/**
 * The outcome of choosing servo points: the chosen points and the rejected candidates, each with its reason, and the
 * figures of the chosen set. When no acceptable set exists, {@code chosen} is empty and {@code message} says why.
 *
 * @param condition scaled cond(L*) of the chosen set (NaN when refused)
 * @param sigmaMin  smallest singular value of the scaled L*
 * @param coverage  convex-hull area of the chosen points as a fraction of the image
 * @param objective log10 cond(L*) - w · coverage
 * @param method    how the set was searched and how many sets were evaluated
 */
public record Selection(Outcome outcome, String message, List<Chosen> chosen, List<Rejected> rejected, double condition,
                        double sigmaMin, double coverage, double objective, String method) {
    public Selection {
        chosen = List.copyOf(chosen);
        rejected = List.copyOf(rejected);
    }

    public enum Outcome { SELECTED, NO_ACCEPTABLE_SET }

    /** A chosen point and why. */
    public record Chosen(Candidate candidate, String reason) {}

    /** A candidate that was not chosen and why. */
    public record Rejected(Candidate candidate, String reason) {}
}
