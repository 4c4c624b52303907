package org.targetbench.app;

import org.targetbench.pipeline.TrackResult;
import org.targetbench.score.TrackingMetrics;
import org.targetbench.score.TrackingScore;
import org.targetbench.track.KltConfig;
import org.targetbench.track.TrackOutcome;

import javax.swing.JScrollPane;
import javax.swing.JTable;
import javax.swing.table.DefaultTableModel;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The figures of a finished tracking run, each value with its unit, and per row a tooltip saying what the figure is,
 * its unit and where its threshold comes from (the column headers say what the columns hold).
 */
final class TrackFigures {
    private final DefaultTableModel model = new DefaultTableModel(new Object[]{"Figure", "Value (unit)"}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final List<String> tips = new ArrayList<>();
    private final JTable table;

    TrackFigures() {
        table = new JTable(model) {
            @Override public String getToolTipText(java.awt.event.MouseEvent e) {
                int r = rowAtPoint(e.getPoint());
                return r >= 0 && r < tips.size() ? "<html><body style='width:340px'>" + tips.get(r) + "</body></html>" : null;
            }
        };
        table.setName("track.figures");
        DetailPane.columnTips(table, "What was measured over the run; hover a row for how it is measured and where its threshold comes from.",
                "The figure's value with its unit: frames, tracks, percent of the first frame's tracks, or pixels (px).");
        table.getColumnModel().getColumn(0).setPreferredWidth(230);
        table.getColumnModel().getColumn(1).setPreferredWidth(200);
        javax.swing.ToolTipManager.sharedInstance().registerComponent(table);
    }

    JScrollPane pane() {
        JScrollPane sp = new JScrollPane(table);
        sp.setName("track.figures.scroll");
        return sp;
    }

    void clear() {
        model.setRowCount(0);
        tips.clear();
    }

    /** Row labels in order (for tests). */
    List<String> labels() {
        List<String> out = new ArrayList<>();
        for (int r = 0; r < model.getRowCount(); r++) out.add(model.getValueAt(r, 0).toString());
        return out;
    }

    void show(TrackResult r) {
        clear();
        TrackingScore s = r.score();
        KltConfig k = r.tracker();
        row("frames tracked", s.frames() + " frames", "Frames the tracker processed, " + s.firstFrame() + " to " + s.lastFrame() + " (frame indices).");
        row("initial tracks", s.initialTracks() + " tracks", "Points " + r.seeding().label() + " picked on the first frame, at most "
                + k.maxTracks + " (the command line's --max-tracks default) and " + Ui.fmt(k.minSpacing, 0) + " px apart.");
        row("survival at frame " + s.survivalAtFrame(), Double.isNaN(s.survivalAtN()) ? "not reached (ended at " + s.lastFrame() + ")" : pct(s.survivalAtN()), "Share of the first frame's tracks still alive after frame "
                + s.survivalAtFrame() + ", percent (the command line's --survival-at default). A track dies on a forward-backward error above "
                + Ui.fmt(k.fbThreshold, 2) + " px (--fb-threshold default; Kalal et al. 2010), leaving the image, a residual above "
                + Ui.fmt(k.maxResidual, 0) + " grey levels, divergence, or too little texture.");
        row("survival at the end", pct(s.survivalAtEnd()), "Share of the first frame's tracks alive after the last frame, percent; same rules.");
        row("median lifetime", s.medianLifetime().isPresent() ? s.medianLifetime().getAsInt() + " frames" : "longer than the run",
                "Frames until half of the first frame's tracks had died, in frames; longer than the run while more than half survive it.");
        row("forward-backward error p50 / p95", px(s.forwardBackward().p50(), s.forwardBackward().p95()),
                "Distance between a point and where tracking it forward then back brings it, px, median and 95th percentile over every "
                        + "tracked step; tracks above " + Ui.fmt(k.fbThreshold, 2) + " px are dropped (--fb-threshold default).");
        row("drift against truth p50 / p95 / max", s.framesWithTruth() == 0 ? "no truth" : px(s.drift().p50(), s.drift().p95(), s.drift().max()),
                "Distance of each tracked point from where truth puts the point it started on, px, pooled over " + s.framesWithTruth()
                        + " frames with truth; no threshold, lower is better.");
        row("jitter while still p50", s.jitter().count() == 0 ? "no still stretch" : px(s.jitter().p50()),
                "Standard deviation of a track's position over runs of at least " + TrackingMetrics.JITTER_MIN_FRAMES
                        + " frames in which truth did not move (within " + TrackingMetrics.STATIC_TOL_PX + " px), px, median over "
                        + s.jitter().count() + " track segments; the 5-frame minimum is common practice, no source.");
        for (TrackOutcome o : TrackOutcome.values())
            if (o.isLoss()) row("ended: " + TrackView.words(o), s.ended().getOrDefault(o, 0) + " tracks",
                    "Tracks that ended this way over the run, in tracks (respawned ones included); marked on the frame where they ended.");
        row("run ended because", r.stop().label(), "Why the run stopped: the source ended, the frame limit was reached, or Stop was pressed.");
        row("tracker time", String.format(Locale.ROOT, "%s ms per frame", Ui.fmt(r.trackerMillisPerFrame(), 2)),
                "Mean time inside the tracker per frame in this run, milliseconds, JIT warm-up included; speed is measured by the benchmark, not here.");
    }

    private void row(String figure, String value, String tip) {
        model.addRow(new Object[]{figure, value});
        tips.add(tip.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;"));
    }

    private static String pct(double v) {
        return Double.isNaN(v) ? "- (no tracks)" : Ui.fmt(100 * v, 1) + " %";
    }

    private static String px(double... v) {
        List<String> parts = new ArrayList<>();
        for (double d : v) parts.add(Ui.fmt(d, 3));
        return String.join(" / ", parts) + " px";
    }
}
