package org.targetbench.servo;

import java.util.Optional;

/**
 * A known failure mode of a rehearsal's set, envelope or results, with its numbers; {@code pipeline.Reasons} renders it
 * as a sentence. Which fields a kind fills is listed at the kind; the others are 0, NaN or empty.
 *
 * @param count   how many runs or starts (LOST_VIEW, REDRAWN_STARTS, TRACK_LOST, TIMED_OUT, RETREAT_STOPPED, SINGULAR)
 * @param runs    runs in the rehearsal (the same kinds)
 * @param value   the figure of the kind, in its unit
 * @param law     the control law used (FAR_RETREAT)
 * @param finding the set's own finding (SET)
 */
public record RehearsalWarning(Kind kind, int count, int runs, double value, ControlLaw law, Optional<SetDiagnostics.Finding> finding) {
    public enum Kind {
        /** A finding of {@link SetDiagnostics} on the set. */
        SET,
        /** The envelope turns the starts by up to {@code value} degrees about the optical axis. */
        TURNED_ABOUT_AXIS,
        /** The camera retreated to {@code value} times the reference distance, under {@code law}. */
        FAR_RETREAT,
        /** {@code count} of {@code runs} runs lost a point out of the field of view. */
        LOST_VIEW,
        /** {@code count} drawn starts had a point out of view, more than one per run ({@code runs}). */
        REDRAWN_STARTS,
        /** {@code count} of {@code runs} runs lost a track by the measured survival. */
        TRACK_LOST,
        /** {@code count} of {@code runs} runs had not converged after {@code value} seconds. */
        TIMED_OUT,
        /** {@code count} of {@code runs} runs backed away beyond {@code value} times the reference distance. */
        RETREAT_STOPPED,
        /** {@code count} runs hit a singular interaction matrix. */
        SINGULAR,
        /** The scaled depth mode's error factor {@code value} is outside 0.5..2. */
        LARGE_DEPTH_FACTOR
    }

    static RehearsalWarning of(SetDiagnostics.Finding f) {
        return new RehearsalWarning(Kind.SET, 0, 0, Double.NaN, null, Optional.of(f));
    }

    static RehearsalWarning value(Kind kind, double value, ControlLaw law) {
        return new RehearsalWarning(kind, 0, 0, value, law, Optional.empty());
    }

    static RehearsalWarning runs(Kind kind, int count, int runs, double value) {
        return new RehearsalWarning(kind, count, runs, value, null, Optional.empty());
    }
}
