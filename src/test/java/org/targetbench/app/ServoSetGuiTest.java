package org.targetbench.app;

import org.assertj.swing.edt.GuiActionRunner;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.formats.ServoSetReader;
import org.targetbench.pipeline.PickRun;
import org.targetbench.pipeline.Reasons;
import org.targetbench.select.Candidate;
import org.targetbench.select.Selection;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.target.FeatureKind;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The servo set view on the demo, as a commissioning engineer checks it: the automatic choice takes the board's outer
 * L-corners (designed features now), eligible and rejected candidates are drawn differently with the reason on hover,
 * a point added by hand that failed a filter is kept with a warning, the points spinner follows the set, a detector
 * that cannot see the better-conditioned designed set says so in the view, and export writes the set and the selection
 * reasons from the same state (a chosen and edited set, and a set read back from its file). Set up as
 * {@link WorkbenchGuiTest}; skipped only where no display exists.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class ServoSetGuiTest extends GuiTestBase {
    /** cond(L*) of the four outer board corners at the demo reference pose, and its tolerance (see DemoExhaustiveConditionTest). */
    static final double OUTER_CORNERS_COND = 37.96, COND_TOL = 0.01;

    @BeforeAll
    static void open() throws Exception {
        start(WAIT_MS);
        size(1280, 800);
        waitFor("demo loaded", () -> workbench.session().hasFrames() && workbench.session().scene().isPresent());
    }

    static void choose(String detector) {
        window.list("nav").selectItem("Servo set");
        GuiActionRunner.execute(() -> window.comboBox("servo.detector").target().setSelectedItem(detector));
        window.comboBox("servo.detector").requireSelection(detector);
        window.button("servo.choose").click();
        waitFor("set chosen with " + detector, () -> workbench.session().pick() != null
                && workbench.session().pick().detector().equals(detector) && workbench.session().servoSet() != null);
    }

    static FrameCanvas.Marker markerAt(double u, double v) {
        return GuiActionRunner.execute(() -> {
            FrameCanvas.Marker best = null;
            for (FrameCanvas.Marker m : workbench.servo().canvas().markers())
                if (Math.hypot(m.x() - u, m.y() - v) < 1e-9 && (best == null || m.radius() > best.radius())) best = m;
            return best;
        });
    }

    /** The tip the canvas shows with the mouse resting on image pixel (u, v). */
    static String tipAt(double u, double v) {
        return GuiActionRunner.execute(() -> {
            FrameCanvas c = workbench.servo().canvas();
            java.awt.Point p = c.toScreen(u, v);
            return c.getToolTipText(new java.awt.event.MouseEvent(c, java.awt.event.MouseEvent.MOUSE_MOVED, 0, 0, p.x, p.y, 0, false));
        });
    }

    @Test
    @Order(1)
    void theChoiceTakesTheOuterBoardCornersAndNothingCallsThemFalse() throws Exception {
        choose("shi-tomasi");
        ServoSet set = GuiActionRunner.execute(() -> workbench.session().servoSet());
        var design = org.targetbench.pipeline.DemoScenario.target();
        assertEquals(4, set.points().size());
        for (ServoPoint p : set.points())
            assertEquals(FeatureKind.CORNER, design.features().get(p.featureId()).kind(), "an outer L-corner: feature " + p.featureId());
        assertEquals(OUTER_CORNERS_COND, set.condition(), COND_TOL);
        window.label("servo.figures").requireText(Pattern.compile(".*cond\\(L\\*\\) 37\\.9[5-7].*"));
        assertFalse(window.label("servo.findings").text().contains("NOTE:"), "no better designed set to report");
        shot("servo-set-outer-corners");
        PickRun.Result pick = GuiActionRunner.execute(() -> workbench.session().pick());
        for (Selection.Rejected r : pick.selection().rejected())
            if (r.candidate().featureId() >= 0) assertNotEquals(Selection.Why.NOT_DESIGNED, r.why(), "a designed corner is never a false detection");
    }

    @Test
    @Order(2)
    void eligibleAndRejectedCandidatesAreDrawnDifferentlyWithTheReasonOnHover() {
        PickRun.Result pick = GuiActionRunner.execute(() -> workbench.session().pick());
        Map<Integer, Selection.Rejected> why = new HashMap<>();
        for (Selection.Rejected r : pick.selection().rejected()) why.put(r.candidate().id(), r);
        int eligible = 0, failed = 0;
        for (Candidate c : pick.candidates()) {
            FrameCanvas.Marker m = markerAt(c.u(), c.v());
            assertNotNull(m, "candidate #" + c.id() + " is drawn");
            Selection.Rejected r = why.get(c.id());
            if (r == null) { // chosen
                assertEquals(ServoView.CHOSEN, m.colour());
                assertEquals(FrameCanvas.Shape.RING, m.shape());
                continue;
            }
            if (r.why().isFilter()) {
                failed++;
                assertEquals(FrameCanvas.Shape.CROSS, m.shape(), "failed a filter: a cross, #" + c.id());
                assertEquals(ServoView.FAILED, m.colour());
            } else {
                eligible++;
                assertEquals(FrameCanvas.Shape.RING, m.shape(), "eligible: a ring, #" + c.id());
                assertEquals(ServoView.CANDIDATE, m.colour());
            }
            String tip = tipAt(c.u(), c.v());
            assertNotNull(tip, "hover on #" + c.id());
            assertTrue(tip.contains(Reasons.rejected(r)), "the reason on hover for #" + c.id() + ": " + tip);
        }
        assertTrue(eligible > 0, "eligible candidates left out of the set exist on the demo");
        assertTrue(failed > 0, "candidates that failed a filter exist on the demo (the page's own corners against the plate)");
        // a real hover shows the tip
        Selection.Rejected first = pick.selection().rejected().stream().filter(r -> r.why().isFilter()).findFirst().orElseThrow();
        java.awt.Point at = GuiActionRunner.execute(() -> workbench.servo().canvas().toScreen(first.candidate().u(), first.candidate().v()));
        robot.moveMouse(workbench.servo().canvas(), at);
        waitFor("tool tip shown", () -> {
            for (java.awt.Window w : java.awt.Window.getWindows())
                for (javax.swing.JToolTip t : findAll(w, javax.swing.JToolTip.class))
                    if (t.isShowing() && t.getTipText() != null && t.getTipText().contains(Reasons.rejected(first))) return true;
            return false;
        });
    }

    static <T extends java.awt.Component> List<T> findAll(java.awt.Component root, Class<T> type) {
        List<T> out = new ArrayList<>();
        if (type.isInstance(root)) out.add(type.cast(root));
        if (root instanceof java.awt.Container c) for (java.awt.Component k : c.getComponents()) out.addAll(findAll(k, type));
        if (root instanceof java.awt.Window w) for (java.awt.Window o : w.getOwnedWindows()) out.addAll(findAll(o, type));
        return out;
    }

    @Test
    @Order(3)
    void aHandAddedPointThatFailedAFilterWarnsAndTheSpinnerTracksTheSet() {
        PickRun.Result pick = GuiActionRunner.execute(() -> workbench.session().pick());
        Selection.Rejected failed = pick.selection().rejected().stream().filter(r -> r.why().isFilter()).findFirst().orElseThrow();
        int id = failed.candidate().id();
        window.spinner("servo.count").requireValue(4);
        GuiActionRunner.execute(() -> workbench.servo().toggle(id));
        waitFor("added by hand", () -> workbench.session().servoSet().points().size() == 5);
        window.spinner("servo.count").requireValue(5);
        window.label("servo.findings").requireText(Pattern.compile(".*WARN: point #" + id + " was added by hand and failed a filter: "
                + Pattern.quote(Reasons.rejected(failed)) + ".*"));
        FrameCanvas.Marker m = markerAt(failed.candidate().u(), failed.candidate().v());
        assertEquals(ServoView.WARNED, m.colour(), "drawn as a chosen point with a warning");
        assertTrue(m.label().endsWith("!"));
        assertTrue(tipAt(failed.candidate().u(), failed.candidate().v()).contains("failed a filter"));
        // a chosen point taken out by a click: the spinner follows, undo brings it back
        ServoPoint out = GuiActionRunner.execute(() -> workbench.session().servoSet().points().get(0));
        java.awt.Point at = GuiActionRunner.execute(() -> workbench.servo().canvas().toScreen(out.u(), out.v()));
        robot.click(workbench.servo().canvas(), at);
        waitFor("taken out", () -> workbench.session().servoSet().points().size() == 4);
        window.spinner("servo.count").requireValue(4);
        window.button("servo.undo").click();
        waitFor("back", () -> workbench.session().servoSet().points().size() == 5);
        window.spinner("servo.count").requireValue(5);
        window.button("servo.redo").click();
        waitFor("out again", () -> workbench.session().servoSet().points().size() == 4);
        window.spinner("servo.count").requireValue(4);
    }

    @Test
    @Order(4)
    void exportWritesTheSetAndTheSelectionReasonsFromTheSameState(@TempDir Path tmp) throws Exception {
        ServoSet set = GuiActionRunner.execute(() -> workbench.session().servoSet());
        PickRun.Result pick = GuiActionRunner.execute(() -> workbench.session().pick());
        Path dir = tmp.resolve("edited");
        export(dir, true);
        assertEquals(set, ServoSetReader.read(dir.resolve("servo-set.json")));
        Map<Integer, String[]> rows = selectionRows(dir.resolve("servo-set-selection.csv"));
        assertEquals(pick.candidates().size(), rows.size(), "one row per candidate");
        Map<Integer, String> inSet = new TreeMap<>();
        for (ServoPoint p : set.points()) inSet.put(p.id(), p.reason());
        Map<Integer, Selection.Rejected> why = new HashMap<>();
        for (Selection.Rejected r : pick.selection().rejected()) why.put(r.candidate().id(), r);
        for (var e : rows.entrySet()) {
            String status = e.getValue()[3], reason = e.getValue()[4];
            if (inSet.containsKey(e.getKey())) {
                assertEquals("chosen", status, "#" + e.getKey());
                assertEquals(inSet.get(e.getKey()), reason, "the set's own reason for #" + e.getKey());
            } else {
                assertEquals("rejected", status, "#" + e.getKey());
                assertEquals(why.containsKey(e.getKey()) ? Reasons.rejected(why.get(e.getKey())) : Reasons.REMOVED_BY_HAND, reason, "#" + e.getKey());
            }
        }
        assertTrue(rows.values().stream().anyMatch(r -> r[4].equals(Reasons.REMOVED_BY_HAND)), "the point taken out by hand says so");

        // the same set read back from its file (no choice behind it) re-exported over the folder: the old selection
        // rows do not linger beside it
        assertTrue(GuiActionRunner.execute(() -> workbench.rehearseView().loadSet(dir.resolve("servo-set.json"))));
        waitFor("loaded", () -> workbench.session().pick() == null && workbench.session().servoSet() != null);
        export(dir, false);
        Map<Integer, String[]> again = selectionRows(dir.resolve("servo-set-selection.csv"));
        assertEquals(inSet.keySet(), again.keySet(), "only the set's points");
        for (var e : again.entrySet()) {
            assertEquals("chosen", e.getValue()[3]);
            assertEquals(inSet.get(e.getKey()), e.getValue()[4]);
        }
    }

    @Test
    @Order(5)
    void aDetectorThatCannotSeeTheBetterDesignedSetSaysWhyInTheView() throws Exception {
        choose("xcorner");
        ServoSet set = GuiActionRunner.execute(() -> workbench.session().servoSet());
        assertTrue(set.condition() > OUTER_CORNERS_COND * 1.2, "inner x-corners only: " + set.condition());
        window.label("servo.findings").requireText(Pattern.compile(
                ".*NOTE: designed features [0-9, ]+ \\(L-corners\\) would give cond\\(L\\*\\) 37\\.9[5-7] instead of [0-9.]+, but the xcorner detector "
                        + "found nothing on [0-9, ]+ \\(L-corners\\): choose a detector that finds them.*"));
        shot("servo-set-better-designed");
    }

    /** Exports through the window: the safety notice (once per session), the not-rehearsed prompt, the folder chooser. */
    static void export(Path dir, boolean first) throws Exception {
        Files.createDirectories(dir);
        window.list("nav").selectItem("Export");
        GuiActionRunner.execute(() -> window.label("status").target().setText(" "));
        window.button("export.write").click();
        if (first) answerOk(SAFETY_TITLE);
        answerOk(ExportView.UNREHEARSED_TITLE);
        chooseFolder(dir);
        waitFor("exported", () -> window.label("status").target().getText().startsWith("Exported"));
    }

    /** Title of the safety notice shown before the first export of a session. */
    static final String SAFETY_TITLE = "Before exporting a servo set";

    /** Waits for the option pane titled {@code title} and answers OK (what its OK button does). */
    static void answerOk(String title) {
        waitFor("dialog '" + title + "'", () -> pane(title) != null);
        GuiActionRunner.execute(() -> pane(title).setValue(javax.swing.JOptionPane.OK_OPTION));
        waitFor("dialog '" + title + "' closed", () -> pane(title) == null);
    }

    private static javax.swing.JOptionPane pane(String title) {
        for (java.awt.Window w : java.awt.Window.getWindows())
            if (w instanceof javax.swing.JDialog d && d.isShowing() && title.equals(d.getTitle()))
                for (javax.swing.JOptionPane p : findAll(d, javax.swing.JOptionPane.class)) return p;
        return null;
    }

    /** Selection rows by candidate id, fields unquoted (CSV as {@code export.Csv} writes it). */
    static Map<Integer, String[]> selectionRows(Path csv) throws Exception {
        List<String> lines = Files.readAllLines(csv);
        Map<Integer, String[]> out = new TreeMap<>();
        for (String line : lines.subList(1, lines.size())) {
            List<String> f = new ArrayList<>();
            StringBuilder b = new StringBuilder();
            boolean quoted = false;
            for (int i = 0; i < line.length(); i++) {
                char ch = line.charAt(i);
                if (quoted) {
                    if (ch == '"' && i + 1 < line.length() && line.charAt(i + 1) == '"') { b.append('"'); i++; }
                    else if (ch == '"') quoted = false;
                    else b.append(ch);
                } else if (ch == '"') quoted = true;
                else if (ch == ',') { f.add(b.toString()); b.setLength(0); }
                else b.append(ch);
            }
            f.add(b.toString());
            out.put(Integer.parseInt(f.get(0)), f.toArray(String[]::new));
        }
        return out;
    }
}
