package org.targetbench.cli;

import org.targetbench.pipeline.SweepBase;
import org.targetbench.source.ImageFolderSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** Base frames of a sweep read from an image folder (each frame is its own reference). */
final class FolderBase {
    private FolderBase() {}

    static SweepBase read(Path folder, Path truth, int most) throws SourceException {
        List<SweepBase.BaseFrame> frames = new ArrayList<>();
        try (ImageFolderSource src = ImageFolderSource.open(folder, truth)) {
            Optional<SourceFrame> f;
            while (frames.size() < most && (f = src.next()).isPresent())
                frames.add(new SweepBase.BaseFrame(f.get().name(), f.get().image(), f.get().truth().features(), Optional.empty()));
        }
        return new SweepBase("frames of " + folder, frames, Optional.empty());
    }
}
