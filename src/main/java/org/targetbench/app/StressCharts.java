package org.targetbench.app;

import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.pipeline.SweepRow;
import org.targetbench.pipeline.SweepRun;
import org.targetbench.report.Charts;
import org.targetbench.report.Palette;

import java.awt.BasicStroke;
import java.awt.Dimension;
import java.awt.Shape;
import java.awt.geom.AffineTransform;
import java.util.ArrayList;
import java.util.List;
import java.util.function.ToDoubleFunction;

/**
 * The stress view's charts: one per condition, a curve per detector over the swept levels, in the theme's colours. A
 * marker sits at every measured level (none where a level has not run). Curves that lie on top of each other (every
 * detector at repeatability 1.0 under a mild condition, say) stay apart: each detector has its own line style and
 * marker shape, and markers are hollow and grow with the series index, so coinciding points show as nested outlines.
 */
final class StressCharts {
    private StressCharts() {}

    /** What the charts plot. */
    enum Metric {
        REPEATABILITY("Repeatability", "repeatability, 0..1"),
        SURVIVAL("KLT survival", "tracks alive, 0..1");

        final String title, axis;

        Metric(String title, String axis) {
            this.title = title;
            this.axis = axis;
        }

        @Override public String toString() { return title; }
    }

    /**
     * One chart per swept parameter of {@code sweep}. {@code running} tells a condition still waiting for its turn from
     * one that never ran; a chart's title says which (or "incomplete: n of m levels").
     */
    static List<ChartPanel> build(SweepConfig sweep, List<SweepRow> rows, boolean running, Metric metric) {
        List<ChartPanel> out = new ArrayList<>();
        for (Perturbation p : sweep.parameters) {
            double[] values = sweep.valuesOf(p);
            List<Charts.Series> lines = new ArrayList<>();
            for (DetectorConfig d : sweep.detectors) {
                double[] y = new double[values.length];
                for (int l = 0; l < values.length; l++) {
                    int level = l;
                    List<SweepRow> cell = rows.stream().filter(x -> x.detector() == d.type() && x.parameter() == p && x.level() == level).toList();
                    y[l] = metric == Metric.REPEATABILITY ? SweepRun.meanRepeatability(cell).orElse(Double.NaN) : mean(cell, SweepRow::kltSurvival);
                }
                lines.add(new Charts.Series(d.type().label(), values, y, Palette.of(d.type())));
            }
            long done = rows.stream().filter(x -> x.parameter() == p).map(SweepRow::level).distinct().count();
            String state = done == 0 ? (running ? " (waiting)" : " (not run)")
                    : done < values.length && !running ? " (incomplete: " + done + " of " + values.length + " levels)" : "";
            if (metric == Metric.SURVIVAL && sweep.trackFrames == 0) state += " (no tracking: set Track frames)";
            JFreeChart chart = Charts.yRange(Charts.lines(metric.title + " vs " + p.id() + state,
                    p.id() + (p.unit().isEmpty() ? "" : " (" + p.unit() + ")"), metric.axis, lines, false), -0.02, 1.02);
            ChartPanel cp = new ChartPanel(ChartLook.themed(nested(ChartLook.markedAndDistinct(chart))));
            cp.setName("stress.chart." + p.id());
            cp.setPreferredSize(new Dimension(420, 260));
            cp.setMinimumDrawWidth(200);
            cp.setMinimumDrawHeight(150);
            out.add(cp);
        }
        return out;
    }

    private static double mean(List<SweepRow> cell, ToDoubleFunction<SweepRow> f) {
        return cell.stream().mapToDouble(f).filter(v -> !Double.isNaN(v)).average().orElse(Double.NaN);
    }

    /** Hollow markers growing with the series index: points that coincide show as nested outlines, none hidden. */
    static JFreeChart nested(JFreeChart chart) {
        if (!(chart.getPlot() instanceof XYPlot p) || !(p.getRenderer() instanceof XYLineAndShapeRenderer r)) return chart;
        int n = p.getDataset() == null ? 0 : p.getDataset().getSeriesCount();
        r.setUseOutlinePaint(false); // outlines drawn in each series' own colour
        for (int i = 0; i < n; i++) {
            Shape s = r.getSeriesShape(i);
            if (s == null) continue;
            double k = 0.7 + 0.22 * i;
            r.setSeriesShape(i, AffineTransform.getScaleInstance(k, k).createTransformedShape(s));
            r.setSeriesShapesFilled(i, false);
            r.setSeriesOutlineStroke(i, new BasicStroke(1.5f));
        }
        r.setDrawOutlines(true);
        return chart;
    }
}
