package org.targetbench.export;

import org.targetbench.source.FrameSource;
import org.targetbench.source.FrameTruth;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.TruthFile;
import org.targetbench.pipeline.Progress;

import java.io.IOException;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;

/**
 * Writes the frames of a source as an image folder with its {@code truth.json}, in exactly the layout
 * {@link org.targetbench.source.ImageFolderSource} reads.
 */
public final class FrameSetWriter {
    private FrameSetWriter() {}

    /** @param folder relative folder inside the output ("" for the top) */
    public static int write(FrameSource source, AtomicOutput out, String folder, Progress progress) throws IOException, SourceException {
        String prefix = folder.isEmpty() ? "" : folder + "/";
        Map<String, FrameTruth> truth = new LinkedHashMap<>();
        int n = 0;
        Optional<SourceFrame> f;
        while ((f = source.next()).isPresent()) {
            SourceFrame frame = f.get();
            ImageFiles.writePng(frame.image(), out.file(prefix + frame.name()));
            truth.put(frame.name(), frame.truth());
            progress.update(++n, source.frameCount(), "rendered " + frame.name());
        }
        TruthFile.write(source.referenceName(), truth, out.file(prefix + "truth.json"));
        return n;
    }
}
