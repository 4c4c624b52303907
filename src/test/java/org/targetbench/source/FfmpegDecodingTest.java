package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The FFmpeg video source against clips made by an encoder we did not write: Debian's ffmpeg 5.1 (libx264, libx265,
 * its MJPEG encoder, libvpx, libaom) from PNG renders, committed with their commands in
 * {@code src/test/resources/reference/video/PROVENANCE.md}. Frame counts, sizes and names must match the PNGs, and
 * each decoded frame must match its PNG in grey levels: a mean absolute difference within {@link #MAD_TOL} and a
 * mean signed difference within {@link #BIAS_TOL}. A wrong luma range (limited read as full or the reverse) moves the
 * dark squares up and the bright paper down by about 12 grey levels each (derived: 16 + 0.86 v against v): it gave a
 * mean absolute difference of 4.6 on a clip whose range flag contradicted its content, and it fails the darkest-grey
 * check below.
 */
class FfmpegDecodingTest {
    static final Path DIR = Path.of("src/test/resources/reference/video");
    static final int FRAMES = 24, W = 320, H = 240;
    /** Mean absolute grey-level difference allowed for lossy codecs at these settings (measured at most 1.05; "a few grey levels": common practice, no source). */
    static final double MAD_TOL = 3;
    /** Mean signed difference allowed: no overall brightness shift (measured at most 0.69, on the limited-range clips: rounding in the two range conversions). */
    static final double BIAS_TOL = 1.5;

    @TempDir Path tmp;

    static List<GrayF32> pngs() throws SourceException {
        List<GrayF32> out = new ArrayList<>();
        for (int i = 0; i < FRAMES; i++) out.add(ImageFiles.read(DIR.resolve(String.format("frames/frame_%03d.png", i))));
        return out;
    }

    /** {mean absolute difference, mean signed difference}. */
    static double[] diff(GrayF32 got, GrayF32 want) {
        double abs = 0, signed = 0;
        for (int i = 0; i < got.data.length; i++) {
            double d = got.data[i] - want.data[i];
            abs += Math.abs(d);
            signed += d;
        }
        return new double[]{abs / got.data.length, signed / got.data.length};
    }

    static List<SourceFrame> readAll(FrameSource s) throws SourceException {
        List<SourceFrame> out = new ArrayList<>();
        Optional<SourceFrame> f;
        while ((f = s.next()).isPresent()) out.add(f.get());
        return out;
    }

    @ParameterizedTest
    @ValueSource(strings = {"h264.mp4", "hevc.mp4", "mjpeg.avi", "h264-fullrange.mkv", "h264.mov", "vp9.webm", "av1.mkv", "h264-aac.mp4"})
    void everyFrameMatchesThePngItWasEncodedFrom(String clip) throws Exception {
        List<GrayF32> ref = pngs();
        try (FfmpegSource s = FfmpegSource.open(DIR.resolve(clip), null)) {
            assertEquals(FRAMES, s.frameCount(), "frames counted from the packets");
            assertEquals(W, s.width());
            assertEquals(H, s.height());
            List<SourceFrame> frames = readAll(s);
            assertEquals(FRAMES, frames.size());
            assertEquals(0, s.skippedFrames());
            for (int i = 0; i < FRAMES; i++) {
                SourceFrame f = frames.get(i);
                assertEquals(i, f.index());
                assertEquals(String.format("frame_%03d.png", i), f.name());
                double[] d = diff(f.image(), ref.get(i));
                assertTrue(d[0] <= MAD_TOL, clip + " frame " + i + ": mean absolute difference " + d[0]);
                assertTrue(Math.abs(d[1]) <= BIAS_TOL, clip + " frame " + i + ": mean signed difference " + d[1]);
            }
        }
    }

    @Test
    void fullRangeLumaKeepsItsValuesAndLimitedRangeIsStretched() throws Exception {
        // the same picture coded in both ranges decodes to the same grey levels (ITU-R BT.601 black 16, white 235)
        try (FfmpegSource full = FfmpegSource.open(DIR.resolve("h264-fullrange.mkv"), null);
             FfmpegSource limited = FfmpegSource.open(DIR.resolve("h264.mp4"), null)) {
            GrayF32 a = full.next().orElseThrow().image(), b = limited.next().orElseThrow().image();
            float minA = 255, minB = 255;
            for (int i = 0; i < a.data.length; i++) {
                minA = Math.min(minA, a.data[i]);
                minB = Math.min(minB, b.data[i]);
            }
            GrayF32 png = pngs().get(0);
            float minPng = 255;
            for (float v : png.data) minPng = Math.min(minPng, v);
            assertEquals(minPng, minA, 3, "darkest grey, full range");
            assertEquals(minPng, minB, 3, "darkest grey, limited range");
        }
    }

    @Test
    void aDamagedClipStillDecodesMostFramesAndCountsTheRest() throws Exception {
        // zero 48 bytes inside the first key frame (the first frame's data starts just after the mdat box header)
        byte[] b = Files.readAllBytes(DIR.resolve("h264.mp4"));
        int mdat = indexOf(b, "mdat".getBytes(StandardCharsets.US_ASCII));
        for (int i = mdat + 400; i < mdat + 448; i++) b[i] = 0;
        Path damaged = tmp.resolve("damaged.mp4");
        Files.write(damaged, b);
        List<GrayF32> ref = pngs();
        try (FfmpegSource s = FfmpegSource.open(damaged, null)) {
            List<SourceFrame> frames = readAll(s);
            assertTrue(frames.size() >= FRAMES - 3, "decoded " + frames.size() + " of " + FRAMES);
            assertEquals(FRAMES - frames.size(), s.skippedFrames());
            for (SourceFrame f : frames) {
                if (f.index() < 8) continue; // the damaged key frame's group is concealed, not exact
                assertTrue(diff(f.image(), ref.get(f.index()))[0] <= MAD_TOL, "frame " + f.index() + " after the next key frame");
            }
        }
    }

    static int indexOf(byte[] hay, byte[] needle) {
        outer:
        for (int i = 0; i + needle.length <= hay.length; i++) {
            for (int j = 0; j < needle.length; j++) if (hay[i + j] != needle[j]) continue outer;
            return i;
        }
        throw new IllegalArgumentException("not found");
    }

    @Test
    void anAudioOnlyFileHasNoVideoStream() {
        SourceException e = assertThrows(SourceException.class, () -> FfmpegSource.open(DIR.resolve("audio-only.m4a"), null));
        assertTrue(e.getMessage().startsWith("no video stream in "), e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
    }

    @ParameterizedTest
    @ValueSource(strings = {"notes.mkv", "notes.webm", "notes.csv", "notes.txt"})
    void aFileThatIsNotAVideoIsRefusedInOneLine(String name) throws Exception {
        Path f = tmp.resolve(name);
        Files.writeString(f, "frame,x,y\n0,1,2\nthese are notes about a video, not a video at all\n".repeat(40));
        SourceException e = assertThrows(SourceException.class, () -> FfmpegSource.open(f, null));
        assertTrue(e.getMessage().startsWith("not a video") || e.getMessage().startsWith("no video stream"), e.getMessage());
        assertFalse(e.getMessage().contains("\n"));
    }

    @Test
    void aStillImageIsNotAVideo() throws Exception {
        Path png = tmp.resolve("still.png");
        Files.copy(DIR.resolve("frames/frame_000.png"), png);
        Path renamed = tmp.resolve("still.mkv");
        Files.copy(png, renamed);
        SourceException e = assertThrows(SourceException.class, () -> FfmpegSource.open(renamed, null));
        assertTrue(e.getMessage().startsWith("not a video"), e.getMessage());
    }
}
