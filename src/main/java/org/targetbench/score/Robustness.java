package org.targetbench.score;

import java.util.OptionalDouble;

/**
 * Robustness figures of one image point, each empty when it was not measured. Filters and the rehearsal skip what
 * was not measured.
 *
 * @param repeatability       fraction of the other frames (the comparison frames now, a condition sweep later) in
 *                            which the point was detected again within epsilon of where the known homography puts
 *                            it, 0..1
 * @param trackSurvival       fraction of tracks of this point that survived a tracked sequence, 0..1
 * @param localisationErrorPx RMS distance of the point's detections from the true feature position, pixels
 * @param jitterPx            standard deviation of the tracked position of a still point, pixels
 */
public record Robustness(OptionalDouble repeatability, OptionalDouble trackSurvival, OptionalDouble localisationErrorPx,
                         OptionalDouble jitterPx) {
    public Robustness {
        check(repeatability, "repeatability", true);
        check(trackSurvival, "track survival", true);
        check(localisationErrorPx, "localisation error", false);
        check(jitterPx, "jitter", false);
    }

    private static void check(OptionalDouble v, String name, boolean fraction) {
        if (v.isEmpty()) return;
        double d = v.getAsDouble();
        if (!Double.isFinite(d) || d < 0 || (fraction && d > 1))
            throw new IllegalArgumentException(name + " must be " + (fraction ? "within 0..1" : "finite and >= 0") + ", got " + d);
    }

    /** Nothing measured. */
    public static Robustness none() {
        return new Robustness(OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty());
    }
}
