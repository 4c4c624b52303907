package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.targetbench.track.TrackScenes;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Video decoding against the PNG each frame was encoded from: clips are made in the test by our own writers (FFmpeg's
 * OpenH264 encoder for MP4, the JDK's JPEG encoder for MJPEG streams and AVI) at the highest quality, then read back
 * through the sources (FFmpeg for MP4 and AVI, the JDK's JPEG reader for raw MJPEG streams).
 * Also: an undecodable frame in the middle is skipped and counted; cut-short, empty and foreign files are refused.
 */
class VideoDecodingTest {
    /** Largest grey-level difference from the source PNG for MJPEG at quality 100 (measured 1, plus one grey level of margin: common practice, no source). */
    static final int GREY_TOL = 2;
    /** The same for H.264 at OpenH264's finest quantiser, which is not lossless (measured 3). */
    static final int GREY_TOL_H264 = 3;
    static final int W = 160, H = 128, FRAMES = 6;

    @TempDir Path tmp;

    /** Frames written as PNG and read back: the references the video must reproduce. */
    List<GrayF32> pngFrames() throws Exception {
        List<GrayF32> out = new ArrayList<>();
        for (int i = 0; i < FRAMES; i++) {
            Path png = tmp.resolve(String.format("src_%02d.png", i));
            ImageFiles.writePng(TrackScenes.texture(W, H, 4, 1.5 * i, 0.5 * i), png);
            out.add(ImageFiles.read(png));
        }
        return out;
    }

    static FrameSource open(Path p) throws SourceException {
        return p.toString().endsWith(".mjpeg") ? MjpegSource.open(p, null) : FfmpegSource.open(p, null);
    }

    @ParameterizedTest
    @ValueSource(strings = {"mp4", "avi", "mjpeg"})
    void framesDecodeWithinTwoGreyLevelsOfTheirPng(String ext) throws Exception {
        List<GrayF32> ref = pngFrames();
        Path video = tmp.resolve("clip." + ext);
        VideoTestFiles.write(ref, video, 100);
        try (FrameSource s = open(video)) {
            assertEquals(FRAMES, s.frameCount());
            assertEquals(W, s.width());
            assertEquals(H, s.height());
            Optional<SourceFrame> f;
            int n = 0;
            while ((f = s.next()).isPresent()) {
                GrayF32 got = f.get().image(), want = ref.get(f.get().index());
                double worst = 0;
                for (int i = 0; i < got.data.length; i++) worst = Math.max(worst, Math.abs(got.data[i] - want.data[i]));
                assertTrue(worst <= (ext.equals("mp4") ? GREY_TOL_H264 : GREY_TOL), ext + " frame " + f.get().index() + " differs by " + worst + " grey levels");
                assertEquals(String.format("frame_%03d.png", n), f.get().name());
                n++;
            }
            assertEquals(FRAMES, n);
        }
    }

    /**
     * Replaces the body of the (k+1)-th JPEG (everything between its start and end markers) with garbage that holds
     * no marker, so no decoder can recover the frame (FFmpeg's decoder skips damage in front of intact markers).
     */
    static byte[] breakJpeg(byte[] file, int k) {
        byte[] b = file.clone();
        int seen = -1;
        for (int i = 0; i + 1 < b.length; i++) {
            if ((b[i] & 0xFF) == 0xFF && (b[i + 1] & 0xFF) == 0xD8 && ++seen == k) {
                for (int j = i + 2; j + 1 < b.length && !((b[j] & 0xFF) == 0xFF && (b[j + 1] & 0xFF) == 0xD9); j++) b[j] = 0x11;
                return b;
            }
        }
        throw new IllegalArgumentException("no JPEG number " + k);
    }

    @ParameterizedTest
    @ValueSource(strings = {"avi", "mjpeg"})
    void anUndecodableFrameIsSkippedAndCounted(String ext) throws Exception {
        Path video = tmp.resolve("clip." + ext);
        VideoTestFiles.write(pngFrames(), video, 90);
        Files.write(video, breakJpeg(Files.readAllBytes(video), 3));
        try (FrameSource s = open(video)) {
            List<Integer> idx = new ArrayList<>();
            Optional<SourceFrame> f;
            while ((f = s.next()).isPresent()) idx.add(f.get().index());
            assertEquals(List.of(0, 1, 2, 4, 5), idx);
            assertEquals(1, s.skippedFrames());
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"mp4", "avi", "mjpeg"})
    void cutShortFilesAreRefused(String ext) throws Exception {
        Path video = tmp.resolve("clip." + ext);
        VideoTestFiles.write(pngFrames(), video, 90);
        byte[] all = Files.readAllBytes(video);
        Files.write(video, Arrays.copyOf(all, all.length * 2 / 3));
        SourceException e = assertThrows(SourceException.class, () -> open(video));
        assertTrue(e.getMessage().contains("truncated"), e.getMessage());
    }

    @ParameterizedTest
    @ValueSource(strings = {"mp4", "avi", "mjpeg"})
    void emptyAndForeignFilesAreRefused(String ext) throws IOException {
        Path empty = tmp.resolve("empty." + ext);
        Files.write(empty, new byte[0]);
        SourceException e = assertThrows(SourceException.class, () -> open(empty));
        assertTrue(e.getMessage().contains("empty video"), e.getMessage());
        Path text = tmp.resolve("notes." + ext);
        Files.writeString(text, "these are notes about a video, not a video at all\n".repeat(20));
        SourceException e2 = assertThrows(SourceException.class, () -> open(text));
        assertTrue(e2.getMessage().contains("not an") || e2.getMessage().contains("corrupt"), e2.getMessage());
    }

    @org.junit.jupiter.api.Test
    void anAviWithoutFramesIsEmpty() throws Exception {
        // a well-formed AVI whose movi list holds no frames: write one frame, then drop its chunk and index
        Path video = tmp.resolve("one.avi");
        VideoTestFiles.write(List.of(pngFrames().get(0)), video, 90);
        byte[] b = Files.readAllBytes(video);
        for (int i = 0; i + 4 < b.length; i++)
            if (b[i] == '0' && b[i + 1] == '0' && b[i + 2] == 'd' && b[i + 3] == 'c') { b[i] = 'J'; b[i + 1] = 'U'; b[i + 2] = 'N'; b[i + 3] = 'K'; }
        Files.write(video, b);
        SourceException e = assertThrows(SourceException.class, () -> open(video));
        assertTrue(e.getMessage().contains("empty video"), e.getMessage());
    }
}
