package org.targetbench.cli;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.targetbench.cli.BadInputTest.assertBadInput;

/**
 * The register command on a short hand-held style sequence of a committed design (rendered with barrel distortion and
 * sensor noise; one frame looks away from the target), the registered truth read back by compare, and its bad inputs.
 */
class RegisterCliTest {
    static final Path XC10 = Path.of("target-designs/fixture-xc10/target.json");
    @TempDir static Path tmp;
    static Path frames, smooth, cameraJson, blank;

    @BeforeAll
    static void footage() throws Exception {
        TargetDesign d = TargetFile.read(XC10);
        CameraModel cam = new CameraModel(640, 480, 532, 532, 319.5, 239.5, -0.25, 0.05, 0, 0, 0);
        cameraJson = tmp.resolve("phone.json");
        CameraFiles.write(cam, cameraJson, CameraFiles.Layout.JSON);
        RenderConfig rc = new RenderConfig();
        rc.noiseSigma = 2;
        SyntheticRenderer r = new SyntheticRenderer(cam, rc);
        frames = Files.createDirectories(tmp.resolve("frames"));
        for (int i = 0; i < 5; i++) {
            GrayF32 img = i == 3 ? flat(110) : r.render(d, Pose.facing(d.widthMm(), d.heightMm(), 0.24 - 0.005 * i, 8 + 2 * i, -6 + 3 * i, 3 - i, 0.002 * i, -0.001 * i), i).image();
            ImageFiles.writePng(img, frames.resolve(String.format("frame_%03d.png", i)));
        }
        smooth = Files.createDirectories(tmp.resolve("smooth"));
        for (int i = 0; i < 8; i++)
            ImageFiles.writePng(r.render(d, Pose.facing(d.widthMm(), d.heightMm(), 0.24, 8 + 0.3 * i, -6 + 0.2 * i, 1, 0.0005 * i, 0), 10 + i).image(),
                    smooth.resolve(String.format("frame_%03d.png", i)));
        blank = Files.createDirectories(tmp.resolve("blank"));
        for (int i = 0; i < 2; i++) ImageFiles.writePng(flat(120 + i), blank.resolve("frame_00" + i + ".png"));
    }

    private static GrayF32 flat(int grey) {
        GrayF32 g = new GrayF32(640, 480);
        java.util.Arrays.fill(g.data, grey);
        return g;
    }

    @Test
    void registersThenCompareScoresAgainstTheRegisteredTruth() throws IOException {
        Path out = tmp.resolve("reg");
        Cli.Result r = Cli.run("register", "--frames", frames.toString(), "--target", XC10.toString(), "--camera", cameraJson.toString(), "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        List<String> rows = Files.readAllLines(out.resolve("registration.csv"));
        assertEquals("frame,status,features_used,rms_px,note", rows.get(0));
        assertEquals(6, rows.size());
        assertTrue(rows.get(4).startsWith("frame_003.png,not_found,"), rows.get(4));
        for (int i : new int[]{1, 2, 3, 5}) assertTrue(rows.get(i).contains(",registered,10,"), rows.get(i));
        List<String> pts = Files.readAllLines(out.resolve("registered.csv"));
        assertEquals("frame,feature_id,target_x_mm,target_y_mm,x,y,kind", pts.get(0));
        assertEquals(1 + 4 * 10, pts.size());
        String truth = Files.readString(out.resolve("truth.json"));
        assertTrue(truth.contains("\"poses\"") && truth.contains("\"frame_004.png\""), truth);
        try (Stream<Path> s = Files.list(out.resolve("overlays"))) {
            assertEquals(5, s.count());
        }
        Path cmp = tmp.resolve("cmp");
        Cli.Result c = Cli.run("compare", "--frames", frames.toString(), "--truth", out.resolve("truth.json").toString(), "--out", cmp.toString());
        assertEquals(0, c.exit(), c.err());
        assertTrue(Files.readString(cmp.resolve("summary.json")).contains("\"true_features\""));
    }

    @Test
    void compareAndTrackRegisterOnTheFlyWithTarget() throws IOException {
        Path cmp = tmp.resolve("cmp-target");
        Cli.Result c = Cli.run("compare", "--frames", frames.toString(), "--target", XC10.toString(), "--camera", cameraJson.toString(), "--out", cmp.toString());
        assertEquals(0, c.exit(), c.err());
        assertTrue(Files.exists(cmp.resolve("registration/registration.csv")));
        String summary = Files.readString(cmp.resolve("summary.json"));
        assertTrue(summary.contains("\"true_features\""));
        // repeatability through the registered poses, although the lens distortion leaves no homography
        assertTrue(summary.matches("(?s).*\"mean_repeatability\" : 0\\.[0-9]+.*"), summary);
        // a recording of the same frames (MJPEG AVI), tracked with drift against the registered truth
        Path avi = tmp.resolve("clip.avi");
        Cli.Result rec = Cli.run("record", "--source", smooth.toString(), "--out", avi.toString(), "--quality", "95");
        assertEquals(0, rec.exit(), rec.err());
        Path trk = tmp.resolve("trk-target");
        Cli.Result t = Cli.run("track", "--source", avi.toString(), "--target", XC10.toString(), "--camera", cameraJson.toString(), "--out", trk.toString());
        assertEquals(0, t.exit(), t.err());
        assertTrue(Files.exists(trk.resolve("drift.csv")), t.out());
        assertTrue(Files.readString(trk.resolve("summary.json")).contains("\"frames_with_truth\" : 7"), t.out());
        assertTrue(Files.exists(trk.resolve("registration/truth.json")));
    }

    @Test
    void pickFillsSurvivalAndJitterFromATrackingRunOnTheSameTarget() throws IOException {
        Path cmp = tmp.resolve("pick-cmp"), trk = tmp.resolve("pick-trk");
        assertEquals(0, Cli.run("compare", "--frames", smooth.toString(), "--target", XC10.toString(), "--camera", cameraJson.toString(),
                "--detectors", "shi-tomasi", "--out", cmp.toString()).exit());
        Cli.Result t = Cli.run("track", "--source", smooth.toString(), "--target", XC10.toString(), "--camera", cameraJson.toString(), "--out", trk.toString());
        assertEquals(0, t.exit(), t.err());
        Cli.Result p = Cli.run("pick", "--from", cmp.toString(), "--tracks", trk.toString());
        assertEquals(0, p.exit(), p.err() + p.out());
        String set = Files.readString(cmp.resolve("servo-set.json"));
        assertTrue(set.contains("track_survival_and_jitter_from"), set);
        assertTrue(set.matches("(?s).*\"track_survival\" : [0-9.]+.*"), set);
        assertTrue(set.matches("(?s).*\"jitter_px\" : [0-9.]+.*"), set);
        // per-point repeatability through the registered poses, although the lens distortion leaves no raw homography
        long withRepeatability = set.lines().filter(l -> l.matches("\\s*\"repeatability\" : [0-9.]+,?")).count();
        assertTrue(withRepeatability >= 4, set);
        assertTrue(set.lines().filter(l -> l.matches("\\s*\"repeatability\" : (0\\.[5-9][0-9]*|1\\.0),?")).count() >= 4, set);
    }

    @Test
    void sweepOfFramesRegistersThemWithTarget() throws IOException {
        Path sw = tmp.resolve("sweep-target");
        Cli.Result r = Cli.run("sweep", "--frames", smooth.toString(), "--target", XC10.toString(), "--camera", cameraJson.toString(),
                "--kinds", "blur", "--levels", "2", "--views", "2", "--detectors", "harris", "--out", sw.toString());
        assertEquals(0, r.exit(), r.err());
        List<String> rows = Files.readAllLines(sw.resolve("sweep.csv"));
        // localisation_px (8th column) is measured against the registered truth
        assertTrue(rows.get(1).split(",", -1)[7].matches("0\\.[0-9]+"), rows.get(1));
        assertTrue(Files.exists(sw.resolve("registration/truth.json")));
    }

    @Test
    void aDesignThatNeverRegistersIsRefused() throws IOException {
        Path out = tmp.resolve("never");
        assertBadInput(out, "never registered: 2 frames tried", "register", "--frames", blank.toString(), "--target", XC10.toString(), "--out", out.toString());
    }

    @Test
    void intrinsicsOfAnotherSizeAreRefused() throws IOException {
        Path out = tmp.resolve("size");
        assertBadInput(out, "are for 640 x 480 images but the footage", "register", "--frames", tmp.resolve("small").toString(),
                "--target", XC10.toString(), "--camera", cameraJson.toString(), "--out", out.toString());
    }

    @BeforeAll
    static void smallFolder() throws IOException {
        Path small = Files.createDirectories(tmp.resolve("small"));
        ImageFiles.writePng(new GrayF32(320, 240), small.resolve("a.png"));
    }
}
