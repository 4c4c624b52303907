package org.targetbench.report;

import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorType;
import org.targetbench.export.AtomicOutput;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.FrameScore;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.SourceFrame;

import java.io.IOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Writes overlay PNGs of a comparison: for each kept sample frame, one image per detector
 * ({@code overlays/<frame>_<detector>.png}) and one with every detector ({@code overlays/<frame>_all.png}).
 */
public final class OverlayWriter {
    private OverlayWriter() {}

    public static List<String> write(CompareResult r, AtomicOutput out) throws IOException {
        List<String> written = new ArrayList<>();
        for (SourceFrame f : r.sampleFrames()) {
            Map<DetectorType, List<Detection>> all = new LinkedHashMap<>();
            for (FrameScore s : r.frames())
                if (s.frameIndex() == f.index()) all.put(s.detector(), s.detections());
            String stem = f.name().replaceAll("\\.[A-Za-z]+$", "");
            for (var e : all.entrySet()) {
                String name = "overlays/" + stem + "_" + e.getKey().cliName() + ".png";
                ImageFiles.writePng(Overlay.draw(f.image(), Map.of(e.getKey(), e.getValue()), f.truth().features()), out.file(name));
                written.add(name);
            }
            String name = "overlays/" + stem + "_all.png";
            ImageFiles.writePng(Overlay.draw(f.image(), all, f.truth().features()), out.file(name));
            written.add(name);
        }
        return written;
    }
}
