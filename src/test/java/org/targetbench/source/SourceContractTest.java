package org.targetbench.source;

import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.targetbench.TestScenes;
import org.targetbench.camera.Pose;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.FrameSetWriter;
import org.targetbench.pipeline.Progress;
import org.targetbench.target.TargetDesign;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/** The {@link FrameSource} contract, checked for every source. */
class SourceContractTest {
    @TempDir
    static Path tmp;

    interface Opener {
        FrameSource open() throws Exception;
    }

    static SyntheticSource synthetic() {
        TargetDesign d = TestScenes.checkerboard();
        RenderConfig rc = new RenderConfig();
        rc.noiseSigma = 2;
        return new SyntheticSource(d, TestScenes.VGA, List.of(
                Pose.facing(d.widthMm(), d.heightMm(), 0.35, 0, 0, 0, 0, 0),
                Pose.facing(d.widthMm(), d.heightMm(), 0.35, 10, 0, 0, 0, 0),
                Pose.facing(d.widthMm(), d.heightMm(), 0.40, 0, -15, 5, 0, 0)), rc);
    }

    static Stream<Arguments> sources() throws Exception {
        Path folder = tmp.resolve("frames");
        if (!java.nio.file.Files.isDirectory(folder)) {
            try (AtomicOutput out = AtomicOutput.open(folder)) {
                FrameSetWriter.write(synthetic(), out, "", Progress.NONE);
                out.commit();
            }
            for (String name : List.of("clip.mjpeg", "clip.avi", "clip.mp4")) VideoTestFiles.record(synthetic(), tmp.resolve(name), 95);
        }
        return Stream.of(
                Arguments.of("synthetic", (Opener) SourceContractTest::synthetic),
                Arguments.of("image folder", (Opener) () -> ImageFolderSource.open(folder, null)),
                Arguments.of("synthetic motion", (Opener) () -> org.targetbench.pipeline.MotionScenarios.open("shake,frames=3")),
                Arguments.of("MJPEG stream", (Opener) () -> MjpegSource.open(tmp.resolve("clip.mjpeg"), null)),
                Arguments.of("MJPEG in AVI", (Opener) () -> FfmpegSource.open(tmp.resolve("clip.avi"), null)),
                Arguments.of("H.264 MP4", (Opener) () -> FfmpegSource.open(tmp.resolve("clip.mp4"), null)),
                Arguments.of("webcam (simulated camera)", (Opener) () -> new WebcamSource(new FakeCamera(320, 240, 3, false), "simulated")));
    }

    /** Live sources carry no truth and do not know their length. */
    static boolean live(String name) { return name.startsWith("webcam"); }

    @ParameterizedTest(name = "{0}")
    @MethodSource("sources")
    void deliversConsecutiveFramesOfTheAdvertisedSizeThenNothing(String name, Opener opener) throws Exception {
        try (FrameSource s = opener.open()) {
            List<SourceFrame> frames = new ArrayList<>();
            Optional<SourceFrame> f;
            while ((f = s.next()).isPresent()) frames.add(f.get());
            if (live(name)) assertEquals(-1, s.frameCount());
            else assertEquals(s.frameCount(), frames.size());
            assertFalse(frames.isEmpty());
            assertEquals(0, s.skippedFrames());
            for (int i = 0; i < frames.size(); i++) {
                assertEquals(i, frames.get(i).index());
                assertEquals(s.width(), frames.get(i).image().width);
                assertEquals(s.height(), frames.get(i).image().height);
            }
            assertTrue(frames.stream().anyMatch(x -> x.name().equals(s.referenceName())), "reference frame delivered");
            assertTrue(s.next().isEmpty());
            assertTrue(s.next().isEmpty(), "empty forever");
            s.close();
            s.close();
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("sources")
    void referenceHasIdentityTruthAndOthersCarryTruth(String name, Opener opener) throws Exception {
        org.junit.jupiter.api.Assumptions.assumeFalse(live(name), "a live camera has no truth");
        try (FrameSource s = opener.open()) {
            SourceFrame ref = s.next().orElseThrow();
            var h = ref.truth().fromReference().orElseThrow();
            double[] p = h.apply(100, 50);
            assertEquals(100, p[0], 1e-9);
            assertEquals(50, p[1], 1e-9);
            SourceFrame next = s.next().orElseThrow();
            assertTrue(next.truth().fromReference().isPresent());
            assertFalse(next.truth().features().isEmpty());
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("sources")
    void deliveredImagesAreNotReused(String name, Opener opener) throws Exception {
        try (FrameSource s = opener.open()) {
            SourceFrame a = s.next().orElseThrow();
            float[] copy = a.image().data.clone();
            s.next().orElseThrow();
            assertArrayEquals(copy, a.image().data);
        }
    }
}
