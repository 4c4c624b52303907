package org.targetbench.report;

import org.jfree.chart.ChartFactory;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.geom.Ellipse2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.util.Base64;
import javax.imageio.ImageIO;
import java.io.IOException;
import java.text.DecimalFormat;
import java.nio.file.Path;
import java.util.List;

/**
 * Chart building blocks on JFreeChart, for the rehearsal report and later run reports: line charts (optionally with a
 * logarithmic y axis and a labelled threshold line) and scatter plots, written as PNG. Every chart gets a title, axis
 * labels with units and a legend; colours come from the Okabe-Ito set (see {@link Palette}) so they stay distinct for
 * common colour blindness.
 */
public final class Charts {
    /** Okabe-Ito colours, in order of use. */
    public static final Color[] COLOURS = {new Color(0, 114, 178), new Color(230, 159, 0), new Color(0, 158, 115),
            new Color(204, 121, 167), new Color(86, 180, 233), new Color(213, 94, 0), new Color(240, 228, 66), Color.DARK_GRAY};
    public static final int WIDTH = 900;
    public static final int HEIGHT = 560;
    /** Size of charts embedded in HTML reports side by side, pixels. */
    public static final int INLINE_WIDTH = 640, INLINE_HEIGHT = 380;

    private Charts() {}

    /**
     * One named series of points. {@code colour} null picks the next colour of {@link #COLOURS}.
     */
    public record Series(String name, double[] x, double[] y, Color colour) {
        public Series {
            if (x.length != y.length) throw new IllegalArgumentException("series " + name + ": x and y lengths differ, " + x.length + " vs " + y.length);
        }
    }

    /** A line chart; {@code logY} uses a logarithmic y axis (non-positive values are dropped there). */
    public static JFreeChart lines(String title, String xLabel, String yLabel, List<Series> series, boolean logY) {
        XYSeriesCollection data = collect(series, logY);
        JFreeChart chart = ChartFactory.createXYLineChart(title, xLabel, yLabel, data, PlotOrientation.VERTICAL, true, false, false);
        XYPlot plot = chart.getXYPlot();
        if (logY) {
            LogAxis axis = new LogAxis(yLabel);
            axis.setSmallestValue(1e-3);
            axis.setTickUnit(new NumberTickUnit(1)); // one tick per decade
            axis.setNumberFormatOverride(new DecimalFormat("0.###")); // plain values rather than powers of ten
            plot.setRangeAxis(axis);
        }
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
        for (int i = 0; i < series.size(); i++) {
            r.setSeriesPaint(i, colour(series.get(i), i));
            // a single point (such as a goal) is drawn as a marker
            r.setSeriesShapesVisible(i, series.get(i).x().length == 1);
            r.setSeriesShape(i, new Ellipse2D.Double(-5, -5, 10, 10));
            // after the palette runs out, the same colours come back dashed
            r.setSeriesStroke(i, i < COLOURS.length ? new BasicStroke(1.6f)
                    : new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10, new float[]{7, 4}, 0));
        }
        plot.setRenderer(r);
        style(chart);
        return chart;
    }

    /** A scatter plot of markers, one colour per series. */
    public static JFreeChart scatter(String title, String xLabel, String yLabel, List<Series> series) {
        JFreeChart chart = ChartFactory.createScatterPlot(title, xLabel, yLabel, collect(series, false), PlotOrientation.VERTICAL, true, false, false);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
        for (int i = 0; i < series.size(); i++) {
            r.setSeriesPaint(i, colour(series.get(i), i));
            r.setSeriesShape(i, new Ellipse2D.Double(-3.5, -3.5, 7, 7));
        }
        chart.getXYPlot().setRenderer(r);
        style(chart);
        return chart;
    }

    /** Adds a dashed horizontal line at {@code y} with a label. */
    public static void horizontalLine(JFreeChart chart, double y, String label) {
        ValueMarker m = new ValueMarker(y, Color.BLACK, new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10, new float[]{6, 4}, 0));
        m.setLabel(label);
        m.setLabelFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
        m.setLabelAnchor(RectangleAnchor.TOP_RIGHT);
        m.setLabelTextAnchor(TextAnchor.BOTTOM_RIGHT);
        chart.getXYPlot().addRangeMarker(m);
    }

    /** Writes a chart as a PNG image of the given size in pixels. */
    public static void png(JFreeChart chart, Path file, int width, int height) throws IOException {
        ChartUtils.saveChartAsPNG(file.toFile(), chart, width, height);
    }

    /** Fixes the y axis to [min, max] (e.g. 0..1 for repeatability). */
    public static JFreeChart yRange(JFreeChart chart, double min, double max) {
        chart.getXYPlot().getRangeAxis().setRange(min, max);
        return chart;
    }

    /** PNG bytes of a chart drawn at the inline size, for self-contained HTML. */
    public static byte[] inlinePng(JFreeChart chart) {
        return png(chart.createBufferedImage(INLINE_WIDTH, INLINE_HEIGHT));
    }

    /** PNG bytes of an image. */
    public static byte[] png(BufferedImage img) {
        try (ByteArrayOutputStream out = new ByteArrayOutputStream()) {
            ImageIO.write(img, "png", out);
            return out.toByteArray();
        } catch (IOException e) {
            throw new IllegalStateException("PNG encoding in memory failed", e);
        }
    }

    /** A data URI of PNG bytes, for self-contained HTML. */
    public static String dataUri(byte[] png) {
        return "data:image/png;base64," + Base64.getEncoder().encodeToString(png);
    }

    private static XYSeriesCollection collect(List<Series> series, boolean logY) {
        XYSeriesCollection data = new XYSeriesCollection();
        for (Series s : series) {
            XYSeries xy = new XYSeries(s.name(), false, true);
            for (int i = 0; i < s.x().length; i++)
                if (Double.isFinite(s.x()[i]) && Double.isFinite(s.y()[i]) && (!logY || s.y()[i] > 0)) xy.add(s.x()[i], s.y()[i]);
            data.addSeries(xy);
        }
        return data;
    }

    private static Color colour(Series s, int i) {
        return s.colour() != null ? s.colour() : COLOURS[i % COLOURS.length];
    }

    private static void style(JFreeChart chart) {
        chart.setBackgroundPaint(Color.WHITE);
        chart.getTitle().setFont(new Font(Font.SANS_SERIF, Font.BOLD, 16));
        XYPlot plot = chart.getXYPlot();
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(210, 210, 210));
        plot.setRangeGridlinePaint(new Color(210, 210, 210));
        Font axis = new Font(Font.SANS_SERIF, Font.PLAIN, 13);
        plot.getDomainAxis().setLabelFont(axis);
        plot.getRangeAxis().setLabelFont(axis);
    }
}
