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
    private final DefaultTableModel ranking = new DefaultTableModel(new Object[]{"Rank", "Detector", "Repeatability", "Worst", "Frames", "Points/frame", "Loc. RMS", "Found", "Coverage"}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final JProgressBar progress = Ui.named(new JProgressBar(), "compare.progress", null);
    private final JButton runAll;
    private SwingWorker<CompareResult, Integer> worker;

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
            figures.setText(f == null ? " " : "  " + f.count() + " points   repeatability " + Ui.fmt(f.repeatability(), 3) + "   coverage " + Ui.pct(f.coverage()));
        }
    }

    CompareView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        this.session = ctx.session();
        setName("view.compare");
        panes.addChangeListener(e -> rebuild());
        runAll = Ui.button("compare.run", "Score all frames", "Run every detector on every loaded frame and rank them", this::runAll);
        add(Ui.row(new JLabel("Detectors side by side:"), panes, new JLabel("  (frame and previewed condition follow the live view)")), BorderLayout.NORTH);
        add(grid, BorderLayout.CENTER);
        JPanel bottom = new JPanel(new BorderLayout());
        bottom.add(Ui.row(runAll, Ui.button("compare.cancel", "Cancel", "Stop the running comparison", this::cancel), progress), BorderLayout.NORTH);
        JTable table = Ui.named(new JTable(ranking), "compare.ranking", null);
        table.getTableHeader().setToolTipText("Repeatability: " + Ui.TIP_REPEATABILITY + "  Loc. RMS: " + Ui.TIP_LOCALISATION + "  Coverage: " + Ui.TIP_COVERAGE);
        JScrollPane sp = new JScrollPane(table);
        sp.setPreferredSize(new Dimension(600, 150));
        bottom.add(sp, BorderLayout.CENTER);
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
    }

    private void runAll() {
        if (!session.hasFrames() || worker != null) return;
        List<SourceFrame> frames = session.frames();
        String ref = session.reference().name(), name = session.sourceName();
        var configs = session.configs();
        progress.setMaximum(frames.size());
        progress.setValue(0);
        ranking.setRowCount(0);
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
        ctx.status().accept("Scored " + r.frameCount() + " frames; best: " + r.ranked().get(0).detector().label());
    }

    /** The loaded frames as a source, for the shared comparison run. */


}
