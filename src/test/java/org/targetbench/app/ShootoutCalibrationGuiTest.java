package org.targetbench.app;

import boofcv.struct.image.GrayF32;
import org.assertj.swing.edt.GuiActionRunner;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.camera.CameraModel;
import org.targetbench.cli.Main;
import org.targetbench.detect.DetectorType;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.ImageFiles;

import javax.swing.JTable;
import java.awt.Color;
import java.awt.Component;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.*;
import static org.targetbench.app.WorkbenchGuiTest.assertAllRowsFit;

/**
 * The shoot-out and calibration views as a person uses them, under a real (virtual) display, on small inputs: five
 * of the chessboard photos from Debian's opencv-doc (left01-05, see src/test/resources/reference/calibration/
 * PROVENANCE.md) plus a blank frame, and two committed designs at one view and two levels. Each view's saved files are
 * checked against what the command line writes for the same inputs. Screenshots at 1280 x 800 go to
 * target/screenshots/.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class ShootoutCalibrationGuiTest extends GuiTestBase {
    static final Path PHOTOS = Path.of("src/test/resources/reference/calibration");
    static final Path CAMERA = Path.of("target-designs/flange-camera.json");

    @TempDir static Path tmp;

    @BeforeAll
    static void open() throws Exception {
        start(WAIT_MS);
        size(1280, 800); // the smallest screen the views are laid out for; screenshots at this size
    }

    /** The command line, in-process; its exit code (what it prints is kept out of the test's output). */
    static int cli(String... args) {
        var cl = Main.commandLine();
        cl.setOut(new PrintWriter(new StringWriter(), true));
        cl.setErr(new PrintWriter(new StringWriter(), true));
        return cl.execute(args);
    }

    /** Every column header is as wide as its full text (measured by its renderer) and has a tooltip of its own. */
    static void assertHeadersFitWithATipEach(JTable t) {
        Set<String> tips = new HashSet<>();
        GuiActionRunner.execute(() -> {
            var header = t.getTableHeader();
            for (int c = 0; c < t.getColumnCount(); c++) {
                int w = header.getDefaultRenderer().getTableCellRendererComponent(t, t.getColumnName(c), false, false, -1, c).getPreferredSize().width;
                assertTrue(t.getColumnModel().getColumn(c).getWidth() >= w, t.getColumnName(c) + " header cut off: "
                        + t.getColumnModel().getColumn(c).getWidth() + " < " + w + " px");
                java.awt.Rectangle r = header.getHeaderRect(c);
                String tip = header.getToolTipText(new java.awt.event.MouseEvent(header, 0, 0, 0, r.x + r.width / 2, r.y + 2, 0, false));
                assertNotNull(tip, t.getColumnName(c));
                tips.add(tip);
            }
            return null;
        });
        assertEquals(t.getColumnCount(), tips.size(), "one tooltip per column");
    }

    static Object cell(JTable t, int r, int c) { return GuiActionRunner.execute(() -> t.getValueAt(r, c)); }

    /** The colour a cell is painted in. */
    static Color foreground(JTable t, int r, int c) {
        return GuiActionRunner.execute(() -> {
            Component comp = t.getCellRenderer(r, c).getTableCellRendererComponent(t, t.getValueAt(r, c), false, false, r, c);
            return comp.getForeground();
        });
    }

    @Test
    @Order(1)
    void calibratesFromPhotosSaysWhereTheBoardIsMissingAndSetsTheSessionCamera() throws Exception {
        Path frames = tmp.resolve("frames");
        Files.createDirectories(frames);
        for (String n : List.of("left01.jpg", "left02.jpg", "left03.jpg", "left04.jpg", "left05.jpg")) Files.copy(PHOTOS.resolve(n), frames.resolve(n));
        GrayF32 blank = new GrayF32(640, 480);
        java.util.Arrays.fill(blank.data, 128f);
        ImageFiles.writePng(blank, frames.resolve("left06-blank.png"));

        GuiActionRunner.execute(() -> workbench.show("Calibration")); // as the nav list does; a robot click can be lost on a loaded machine
        waitFor("calibration view showing", () -> workbench.calibrationView().isShowing());
        CalibrationView view = workbench.calibrationView();
        GuiActionRunner.execute(() -> view.setFolder(frames));
        window.button("calibration.run").click();
        waitFor("calibrated", () -> !view.running() && view.result() != null);

        JTable views = window.table("calibration.views").target();
        assertEquals(6, GuiActionRunner.execute(views::getRowCount));
        assertEquals("left06-blank.png", cell(views, 5, 0));
        assertEquals("NOT FOUND", cell(views, 5, 1));
        assertTrue(cell(views, 5, 5).toString().startsWith("WARN not used: the board was not found whole"), cell(views, 5, 5).toString());
        assertEquals(DetailPane.WARN, foreground(views, 5, 5), "the flag is coloured as well as worded");
        assertTrue(cell(views, 0, 3).toString().endsWith(" px"), "units on the per-view errors");
        String message = GuiActionRunner.execute(() -> window.label("calibration.message").target().getText());
        assertTrue(message.contains("not found whole in 1 of 6 frames (left06-blank.png)"), message);

        JTable params = window.table("calibration.intrinsics").target();
        assertEquals("fx", cell(params, 0, 0));
        assertTrue(cell(params, 0, 1).toString().endsWith(" px") && cell(params, 0, 2).toString().startsWith("± "), "value and spread with units");
        assertEquals("RMS error", cell(params, 9, 0));
        assertTrue(cell(params, 9, 1).toString().endsWith(" px"), "RMS reprojection error in pixels");
        // Debian opencv-doc's left_intrinsics.yml (OpenCV's calibration sample on all thirteen photos, read from the
        // committed file: fx = fy = 535.9 px); five photos land within 2 % of it (tolerance ours, common practice, no source)
        CameraModel ref = CameraFiles.readUnchecked(PHOTOS.resolve("left_intrinsics.yml"));
        CameraModel got = view.result().camera();
        assertEquals(ref.fx(), got.fx(), 0.02 * ref.fx());

        // the same run as the command line: the files it writes for these photos hold the same camera
        Path cliOut = tmp.resolve("cli/camera.json"), appOut = tmp.resolve("app/camera.json");
        assertEquals(0, cli("calibrate", "--frames", frames.toString(), "--inner-corners", "9x6", "--square-mm", "25", "--out", cliOut.toString()));
        GuiActionRunner.execute(() -> view.saveTo(appOut));
        for (String f : List.of("camera.json", "camera.opencv.yml", "camera.ros.yaml", "camera.calibration.json", "camera.views.csv", "camera.coverage.png"))
            assertTrue(Files.isRegularFile(appOut.resolveSibling(f)), f);
        assertEquals(CameraFiles.readUnchecked(cliOut), CameraFiles.readUnchecked(appOut));
        assertEquals(Files.readAllLines(cliOut.resolveSibling("camera.views.csv")), Files.readAllLines(appOut.resolveSibling("camera.views.csv")));

        assertHeadersFitWithATipEach(views);
        assertHeadersFitWithATipEach(params);
        GuiActionRunner.execute(() -> views.setRowSelectionInterval(5, 5));
        assertAllRowsFit((javax.swing.JTextArea) window.textBox("calibration.detail").target());
        shot("calibration-result");

        boolean usable = GuiActionRunner.execute(() -> window.button("calibration.use").target().isEnabled());
        assertEquals(org.targetbench.camera.CameraChecks.problem(got).isEmpty(), usable, "a camera the other views would refuse is not offered");
        if (usable) {
            window.button("calibration.use").click();
            waitFor("session camera set", () -> workbench.session().camera() != null);
            assertEquals(got, GuiActionRunner.execute(() -> workbench.session().camera()));
            String label = GuiActionRunner.execute(() -> robot.finder().findByName("shootout.camera", javax.swing.JLabel.class, false).getText());
            assertTrue(label.contains("calibrated from frames"), label);
        }
    }

    @Test
    @Order(2)
    void comparesTwoDesignsRanksThemReadablyAndSavesWhatTheCommandLineWrites() throws Exception {
        GuiActionRunner.execute(() -> workbench.session().setCamera(CameraFiles.read(CAMERA), CAMERA.getFileName().toString()));
        GuiActionRunner.execute(() -> workbench.show("Shoot-out"));
        waitFor("shoot-out view showing", () -> workbench.shootoutView().isShowing());
        ShootoutView view = workbench.shootoutView();
        GuiActionRunner.execute(() -> {
            var list = window.list("shootout.designs").target();
            List<Integer> pick = new java.util.ArrayList<>();
            for (int i = 0; i < list.getModel().getSize(); i++)
                if (List.of("fixture-cb15", "fixture-dots20").contains(((org.targetbench.target.TargetDesign) list.getModel().getElementAt(i)).id())) pick.add(i);
            assertEquals(2, pick.size(), "both designs listed from target-designs/");
            list.setSelectedIndices(pick.stream().mapToInt(Integer::intValue).toArray());
            var dets = window.list("shootout.detectors").target();
            dets.setSelectedIndices(new int[]{DetectorType.SHI_TOMASI.ordinal(), DetectorType.DOTS.ordinal(), DetectorType.XCORNER.ordinal()});
            return null;
        });
        window.spinner("shootout.views").enterTextAndCommit("1");
        window.spinner("shootout.levels").enterTextAndCommit("2");
        window.spinner("shootout.standoff").enterTextAndCommit("250");
        for (String k : List.of("lighting", "jpeg", "viewpoint")) { // set directly: a robot click can be lost on a loaded machine
            var box = window.checkBox("shootout.kind." + k).target();
            GuiActionRunner.execute(() -> box.setSelected(false));
        }
        window.button("shootout.run").click();
        waitFor("shoot-out done", () -> !view.running() && view.result() != null);

        JTable t = view.table();
        assertEquals(2, GuiActionRunner.execute(t::getRowCount));
        assertEquals(1, cell(t, 0, 0));
        for (int r = 0; r < 2; r++) {
            String check = cell(t, r, 2).toString();
            assertTrue(check.matches("(PASS|WARN|FAIL) \\(\\d+ warn, \\d+ fail\\)"), check);
            Color c = foreground(t, r, 2);
            assertTrue(c.equals(DetailPane.PASS) || c.equals(DetailPane.WARN) || c.equals(DetailPane.FAIL), "coloured: " + c);
            assertTrue(cell(t, r, 9).toString().endsWith(" %"), "coverage in percent");
        }
        // every header in full, and one tooltip of its own per column
        assertHeadersFitWithATipEach(t);
        GuiActionRunner.execute(() -> t.setRowSelectionInterval(0, 0));
        String detail = GuiActionRunner.execute(() -> view.detail().text().getText());
        assertTrue(detail.contains("Design-matched detector: ") && detail.contains("Servo choice: "), detail);
        assertAllRowsFit(view.detail().text());
        String verdict = GuiActionRunner.execute(() -> window.label("shootout.verdict").target().getText());
        assertTrue(verdict.contains("Not a guarantee"), verdict);
        shot("shoot-out-result");

        // Save writes what the command line writes for the same designs, camera and conditions
        Path app = tmp.resolve("shootout-app"), cliOut = tmp.resolve("shootout-cli");
        GuiActionRunner.execute(() -> view.saveTo(app));
        assertEquals(0, cli("shootout", "--targets", "target-designs/fixture-cb15/target.json,target-designs/fixture-dots20/target.json",
                "--camera", CAMERA.toString(), "--standoff-mm", "250", "--views", "1", "--levels", "2", "--kinds", "noise,blur",
                "--detectors", "shi-tomasi,dots,xcorner",
                "--out", cliOut.toString()));
        assertEquals(Files.readAllLines(cliOut.resolve("shootout.csv")), Files.readAllLines(app.resolve("shootout.csv")));
        assertTrue(Files.readString(app.resolve("shootout.html")).contains("ISO 10218"), "the report keeps the cautions");
    }

    @Test
    @Order(3)
    void aCancelledShootoutRanksNothing() {
        ShootoutView view = workbench.shootoutView();
        window.spinner("shootout.levels").enterTextAndCommit("8");
        window.spinner("shootout.views").enterTextAndCommit("4");
        window.button("shootout.run").click();
        window.button("shootout.cancel").click();
        waitFor("stopped", () -> !view.running());
        String verdict = GuiActionRunner.execute(() -> window.label("shootout.verdict").target().getText());
        assertTrue(verdict.startsWith("Stopped: incomplete: ") && verdict.contains("no ranking from an incomplete shoot-out"), verdict);
        assertFalse(GuiActionRunner.execute(() -> window.button("shootout.save").target().isEnabled()), "nothing to save");
        assertEquals(0, GuiActionRunner.execute(() -> view.table().getRowCount()));
    }
}
