package org.targetbench.app;

import org.assertj.swing.edt.GuiActionRunner;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.assertj.swing.timing.Pause.pause;
import static org.junit.jupiter.api.Assertions.*;

/**
 * The Camera view against simulated cameras behind the {@code Camera} interface (no real camera is needed): no camera
 * said plainly, a live stream scored and shown, recording and freezing while it runs, an unplugged camera, and live
 * frames registered to a chosen target. Skipped only where no display exists; CI runs it under Xvfb.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class CameraGuiTest extends GuiTestBase {
    @BeforeAll
    static void open() throws Exception {
        start(WAIT_MS);
        size(1280, 800);
    }

    @Test
    @Order(1)
    void theCameraRunsLiveAgainstASimulatedCamera(@org.junit.jupiter.api.io.TempDir Path tmp) throws Exception {
        awaitDialogsClosed();
        CameraView cv = workbench.camera();
        // no camera: said plainly, nothing to start
        GuiActionRunner.execute(() -> cv.offer(new org.targetbench.source.Webcams.Discovery(java.util.List.of(), "no video devices (/dev/video*) on this machine"),
                CameraView.WEBCAMS));
        window.list("nav").selectItem("Camera");
        window.label("camera.message").requireText(java.util.regex.Pattern.compile("No camera found: no video devices.*"));
        window.button("camera.start").requireDisabled();
        // a simulated camera behind the Camera interface: 1500 images, one every 10 ms (15 s, long enough to record and
        // freeze while it runs even when this class is the first in a cold JVM on a loaded machine), then unplugged
        java.util.concurrent.atomic.AtomicReference<String> opened = new java.util.concurrent.atomic.AtomicReference<>();
        CameraView.Opener simulated = (index, size) -> {
            opened.set(size);
            String[] wh = size.split("x");
            return new org.targetbench.source.WebcamSource(new org.targetbench.source.FakeCamera(Integer.parseInt(wh[0]), Integer.parseInt(wh[1]), 1500, false, 10),
                    "simulated camera at " + size);
        };
        GuiActionRunner.execute(() -> cv.offer(new org.targetbench.source.Webcams.Discovery(java.util.List.of(
                new org.targetbench.source.Webcams.CameraInfo(0, "simulated camera", java.util.List.of("160x120", "320x240", "1280x720"))), ""), simulated));
        window.comboBox("camera.size").requireSelection("320x240"); // the largest within 640 x 480
        window.button("camera.start").click();
        int detectors = org.targetbench.detect.DetectorType.values().length;
        waitFor("live frames scored and shown", () -> cv.shownFrames() >= 3 && window.table("camera.scores").target().getRowCount() == detectors);
        assertEquals("320x240", opened.get());
        Path rec = tmp.resolve("live.avi");
        GuiActionRunner.execute(() -> cv.startRecording(rec));
        window.button("camera.record").requireText("Stop recording");
        window.button("camera.freeze").click();
        window.button("camera.freeze").requireText("Resume");
        int frozenAt = GuiActionRunner.execute(cv::shownFrames);
        pause(300);
        assertEquals(frozenAt, (int) GuiActionRunner.execute(cv::shownFrames), "a frozen view does not change");
        window.button("camera.freeze").click();
        shot("camera");
        // the camera goes away mid-stream: a plain message, and the recording is kept and reads back
        waitFor("the stream ended with the camera", () -> !cv.running());
        window.label("camera.message").requireText(java.util.regex.Pattern.compile(
                "The camera stream ended: simulated camera stopped delivering images after 1500 frames.*\\d+ frames recorded to .*live\\.avi and kept\\."));
        var m = java.util.regex.Pattern.compile("([0-9.]+) frames/s scored and shown of the camera's ([0-9.]+) frames/s; (\\d+) of (\\d+) images dropped.*")
                .matcher(window.label("camera.rates").text());
        assertTrue(m.matches(), window.label("camera.rates").text());
        assertTrue(Integer.parseInt(m.group(3)) > 0, "the detectors fall behind a 100 frames/s camera and frames are dropped: " + m.group());
        try (org.targetbench.source.FrameSource s = org.targetbench.source.FfmpegSource.open(rec, null)) {
            assertEquals(320, s.width());
            assertTrue(s.frameCount() > 10, "frames recorded: " + s.frameCount());
        }
        window.button("camera.start").requireText("Start");
    }

    @Test
    @Order(2)
    void liveFramesOfASimulatedCameraAreRegisteredToTheChosenTarget(@org.junit.jupiter.api.io.TempDir Path tmp) throws Exception {
        awaitDialogsClosed();
        CameraView cv = workbench.camera();
        // the demo target seen by a lens with barrel distortion, the camera swaying; every 5th image looks away
        var design = org.targetbench.source.TargetFile.read(Path.of("target-designs/fixture-cb15/target.json"));
        var lens = new org.targetbench.camera.CameraModel(640, 480, 532, 532, 319.5, 239.5, -0.25, 0.05, 0, 0, 0);
        Path cameraFile = tmp.resolve("phone.json");
        org.targetbench.source.CameraFiles.write(lens, cameraFile, org.targetbench.source.CameraFiles.Layout.JSON);
        var rc = new org.targetbench.source.RenderConfig();
        rc.noiseSigma = 1;
        var renderer = new org.targetbench.source.SyntheticRenderer(lens, rc);
        java.util.List<java.awt.image.BufferedImage> scene = new java.util.ArrayList<>();
        for (int i = 0; i < 4; i++)
            scene.add(org.targetbench.source.ImageFiles.toBuffered(renderer.render(design, org.targetbench.camera.Pose.facing(design.widthMm(),
                    design.heightMm(), 0.26, 6 + 2 * i, -5 + 2 * i, 2, 0.002 * i, 0), i).image()));
        var blank = new boofcv.struct.image.GrayF32(640, 480);
        java.util.Arrays.fill(blank.data, 110f);
        scene.add(org.targetbench.source.ImageFiles.toBuffered(blank));
        CameraView.Opener simulated = (index, size) -> new org.targetbench.source.WebcamSource(
                new org.targetbench.source.FakeCamera(scene, 100_000, 30), "simulated camera at " + size);
        GuiActionRunner.execute(() -> cv.offer(new org.targetbench.source.Webcams.Discovery(java.util.List.of(
                new org.targetbench.source.Webcams.CameraInfo(0, "simulated camera", java.util.List.of("640x480"))), ""), simulated));
        window.list("nav").selectItem("Camera");
        GuiActionRunner.execute(() -> cv.registerTo(Path.of("target-designs/fixture-cb15/target.json"), cameraFile));
        window.label("camera.registration").requireText(java.util.regex.Pattern.compile("Target: fixture-cb15 with phone\\.json"));
        window.button("camera.start").click();
        int detectors = org.targetbench.detect.DetectorType.values().length;
        java.util.concurrent.atomic.AtomicBoolean sawRegistered = new java.util.concurrent.atomic.AtomicBoolean(),
                sawNotRegistered = new java.util.concurrent.atomic.AtomicBoolean();
        java.util.concurrent.atomic.AtomicReference<String> scoredRow = new java.util.concurrent.atomic.AtomicReference<>();
        waitFor("registered frames scored against the target, and a frame that did not register shown as such", () -> {
            String text = GuiActionRunner.execute(() -> window.label("camera.registration").target().getText());
            String rep = GuiActionRunner.execute(() -> window.label("camera.against").target().getText());
            if (text.contains("this frame registered") && rep.contains("against the first registered frame")) {
                javax.swing.JTable t = window.table("camera.scores").target();
                String row = GuiActionRunner.execute(() -> {
                    for (int r = 0; r < t.getRowCount(); r++)
                        if ("Harris".equalsIgnoreCase(String.valueOf(t.getValueAt(r, 0)).trim()))
                            return t.getValueAt(r, 2) + "|" + t.getValueAt(r, 4) + "|" + t.getValueAt(r, 5);
                    return null;
                });
                if (row != null && row.matches("[01]\\.[0-9]+\\|0\\.[0-9]+\\|[0-9]+.*%")) {
                    scoredRow.set(row);
                    sawRegistered.set(true);
                }
            }
            if (text.contains("NOT REGISTERED, the target was not found (not scored)")) sawNotRegistered.set(true);
            return sawRegistered.get() && sawNotRegistered.get() && window.table("camera.scores").target().getRowCount() == detectors;
        });
        String[] harris = scoredRow.get().split("\\|");
        assertTrue(Double.parseDouble(harris[0]) >= 0.5, "Harris repeatability through the registered target: " + scoredRow.get());
        assertTrue(Double.parseDouble(harris[1]) < 0.5, "Harris localisation against the registered corners: " + scoredRow.get());
        shot("camera-registered");
        GuiActionRunner.execute(cv::stop);
        waitFor("stopped", () -> !cv.running());
        int[] counts = GuiActionRunner.execute(cv::registeredOfTried);
        assertTrue(counts[0] >= 2 && counts[0] < counts[1], "registered " + counts[0] + " of " + counts[1]);
        GuiActionRunner.execute(cv::clearTarget);
    }
}
