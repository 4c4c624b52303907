package org.targetbench.cli;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.TestScenes;
import org.targetbench.camera.CameraModel;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.TargetFile;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;
import static org.targetbench.cli.BadInputTest.assertBadInput;

/**
 * The design, check and calibrate commands as a user runs them, and each bad-input case of theirs: one line on stderr,
 * exit code 2, no stack trace, no output left behind.
 */
class DesignCheckCalibrateCliTest {
    static final Path PHOTOS = Path.of("src/test/resources/reference/calibration");
    static final Path YAML = PHOTOS.resolve("left_intrinsics.yml");
    static final Path CB15 = Path.of("target-designs/fixture-cb15/target.json");
    @TempDir static Path tmp;
    static Path threePhotos;

    @BeforeAll
    static void folders() throws IOException {
        threePhotos = tmp.resolve("three");
        Files.createDirectories(threePhotos);
        for (String n : List.of("left01.jpg", "left02.jpg", "left03.jpg")) Files.copy(PHOTOS.resolve(n), threePhotos.resolve(n));
    }

    /** A plain mid-grey frame: no board in it. */
    private static GrayF32 flat(int w, int h) {
        GrayF32 g = new GrayF32(w, h);
        java.util.Arrays.fill(g.data, 128f);
        return g;
    }

    private static String out(String name) { return tmp.resolve("out-" + name).toString(); }

    @Test
    void helpNamesEveryOption() {
        for (String cmd : List.of("design", "check", "calibrate")) {
            Cli.Result h = Cli.run(cmd, "--help");
            assertEquals(0, h.exit());
            assertTrue(h.out().contains("Usage: targetbench " + cmd), h.out());
        }
    }

    @Test
    void designWritesTheFourFilesAndTheyReadBack() throws Exception {
        Path o = tmp.resolve("design-dots");
        Cli.Result r = Cli.run("design", "--pattern", "dots", "--rows", "4", "--cols", "5", "--pitch-mm", "25", "--diameter-mm", "12",
                "--page", "Letter", "--out", o.toString());
        assertEquals(0, r.exit(), r.err());
        assertEquals("", r.err());
        for (String f : List.of("target.json", "target.pdf", "target.svg", "preview.png")) assertTrue(Files.size(o.resolve(f)) > 0, f);
        assertEquals(20, TargetFile.read(o.resolve("target.json")).features().size());
        assertTrue(r.out().contains("Letter (215.9 x 279.4 mm)"), r.out());
        assertTrue(Files.readString(o.resolve("target.svg")).contains("width=\"215.9mm\""));
    }

    @Test
    void checkReportsEachLineWithItsBasisAndExitsOneOnFailure() {
        Cli.Result ok = Cli.run("check", "--target", CB15.toString(), "--camera", YAML.toString(), "--standoff-mm", "300", "--tilt", "20");
        assertEquals(0, ok.exit(), ok.err() + ok.out());
        for (String s : List.of("smallest feature", "feature spacing", "quiet zone", "field of view filled", "target in view",
                "derived: the window must fit inside one square", "common practice in chessboard detection, no formal source"))
            assertTrue(ok.out().contains(s), "'" + s + "' missing from:\n" + ok.out());
        Cli.Result far = Cli.run("check", "--target", CB15.toString(), "--camera", YAML.toString(), "--standoff-mm", "1200");
        assertEquals(1, far.exit(), far.out());
        assertTrue(far.out().contains("FAIL  smallest feature"), far.out());
    }

    @Test
    void calibrateWritesIntrinsicsInThreeLayoutsWithTheReport() throws Exception {
        Path cam = tmp.resolve("cal/camera.json");
        Cli.Result r = Cli.run("calibrate", "--frames", threePhotos.toString(), "--inner-corners", "9x6", "--square-mm", "25", "--out", cam.toString());
        assertEquals(0, r.exit(), r.err());
        assertTrue(r.out().contains("RMS reprojection error"), r.out());
        // three photos leave the corners unconstrained: the model folds there, so calibrate warns and runs refuse it
        assertTrue(r.out().contains("Warning: the calibrated camera's radial distortion"), r.out());
        assertThrows(org.targetbench.source.SourceException.class, () -> CameraFiles.read(cam));
        CameraModel json = CameraFiles.readUnchecked(cam);
        assertEquals(json, CameraFiles.readUnchecked(cam.resolveSibling("camera.opencv.yml")));
        assertEquals(json, CameraFiles.readUnchecked(cam.resolveSibling("camera.ros.yaml")));
        for (String f : List.of("camera.calibration.json", "camera.views.csv", "camera.coverage.png"))
            assertTrue(Files.size(cam.resolveSibling(f)) > 0, f);
        assertEquals(4, Files.readAllLines(cam.resolveSibling("camera.views.csv")).size());
    }

    @Test
    void calibrationBadInput() throws IOException {
        Path noBoard = tmp.resolve("no-board");
        Files.createDirectories(noBoard);
        for (int i = 0; i < 3; i++) ImageFiles.writePng(TestScenes.texture(160, 120, i), noBoard.resolve("t" + i + ".png"));
        assertBadInput(null, "not found in any of the 3 frames", "calibrate", "--frames", noBoard.toString(), "--inner-corners", "9x6", "--square-mm", "25",
                "--out", out("c1") + "/camera.json");
        Path two = tmp.resolve("two-boards");
        Files.createDirectories(two);
        Files.copy(PHOTOS.resolve("left01.jpg"), two.resolve("a.jpg"));
        Files.copy(PHOTOS.resolve("left02.jpg"), two.resolve("b.jpg"));
        ImageFiles.writePng(flat(640, 480), two.resolve("c.png"));
        assertBadInput(Path.of(out("c2")), "found in 2 of 3 frames; calibration needs at least 3 views", "calibrate", "--frames", two.toString(),
                "--inner-corners", "9x6", "--square-mm", "25", "--out", out("c2") + "/camera.json");
        Path mixed = tmp.resolve("mixed");
        Files.createDirectories(mixed);
        Files.copy(PHOTOS.resolve("left01.jpg"), mixed.resolve("a.jpg"));
        ImageFiles.writePng(flat(320, 240), mixed.resolve("b.png"));
        assertBadInput(Path.of(out("c3")), "mixed frame sizes", "calibrate", "--frames", mixed.toString(), "--inner-corners", "9x6", "--square-mm", "25",
                "--out", out("c3") + "/camera.json");
        assertBadInput(null, "--square-mm must be > 0 mm, got -25", "calibrate", "--frames", threePhotos.toString(), "--inner-corners", "9x6", "--square-mm", "-25");
        assertBadInput(null, "--inner-corners must be COLSxROWS", "calibrate", "--frames", threePhotos.toString(), "--inner-corners", "9by6", "--square-mm", "25");
        assertBadInput(null, "--inner-corners needs at least 2x2 inner corners, got -9x6", "calibrate", "--frames", threePhotos.toString(), "--inner-corners", "-9x6", "--square-mm", "25");
        assertBadInput(null, "--out names the camera .json", "calibrate", "--frames", threePhotos.toString(), "--inner-corners", "9x6", "--square-mm", "25",
                "--out", out("c4") + "/camera.yml");
    }

    @Test
    void cameraYamlBadInputThroughCheckAndRender() throws IOException {
        String good = Files.readString(YAML);
        Path missing = tmp.resolve("missing-key.yml");
        Files.writeString(missing, good.replace("image_height: 480\n", ""));
        assertBadInput(null, "missing key image_height", "check", "--target", CB15.toString(), "--camera", missing.toString(), "--standoff-mm", "300");
        Path notSquare = tmp.resolve("not-3x3.yml");
        Files.writeString(notSquare, good.replaceFirst("rows: 3\n   cols: 3", "rows: 3\n   cols: 4"));
        assertBadInput(null, "camera_matrix is 3x4; expected 3x3", "check", "--target", CB15.toString(), "--camera", notSquare.toString(),
                "--standoff-mm", "300");
        Path poses = tmp.resolve("poses.json");
        Files.writeString(poses, "{\"poses\": [{\"distance_m\": 0.3}]}");
        assertBadInput(Path.of(out("r1")), "missing key image_height", "render", "--target", CB15.toString(), "--camera", missing.toString(),
                "--poses", poses.toString(), "--out", out("r1"));
        assertBadInput(null, "--standoff-mm must be > 0 mm, got -300", "check", "--target", CB15.toString(), "--camera", YAML.toString(), "--standoff-mm", "-300");
    }

    @Test
    void designBadInput() throws IOException {
        assertBadInput(Path.of(out("d1")), "does not fit A4 (210 x 297 mm) in either orientation; A2 (420 x 594 mm) would fit",
                "design", "--pattern", "checkerboard", "--rows", "12", "--cols", "16", "--square-mm", "20", "--out", out("d1"));
        assertBadInput(Path.of(out("d2")), "--square-mm must be > 0, got -5", "design", "--pattern", "checkerboard", "--square-mm", "-5", "--out", out("d2"));
        assertBadInput(Path.of(out("d3")), "--rows must be > 0, got -2", "design", "--pattern", "dots", "--rows", "-2", "--out", out("d3"));
        assertBadInput(Path.of(out("d4")), "--diameter-mm does not apply to --pattern checkerboard", "design", "--pattern", "checkerboard",
                "--diameter-mm", "5", "--out", out("d4"));
        assertBadInput(Path.of(out("d5")), "unknown pattern \"hexagons\"", "design", "--pattern", "hexagons", "--out", out("d5"));
        assertBadInput(Path.of(out("d6")), "--page: unknown page \"B9\"", "design", "--pattern", "dots", "--page", "B9", "--out", out("d6"));
        assertBadInput(Path.of(out("d7")), "dot diameter 30.0 mm must be smaller than the pitch 20.0 mm", "design", "--pattern", "dots",
                "--diameter-mm", "30", "--out", out("d7"));
    }
}
