package org.targetbench.detect;

import boofcv.struct.image.GrayF32;

import java.util.List;

/**
 * Finds point features in a grey frame. Implementations keep work buffers and are not thread safe: create one per
 * thread with {@link Detectors#create}.
 */
public interface PointDetector {
    DetectorType type();

    /**
     * Detects points in {@code image} (grey levels 0..255, not modified).
     *
     * @return at most {@link DetectorConfig#maxFeatures} points, strongest first, in the pixel-centre convention
     */
    List<Detection> detect(GrayF32 image);
}
