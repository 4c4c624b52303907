package org.targetbench.app;

import org.assertj.swing.edt.GuiActionRunner;
import org.jfree.chart.ChartPanel;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYDataset;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.targetbench.perturb.PerturbKind;
import org.targetbench.perturb.Perturbation;
import org.targetbench.source.TargetFile;

import javax.swing.AbstractButton;
import javax.swing.JComponent;
import javax.swing.JLabel;
import javax.swing.JTable;
import javax.swing.SwingUtilities;
import java.awt.Component;
import java.awt.Container;
import java.awt.Rectangle;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The stress view as a person uses it, under a real (virtual) display: every control fits at 1280 x 800 and
 * 1920 x 1080, a tiny sweep ranks its detectors exactly as the command line does and saves the same files, the charts
 * mark every measured level and keep overlapping curves apart and follow the theme, an envelope file fills the
 * conditions, and a cancelled sweep gives no ranking, only how far it got. Screenshots go to target/screenshots/.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class StressViewGuiTest extends GuiTestBase {
    static StressView view;

    @BeforeAll
    static void open() throws Exception {
        start(WAIT_MS, prefs -> prefs.put("view", "Stress"));
        size(1280, 800);
        view = GuiActionRunner.execute(() -> workbench.stressView());
        waitFor("demo loaded", () -> workbench.session().hasFrames() && workbench.session().scene().isPresent());
        window.list("nav").selectItem("Stress");
        waitFor("stress view showing", () -> window.panel("view.stress").target().isShowing());
    }

    @Test
    @Order(1)
    void everyControlFitsAt1280x800And1920x1080() throws Exception {
        for (int[] s : new int[][]{{1920, 1080}, {1280, 800}}) {
            size(s[0], s[1]);
            List<String> problems = GuiActionRunner.execute(StressViewGuiTest::cutOffControls);
            assertEquals(List.of(), problems, "at " + s[0] + " x " + s[1]);
            int rankingHeight = GuiActionRunner.execute(() -> view.ranking().getHeight());
            assertTrue(rankingHeight >= 120, "ranking table shown at " + s[0] + " x " + s[1] + ": " + rankingHeight + " px");
            int chartsHeight = GuiActionRunner.execute(() -> ((JComponent) window.panel("view.stress").target().getComponent(1)).getHeight());
            assertTrue(chartsHeight >= 300, "charts and ranking get the rest: " + chartsHeight + " px");
            shot("stress-" + s[0] + "x" + s[1]);
        }
    }

    /**
     * Every named control of the view lies fully inside the window and is not clipped by its parents, and every label,
     * check box and button is at least as wide as its text needs (Swing would shorten it with "...").
     */
    static List<String> cutOffControls() {
        List<String> out = new ArrayList<>();
        Container root = workbench.getRootPane();
        List<Component> all = new ArrayList<>();
        collect(window.panel("view.stress").target(), all);
        int checked = 0;
        for (Component c : all) {
            if (!(c instanceof JComponent j) || !j.isShowing()) continue;
            String name = c.getName();
            boolean control = name != null && name.startsWith("stress.") && !name.startsWith("stress.chart") && !name.equals("stress.ranking");
            boolean text = c instanceof JLabel || c instanceof AbstractButton;
            if (!control && !text) continue;
            if (text && hasNoText(c)) continue;
            checked++;
            Rectangle r = SwingUtilities.convertRectangle(c.getParent(), c.getBounds(), root);
            Rectangle visible = j.getVisibleRect();
            String what = (name != null ? name : c.getClass().getSimpleName()) + " " + r;
            if (r.x < 0 || r.y < 0 || r.getMaxX() > root.getWidth() || r.getMaxY() > root.getHeight()) out.add(what + " outside the window");
            else if (visible.width < j.getWidth() || visible.height < j.getHeight()) out.add(what + " clipped to " + visible);
            else if (text && j.getWidth() < j.getPreferredSize().width) out.add(what + " narrower than its text needs (" + j.getPreferredSize().width + " px)");
        }
        if (checked < 40) out.add("only " + checked + " controls found");
        return out;
    }

    private static boolean hasNoText(Component c) {
        String t = c instanceof JLabel l ? l.getText() : ((AbstractButton) c).getText();
        return t == null || t.isBlank();
    }

    private static void collect(Component c, List<Component> out) {
        out.add(c);
        if (c instanceof Container k) for (Component x : k.getComponents()) collect(x, out);
    }

    @Test
    @Order(2)
    void aTinySweepRanksAndSavesAsTheCommandLine(@org.junit.jupiter.api.io.TempDir Path tmp) throws Exception {
        // the sweep: Harris and Shi-Tomasi, blur (defocus) and noise (gaussian), 3 levels, one view, seed 7, 2 tracked
        // frames, blur ranked over an envelope up to 2.5 px: 6 cells
        for (var t : org.targetbench.detect.DetectorType.values())
            if (t != org.targetbench.detect.DetectorType.HARRIS && t != org.targetbench.detect.DetectorType.SHI_TOMASI)
                window.checkBox("stress.detector." + t.cliName()).uncheck();
        for (PerturbKind k : List.of(PerturbKind.LIGHTING, PerturbKind.JPEG, PerturbKind.VIEWPOINT)) window.checkBox("stress.kind." + k.cliName()).uncheck();
        window.checkBox("stress.limit.blur").check();
        window.spinner("stress.limitValue.blur").enterTextAndCommit("2.5");
        window.spinner("stress.levels").enterTextAndCommit("3");
        window.spinner("stress.views").enterTextAndCommit("1");
        window.spinner("stress.seed").enterTextAndCommit("7");
        window.spinner("stress.trackFrames").enterTextAndCommit("2");
        window.button("stress.run").click();
        waitFor("sweep done", () -> view.result().isPresent() && window.button("stress.run").target().isEnabled());

        String verdict = GuiActionRunner.execute(() -> window.label("stress.verdict").target().getText());
        assertTrue(verdict.startsWith("Done. Best over the operating envelope: "), verdict);
        JTable t = window.table("stress.ranking").target();
        List<List<String>> table = GuiActionRunner.execute(() -> {
            List<List<String>> rows = new ArrayList<>();
            List<String> head = new ArrayList<>();
            for (int c = 0; c < t.getColumnCount(); c++) head.add(t.getColumnName(c));
            rows.add(head);
            for (int r = 0; r < t.getRowCount(); r++) {
                List<String> row = new ArrayList<>();
                for (int c = 0; c < t.getColumnCount(); c++) row.add(String.valueOf(t.getValueAt(r, c)));
                rows.add(row);
            }
            return rows;
        });
        assertEquals(List.of("Rank", "Detector", "Score", "Weakest condition", "blur.defocus", "noise.gaussian", "KLT survival", "Refinement"), table.get(0));
        assertEquals(3, table.size(), table.toString());
        // one tooltip per column, each its own, saying what the figure is and its unit (or that it has none)
        Set<String> tips = new HashSet<>();
        for (int c = 0; c < table.get(0).size(); c++) {
            int col = c;
            String tip = GuiActionRunner.execute(() -> view.ranking().tip(col));
            assertNotNull(tip, table.get(0).get(c));
            assertTrue(tips.add(tip), "tooltip of " + table.get(0).get(c) + " repeats another");
        }
        String scoreTip = GuiActionRunner.execute(() -> view.ranking().tip(2));
        assertTrue(scoreTip.contains("0..1") && scoreTip.contains("blur.defocus up to 2.5 px sigma") && scoreTip.contains("Threshold"), scoreTip);
        String headerTip = GuiActionRunner.execute(() -> {
            var h = t.getTableHeader();
            Rectangle r = h.getHeaderRect(2);
            return h.getToolTipText(new java.awt.event.MouseEvent(h, java.awt.event.MouseEvent.MOUSE_MOVED, 0, 0, r.x + 2, r.y + 2, 0, false));
        });
        assertTrue(headerTip != null && headerTip.contains("weakest condition"), headerTip);

        // markers at every measured level, a line style and hollow marker of its own per detector
        List<ChartPanel> charts = chartPanels();
        assertEquals(List.of("Repeatability vs blur.defocus", "Repeatability vs noise.gaussian"), GuiActionRunner.execute(() -> view.chartTitles()));
        for (ChartPanel cp : charts) {
            XYPlot plot = cp.getChart().getXYPlot();
            XYLineAndShapeRenderer r = (XYLineAndShapeRenderer) plot.getRenderer();
            XYDataset d = plot.getDataset();
            assertEquals(2, d.getSeriesCount());
            for (int s = 0; s < 2; s++) {
                assertEquals(3, d.getItemCount(s));
                for (int i = 0; i < 3; i++) assertFalse(Double.isNaN(d.getYValue(s, i)), "measured level " + i + " has a value");
                assertTrue(r.getItemShapeVisible(s, 0), "marker at each level");
                assertFalse(r.getItemShapeFilled(s, 0), "hollow markers, so coinciding points nest");
            }
            assertNotEquals(r.getSeriesStroke(0), r.getSeriesStroke(1), "line styles differ");
            assertTrue(r.getSeriesShape(1).getBounds2D().getWidth() > r.getSeriesShape(0).getBounds2D().getWidth(), "markers nest");
        }
        shot("stress-ranked");
        window.comboBox("stress.metric").selectItem("KLT survival");
        waitFor("survival charts", () -> view.chartTitles().get(0).startsWith("KLT survival vs"));
        for (ChartPanel cp : chartPanels()) {
            XYDataset d = cp.getChart().getXYPlot().getDataset();
            for (int s = 0; s < d.getSeriesCount(); s++) assertFalse(Double.isNaN(d.getYValue(s, 0)), "survival measured");
        }
        shot("stress-survival");
        window.comboBox("stress.metric").selectItem("Repeatability");

        // the files of the command line's sweep, with the same bytes where the run is deterministic (every CSV)
        Path app = tmp.resolve("app"), cli = tmp.resolve("cli");
        GuiActionRunner.execute(() -> view.saveTo(app));
        var scene = workbench.session().scene().orElseThrow();
        Path target = tmp.resolve("target.json"), envelope = tmp.resolve("envelope.json");
        TargetFile.write(scene.design(), target);
        Files.writeString(envelope, "{\"format\": \"targetbench-envelope\", \"version\": 1, \"worst\": {\"blur.defocus\": 2.5}}");
        StringWriter out = new StringWriter(), err = new StringWriter();
        var cl = org.targetbench.cli.Main.commandLine();
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        int code = cl.execute("sweep", "--target", target.toString(), "--standoff-mm", Double.toString(scene.standoffM() * 1000),
                "--detectors", "harris,shi-tomasi", "--kinds", "blur,noise", "--levels", "3", "--views", "1", "--seed", "7",
                "--track-frames", "2", "--envelope", envelope.toString(), "--out", cli.toString());
        assertEquals(0, code, err.toString());
        assertEquals(files(cli), files(app));
        for (String f : files(cli)) if (f.endsWith(".csv")) assertEquals(Files.readString(cli.resolve(f)), Files.readString(app.resolve(f)), f);
        // and the ranking the command line prints is the table's, line by line
        List<String> printed = out.toString().lines().filter(l -> l.matches("\\s+\\d+\\. .*")).map(String::trim).toList();
        assertEquals(2, printed.size(), out.toString());
        for (int i = 0; i < 2; i++) {
            List<String> row = table.get(i + 1);
            assertTrue(printed.get(i).matches(row.get(0) + "\\. " + java.util.regex.Pattern.quote(row.get(1)) + "\\s+" + java.util.regex.Pattern.quote(row.get(2))
                    + "\\s+weakest: " + java.util.regex.Pattern.quote(row.get(3))), printed.get(i) + " vs " + row);
        }
    }

    private static List<ChartPanel> chartPanels() {
        return GuiActionRunner.execute(() -> {
            List<Component> all = new ArrayList<>();
            collect(window.panel("view.stress").target(), all);
            return all.stream().filter(c -> c instanceof ChartPanel).map(c -> (ChartPanel) c).toList();
        });
    }

    private static List<String> files(Path dir) throws Exception {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> !n.startsWith(".")).sorted().toList();
        }
    }

    @Test
    @Order(3)
    void chartsFollowTheTheme() throws Exception {
        java.awt.Color before = GuiActionRunner.execute(() -> (java.awt.Color) chartPanels().get(0).getChart().getBackgroundPaint());
        window.menuItem("menu.theme").click();
        waitFor("charts re-themed", () -> {
            java.awt.Color bg = javax.swing.UIManager.getColor("Panel.background");
            return !bg.equals(before) && bg.equals(chartPanels().get(0).getChart().getBackgroundPaint());
        });
        shot("stress-dark");
        window.menuItem("menu.theme").click();
        waitFor("charts back", () -> before.equals(chartPanels().get(0).getChart().getBackgroundPaint()));
    }

    @Test
    @Order(4)
    void anEnvelopeFileFillsTheConditions(@org.junit.jupiter.api.io.TempDir Path tmp) throws Exception {
        Path good = tmp.resolve("good.json"), bad = tmp.resolve("bad.json");
        Files.writeString(good, "{\"format\": \"targetbench-envelope\", \"version\": 1, \"worst\": {\"lighting.gamma\": 2.0, \"jpeg\": 40}}");
        Files.writeString(bad, "{\"format\": \"targetbench-envelope\", \"version\": 1, \"worst\": {\"noise.gaussian\": 500}}");
        GuiActionRunner.execute(() -> view.loadEnvelope(good));
        var env = GuiActionRunner.execute(() -> view.controls().envelope());
        assertEquals(2.0, env.get(Perturbation.GAMMA));
        assertEquals(40.0, env.get(Perturbation.JPEG_QUALITY));
        assertEquals(2.5, env.get(Perturbation.DEFOCUS), "blur keeps its own limit");
        window.checkBox("stress.kind.lighting").requireSelected();
        window.comboBox("stress.param.lighting").requireSelection("gamma");
        GuiActionRunner.execute(() -> view.loadEnvelope(bad));
        window.label("status").requireText(java.util.regex.Pattern.compile("Could not use the envelope file: noise.gaussian level 500.0 is out of range.*"));
        assertEquals(env, GuiActionRunner.execute(() -> view.controls().envelope()), "a bad file changes nothing");
    }

    @Test
    @Order(5)
    void aCancelledSweepGivesNoRanking() throws Exception {
        for (PerturbKind k : PerturbKind.values()) window.checkBox("stress.kind." + k.cliName()).check();
        window.spinner("stress.levels").enterTextAndCommit("8");
        window.spinner("stress.views").enterTextAndCommit("4");
        window.spinner("stress.trackFrames").enterTextAndCommit("0");
        runSweepThenCancel();
        String verdict = GuiActionRunner.execute(() -> window.label("stress.verdict").target().getText());
        var m = java.util.regex.Pattern.compile("Stopped: incomplete: (\\d+) of (\\d+) cells; no ranking from an incomplete sweep\\..*").matcher(verdict);
        assertTrue(m.matches(), verdict);
        assertTrue(Integer.parseInt(m.group(1)) < Integer.parseInt(m.group(2)), verdict);
        assertEquals(0, GuiActionRunner.execute(() -> window.table("stress.ranking").target().getRowCount()), "no ranking from an incomplete sweep");
        assertEquals("incomplete: " + m.group(1) + " of " + m.group(2) + " cells; no ranking from an incomplete sweep",
                GuiActionRunner.execute(() -> view.ranking().note()));
        var notRun = GuiActionRunner.execute(() -> view.conditionsNotRun());
        var titles = GuiActionRunner.execute(() -> view.chartTitles());
        for (var p : notRun) assertTrue(titles.contains("Repeatability vs " + p.id() + " (not run)"), titles.toString());
        List<String> problems = GuiActionRunner.execute(StressViewGuiTest::cutOffControls);
        assertEquals(List.of(), problems, "the long verdict does not push anything off");
        shot("stress-cancelled-1280x800");
    }
}
