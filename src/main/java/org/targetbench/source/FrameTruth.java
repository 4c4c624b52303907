package org.targetbench.source;

import org.targetbench.camera.Homography;
import org.targetbench.camera.Projection.ProjectedFeature;

import java.util.List;
import java.util.Optional;

/**
 * What is known to be true about a frame.
 *
 * @param fromReference homography taking reference-frame pixels to this frame's pixels, when known
 * @param features      true pixel of each target feature visible in this frame (empty when unknown)
 */
public record FrameTruth(Optional<Homography> fromReference, List<ProjectedFeature> features) {
    public FrameTruth {
        features = List.copyOf(features);
    }

    public static FrameTruth none() { return new FrameTruth(Optional.empty(), List.of()); }

    public static FrameTruth homography(Homography h) { return new FrameTruth(Optional.of(h), List.of()); }
}
