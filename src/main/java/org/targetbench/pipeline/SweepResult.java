package org.targetbench.pipeline;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.Perturbation;

import java.util.List;
import java.util.Map;

/**
 * Everything a sweep produced.
 *
 * @param rows          every finished cell, sorted by detector, parameter, level, frame (the order of the inputs)
 * @param values        the swept values of each parameter, by level
 * @param cancelled     true when the run was stopped early; {@code rows} then holds only finished cells
 * @param sampleImage   the first base frame, for overlays
 * @param sampleDetections each detector's points on it
 */
public record SweepResult(String description, List<DetectorConfig> detectors, List<Perturbation> parameters,
                          Map<Perturbation, double[]> values, int baseFrames, long seed, double epsilon,
                          List<SweepRow> rows, boolean cancelled, int cellsDone, int cellsTotal, double wallSeconds,
                          GrayF32 sampleImage, List<ProjectedFeature> sampleTruth, Map<DetectorType, List<Detection>> sampleDetections) {
    public SweepResult {
        detectors = List.copyOf(detectors);
        parameters = List.copyOf(parameters);
        values = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(values));
        rows = List.copyOf(rows);
        sampleTruth = List.copyOf(sampleTruth);
        sampleDetections = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(sampleDetections)); // in detector order: reports draw in it
    }

    public List<DetectorType> detectorTypes() {
        return detectors.stream().map(DetectorConfig::type).toList();
    }
}
