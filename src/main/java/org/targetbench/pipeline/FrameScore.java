package org.targetbench.pipeline;

import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorType;
import org.targetbench.score.LocalisationResult;
import org.targetbench.score.RepeatabilityResult;
import org.targetbench.score.SpreadResult;

import java.util.List;
import java.util.Optional;

/**
 * One detector's result on one frame.
 *
 * @param repeatability against the reference frame, when the frame has a homography and is not the reference
 * @param localisation  against true feature positions, when the frame has them
 * @param locDistances  distances of the found true features (for pooling over frames), pixels
 */
public record FrameScore(DetectorType detector, int frameIndex, String frameName, List<Detection> detections,
                         Optional<RepeatabilityResult> repeatability, Optional<LocalisationResult> localisation,
                         double[] locDistances, SpreadResult spread) {
    public FrameScore {
        detections = List.copyOf(detections);
        locDistances = locDistances.clone();
    }

    @Override public double[] locDistances() { return locDistances.clone(); }
}
