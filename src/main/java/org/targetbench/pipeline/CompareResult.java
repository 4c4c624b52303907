package org.targetbench.pipeline;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.source.SourceFrame;

import java.util.List;

/**
 * Everything a detector comparison produced.
 *
 * @param ranked       detector summaries, best first (see {@link CompareRun#RANKING})
 * @param frames       per detector, per frame scores, in detector then frame order
 * @param sampleFrames the reference frame and a few others, kept for overlays
 */
public record CompareResult(String sourceDescription, int width, int height, String referenceName, double epsilon,
                            int frameCount, int framesWithHomography, int framesWithPoints,
                            List<DetectorConfig> configs, List<DetectorSummary> ranked, List<FrameScore> frames,
                            List<SourceFrame> sampleFrames) {
    public CompareResult {
        configs = List.copyOf(configs);
        ranked = List.copyOf(ranked);
        frames = List.copyOf(frames);
        sampleFrames = List.copyOf(sampleFrames);
    }
}
