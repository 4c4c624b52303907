package org.targetbench.formats;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.detect.Detection;
import org.targetbench.export.CompareWriter;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.FrameScore;
import org.targetbench.pipeline.PickRun;
import org.targetbench.source.FrameTruth;
import org.targetbench.source.SourceFrame;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A pick's input from a comparison in memory, holding exactly what its saved results folder would give
 * ({@link ResultsFolder.Data#pickInput()}): detections at the precision detections.csv records, settings as summary.json
 * records them, truth of the frames that have some, the files named as a saved folder names them. So the workbench,
 * the demo and {@code pick --from} choose the same set from the same frames.
 */
public final class PickInputs {
    private PickInputs() {}

    /** Name under which the reference pose and the design are recorded, as in a saved folder. */
    public static final String POSES_LABEL = "poses.json", DESIGN_LABEL = "target.json";

    public static PickRun.Input fromComparison(CompareResult cr, List<SourceFrame> frames, CameraModel camera, TargetDesign design,
                                               Pose referencePose) {
        Map<String, Map<String, List<Detection>>> dets = new LinkedHashMap<>();
        for (FrameScore s : cr.frames()) {
            if (s.detections().isEmpty()) continue; // a saved folder has no rows for such a frame
            List<Detection> recorded = new ArrayList<>();
            for (Detection d : s.detections()) recorded.add(CompareWriter.asRecorded(d));
            dets.computeIfAbsent(s.detector().cliName(), k -> new LinkedHashMap<>()).put(s.frameName(), recorded);
        }
        Map<String, FrameTruth> truth = new LinkedHashMap<>();
        for (SourceFrame f : frames)
            if (f.truth().fromReference().isPresent() || !f.truth().features().isEmpty()) truth.put(f.name(), f.truth());
        List<String> ranking = cr.ranked().stream().map(s -> s.detector().cliName()).toList();
        return new PickRun.Input(cr.referenceName(), cr.epsilon(), ranking, CompareWriter.detectorSettings(cr), dets, Optional.of(truth),
                Optional.of(camera), Optional.ofNullable(design), Optional.ofNullable(referencePose), POSES_LABEL, DESIGN_LABEL);
    }
}
