package org.targetbench.app;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.assertj.swing.edt.GuiActionRunner;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.cli.Main;
import org.targetbench.detect.DetectorType;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.FrameSetWriter;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.report.Palette;
import org.targetbench.source.FrameList;
import org.targetbench.source.FrameSource;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.SourceFrame;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;

import javax.swing.JTable;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The Track and Compare views answer their questions without the command line: tracks drawn with trails and end
 * marks in outcome colours, drift and jitter plotted or their absence said in the plot area, a scrubber over the
 * finished run, and saves that write exactly what the command line's {@code track} and {@code compare} write.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class TrackCompareGuiTest {
    /** Frames tracked in these tests: enough for drift and a still stretch, few enough to stay quick. */
    static final int FRAMES = 16;
    /** Demo frames written as a folder for the comparison. */
    static final int COMPARE_FRAMES = 4;

    static GuiWindow gui;

    @BeforeAll
    static void open() throws Exception {
        gui = GuiWindow.open(1280, 800);
    }

    @AfterAll
    static void close() throws Exception {
        if (gui != null) gui.close();
    }

    private static TrackView trackView() {
        return (TrackView) gui.robot.finder().findByName(gui.workbench.panelName("Track"), javax.swing.JPanel.class, false);
    }

    /** Shows plot tab {@code plot} of the track view and saves the window as target/screenshots/NAME.png. */
    private static void shotOfPlot(TrackView v, int plot, String name) throws Exception {
        GuiActionRunner.execute(() -> v.plots().setSelectedIndex(plot));
        gui.shot(name);
    }

    private static CompareView compareView() { return gui.workbench.compareView(); }

    private static void track(String source, int frames) {
        gui.show("Track");
        gui.window.comboBox("track.source").selectItem(source);
        gui.window.spinner("track.frames").enterTextAndCommit(Integer.toString(frames));
        gui.window.button("track.run").click();
        gui.waitFor("tracking finished", () -> trackView().history() != null && trackView().history().result() != null
                && gui.window.button("track.run").target().isEnabled() && gui.window.slider("track.scrub").target().isEnabled());
    }

    @Test
    @Order(1)
    void tracksWithTruthDrawsTrailsAndEndsAndScrubsThroughTheRun(@TempDir Path tmp) throws Exception {
        track("synthetic: approach", FRAMES);
        TrackView v = trackView();
        TrackHistory h = v.history();
        assertEquals(FRAMES, GuiActionRunner.execute(h::size));
        // drift against truth is plotted per frame; no still stretch in a short approach, and the plot area says so
        assertEquals(3, GuiActionRunner.execute(() -> v.chart(1).getChart().getXYPlot().getDataset().getSeriesCount()));
        assertEquals(TrackPlots.NO_STILL, GuiActionRunner.execute(() -> TrackPlots.message(v.chart(2))));
        assertEquals("", GuiActionRunner.execute(() -> TrackPlots.message(v.chart(1))));

        // the scrubber shows frame 5 with the tracks as they were then
        int at = 5;
        gui.window.slider("track.scrub").slideTo(at);
        gui.waitFor("frame " + at + " shown", () -> v.shownScene() != null && v.shownScene().index() == at);
        TrackHistory.Scene sc = GuiActionRunner.execute(v::shownScene);
        List<TrackPoint> live = new ArrayList<>(), ended = new ArrayList<>();
        for (TrackPoint p : h.rows(at).points()) if (!p.outcome().isLoss()) live.add(p);
        for (int k = 0; k <= at; k++) for (TrackPoint p : h.rows(k).points()) if (p.outcome().isLoss()) ended.add(p);
        assertEquals(live, sc.live());
        assertEquals(ended, sc.ended());
        assertFalse(live.isEmpty());
        // each live track's trail ends where the track is on the shown frame and holds at most the trail length
        for (TrackPoint p : live) {
            List<double[]> trail = sc.trails().get(p.trackId());
            assertNotNull(trail, "track " + p.trackId() + " has a trail");
            assertTrue(trail.size() <= TrackView.TRAIL_FRAMES && trail.size() == Math.min(at + 1, TrackView.TRAIL_FRAMES), "trail of " + trail.size());
            assertArrayEquals(new double[]{p.x(), p.y()}, trail.get(trail.size() - 1), 0);
        }
        gui.window.label("track.frame").requireText(java.util.regex.Pattern.compile(" frame " + h.rows(at).frame() + " \\(6 of " + FRAMES + "\\) "));
        // the legend names every outcome, in the outcome's own colour
        for (TrackOutcome o : TrackOutcome.values()) gui.window.label("track.legend." + o.csvName()).requireText(TrackView.words(o));
        for (TrackOutcome o : TrackOutcome.values())
            for (DetectorType d : DetectorType.values()) assertNotEquals(Palette.of(d), Palette.of(o));
        // every figure carries its unit
        JTable figures = gui.window.table("track.figures").target();
        for (int r = 0; r < GuiActionRunner.execute(figures::getRowCount); r++) {
            int row = r;
            String value = GuiActionRunner.execute(() -> figures.getValueAt(row, 1).toString());
            assertTrue(value.matches(".*(px|%|frames|tracks|ms per frame|by the user|source ended|frame limit was reached|longer than the run|no truth|no still stretch|not reached \\(ended at \\d+\\))"), value);
        }
        shotOfPlot(v, 1, "track-scrubbed-drift");

        // saved, the run is what the command line's track writes for the same source and settings
        Path app = tmp.resolve("app"), cli = tmp.resolve("cli");
        assertTrue(GuiActionRunner.execute(() -> v.saveTo(app)));
        assertEquals(0, cli("track", "--source", "synthetic:approach", "--frame-count", Integer.toString(FRAMES), "--out", cli.toString()));
        assertEquals(files(cli), files(app));
        assertTrue(files(app).containsAll(Set.of("tracks.csv", "survival.csv", "drift.csv", "summary.json")), files(app).toString());
        for (String f : List.of("tracks.csv", "survival.csv", "drift.csv"))
            assertEquals(Files.readString(cli.resolve(f)), Files.readString(app.resolve(f)), f);
        assertEquals(summary(cli, "timing"), summary(app, "timing"));
    }

    @Test
    @Order(2)
    void aStillViewGivesJitter() throws Exception {
        track("synthetic: still", FRAMES);
        TrackView v = trackView();
        var jitter = GuiActionRunner.execute(() -> v.chart(2).getChart().getXYPlot().getDataset());
        assertEquals(1, jitter.getSeriesCount());
        assertEquals(5, jitter.getItemCount(0), "p50, p90, p95, p99 and the worst segment");
        double worst = jitter.getYValue(0, 4);
        assertEquals(GuiActionRunner.execute(() -> v.history().result().score().jitter().max()), worst, 0);
        shotOfPlot(v, 2, "track-still-jitter");
    }

    @Test
    @Order(3)
    void withoutTruthThePlotAreaSaysSo(@TempDir Path tmp) throws Exception {
        // the first frames of the demo as a folder without truth.json
        Path dir = tmp.resolve("frames");
        Files.createDirectories(dir);
        try (FrameSource s = DemoScenario.source()) {
            for (int i = 0; i < 6; i++) {
                SourceFrame f = s.next().orElseThrow();
                ImageFiles.writePng(f.image(), dir.resolve(f.name()));
            }
        }
        GuiActionRunner.execute(() -> gui.workbench.live().loadFolder(dir));
        gui.waitFor("folder loaded", () -> gui.workbench.session().frames().size() == 6 && gui.workbench.session().detections() != null);
        track(TrackView.LOADED, 0);
        TrackView v = trackView();
        assertEquals(TrackPlots.NO_TRUTH, GuiActionRunner.execute(() -> TrackPlots.message(v.chart(1))));
        assertEquals(TrackPlots.NO_STILL, GuiActionRunner.execute(() -> TrackPlots.message(v.chart(2))));
        assertEquals("no truth", GuiActionRunner.execute(() -> gui.window.table("track.figures").target().getValueAt(6, 1)));
        Path out = tmp.resolve("saved");
        assertTrue(GuiActionRunner.execute(() -> v.saveTo(out)));
        assertEquals(Set.of("tracks.csv", "survival.csv", "summary.json"), files(out), "no drift.csv without truth");
        shotOfPlot(v, 1, "track-no-truth");
    }

    @Test
    @Order(4)
    void compareStepsPlotsPerFrameAndSavesWhatTheCommandLineWrites(@TempDir Path tmp) throws Exception {
        // the first demo frames with their truth, as a folder both the window and the command line read
        Path dir = tmp.resolve("frames");
        try (FrameSource s = DemoScenario.source(); AtomicOutput out = AtomicOutput.open(dir)) {
            List<SourceFrame> first = new ArrayList<>();
            for (int i = 0; i < COMPARE_FRAMES; i++) first.add(s.next().orElseThrow());
            FrameSetWriter.write(new FrameList("demo", first, s.referenceName()), out, "", (d, t, w) -> { });
            out.commit();
        }
        GuiActionRunner.execute(() -> gui.workbench.live().loadFolder(dir));
        gui.waitFor("folder loaded", () -> gui.workbench.session().frames().size() == COMPARE_FRAMES && gui.workbench.session().detections() != null);
        gui.show("Compare");
        gui.window.button("compare.save").requireDisabled();
        gui.window.button("compare.run").click();
        int detectors = DetectorType.values().length;
        gui.waitFor("ranking filled", () -> gui.window.table("compare.ranking").target().getRowCount() == detectors && compareView().perFrameSeries() == detectors);
        gui.window.label("compare.note").requireText(CompareView.RANKING_NOTE);
        assertTrue(GuiActionRunner.execute(() -> gui.window.label("compare.note").target().isShowing()));
        // its own frame stepping
        GuiActionRunner.execute(() -> gui.workbench.session().setFrameIndex(0));
        gui.window.button("compare.next").click();
        gui.waitFor("stepped", () -> gui.workbench.session().frameIndex() == 1);
        gui.window.label("compare.frame").requireText(java.util.regex.Pattern.compile(" frame 2 of " + COMPARE_FRAMES + ": .*"));
        gui.window.button("compare.last").click();
        gui.waitFor("last frame", () -> gui.workbench.session().frameIndex() == COMPARE_FRAMES - 1);
        // every ranking header (name and unit) fits its column
        JTable t = gui.window.table("compare.ranking").target();
        GuiActionRunner.execute(() -> {
            var fm = t.getTableHeader().getFontMetrics(t.getTableHeader().getFont());
            for (int c = 0; c < t.getColumnCount(); c++) {
                String h = t.getColumnName(c).replaceAll("<br>", "\n").replaceAll("<[^>]+>", "").replace("&nbsp;", " ");
                for (String line : h.split("\n"))
                    assertTrue(fm.stringWidth(line) + 8 <= t.getColumnModel().getColumn(c).getWidth(), "'" + line + "' in " + t.getColumnModel().getColumn(c).getWidth() + " px");
            }
            return null;
        });
        gui.shot("compare-ranked-folder");

        Path app = tmp.resolve("app"), cli = tmp.resolve("cli");
        assertTrue(GuiActionRunner.execute(() -> compareView().saveTo(app)));
        assertEquals(0, cli("compare", "--frames", dir.toString(), "--out", cli.toString()));
        assertEquals(files(cli), files(app));
        assertTrue(files(app).containsAll(Set.of("detections.csv", "repeatability.csv", "summary.json")), files(app).toString());
        assertTrue(files(app).stream().anyMatch(f -> f.startsWith("overlays/")), files(app).toString());
        for (String f : List.of("detections.csv", "repeatability.csv")) assertEquals(Files.readString(cli.resolve(f)), Files.readString(app.resolve(f)), f);
        assertEquals(summary(cli, "mean_ms_per_frame_in_run"), summary(app, "mean_ms_per_frame_in_run"));
    }

    @Test
    @Order(5)
    void theChartsFollowATheme() throws Exception {
        javax.swing.JMenuItem theme = gui.robot.finder().findByName("menu.theme", javax.swing.JMenuItem.class, false);
        GuiActionRunner.execute(() -> { theme.doClick(); return null; });
        try {
            java.awt.Color bg = GuiActionRunner.execute(() -> javax.swing.UIManager.getColor("Panel.background"));
            assertTrue(bg.getRed() + bg.getGreen() + bg.getBlue() < 3 * 128, "dark now: " + bg);
            gui.show("Track");
            for (int tab = 0; tab < 3; tab++) {
                int t = tab;
                gui.waitFor("chart " + tab + " in the dark theme", () -> bg.equals(trackView().chart(t).getChart().getBackgroundPaint()));
            }
            GuiActionRunner.execute(() -> trackView().plots().setSelectedIndex(0));
            gui.shot("track-dark");
            gui.show("Compare");
            gui.waitFor("per-frame chart in the dark theme", () -> bg.equals(compareView().perFrameChart().getChart().getBackgroundPaint()));
            gui.shot("compare-dark");
        } finally {
            GuiActionRunner.execute(() -> { theme.doClick(); return null; });
        }
    }

    /** Runs the command line in this process. */
    private static int cli(String... args) {
        var cl = Main.commandLine();
        cl.setOut(new PrintWriter(new StringWriter(), true));
        cl.setErr(new PrintWriter(new StringWriter(), true));
        return cl.execute(args);
    }

    /** Files of an output folder, relative, without the tool's own bookkeeping. */
    private static Set<String> files(Path dir) throws Exception {
        try (Stream<Path> s = Files.walk(dir)) {
            Set<String> out = new TreeSet<>();
            s.filter(Files::isRegularFile).map(p -> dir.relativize(p).toString().replace('\\', '/'))
                    .filter(n -> !n.startsWith(".targetbench")).forEach(out::add);
            return out;
        }
    }

    /** summary.json without what differs between any two runs: when, how long, and what the source was called. */
    private static JsonNode summary(Path dir, String timing) throws Exception {
        JsonNode n = new ObjectMapper().readTree(dir.resolve("summary.json").toFile());
        strip(n, Set.of("created", "source", timing));
        return n;
    }

    private static void strip(JsonNode n, Set<String> keys) {
        if (n instanceof ObjectNode o) o.remove(keys);
        n.forEach(c -> strip(c, keys));
    }
}
