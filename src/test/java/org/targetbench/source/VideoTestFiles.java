package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.targetbench.export.VideoWriter;

import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/** Test clips made in the test itself: a source's frames written as a video, with its truth beside it. */
public final class VideoTestFiles {
    private VideoTestFiles() {}

    /** Writes every frame of {@code source} to {@code video} and its truth to NAME.truth.json. */
    public static void record(FrameSource source, Path video, int quality) throws IOException, SourceException {
        Map<String, FrameTruth> truth = new LinkedHashMap<>();
        try (source; VideoWriter w = VideoWriter.open(video, quality, 30)) {
            Optional<SourceFrame> f;
            while ((f = source.next()).isPresent()) {
                w.write(f.get().image());
                truth.put(f.get().name(), f.get().truth());
            }
        }
        TruthFile.write(source.referenceName(), truth, VideoFrames.truthBeside(video));
    }

    /** Writes frames to a video without truth. */
    public static void write(List<GrayF32> frames, Path video, int quality) throws IOException {
        try (VideoWriter w = VideoWriter.open(video, quality, 30)) {
            for (GrayF32 f : frames) w.write(f);
        }
    }
}
