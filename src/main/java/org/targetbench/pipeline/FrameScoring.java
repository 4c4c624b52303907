package org.targetbench.pipeline;

import org.targetbench.camera.Homography;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.score.Localisation;
import org.targetbench.score.LocalisationResult;
import org.targetbench.score.Repeatability;
import org.targetbench.score.RepeatabilityResult;
import org.targetbench.score.Spread;
import org.targetbench.score.SpreadResult;

import java.util.List;
import java.util.Optional;

/**
 * The one per-frame scoring of a detector's points, shared by the comparison, the sweep's cells and the workbench's
 * live view: repeatability against the reference detections through the frame's homography ({@link Repeatability},
 * whose "found again" rule is the only one), localisation against the frame's true features within
 * {@link Localisation#DEFAULT_RADIUS}, and spread.
 */
public final class FrameScoring {
    private FrameScoring() {}

    /**
     * One frame's scores.
     *
     * @param repeatability against the reference, when a homography was given
     * @param localisation  against the true features, when the frame has some
     * @param locDistances  distances of the found true features (for pooling over frames), pixels
     */
    public record Scored(Optional<RepeatabilityResult> repeatability, Optional<LocalisationResult> localisation, double[] locDistances,
                         SpreadResult spread) {
        /** The same scores with repeatability measured another way (between undistorted images, for registered truth). */
        public Scored withRepeatability(RepeatabilityResult r) {
            return new Scored(Optional.of(r), localisation, locDistances, spread);
        }

        /** RMS localisation error, pixels; NaN when unknown. */
        public double localisationRmsPx() { return localisation.map(LocalisationResult::rmsPx).orElse(Double.NaN); }

        /** Repeatability, NaN when undefined or not measured. */
        public double repeatabilityOrNaN() {
            return repeatability.flatMap(r -> r.repeatability().isPresent() ? Optional.of(r.repeatability().getAsDouble()) : Optional.empty())
                    .orElse(Double.NaN);
        }
    }

    /**
     * @param reference     the same detector's points on the reference frame (used only with a homography)
     * @param found         the points on this frame
     * @param fromReference maps reference pixels to this frame's pixels; empty for no repeatability
     * @param refWidth      reference frame width, pixels (likewise height)
     * @param truth         true feature positions in this frame that the detector is built to find
     *                      ({@link Localisation#findableBy}; may be empty)
     * @param width         this frame's width, pixels (likewise height)
     * @param epsilon       match radius, pixels
     */
    public static Scored score(List<Detection> reference, List<Detection> found, Optional<Homography> fromReference, int refWidth,
                               int refHeight, List<ProjectedFeature> truth, int width, int height, double epsilon) {
        Optional<RepeatabilityResult> rep = fromReference.map(h -> Repeatability.score(reference, found, h, refWidth, refHeight, width, height, epsilon));
        Optional<LocalisationResult> loc = Optional.empty();
        double[] d = new double[0];
        if (!truth.isEmpty()) {
            d = Localisation.distances(truth, found, Localisation.DEFAULT_RADIUS);
            loc = Optional.of(Localisation.summarise(d, truth.size()));
        }
        return new Scored(rep, loc, d, Spread.score(found, width, height));
    }
}
