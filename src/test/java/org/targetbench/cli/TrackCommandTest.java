package org.targetbench.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.source.ImageFiles;
import org.targetbench.track.TrackScenes;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The track, record and devices commands as a user runs them: outputs and their consistency, a recorded video read
 * back with its truth, and one-line refusals of bad input with no output left behind.
 */
class TrackCommandTest {
    @TempDir static Path tmp;
    static Path mjpeg, mp4, avi;

    @BeforeAll
    static void recordClips() {
        mjpeg = tmp.resolve("clips/still.mjpeg");
        mp4 = tmp.resolve("clips/shake.mp4");
        avi = tmp.resolve("clips/shake.avi");
        for (var c : List.of(List.of("synthetic:still,frames=8", mjpeg.toString()), List.of("synthetic:shake,frames=8", mp4.toString()),
                List.of("synthetic:shake,frames=8", avi.toString()))) {
            Cli.Result r = Cli.run("record", "--source", c.get(0), "--quality", "90", "--out", c.get(1));
            assertEquals(0, r.exit(), r.err());
            assertEquals("", r.err());
        }
    }

    @Test
    void syntheticRunWritesConsistentFiles() throws IOException {
        Path out = tmp.resolve("synthetic");
        Cli.Result r = Cli.run("track", "--source", "synthetic:shake,frames=12", "--out", out.toString(), "--survival-at", "5");
        assertEquals(0, r.exit(), r.err());
        assertEquals("", r.err(), "nothing on stderr when not on a terminal");
        assertTrue(r.out().contains("survival: 1.000 at frame 5"), r.out());
        List<String> tracks = Files.readAllLines(out.resolve("tracks.csv"));
        assertEquals("track,frame,x,y,outcome,fb_error", tracks.get(0));
        List<String> survival = Files.readAllLines(out.resolve("survival.csv"));
        assertEquals("frame,alive_fraction", survival.get(0));
        assertEquals(1 + 12, survival.size());
        assertEquals("frame,tracks,p50_px,p95_px,max_px", Files.readAllLines(out.resolve("drift.csv")).get(0));
        JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        assertEquals("targetbench-track-summary", s.get("format").asText());
        assertEquals(12, s.get("frames").asInt());
        int initial = s.get("survival").get("initial_tracks").asInt();
        assertTrue(initial > 40, "checkerboard corners tracked: " + initial);
        assertEquals(12 * initial, tracks.size() - 1, "no loss under gentle shake: one row per track per frame");
        checkRows(tracks, survival, initial);
        assertTrue(s.get("drift_px").get("p95").asDouble() < 1.0, s.get("drift_px").toString());
    }

    @Test
    void lossesEndTracksWithOneRowAndSurvivalMatchesTheRows() throws IOException {
        Path out = tmp.resolve("ringing");
        Cli.Result r = Cli.run("track", "--source", "synthetic:vibration,amplitude_mm=15,frequency_hz=3,exposure_ms=32,frames=10", "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        List<String> tracks = Files.readAllLines(out.resolve("tracks.csv"));
        JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        int died = 0;
        for (JsonNode n : s.get("tracks").get("ended")) died += n.asInt();
        assertTrue(died > 0, "strong blur loses tracks: " + r.out());
        checkRows(tracks, Files.readAllLines(out.resolve("survival.csv")), s.get("survival").get("initial_tracks").asInt());
    }

    /**
     * Every track: a started row, then one row per frame while alive with consecutive frames, ending at most once with
     * a loss row and nothing after; survival.csv equals the initial tracks alive after each frame over their count.
     */
    static void checkRows(List<String> tracks, List<String> survival, int initial) {
        Map<String, Integer> lastFrame = new HashMap<>();
        Map<String, Boolean> ended = new HashMap<>();
        Map<Integer, Integer> initialAlive = new HashMap<>();
        java.util.Set<String> initialIds = new java.util.HashSet<>();
        for (String line : tracks.subList(1, tracks.size())) {
            String[] c = line.split(",", -1);
            assertEquals(6, c.length, line);
            String id = c[0];
            int frame = Integer.parseInt(c[1]);
            if (c[4].equals("started")) {
                assertFalse(lastFrame.containsKey(id), "started twice: " + line);
                assertEquals("", c[5], "no forward-backward error on a start row");
                if (frame == 0) initialIds.add(id);
            } else {
                assertEquals(lastFrame.get(id) + 1, frame, "consecutive frames: " + line);
                assertFalse(ended.getOrDefault(id, false), "row after the end: " + line);
            }
            lastFrame.put(id, frame);
            boolean loss = !(c[4].equals("started") || c[4].equals("tracked"));
            if (loss) ended.put(id, true);
            if (!loss && initialIds.contains(id)) initialAlive.merge(frame, 1, Integer::sum);
        }
        assertEquals(initial, initialIds.size());
        for (String line : survival.subList(1, survival.size())) {
            String[] c = line.split(",");
            int frame = Integer.parseInt(c[0]);
            assertEquals(initialAlive.getOrDefault(frame, 0) / (double) initial, Double.parseDouble(c[1]), 1e-4, line);
        }
    }

    @Test
    void recordedVideosAreTrackedWithTheirTruth() throws IOException {
        for (Path clip : List.of(mp4, avi)) {
            Path out = tmp.resolve("from-" + clip.getFileName());
            Cli.Result r = Cli.run("track", "--source", clip.toString(), "--out", out.toString());
            assertEquals(0, r.exit(), r.err());
            JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
            assertEquals(8, s.get("frames").asInt());
            assertEquals(7, s.get("drift_px").get("frames_with_truth").asInt(), "truth beside the video was used: " + r.out());
            assertTrue(s.get("drift_px").get("p95").asDouble() < 1.0, clip + ": " + s.get("drift_px"));
        }
        Path out = tmp.resolve("still");
        Cli.Result r = Cli.run("track", "--source", mjpeg.toString(), "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        assertEquals(7, s.get("jitter_px").get("static_frames").asInt(), "truth says nothing moved");
        assertTrue(s.get("jitter_px").get("p95").asDouble() < 0.1, s.get("jitter_px").toString());
    }

    @Test
    void aCorruptFrameInTheMiddleIsSkippedAndCounted() throws IOException {
        Path clip = tmp.resolve("clips/broken.mjpeg");
        byte[] b = Files.readAllBytes(mjpeg);
        Files.write(clip, org.targetbench.source.VideoDecodingTestAccess.breakJpeg(b, 4));
        Path out = tmp.resolve("broken");
        Cli.Result r = Cli.run("track", "--source", clip.toString(), "--truth", mjpeg.resolveSibling("still.truth.json").toString(), "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        assertTrue(r.out().contains("1 undecodable frame skipped"), r.out());
        JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        assertEquals(1, s.get("skipped_frames").asInt());
        assertEquals(7, s.get("frames").asInt());
        assertFalse(Files.readString(out.resolve("survival.csv")).contains("\n4,"), "frame 4 was skipped");
    }

    @Test
    void devicesSaysThereIsNoCameraAndTrackRefusesPlainly() throws IOException {
        Cli.Result d = Cli.run("devices");
        assertEquals(0, d.exit(), d.err());
        assertTrue(d.out().startsWith("No camera found") || d.out().contains("webcam:0"), d.out());
        org.junit.jupiter.api.Assumptions.assumeTrue(d.out().startsWith("No camera found"), "a camera is attached");
        Path out = tmp.resolve("cam");
        BadInputTest.assertBadInput(out, "no camera found", "track", "--source", "webcam", "--out", out.toString());
        BadInputTest.assertBadInput(out, "webcam 3 does not exist", "track", "--source", "webcam:3", "--out", out.toString());
        BadInputTest.assertBadInput(out, "webcam index must be a whole number", "track", "--source", "webcam:front", "--out", out.toString());
    }

    static void bad(String fragment, String... args) throws IOException {
        Path out = Path.of(args[Arrays.asList(args).indexOf("--out") + 1]);
        BadInputTest.assertBadInput(out, fragment, args);
    }

    @Test
    void badVideosAreOneLineErrorsWithNoOutput() throws IOException {
        byte[] m = Files.readAllBytes(mp4), j = Files.readAllBytes(mjpeg);
        Path cutMp4 = tmp.resolve("bad/cut.mp4"), cutMjpeg = tmp.resolve("bad/cut.mjpeg"), junk = tmp.resolve("bad/junk.mp4");
        Path empty = tmp.resolve("bad/empty.avi"), emptyMp4 = tmp.resolve("bad/empty.mp4");
        Files.createDirectories(cutMp4.getParent());
        Files.write(cutMp4, Arrays.copyOf(m, m.length / 2));
        Files.write(cutMjpeg, Arrays.copyOf(j, j.length - 700));
        byte[] garbage = m.clone();
        for (int i = 0; i < 64; i++) garbage[i] = (byte) (i * 37);
        Files.write(junk, garbage);
        Files.write(empty, new byte[0]);
        Files.write(emptyMp4, new byte[0]);
        Path out = tmp.resolve("bad-out");
        bad("truncated MP4", "track", "--source", cutMp4.toString(), "--out", out.toString());
        bad("truncated MJPEG", "track", "--source", cutMjpeg.toString(), "--out", out.toString());
        bad("not an MP4 video", "track", "--source", junk.toString(), "--out", out.toString());
        bad("empty video", "track", "--source", empty.toString(), "--out", out.toString());
        bad("empty video", "track", "--source", emptyMp4.toString(), "--out", out.toString());
        bad("source not found", "track", "--source", tmp.resolve("nope.mp4").toString(), "--out", out.toString());
        bad("unsupported source file", "track", "--source", tmp.resolve("clips/still.truth.json").toString(), "--out", out.toString());
        // FFmpeg: a file without a video stream (reference clip made with Debian's ffmpeg, see its PROVENANCE.md) and a text file
        bad("no video stream", "track", "--source", "src/test/resources/reference/video/audio-only.m4a", "--out", out.toString());
        Path notes = tmp.resolve("bad/notes.mkv");
        Files.writeString(notes, "not a video at all\n".repeat(50));
        bad("not a video", "track", "--source", notes.toString(), "--out", out.toString());
        Path still = tmp.resolve("bad/still.png");
        Files.copy(Path.of("src/test/resources/reference/video/frames/frame_000.png"), still);
        bad("not a video", "track", "--source", still.toString(), "--out", out.toString());
    }

    @Test
    void badOptionsAreOneLineErrors() throws IOException {
        String out = tmp.resolve("opt-out").toString();
        bad("unknown source scheme \"rtsp:\"", "track", "--source", "rtsp://camera.local/stream", "--out", out);
        bad("unknown synthetic motion \"spin\"", "track", "--source", "synthetic:spin", "--out", out);
        bad("unknown setting \"speed=3\"", "track", "--source", "synthetic:orbit,speed=3", "--out", out);
        bad("exposure must be", "track", "--source", "synthetic:orbit,exposure_ms=50", "--out", out);
        bad("unknown detector \"orb\"", "track", "--source", "synthetic:orbit", "--detector", "orb", "--out", out);
        bad("--window-radius must be 1..20", "track", "--source", "synthetic:orbit", "--window-radius", "0", "--out", out);
        bad("--fb-threshold must be > 0", "track", "--source", "synthetic:orbit", "--fb-threshold", "0", "--out", out);
        bad("unknown respawn policy", "track", "--source", "synthetic:orbit", "--respawn", "always", "--out", out);
        bad("--truth goes with folders and videos", "track", "--source", "synthetic:orbit", "--truth", "x.json", "--out", out);
        bad("--out must name a .mp4", "record", "--source", "synthetic:orbit", "--out", tmp.resolve("clip.gif").toString());
    }

    @Test
    void framesTooSmallForThePyramidAreRefused() throws IOException {
        Path folder = tmp.resolve("small");
        Files.createDirectories(folder);
        for (int i = 0; i < 3; i++) ImageFiles.writePng(TrackScenes.texture(100, 80, 2, i, 0), folder.resolve("f" + i + ".png"));
        String out = tmp.resolve("small-out").toString();
        bad("too small to track", "track", "--source", folder.toString(), "--out", out);
        Cli.Result r = Cli.run("track", "--source", folder.toString(), "--pyramid-levels", "2", "--out", out);
        assertEquals(0, r.exit(), r.err());
        assertTrue(r.out().contains("no static stretch (without truth, mark a still recording with --static)"), r.out());
    }

    @Test
    void helpListsTheNewCommands() {
        Cli.Result h = Cli.run("--help");
        for (String c : List.of("track", "record", "devices")) assertTrue(h.out().contains(c), h.out());
        Cli.Result t = Cli.run("track", "--help");
        assertTrue(t.out().contains("synthetic:NAME"), t.out());
    }
}
