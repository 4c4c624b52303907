package org.targetbench.app;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;

import javax.swing.UIManager;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Shape;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;

/**
 * How charts look in the window: the current theme's colours (dark or light), a marker at every measured point, and
 * line styles and marker shapes that differ per series so curves that lie on top of each other stay distinguishable.
 */
final class ChartLook {
    private ChartLook() {}

    private static final float[][] DASHES = {null, {8, 4}, {2, 3}, {10, 3, 2, 3}, {5, 5}, {1, 4}};

    /** Follows the theme: background, plot, text and grid colours from the look and feel. */
    static JFreeChart themed(JFreeChart chart) {
        Color bg = UIManager.getColor("Panel.background"), fg = UIManager.getColor("Label.foreground");
        if (bg == null || fg == null) return chart;
        boolean dark = (bg.getRed() + bg.getGreen() + bg.getBlue()) / 3 < 128;
        Color plotBg = dark ? bg.darker() : Color.WHITE, grid = dark ? new Color(90, 90, 90) : new Color(210, 210, 210);
        chart.setBackgroundPaint(bg);
        if (chart.getTitle() != null) chart.getTitle().setPaint(fg);
        for (int i = 0; i < chart.getSubtitleCount(); i++)
            if (chart.getSubtitle(i) instanceof TextTitle t) t.setPaint(fg);
            else if (chart.getSubtitle(i) instanceof org.jfree.chart.title.LegendTitle l) {
                l.setBackgroundPaint(bg);
                l.setItemPaint(fg);
            }
        if (chart.getPlot() instanceof XYPlot p) {
            p.setBackgroundPaint(plotBg);
            p.setDomainGridlinePaint(grid);
            p.setRangeGridlinePaint(grid);
            for (var a : new org.jfree.chart.axis.Axis[]{p.getDomainAxis(), p.getRangeAxis()}) {
                if (a == null) continue;
                a.setLabelPaint(fg);
                a.setTickLabelPaint(fg);
                a.setAxisLinePaint(fg);
                a.setTickMarkPaint(fg);
            }
        }
        return chart;
    }

    /** Markers at every measured point, and a line style and marker shape of its own per series. */
    static JFreeChart markedAndDistinct(JFreeChart chart) {
        if (!(chart.getPlot() instanceof XYPlot p) || !(p.getRenderer() instanceof XYLineAndShapeRenderer r)) return chart;
        int n = p.getDataset() == null ? 0 : p.getDataset().getSeriesCount();
        for (int i = 0; i < n; i++) {
            r.setSeriesShapesVisible(i, true);
            r.setSeriesShape(i, shape(i));
            float[] dash = DASHES[i % DASHES.length];
            r.setSeriesStroke(i, dash == null ? new BasicStroke(1.8f)
                    : new BasicStroke(1.8f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10, dash, 0));
        }
        return chart;
    }

    private static Shape shape(int i) {
        double s = 4;
        return switch (i % 4) {
            case 0 -> new Ellipse2D.Double(-s, -s, 2 * s, 2 * s);
            case 1 -> new Rectangle2D.Double(-s, -s, 2 * s, 2 * s);
            case 2 -> {
                Path2D.Double t = new Path2D.Double();
                t.moveTo(0, -s - 1);
                t.lineTo(s + 1, s);
                t.lineTo(-s - 1, s);
                t.closePath();
                yield t;
            }
            default -> {
                Path2D.Double d = new Path2D.Double();
                d.moveTo(0, -s - 1);
                d.lineTo(s + 1, 0);
                d.lineTo(0, s + 1);
                d.lineTo(-s - 1, 0);
                d.closePath();
                yield d;
            }
        };
    }
}
