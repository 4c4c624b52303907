package org.targetbench.app;

import org.targetbench.pipeline.DemoScenario;
import org.targetbench.source.FrameSource;
import org.targetbench.source.ImageFolderSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** Loads sources into memory for the workbench (the frames of a file source are scrubbed back and forth). */
final class SourceLoader {
    /** Most frames held in memory from one file source (about 1.2 MB each at VGA). */
    static final int MAX_FRAMES = 600;

    /** A loaded source. */
    record Loaded(String name, List<SourceFrame> frames, String reference, Optional<Session.Scene> scene, boolean truncated) {}

    private SourceLoader() {}

    static Loaded demo() throws SourceException {
        Session.Scene scene = new Session.Scene(DemoScenario.target(), DemoScenario.camera(), DemoScenario.lighting(), DemoScenario.STANDOFF_M,
                DemoScenario.poses());
        try (FrameSource s = DemoScenario.source()) {
            return read("Demo: " + DemoScenario.target().name() + " on the fixture plate", s, Optional.of(scene));
        }
    }

    /** A video file (any FFmpeg reads, or raw MJPEG), with its NAME.truth.json when present. */
    static Loaded video(Path file) throws SourceException {
        try (FrameSource s = org.targetbench.formats.SourceSpec.open(file.toString(), null)) {
            return read(file.getFileName().toString(), s, Optional.empty());
        }
    }

    static Loaded folder(Path dir) throws SourceException {
        try (FrameSource s = ImageFolderSource.open(dir, null)) {
            return read(dir.getFileName() + " (" + dir + ")", s, Optional.empty());
        }
    }

    static Loaded read(String name, FrameSource s, Optional<Session.Scene> scene) throws SourceException {
        return read(name, s, scene, MAX_FRAMES);
    }

    /** Reads at most {@code most} frames of a source into memory. */
    static Loaded read(String name, FrameSource s, Optional<Session.Scene> scene, int most) throws SourceException {
        List<SourceFrame> frames = new ArrayList<>();
        Optional<SourceFrame> f;
        boolean truncated = false;
        while ((f = s.next()).isPresent()) {
            if (frames.size() >= most) {
                truncated = true;
                break;
            }
            frames.add(f.get());
        }
        if (frames.isEmpty()) throw new SourceException("the source delivered no frames: " + s.description());
        return new Loaded(name, frames, s.referenceName(), scene, truncated);
    }
}
