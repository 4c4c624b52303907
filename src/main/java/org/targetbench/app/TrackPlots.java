package org.targetbench.app;

import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.title.TextTitle;
import org.targetbench.pipeline.TrackResult;
import org.targetbench.report.Charts;
import org.targetbench.report.Palette;
import org.targetbench.score.Distribution;
import org.targetbench.score.FrameTracking;
import org.targetbench.score.TrackingMetrics;
import org.targetbench.track.TrackOutcome;

import javax.swing.UIManager;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The tracking view's charts, from the run's own figures: survival of the first frame's tracks per frame, drift against
 * truth per frame (median, 95th percentile and worst track), and the distribution of jitter over the track segments
 * that stayed still. Where a figure cannot exist (no truth, no still stretch) the plot area says so and why, instead
 * of showing an empty chart. All follow the window's theme ({@link ChartLook}).
 */
final class TrackPlots {
    private TrackPlots() {}

    /** Plot-area messages when a figure cannot be measured. */
    static final String NO_TRUTH = "No truth for this source", NO_STILL = "No still stretch", NOT_YET = "Measured when the run ends";
    static final String NO_TRUTH_WHY = "Drift needs a homography or true points per frame: the synthetic motions carry them, "
            + "and footage registered to its design (Live: Register) gets them.";
    static final String NO_STILL_WHY = "Jitter is the spread of a track's position over at least " + TrackingMetrics.JITTER_MIN_FRAMES
            + " frames in which truth did not move (within " + TrackingMetrics.STATIC_TOL_PX + " px); try synthetic: still.";

    static ChartPanel survival(List<FrameTracking> frames) {
        double[] x = new double[frames.size()], y = new double[frames.size()];
        for (int i = 0; i < x.length; i++) {
            x[i] = frames.get(i).frame();
            y[i] = frames.get(i).aliveFraction();
        }
        JFreeChart c = Charts.yRange(Charts.lines("Survival of the first frame's tracks", "frame (index)", "alive fraction, 0..1",
                List.of(new Charts.Series("alive", x, y, Palette.of(TrackOutcome.TRACKED).darker())), false), 0, 1.05);
        integerFrames(c);
        return panel(c, "track.chart.survival");
    }

    /** Drift per frame; {@code done} null while the run is going. */
    static ChartPanel drift(List<FrameTracking> frames, TrackResult done) {
        List<double[]> rows = new ArrayList<>();
        for (FrameTracking f : frames) {
            Distribution d = f.drift();
            if (d.count() > 0) rows.add(new double[]{f.frame(), d.p50(), d.p95(), d.max()});
        }
        List<Charts.Series> series = new ArrayList<>();
        if (!rows.isEmpty()) {
            String[] names = {"median", "95th percentile", "worst track"};
            Color[] colours = {new Color(0, 114, 178), new Color(230, 159, 0), new Color(213, 94, 0)};
            for (int s = 0; s < 3; s++) {
                double[] x = new double[rows.size()], y = new double[rows.size()];
                for (int i = 0; i < x.length; i++) {
                    x[i] = rows.get(i)[0];
                    y[i] = rows.get(i)[s + 1];
                }
                series.add(new Charts.Series(names[s], x, y, colours[s]));
            }
        }
        JFreeChart c = Charts.lines("Drift against truth per frame", "frame (index)", "drift, px", series, false);
        if (rows.isEmpty()) {
            empty(c, done == null ? "No truth on the frames so far" : NO_TRUTH, NO_TRUTH_WHY);
        } else {
            ChartLook.markedAndDistinct(c);
            c.addSubtitle(new TextTitle(done != null ? String.format(Locale.ROOT, "over %d frames with truth; whole run p50 %s px, p95 %s px",
                    done.score().framesWithTruth(), Ui.fmt(done.score().drift().p50(), 3), Ui.fmt(done.score().drift().p95(), 3))
                    : "the run is going"));
        }
        integerFrames(c);
        return panel(c, "track.chart.drift");
    }

    /** Jitter percentiles over track segments; {@code done} null while the run is going. */
    static ChartPanel jitter(TrackResult done) {
        Distribution d = done == null ? Distribution.EMPTY : done.score().jitter();
        List<Charts.Series> series = new ArrayList<>();
        if (d.count() > 0)
            series.add(new Charts.Series("track segments", new double[]{50, 90, 95, 99, 100}, new double[]{d.p50(), d.p90(), d.p95(), d.p99(), d.max()},
                    new Color(0, 114, 178)));
        JFreeChart c = Charts.lines("Jitter while still: distribution over tracks", "percentile of track segments, %", "position std. dev., px", series, false);
        if (d.count() == 0) {
            empty(c, done == null ? NOT_YET : NO_STILL, done == null ? "Jitter is summarised over the whole run." : NO_STILL_WHY);
        } else {
            ChartLook.markedAndDistinct(c);
            c.getXYPlot().getDomainAxis().setRange(45, 101);
            c.addSubtitle(new TextTitle(String.format(Locale.ROOT, "%d track segments of %d+ still frames; mean %s px",
                    d.count(), TrackingMetrics.JITTER_MIN_FRAMES, Ui.fmt(d.mean(), 3))));
        }
        return panel(c, "track.chart.jitter");
    }

    /** Moves the "shown frame" line of a per-frame chart to {@code frame}. */
    static void markFrame(ChartPanel p, int frame) {
        XYPlot plot = p.getChart().getXYPlot();
        plot.clearDomainMarkers();
        if (frame < 0) return;
        Color fg = UIManager.getColor("Label.foreground");
        plot.addDomainMarker(new ValueMarker(frame, fg == null ? Color.GRAY : fg, new BasicStroke(1f, BasicStroke.CAP_BUTT,
                BasicStroke.JOIN_MITER, 10, new float[]{3, 3}, 0)));
    }

    /** The message of an empty plot area. */
    static String message(ChartPanel p) {
        var plot = p.getChart().getXYPlot();
        return plot.getDataset() != null && plot.getDataset().getSeriesCount() > 0 ? "" : plot.getNoDataMessage();
    }

    private static void integerFrames(JFreeChart c) {
        if (c.getXYPlot().getDomainAxis() instanceof org.jfree.chart.axis.NumberAxis a) a.setStandardTickUnits(org.jfree.chart.axis.NumberAxis.createIntegerTickUnits());
    }

    private static void empty(JFreeChart c, String message, String why) {
        XYPlot p = c.getXYPlot();
        p.setNoDataMessage(message);
        p.setNoDataMessageFont(new Font(Font.SANS_SERIF, Font.BOLD, 14));
        Color fg = UIManager.getColor("Label.foreground");
        p.setNoDataMessagePaint(fg == null ? Color.DARK_GRAY : fg);
        c.removeLegend();
        c.addSubtitle(new TextTitle(why));
        p.getDomainAxis().setVisible(false); // no axes around nothing: the message is the content
        p.getRangeAxis().setVisible(false);
    }

    private static ChartPanel panel(JFreeChart c, String name) {
        ChartPanel p = new ChartPanel(ChartLook.themed(c));
        p.setName(name);
        p.setMinimumDrawWidth(200);
        p.setMinimumDrawHeight(150);
        p.setMaximumDrawWidth(4000);
        p.setMaximumDrawHeight(3000);
        return p;
    }
}
