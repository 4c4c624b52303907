package org.targetbench.app;

import org.targetbench.source.FrameList;
import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.pipeline.MotionScenarios;
import org.targetbench.pipeline.TrackResult;
import org.targetbench.pipeline.TrackRun;
import org.targetbench.report.Charts;
import org.targetbench.source.FrameSource;
import org.targetbench.track.KltConfig;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;

import javax.swing.JButton;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSplitPane;
import javax.swing.JTable;
import javax.swing.SwingWorker;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.GridLayout;
import java.awt.Color;
import java.awt.Dimension;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * KLT tracking of the loaded frames or of a synthetic motion of the demo target: tracks drawn coloured by their outcome
 * with a legend, the survival curve growing as frames are tracked, and the survival, forward-backward, drift and
 * jitter figures when the run ends. The run is the command line's {@code track} run.
 */
final class TrackView extends JPanel {
    /**
     * Outcome colours, a palette of their own (Paul Tol's "bright" scheme) so outcomes never read as the detector colours
     * (Okabe-Ito); ended tracks are also drawn as crosses where they died, so colour is not the only cue.
     */
    static final Map<TrackOutcome, Color> COLOURS = new EnumMap<>(Map.of(
            TrackOutcome.STARTED, new Color(102, 204, 238), TrackOutcome.TRACKED, new Color(34, 136, 51),
            TrackOutcome.LOST_FORWARD_BACKWARD, new Color(238, 102, 119), TrackOutcome.LEFT_IMAGE, new Color(204, 187, 68),
            TrackOutcome.RESIDUAL_TOO_LARGE, new Color(170, 51, 119), TrackOutcome.DIVERGED, new Color(68, 119, 170),
            TrackOutcome.TOO_FLAT, new Color(187, 187, 187)));
    /** Trail colour (the path of a live track), and how many frames of path each trail keeps. */
    static final Color TRAIL = new Color(34, 136, 51, 170);
    static final int TRAIL_FRAMES = 40;

    static final String LOADED = "the loaded frames";

    private final AppContext ctx;
    private final JComboBox<String> what;
    private final JComboBox<DetectorType> seeding = Ui.named(new JComboBox<>(DetectorType.values()), "track.detector", "Detector that seeds the tracks");
    private final FrameCanvas canvas = new FrameCanvas("track.canvas");
    private final JPanel chartHolder = new JPanel(new BorderLayout());
    private final DefaultTableModel figures = new DefaultTableModel(new Object[]{"Figure", "Value"}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final JButton run, stop;
    private final AtomicBoolean cancel = new AtomicBoolean();
    private final List<double[]> survival = new ArrayList<>();
    private SwingWorker<TrackResult, Object[]> worker;

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
        stop.setEnabled(false);
        add(Ui.row(new JLabel("Source"), what, new JLabel("Seeded by"), seeding, run, stop), BorderLayout.NORTH);
        JTable t = Ui.named(new JTable(figures), "track.figures", null);
        t.setToolTipText(Ui.TIP_SURVIVAL);
        JSplitPane right = new JSplitPane(JSplitPane.VERTICAL_SPLIT, chartHolder, new JScrollPane(t));
        right.setResizeWeight(0.6);
        right.setPreferredSize(new Dimension(520, 500));
        JSplitPane split = new JSplitPane(JSplitPane.HORIZONTAL_SPLIT, canvas, right);
        split.setResizeWeight(0.7); // a large frame pane
        canvas.setMinimumSize(new Dimension(560, 400));
        right.setMinimumSize(new Dimension(360, 300));
        add(split, BorderLayout.CENTER);
        drawChart();
    }

    void start() {
        if (worker != null) return;
        String choice = (String) what.getSelectedItem();
        Session s = ctx.session();
        if (LOADED.equals(choice) && !s.hasFrames()) {
            ctx.status().accept("Load a source first");
            return;
        }
        Peek source = new Peek(LOADED.equals(choice) ? new FrameList(s.sourceName(), s.frames(), s.reference().name())
                : MotionScenarios.open(choice.substring("synthetic: ".length())));
        DetectorConfig seed = DetectorConfig.defaults((DetectorType) seeding.getSelectedItem());
        cancel.set(false);
        survival.clear();
        paths.clear();
        deaths.clear();
        figures.setRowCount(0);
        run.setEnabled(false);
        stop.setEnabled(true);
        ctx.status().accept("Tracking " + choice + "...");
        worker = new SwingWorker<>() {
            @Override protected TrackResult doInBackground() throws Exception {
                try (Peek src = source) {
                    return new TrackRun(new KltConfig(), seed, 30, false, 0).run(src, (rows, f) ->
                            publish(new Object[]{rows, f, src.last}), (d, tot, w) -> { }, cancel::get);
                }
            }
            @Override protected void process(List<Object[]> chunks) {
                for (Object[] c : chunks) accumulate((org.targetbench.track.TrackFrame) c[0]);
                for (Object[] c : chunks) survival.add(new double[]{((org.targetbench.score.FrameTracking) c[1]).frame(),
                        ((org.targetbench.score.FrameTracking) c[1]).aliveFraction()});
                Object[] last = chunks.get(chunks.size() - 1);
                if (last[2] != null) canvas.setFrame((boofcv.struct.image.GrayF32) last[2]);
                showTracks((org.targetbench.track.TrackFrame) last[0]);
                drawChart();
            }
            @Override protected void done() {
                worker = null;
                run.setEnabled(true);
                stop.setEnabled(false);
                try {
                    show(get());
                } catch (ExecutionException e) {
                    ctx.status().accept("Tracking failed: " + e.getCause().getMessage());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        };
        worker.execute();
    }

    /** Per track id, its recent path; and where tracks ended, with how. */
    private final Map<Integer, java.util.ArrayDeque<double[]>> paths = new java.util.HashMap<>();
    private final List<TrackPoint> deaths = new ArrayList<>();

    private void accumulate(org.targetbench.track.TrackFrame rows) {
        for (TrackPoint p : rows.points()) {
            if (p.outcome() == TrackOutcome.TRACKED || p.outcome() == TrackOutcome.STARTED) {
                var q = paths.computeIfAbsent(p.trackId(), k -> new java.util.ArrayDeque<>());
                q.addLast(new double[]{p.x(), p.y()});
                while (q.size() > TRAIL_FRAMES) q.removeFirst();
            } else if (paths.remove(p.trackId()) != null || deaths.stream().noneMatch(d -> d.trackId() == p.trackId())) deaths.add(p);
        }
    }

    /** Tracks that ended so far (one cross each). */
    int deathCount() { return deaths.size(); }

    private void showTracks(org.targetbench.track.TrackFrame rows) {
        List<FrameCanvas.Trail> trails = new ArrayList<>();
        for (var q : paths.values()) {
            double[] x = new double[q.size()], y = new double[q.size()];
            int i = 0;
            for (double[] p : q) { x[i] = p[0]; y[i] = p[1]; i++; }
            trails.add(new FrameCanvas.Trail(x, y, TRAIL));
        }
        canvas.setTrails(trails);
        List<FrameCanvas.Marker> marks = new ArrayList<>();
        for (TrackPoint p : deaths)
            marks.add(new FrameCanvas.Marker(p.x(), p.y(), "", COLOURS.get(p.outcome()), 4, FrameCanvas.Shape.CROSS,
                    "track " + p.trackId() + " ended at frame " + p.frame() + ": " + p.outcome().name().toLowerCase(Locale.ROOT).replace('_', ' ')));
        for (TrackPoint p : rows.points())
            if (p.outcome() == TrackOutcome.TRACKED || p.outcome() == TrackOutcome.STARTED)
                marks.add(new FrameCanvas.Marker(p.x(), p.y(), "", COLOURS.get(p.outcome()), 4));
        canvas.setMarkers(marks);
    }

    private void drawChart() {
        double[] x = new double[survival.size()], y = new double[survival.size()];
        for (int i = 0; i < x.length; i++) {
            x[i] = survival.get(i)[0];
            y[i] = survival.get(i)[1];
        }
        JFreeChart c = ChartLook.themed(Charts.yRange(Charts.lines("Survival of the first frame's tracks", "frame", "alive fraction",
                List.of(new Charts.Series("alive", x, y, COLOURS.get(TrackOutcome.TRACKED))), false), 0, 1.05));
        ChartPanel cp = new ChartPanel(c);
        cp.setName("track.survival");
        chartHolder.removeAll();
        chartHolder.add(cp, BorderLayout.CENTER);
        chartHolder.add(legend(), BorderLayout.SOUTH);
        chartHolder.revalidate();
        chartHolder.repaint();
    }

    private JPanel legend() {
        JPanel p = new JPanel(new GridLayout(0, 2));
        p.setToolTipText("Live tracks: rings with a trail of their last " + TRAIL_FRAMES + " frames; ended tracks: a cross (x) where they ended, coloured by how");
        for (var e : COLOURS.entrySet()) p.add(new JLabel(e.getKey().name().toLowerCase(Locale.ROOT).replace('_', ' ')
                + (e.getKey() == TrackOutcome.TRACKED || e.getKey() == TrackOutcome.STARTED ? "" : " (x)"), Ui.swatch(e.getValue()), JLabel.LEFT));
        return p;
    }

    private void show(TrackResult r) {
        var s = r.score();
        row("frames tracked", Integer.toString(s.frames()));
        row("initial tracks", Integer.toString(s.initialTracks()));
        row("survival at frame " + s.survivalAtFrame(), Ui.fmt(s.survivalAtN(), 3));
        row("survival at the end", Ui.fmt(s.survivalAtEnd(), 3));
        row("median lifetime", s.medianLifetime().isPresent() ? s.medianLifetime().getAsInt() + " frames" : "longer than the run");
        row("forward-backward error p50 / p95", Ui.fmt(s.forwardBackward().p50(), 3) + " / " + Ui.fmt(s.forwardBackward().p95(), 3) + " px");
        row("drift against truth p50 / p95 / max", s.framesWithTruth() == 0 ? "no truth"
                : Ui.fmt(s.drift().p50(), 3) + " / " + Ui.fmt(s.drift().p95(), 3) + " / " + Ui.fmt(s.drift().max(), 3) + " px");
        row("jitter while still p50", s.staticFrames() == 0 ? "no still stretch" : Ui.fmt(s.jitter().p50(), 3) + " px");
        for (var e : s.ended().entrySet()) row("ended: " + e.getKey().name().toLowerCase(Locale.ROOT).replace('_', ' '), Integer.toString(e.getValue()));
        row("run ended because", r.stop().label());
        ctx.status().accept(String.format(Locale.ROOT, "Tracked %d frames: survival %.2f at the end", s.frames(), s.survivalAtEnd()));
    }

    private void row(String k, String v) { figures.addRow(new Object[]{k, v}); }


    /** Passes a source through, keeping the last frame delivered so the view can draw the tracks on it. */
    private static final class Peek implements FrameSource {
        private final FrameSource in;
        volatile boofcv.struct.image.GrayF32 last;

        Peek(FrameSource in) { this.in = in; }

        @Override public String description() { return in.description(); }
        @Override public int width() { return in.width(); }
        @Override public int height() { return in.height(); }
        @Override public int frameCount() { return in.frameCount(); }
        @Override public String referenceName() { return in.referenceName(); }
        @Override public java.util.Optional<org.targetbench.source.SourceFrame> next() throws org.targetbench.source.SourceException {
            var f = in.next();
            f.ifPresent(x -> last = x.image());
            return f;
        }
        @Override public void close() { in.close(); }
    }
}
