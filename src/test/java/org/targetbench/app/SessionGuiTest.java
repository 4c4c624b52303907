package org.targetbench.app;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.assertj.swing.edt.GuiActionRunner;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.formats.ConfigJson;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * A session saved and reopened gives the same state, compared field by field: source, registration, frame, every
 * detector setting, the detectors drawn, the servo choice with its hand edits and undo/redo steps, the kept rehearsal
 * and its figures, the rehearsal and stress settings, the rehearsal runs side by side and the stress results folder.
 * Skipped only where no display exists; CI runs it under Xvfb.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class SessionGuiTest extends GuiTestBase {
    /** Longest wait for background work in the window, milliseconds. */
    static final long WAIT_MS = 120_000;

    @BeforeAll
    static void open() throws Exception {
        start(WAIT_MS);
        size(1280, 800);
    }

    /** Everything a session keeps, by name, as values with equals (records, lists, JSON text). */
    static Map<String, Object> state() {
        return GuiActionRunner.execute(() -> {
            Session s = workbench.session();
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("origin", s.origin());
            m.put("registration", s.registration());
            m.put("source name", s.sourceName());
            m.put("frames", s.frames().size());
            m.put("frame index", s.frameIndex());
            for (DetectorConfig c : s.configs()) m.put("settings of " + c.type().cliName(), ConfigJson.toJson(c).toString());
            m.put("shown", s.shown());
            m.put("degrade", s.degrade() + " " + s.degradeValue());
            m.put("pick detector", s.pick() == null ? null : s.pick().detector());
            m.put("pick candidates", s.pick() == null ? null : s.pick().candidates());
            m.put("pick selection", s.pick() == null ? null : s.pick().selection());
            m.put("pick set", s.pick() == null ? null : s.pick().set());
            m.put("servo set", s.servoSet());
            m.put("servo states (undo, current, redo)", s.servoStates());
            m.put("servo edits", s.servoEdits());
            m.put("can undo", s.canUndo());
            m.put("can redo", s.canRedo());
            m.put("rehearsal applies", s.rehearsal() != null);
            m.put("changed since rehearsal", s.changedSinceRehearsal());
            m.put("rehearsed set", s.rehearsedSet());
            m.put("rehearsal settings", s.lastRehearsal() == null ? null : ConfigJson.toJson(s.lastRehearsal().config()).toString());
            m.put("rehearsal summary", s.lastRehearsal() == null ? null : s.lastRehearsal().summary());
            m.put("rehearsal warnings", s.lastRehearsal() == null ? null : s.lastRehearsal().warnings());
            m.put("rehearsal elapsed", s.rehearsalElapsedS());
            var views = ViewSettings.save(ViewSettings.views(workbench));
            m.put("view controls", ViewSettings.controls(views));
            m.put("view tables", views.get("tables").toString());
            m.put("stress results", s.stressResults());
            return m;
        });
    }

    static void assertSameState(Map<String, Object> before, Map<String, Object> after) {
        assertEquals(before.keySet(), after.keySet());
        for (String k : before.keySet()) assertEquals(before.get(k), after.get(k), k);
    }

    @Test
    @Order(1)
    void aSessionSavedAndReopenedGivesIdenticalState(@TempDir Path tmp) throws Exception {
        waitFor("demo loaded", () -> workbench.session().frames().size() == 12 && workbench.session().origin() != null);
        // detector settings the app edits, refinement included
        GuiActionRunner.execute(() -> {
            Session s = workbench.session();
            DetectorConfig h = s.config(DetectorType.HARRIS);
            h.maxFeatures = 123;
            h.threshold = 0.02;
            h.nmsRadius = 4;
            h.refine.enabled = true;
            h.refine.windowRadius = 5;
            h.refine.maxShiftPx = 2.5;
            s.setConfig(h);
            DetectorConfig f = s.config(DetectorType.FAST);
            f.maxFeatures = 77;
            s.setConfig(f);
        });
        window.checkBox("det.show.harris").click();
        waitFor("harris drawn", () -> workbench.session().shown().contains(DetectorType.HARRIS));
        // the servo choice with a chosen detector, two hand edits, one of them undone
        window.list("nav").selectItem("Servo set");
        window.comboBox("servo.detector").selectItem("shi-tomasi");
        window.button("servo.choose").click();
        waitFor("servo set chosen", () -> workbench.session().servoSet() != null);
        int extra = GuiActionRunner.execute(() -> workbench.session().pick().selection().rejected().get(0).candidate().id());
        GuiActionRunner.execute(() -> workbench.servo().toggle(extra));
        waitFor("point added", () -> workbench.session().servoSet().points().size() == 5);
        // rehearsal settings, two kept runs; the second (seed 7) on the edited set
        window.list("nav").selectItem("Rehearse");
        GuiActionRunner.execute(() -> {
            robot.finder().findByName(workbench, "rehearse.starts", javax.swing.JSpinner.class).setValue(20);
            robot.finder().findByName(workbench, "rehearse.envelope.mm", javax.swing.JSpinner.class).setValue(15.0);
        });
        window.button("rehearse.run").click();
        waitFor("first run", () -> workbench.rehearseView().runCount() == 1);
        GuiActionRunner.execute(() -> robot.finder().findByName(workbench, "rehearse.seed", javax.swing.JSpinner.class).setValue(7));
        window.button("rehearse.run").click();
        waitFor("second run", () -> workbench.rehearseView().runCount() == 2 && workbench.session().rehearsal() != null
                && workbench.session().rehearsal().config().seed == 7);
        int first = GuiActionRunner.execute(() -> workbench.session().servoSet().points().get(0).id());
        GuiActionRunner.execute(() -> workbench.servo().toggle(first));
        GuiActionRunner.execute(() -> workbench.session().undoServoEdit());
        waitFor("edit undone", () -> workbench.session().canRedo() && workbench.session().rehearsal() != null);
        // stress settings and a results folder
        window.list("nav").selectItem("Stress");
        window.checkBox("stress.kind.blur").click();
        GuiActionRunner.execute(() -> {
            robot.finder().findByName(workbench, "stress.levels", javax.swing.JSpinner.class).setValue(4);
            workbench.session().setStressResults(tmp.resolve("sweep-results").toAbsolutePath());
        });
        GuiActionRunner.execute(() -> workbench.session().setFrameIndex(3));
        Map<String, Object> before = state();
        assertNotNull(before.get("pick set"));
        assertEquals(true, before.get("can redo"));

        Path file = tmp.resolve("cell.session.json");
        assertTrue(GuiActionRunner.execute(() -> workbench.sessions().save(file)));
        JsonNode json = new ObjectMapper().readTree(file.toFile());
        assertEquals(2, json.get("version").asInt());
        assertEquals("sweep-results", json.at("/stress/results").asText(), "paths relative to the session file");
        assertEquals(123, json.at("/detectors/settings/harris/maxFeatures").asInt());
        assertEquals(5, json.at("/detectors/settings/harris/refine/windowRadius").asInt());
        assertEquals(2, json.at("/views/tables/rehearse.runs").size());

        GuiActionRunner.execute(() -> workbench.sessions().newSession());
        waitFor("fresh demo", () -> workbench.session().servoSet() == null && workbench.session().frameIndex() == workbench.session().referenceIndex()
                && workbench.session().config(DetectorType.HARRIS).maxFeatures != 123);
        GuiActionRunner.execute(() -> workbench.sessions().open(file));
        waitFor("session reopened", () -> !workbench.sessions().restoring());
        assertSameState(before, state());
        assertFalse(GuiActionRunner.execute(() -> workbench.sessions().dirty()));
        // the undo history came back with it: redo is the undone click
        GuiActionRunner.execute(() -> workbench.session().redoServoEdit());
        waitFor("redone", () -> workbench.session().servoSet().points().size() == 4 && workbench.session().changedSinceRehearsal());
    }

    @Test
    @Order(2)
    void aRegisteredFolderReopensRegisteredToTheSameFiles(@TempDir Path tmp) throws Exception {
        var design = org.targetbench.source.TargetFile.read(Path.of("target-designs/fixture-cb15/target.json"));
        Path cameraFile = Path.of("target-designs/flange-camera.json");
        var camera = org.targetbench.source.CameraFiles.read(cameraFile);
        var renderer = new org.targetbench.source.SyntheticRenderer(camera, new org.targetbench.source.RenderConfig());
        Path frames = tmp.resolve("frames");
        java.nio.file.Files.createDirectories(frames);
        for (int i = 0; i < 3; i++)
            org.targetbench.source.ImageFiles.writePng(renderer.render(design, org.targetbench.camera.Pose.facing(design.widthMm(), design.heightMm(),
                    0.25, 5 + 3 * i, -4 + 2 * i, 2, 0.002 * i, 0)).image(), frames.resolve("frame_00" + i + ".png"));
        GuiActionRunner.execute(() -> workbench.live().loadFolder(frames));
        waitFor("folder loaded", () -> workbench.session().frames().size() == 3 && workbench.session().registration() == null);
        GuiActionRunner.execute(() -> workbench.live().registerTo(Path.of("target-designs/fixture-cb15/target.json"), cameraFile));
        waitFor("registered", () -> workbench.session().registration() != null && workbench.session().scene().isPresent());
        GuiActionRunner.execute(() -> workbench.session().setFrameIndex(2));
        Map<String, Object> before = state();
        Path file = tmp.resolve("registered.session.json");
        assertTrue(GuiActionRunner.execute(() -> workbench.sessions().save(file)));
        JsonNode json = new ObjectMapper().readTree(file.toFile());
        assertEquals("folder", json.at("/source/kind").asText());
        assertTrue(json.at("/registration/target").asText().endsWith("target-designs/fixture-cb15/target.json"), json.toString());
        GuiActionRunner.execute(() -> workbench.sessions().newSession());
        waitFor("fresh demo", () -> workbench.session().frames().size() == 12 && workbench.session().registration() == null);
        GuiActionRunner.execute(() -> workbench.sessions().open(file));
        waitFor("session reopened", () -> !workbench.sessions().restoring());
        assertSameState(before, state());
    }

    @Test
    @Order(3)
    void aSessionWhoseSourceDoesNotLoadSaysSoAndStopsWaiting(@TempDir Path tmp) throws Exception {
        Path broken = tmp.resolve("broken.mp4");
        java.nio.file.Files.writeString(broken, "this is not a video");
        Path file = tmp.resolve("broken.session.json");
        java.nio.file.Files.writeString(file, "{ \"format\": \"targetbench-session\", \"version\": 1, \"source\": { \"kind\": \"video\","
                + " \"path\": \"broken.mp4\" }, \"frame_index\": 0, \"servo_set\": null }");
        String before = GuiActionRunner.execute(() -> workbench.session().sourceName());
        GuiActionRunner.execute(() -> workbench.sessions().open(file));
        var pane = window.optionPane(org.assertj.swing.timing.Timeout.timeout(WAIT_MS)).requireTitle("Could not load the source");
        press(pane.okButton());
        waitFor("no longer restoring", () -> !workbench.sessions().restoring());
        assertEquals(before, GuiActionRunner.execute(() -> workbench.session().sourceName()), "the loaded source stays");
        // a later version is refused in one line before anything changes
        java.nio.file.Files.writeString(file, "{ \"format\": \"targetbench-session\", \"version\": 9, \"source\": { \"kind\": \"demo\" } }");
        javax.swing.SwingUtilities.invokeLater(() -> workbench.sessions().open(file)); // its message is modal
        var refused = window.optionPane(org.assertj.swing.timing.Timeout.timeout(WAIT_MS)).requireTitle("Could not open the session");
        String said = GuiActionRunner.execute(() -> ((javax.swing.JOptionPane) refused.target()).getMessage().toString());
        assertTrue(said.contains("session version 9 is not readable") && said.split("\\R").length == 1, said);
        press(refused.okButton());
        assertFalse(GuiActionRunner.execute(() -> workbench.sessions().restoring()));
    }
}
