package org.targetbench.app;

import org.targetbench.source.FrameList;
import org.targetbench.detect.DetectorType;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.CompareRun;
import org.targetbench.pipeline.DetectorSummary;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceFrame;

import javax.swing.JButton;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JProgressBar;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.JTable;
import javax.swing.SpinnerNumberModel;
import javax.swing.SwingWorker;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.GridLayout;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ExecutionException;

/**
 * Two to four detectors side by side on the current frame, each with its count, repeatability against the
 * reference frame and coverage; and the full comparison over every loaded frame, ranked as on the command line.
 */
final class CompareView extends JPanel implements Session.Listener {
    private final AppContext ctx;
    private final Session session;
    private final JSpinner panes = Ui.named(new JSpinner(new SpinnerNumberModel(2, 2, 4, 1)), "compare.panes", "How many detectors side by side");
    private final JPanel grid = new JPanel(new GridLayout(1, 2, 4, 4));
    private final List<Pane> paneList = new ArrayList<>();
    private final DefaultTableModel ranking = new DefaultTableModel(HEADERS, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    /** Ranking headers, each with its unit on a second line (two lines on every column, so the header is two lines tall). */
    static final String[] HEADERS = {Ui.head("Rank", "#"), Ui.head("Detector", ""), Ui.head("Repeatability", "0..1"), Ui.head("Worst", "0..1"),
            Ui.head("Frames", "n"), Ui.head("Points", "per frame"), Ui.head("Loc. RMS", "px"), Ui.head("Found", "%"), Ui.head("Coverage", "%")};

    private final JProgressBar progress = Ui.named(new JProgressBar(), "compare.progress", null);
    private final JButton runAll;
    private SwingWorker<CompareResult, Integer> worker;
    private final JButton save;
    private CompareResult last;
    private final JLabel frameLabel = Ui.named(new JLabel(" "), "compare.frame", null);
    private final JPanel perFrame = new JPanel(new BorderLayout());
    /** Why this ranking may differ from the Stress view's. */
    static final String RANKING_NOTE = "Compare ranks on these frames as they are; Stress ranks under degraded conditions, so the rankings can differ.";

    /** One side-by-side pane. */
    private final class Pane extends JPanel {
        final JComboBox<DetectorType> choice = new JComboBox<>(DetectorType.values());
        final FrameCanvas canvas;
        final JLabel figures = new JLabel(" ");

        Pane(int i, DetectorType initial) {
            super(new BorderLayout());
            canvas = new FrameCanvas("compare.canvas." + i);
            canvas.setPreferredSize(new Dimension(320, 260));
            choice.setName("compare.detector." + i);
            choice.setRenderer(Ui.detectorRenderer());
            choice.setSelectedItem(initial);
            choice.addActionListener(e -> refresh());
            figures.setName("compare.figures." + i);
            figures.setToolTipText("Repeatability: " + Ui.TIP_REPEATABILITY + " Coverage: " + Ui.TIP_COVERAGE);
            add(Ui.row(choice), BorderLayout.NORTH);
            add(canvas, BorderLayout.CENTER);
            add(figures, BorderLayout.SOUTH);
        }

        void refresh() {
            var d = session.detections();
            if (d == null) return;
            DetectorType t = (DetectorType) choice.getSelectedItem();
            canvas.setFrame(d.shown());
            List<org.targetbench.detect.Detection> pts = d.points().get(t);
            canvas.setOverlay(pts == null ? Map.of() : Map.of(t, pts), List.of());
            var f = d.figures().get(t);
            figures.setText(f == null ? " " : "  " + f.count() + " points   repeatability " + Ui.fmt(f.repeatability(), 3) + " (0..1)   coverage "
                    + Ui.pct(f.coverage()).replace("%", " %"));
        }
    }

    CompareView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        this.session = ctx.session();
        setName("view.compare");
        panes.addChangeListener(e -> rebuild());
        runAll = Ui.button("compare.run", "Score all frames", "Run every detector on every loaded frame and rank them", this::runAll);
        JPanel top = new JPanel(new BorderLayout());
        top.add(Ui.row(new JLabel("Detectors side by side:"), panes,
                Ui.button("compare.first", "|<", "First frame", () -> session.setFrameIndex(0)),
                Ui.button("compare.prev", "<", "Previous frame", () -> session.setFrameIndex(session.frameIndex() - 1)),
                Ui.button("compare.next", ">", "Next frame", () -> session.setFrameIndex(session.frameIndex() + 1)),
                Ui.button("compare.last", ">|", "Last frame", () -> session.setFrameIndex(session.frames().size() - 1)),
                frameLabel), BorderLayout.NORTH);
        top.add(Ui.row(Ui.named(new JLabel("The frames are shown under the condition previewed in the Live view."), "compare.condition", null)), BorderLayout.SOUTH);
        add(top, BorderLayout.NORTH);
        add(grid, BorderLayout.CENTER);
        JPanel bottom = new JPanel(new BorderLayout());
        save = Ui.button("compare.save", "Save results...", "Write detections.csv, repeatability.csv, summary.json, overlays/ (and dot-bias.csv when the scene is known), as the command line's compare does", this::save);
        save.setEnabled(false);
        bottom.add(Ui.row(runAll, Ui.button("compare.cancel", "Cancel", "Stop the running comparison", this::cancel), progress, save), BorderLayout.NORTH);
        JTable table = Ui.named(new JTable(ranking), "compare.ranking", null);
        DetailPane.columnTips(table, "Rank, 1 = best: by mean repeatability on these frames; ties by the share of true features found, then by points per frame (the command line's compare ranking).",
                "Detector, with its default settings or those edited in Live: Settings.",
                "Mean repeatability over the frames, 0..1 (no unit): " + Ui.TIP_REPEATABILITY + " The 1.5 px radius is the command line's --epsilon default.",
                "Lowest repeatability of any one frame, 0..1 (no unit); same rule and radius.",
                "Frames scored against the reference, a count: those with a known homography from the reference frame.",
                "Mean points per frame, a count; at most the detector's feature limit (500 by default, --max-features).",
                "Localisation RMS against the true feature positions, px: " + Ui.TIP_LOCALISATION,
                "Share of true features with a point within 3 px, percent; needs ground truth.",
                "Coverage, percent: " + Ui.TIP_COVERAGE);
        table.getTableHeader().setReorderingAllowed(false);
        int[] widths = {44, 100, 100, 60, 60, 84, 72, 60, 76};
        for (int i = 0; i < widths.length; i++) table.getColumnModel().getColumn(i).setPreferredWidth(widths[i]);
        table.setDefaultRenderer(Object.class, DetailPane.renderer(table.getDefaultRenderer(Object.class)));
        JScrollPane sp = new JScrollPane(table);
        sp.setPreferredSize(new Dimension(680, 170));
        perFrame.setPreferredSize(new Dimension(440, 250));
        perFrame.add(new JLabel("  Score all frames to plot repeatability per frame."), BorderLayout.CENTER);
        javax.swing.JSplitPane split = new javax.swing.JSplitPane(javax.swing.JSplitPane.HORIZONTAL_SPLIT, sp, perFrame);
        split.setResizeWeight(0.6);
        bottom.add(split, BorderLayout.CENTER);
        JLabel note = Ui.named(new JLabel(RANKING_NOTE), "compare.note", RANKING_NOTE);
        bottom.add(note, BorderLayout.SOUTH);
        add(bottom, BorderLayout.SOUTH);
        rebuild();
        session.addListener(this);
    }

    private void rebuild() {
        int n = (Integer) panes.getValue();
        DetectorType[] initial = {DetectorType.SHI_TOMASI, DetectorType.FAST, DetectorType.SIFT, DetectorType.HARRIS};
        while (paneList.size() < n) paneList.add(new Pane(paneList.size(), initial[paneList.size()]));
        while (paneList.size() > n) paneList.remove(paneList.size() - 1);
        grid.removeAll();
        grid.setLayout(new GridLayout(n > 2 ? 2 : 1, n > 2 ? 2 : n, 4, 4));
        for (Pane p : paneList) grid.add(p);
        grid.revalidate();
        grid.repaint();
        paneList.forEach(Pane::refresh);
    }

    @Override
    public void changed(Session.Change c) {
        if (c == Session.Change.DETECTIONS) paneList.forEach(Pane::refresh);
        if ((c == Session.Change.FRAME || c == Session.Change.SOURCE) && session.hasFrames())
            frameLabel.setText(String.format(java.util.Locale.ROOT, " frame %d of %d: %s%s ", session.frameIndex() + 1, session.frames().size(),
                    session.frame().name(), session.frameIndex() == session.referenceIndex() ? " (reference)" : ""));
    }

    private void runAll() {
        if (!session.hasFrames() || worker != null) return;
        List<SourceFrame> frames = session.frames();
        String ref = session.reference().name(), name = session.sourceName();
        var configs = session.configs();
        progress.setMaximum(frames.size());
        progress.setValue(0);
        ranking.setRowCount(0);
        last = null;
        save.setEnabled(false);
        ctx.status().accept("Scoring " + configs.size() + " detectors on " + frames.size() + " frames...");
        worker = new SwingWorker<>() {
            @Override protected CompareResult doInBackground() throws Exception {
                return new CompareRun(configs, org.targetbench.score.Repeatability.DEFAULT_EPSILON)
                        .run(new FrameList(name, frames, ref), (d, t, w) -> publish(d));
            }
            @Override protected void process(List<Integer> chunks) { progress.setValue(chunks.get(chunks.size() - 1)); }
            @Override protected void done() {
                worker = null;
                if (isCancelled()) {
                    ctx.status().accept("Comparison cancelled");
                    return;
                }
                try {
                    show(get());
                } catch (ExecutionException e) {
                    ctx.status().accept("Comparison failed: " + e.getCause().getMessage());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        };
        worker.execute();
    }

    /** Repeatability of each detector on each frame against the reference (frames without a homography are gaps). */
    private void plotPerFrame(CompareResult r) {
        List<org.targetbench.report.Charts.Series> lines = new java.util.ArrayList<>();
        for (DetectorSummary s : r.ranked()) {
            DetectorType t = s.detector();
            List<org.targetbench.pipeline.FrameScore> fs = r.frames().stream().filter(f -> f.detector() == t).toList();
            double[] x = new double[fs.size()], y = new double[fs.size()];
            for (int i = 0; i < fs.size(); i++) {
                x[i] = fs.get(i).frameIndex() + 1;
                y[i] = fs.get(i).repeatability().flatMap(q -> q.repeatability().isPresent()
                        ? java.util.Optional.of(q.repeatability().getAsDouble()) : java.util.Optional.empty()).orElse(Double.NaN);
            }
            lines.add(new org.targetbench.report.Charts.Series(t.label(), x, y, org.targetbench.report.Palette.of(t)));
        }
        var chart = ChartLook.themed(ChartLook.markedAndDistinct(org.targetbench.report.Charts.yRange(org.targetbench.report.Charts.lines(
                "Repeatability per frame (against the reference)", "frame (number)", "repeatability (0..1)", lines, false), -0.02, 1.02)));
        ((org.jfree.chart.axis.NumberAxis) chart.getXYPlot().getDomainAxis()).setStandardTickUnits(org.jfree.chart.axis.NumberAxis.createIntegerTickUnits());
        org.jfree.chart.ChartPanel cp = new org.jfree.chart.ChartPanel(chart);
        cp.setMinimumDrawWidth(200); // drawn at its size, never scaled down (which shrinks and clips its text)
        cp.setMinimumDrawHeight(120);
        cp.setMaximumDrawWidth(4000);
        cp.setMaximumDrawHeight(3000);
        cp.setName("compare.perframe");
        perFrame.removeAll();
        perFrame.add(cp, BorderLayout.CENTER);
        perFrame.revalidate();
        perFrame.repaint();
    }

    /** A theme switch redraws the chart in the new theme's colours (it is themed when built). */
    @Override
    public void updateUI() {
        super.updateUI();
        if (last != null) javax.swing.SwingUtilities.invokeLater(() -> plotPerFrame(last));
    }

    /** The repeatability-per-frame chart, or null before a comparison. */
    org.jfree.chart.ChartPanel perFrameChart() {
        for (java.awt.Component c : perFrame.getComponents()) if (c instanceof org.jfree.chart.ChartPanel cp) return cp;
        return null;
    }

    /** Series in the repeatability-per-frame chart (0 before a comparison). */
    int perFrameSeries() {
        for (java.awt.Component c : perFrame.getComponents())
            if (c instanceof org.jfree.chart.ChartPanel cp) return cp.getChart().getXYPlot().getDataset().getSeriesCount();
        return 0;
    }

    private void cancel() {
        if (worker != null) worker.cancel(true);
    }

    private void show(CompareResult r) {
        ranking.setRowCount(0);
        int rank = 1;
        for (DetectorSummary s : r.ranked())
            ranking.addRow(new Object[]{rank++, s.detector().label(), Ui.fmt(s.meanRepeatability().orElse(Double.NaN), 3),
                    Ui.fmt(s.minRepeatability().orElse(Double.NaN), 3), s.framesScored(), Ui.fmt(s.meanCount(), 1),
                    Ui.fmt(s.localisation().rmsPx(), 3), Ui.pct(s.localisation().foundFraction()), Ui.pct(s.meanOccupancy())});
        progress.setValue(progress.getMaximum());
        plotPerFrame(r);
        last = r;
        save.setEnabled(true);
        ctx.status().accept("Scored " + r.frameCount() + " frames; best: " + r.ranked().get(0).detector().label());
    }

    private void save() {
        if (last == null) return;
        Folders.choose(ctx, "lastCompareFolder", "Folder for the comparison results", Folders.Use.SAVE).ifPresent(this::saveTo);
    }

    /** Writes the last comparison into {@code dir} as the command line's compare does; says so in the status bar. */
    boolean saveTo(java.nio.file.Path dir) {
        if (last == null) return false;
        ctx.prefs().put("lastCompareFolder", dir.toString());
        try {
            List<String> files = CompareSave.write(last, session, dir);
            ctx.status().accept("Comparison written to " + dir + ": " + String.join(", ", files));
            return true;
        } catch (Exception e) {
            ctx.status().accept("Could not write the comparison: " + e.getMessage());
            return false;
        }
    }
}
