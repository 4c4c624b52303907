package org.targetbench.app;

import org.jfree.chart.ChartPanel;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.pipeline.MotionScenarios;
import org.targetbench.pipeline.TrackResult;
import org.targetbench.pipeline.TrackRun;
import org.targetbench.report.Palette;
import org.targetbench.source.FrameList;
import org.targetbench.source.FrameSource;
import org.targetbench.track.KltConfig;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;

import javax.swing.JButton;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JSlider;
import javax.swing.JSpinner;
import javax.swing.JSplitPane;
import javax.swing.JTabbedPane;
import javax.swing.SpinnerNumberModel;
import javax.swing.SwingWorker;
import java.awt.BorderLayout;
import java.awt.Color;
import java.awt.Dimension;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * KLT tracking of the loaded frames or of a synthetic motion of the demo target, by the command line's {@code track}
 * run with its default settings. While it runs, the newest frame shows its tracks; when it ends, the scrubber shows
 * any frame with the tracks as they were then: each live track with a trail of its last {@link #TRAIL_FRAMES} frames,
 * and every track that has ended by then marked where it ended, in the colour and shape of how it ended (colours of
 * their own, {@link Palette#of(TrackOutcome)}). Beside the frame: survival, drift and jitter charts and the run's
 * figures with units; Save writes what {@code track} writes, through the same writer.
 */
final class TrackView extends JPanel {
    /** Frames of path each trail keeps. */
    static final int TRAIL_FRAMES = 40;
    static final String LOADED = "the loaded frames";
    /** Least time between two redraws of the survival chart while a run goes, nanoseconds. */
    private static final long CHART_EVERY_NS = 300_000_000L;

    private final AppContext ctx;
    private final JComboBox<String> what;
    private final JComboBox<DetectorType> seeding = Ui.named(new JComboBox<>(DetectorType.values()), "track.detector",
            "Detector that picks the points on the first frame (the command line's --detector)");
    private final JSpinner frameCount = Ui.named(new JSpinner(new SpinnerNumberModel(0, 0, 100_000, 10)), "track.frames",
            "Most frames to track; 0 tracks every frame (the command line's --frame-count)");
    private final FrameCanvas canvas = new FrameCanvas("track.canvas");
    private final JSlider scrub = Ui.named(new JSlider(0, 0, 0), "track.scrub", "Show any frame of the finished run with its tracks as they were then");
    private final JLabel frameLabel = Ui.named(new JLabel("frame -"), "track.frame", null);
    private final JTabbedPane plots = Ui.named(new JTabbedPane(), "track.plots", null);
    private final TrackFigures figures = new TrackFigures();
    private final JButton run, stop, save;
    private final AtomicBoolean cancel = new AtomicBoolean();
    private ChartPanel survivalChart, driftChart, jitterChart;
    private TrackHistory history;
    private SwingWorker<TrackResult, Integer> worker;

    TrackView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        setName("view.track");
        List<String> choices = new ArrayList<>();
        choices.add(LOADED);
        for (String n : MotionScenarios.NAMES) choices.add("synthetic: " + n);
        what = Ui.named(new JComboBox<>(choices.toArray(String[]::new)), "track.source", "What to track: the loaded frames, or the demo target under a synthetic motion with truth");
        what.setSelectedIndex(1);
        seeding.setSelectedItem(DetectorType.SHI_TOMASI);
        seeding.setRenderer(Ui.detectorRenderer());
        run = Ui.button("track.run", "Track", "Track from the first frame to the last", this::start);
        stop = Ui.button("track.stop", "Stop", "Stop tracking; what was measured is kept", () -> cancel.set(true));
        save = Ui.button("track.save", "Save...", "Write tracks.csv, survival.csv, drift.csv (with truth) and summary.json, as the command line's track does", this::save);
        stop.setEnabled(false);
        save.setEnabled(false);
        ((JSpinner.DefaultEditor) frameCount.getEditor()).getTextField().setColumns(5);
        add(Ui.row(new JLabel("Source"), what, new JLabel("Seeded by"), seeding, new JLabel("Frames (0: all)"), frameCount, run, stop, save), BorderLayout.NORTH);

        scrub.setEnabled(false);
        scrub.addChangeListener(e -> {
            if (history != null && history.size() > 0 && scrub.isEnabled()) showFrame(scrub.getValue());
        });
        JPanel framePane = new JPanel(new BorderLayout(4, 4));
        framePane.add(canvas, BorderLayout.CENTER);
        JPanel scrubRow = new JPanel(new BorderLayout(6, 0));
        scrubRow.add(new JLabel("Frame"), BorderLayout.WEST);
        scrubRow.add(scrub, BorderLayout.CENTER);
        frameLabel.setPreferredSize(new Dimension(frameLabel.getFontMetrics(frameLabel.getFont()).stringWidth(" frame 00000 (00000 of 00000) "), frameLabel.getPreferredSize().height));
        scrubRow.add(frameLabel, BorderLayout.EAST);
        framePane.add(scrubRow, BorderLayout.SOUTH);

        JPanel chartSide = new JPanel(new BorderLayout());
        chartSide.add(plots, BorderLayout.CENTER);
        chartSide.add(legend(), BorderLayout.SOUTH);
        JSplitPane right = new JSplitPane(JSplitPane.VERTICAL_SPLIT, chartSide, figures.pane());
        right.setResizeWeight(0.62);
        JSplitPane split = new JSplitPane(JSplitPane.HORIZONTAL_SPLIT, framePane, right);
        split.setResizeWeight(0.6); // a large frame pane
        framePane.setMinimumSize(new Dimension(480, 360));
        right.setMinimumSize(new Dimension(400, 300));
        canvas.setPreferredSize(new Dimension(640, 480));
        right.setPreferredSize(new Dimension(460, 480));
        add(split, BorderLayout.CENTER);
        plots.addTab("Survival", null, new JPanel(), Ui.TIP_SURVIVAL);
        plots.addTab("Drift", null, new JPanel(), "Distance of each tracked point from where truth puts it, per frame, px");
        plots.addTab("Jitter", null, new JPanel(), "Spread of each track's position while nothing moved, px");
        drawCharts(null);
    }

    void start() {
        if (worker != null) return;
        String choice = (String) what.getSelectedItem();
        Session s = ctx.session();
        if (LOADED.equals(choice) && !s.hasFrames()) {
            ctx.status().accept("Load a source first");
            return;
        }
        FrameSource in;
        try {
            in = LOADED.equals(choice) ? new FrameList(s.sourceName(), s.frames(), s.reference().name())
                    : MotionScenarios.open(choice.substring("synthetic: ".length()));
        } catch (IllegalArgumentException e) {
            ctx.status().accept("Cannot track: " + e.getMessage());
            return;
        }
        DetectorConfig seed = DetectorConfig.defaults((DetectorType) seeding.getSelectedItem());
        int most = (Integer) frameCount.getValue();
        TrackHistory h = new TrackHistory();
        history = h;
        cancel.set(false);
        run.setEnabled(false);
        stop.setEnabled(true);
        save.setEnabled(false);
        scrub.setEnabled(false);
        figures.clear();
        drawCharts(null);
        ctx.status().accept("Tracking " + choice + "...");
        worker = new SwingWorker<>() {
            @Override protected TrackResult doInBackground() throws Exception {
                try (Peek src = new Peek(in, h)) {
                    // the command line's defaults: its tracker settings, survival at frame 30, not marked static
                    TrackResult r = new TrackRun(new KltConfig(), seed, 30, false, most).run(src, (rows, f) -> {
                        h.frame(rows, f);
                        publish(h.size() - 1);
                    }, (d, tot, w) -> { }, cancel::get);
                    h.finish(r);
                    return r;
                }
            }
            @Override protected void process(List<Integer> chunks) {
                if (history != h) return;
                int last = chunks.get(chunks.size() - 1);
                scrub.setMaximum(last);
                scrub.setValue(last);
                long now = System.nanoTime();
                if (now - chartDrawn > CHART_EVERY_NS) { // the chart is rebuilt a few times a second, not per frame
                    chartDrawn = now;
                    survivalChart = TrackPlots.survival(h.allFigures());
                    replaceTab(0, survivalChart);
                }
                showFrame(last);
            }
            private long chartDrawn;
            @Override protected void done() {
                worker = null;
                run.setEnabled(true);
                stop.setEnabled(false);
                try {
                    finished(get());
                } catch (ExecutionException e) {
                    ctx.status().accept("Tracking failed: " + e.getCause().getMessage());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        };
        worker.execute();
    }

    private void finished(TrackResult r) {
        int last = history.size() - 1;
        scrub.setMaximum(last);
        scrub.setValue(last);
        scrub.setEnabled(true);
        save.setEnabled(true);
        drawCharts(r);
        showFrame(last);
        figures.show(r);
        var s = r.score();
        ctx.status().accept(String.format(Locale.ROOT, "Tracked %d frames: survival %s %% at the end; %s. Drag the frame slider to see any frame.",
                s.frames(), Ui.fmt(100 * s.survivalAtEnd(), 1), r.stop().label()));
    }

    /** A theme switch redraws the charts in the new theme's colours (they are themed when built). */
    @Override
    public void updateUI() {
        super.updateUI();
        if (plots != null && worker == null) javax.swing.SwingUtilities.invokeLater(() -> drawCharts(history == null ? null : history.result()));
    }

    private void drawCharts(TrackResult r) {
        List<org.targetbench.score.FrameTracking> f = history == null ? List.of() : history.allFigures();
        survivalChart = TrackPlots.survival(f);
        driftChart = TrackPlots.drift(f, r);
        jitterChart = TrackPlots.jitter(r);
        replaceTab(0, survivalChart);
        replaceTab(1, driftChart);
        replaceTab(2, jitterChart);
        if (shown != null && history != null && shown.index() < history.size())
            for (ChartPanel p : new ChartPanel[]{survivalChart, driftChart}) TrackPlots.markFrame(p, history.rows(shown.index()).frame());
    }

    private void replaceTab(int i, ChartPanel p) {
        plots.setComponentAt(i, p);
        plots.revalidate();
        plots.repaint();
    }

    /** Shows frame {@code i} of the run (0-based position in the run) with its tracks as they were then. */
    void showFrame(int i) {
        TrackHistory.Scene sc = history.scene(i, TRAIL_FRAMES);
        var img = history.image(i);
        if (img != null) canvas.setImage(img);
        List<FrameCanvas.Trail> trails = new ArrayList<>();
        Color trail = withAlpha(Palette.of(TrackOutcome.TRACKED), 170);
        for (List<double[]> path : sc.trails().values()) {
            double[] x = new double[path.size()], y = new double[path.size()];
            for (int k = 0; k < x.length; k++) { x[k] = path.get(k)[0]; y[k] = path.get(k)[1]; }
            trails.add(new FrameCanvas.Trail(x, y, trail));
        }
        canvas.setTrails(trails);
        List<FrameCanvas.Marker> marks = new ArrayList<>();
        for (TrackPoint p : sc.ended())
            marks.add(new FrameCanvas.Marker(p.x(), p.y(), "", Palette.of(p.outcome()), 4.5, shape(p.outcome()),
                    "track " + p.trackId() + " ended at frame " + p.frame() + ": " + words(p.outcome())));
        for (TrackPoint p : sc.live())
            marks.add(new FrameCanvas.Marker(p.x(), p.y(), "", Palette.of(p.outcome()), 4, FrameCanvas.Shape.RING,
                    "track " + p.trackId() + (p.outcome() == TrackOutcome.STARTED ? " started here" : String.format(Locale.ROOT,
                            " tracked, forward-backward error %s px", Ui.fmt(p.fbError(), 3)))));
        canvas.setMarkers(marks);
        int index = history.rows(i).frame();
        frameLabel.setText(String.format(Locale.ROOT, " frame %d (%d of %d) ", index, i + 1, history.size()));
        canvas.setNote(String.format(Locale.ROOT, "frame %d: %d tracks alive, %d ended so far%s", index, sc.live().size(), sc.ended().size(),
                img == null ? " (picture not kept: memory)" : ""));
        shown = sc;
        for (ChartPanel p : new ChartPanel[]{survivalChart, driftChart}) if (p != null) TrackPlots.markFrame(p, index);
    }

    private TrackHistory.Scene shown;

    /** What the frame pane shows now (null before a run). */
    TrackHistory.Scene shownScene() { return shown; }

    TrackHistory history() { return history; }

    /** The chart of a tab: 0 survival, 1 drift, 2 jitter. */
    ChartPanel chart(int tab) { return (ChartPanel) plots.getComponentAt(tab); }

    JTabbedPane plots() { return plots; }

    JSlider scrubber() { return scrub; }

    /** Shape of a track's end marker: one per way of ending, so colour is not the only cue. */
    static FrameCanvas.Shape shape(TrackOutcome o) {
        return switch (o) {
            case STARTED, TRACKED -> FrameCanvas.Shape.RING;
            case LOST_FORWARD_BACKWARD -> FrameCanvas.Shape.CROSS;
            case LEFT_IMAGE -> FrameCanvas.Shape.SQUARE;
            case RESIDUAL_TOO_LARGE -> FrameCanvas.Shape.TRIANGLE;
            case DIVERGED -> FrameCanvas.Shape.DIAMOND;
            case TOO_FLAT -> FrameCanvas.Shape.PLUS;
        };
    }

    static String words(TrackOutcome o) {
        return switch (o) {
            case STARTED -> "started";
            case TRACKED -> "tracked";
            case LOST_FORWARD_BACKWARD -> "lost: forward-backward";
            case LEFT_IMAGE -> "left the image";
            case RESIDUAL_TOO_LARGE -> "residual too large";
            case DIVERGED -> "diverged";
            case TOO_FLAT -> "too flat";
        };
    }

    private static Color withAlpha(Color c, int a) { return new Color(c.getRed(), c.getGreen(), c.getBlue(), a); }

    private JPanel legend() {
        JPanel p = new JPanel(new java.awt.GridLayout(0, 2, 8, 0));
        p.setName("track.legend");
        p.setToolTipText("Live tracks: rings with a trail of their last " + TRAIL_FRAMES + " frames; ended tracks: a mark where they ended, its colour and shape saying how");
        for (TrackOutcome o : TrackOutcome.values()) {
            JLabel l = new JLabel(words(o), new javax.swing.Icon() {
                @Override public void paintIcon(java.awt.Component c, java.awt.Graphics g, int x, int y) {
                    java.awt.Graphics2D g2 = (java.awt.Graphics2D) g.create();
                    g2.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING, java.awt.RenderingHints.VALUE_ANTIALIAS_ON);
                    FrameCanvas.drawShape(g2, shape(o), x + 7, y + 7, 4.5, Palette.of(o));
                    g2.dispose();
                }
                @Override public int getIconWidth() { return 14; }
                @Override public int getIconHeight() { return 14; }
            }, JLabel.LEFT);
            l.setName("track.legend." + o.csvName());
            p.add(l);
        }
        return p;
    }

    private void save() {
        if (history == null || history.result() == null) return;
        Folders.choose(ctx, "lastTrackFolder", "Folder for the tracking results", Folders.Use.SAVE).ifPresent(this::saveTo);
    }

    /** Writes the finished run into {@code dir}; says in the status bar what was written, or why not. */
    boolean saveTo(Path dir) {
        ctx.prefs().put("lastTrackFolder", dir.toString());
        try {
            List<String> files = history.save(dir);
            ctx.status().accept("Tracking results written to " + dir + ": " + String.join(", ", files));
            return true;
        } catch (Exception e) {
            ctx.status().accept("Could not write the tracking results: " + e.getMessage());
            return false;
        }
    }

    /** Passes a source through, handing each frame to the history before the tracker's rows for it arrive. */
    private static final class Peek extends org.targetbench.source.ForwardingSource {
        private final TrackHistory h;

        Peek(FrameSource in, TrackHistory h) {
            super(in);
            this.h = h;
        }

        @Override public java.util.Optional<org.targetbench.source.SourceFrame> next() throws org.targetbench.source.SourceException {
            var f = source.next();
            f.ifPresent(x -> h.offer(x.image()));
            return f;
        }
    }
}
