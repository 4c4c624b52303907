package org.targetbench.report;

import org.jfree.chart.ChartFactory;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.Map;
import javax.imageio.ImageIO;

/**
 * Line charts for reports and the app (JFreeChart). Every chart has a title, axis labels with units and a legend.
 */
public final class Charts {
    /** Chart size in the report, pixels. */
    public static final int WIDTH = 640, HEIGHT = 380;

    private Charts() {}

    /** One named line: x values, y values (NaN points are skipped) and a colour. */
    public record Line(String name, double[] x, double[] y, Color colour) {}

    public static JFreeChart lineChart(String title, String xLabel, String yLabel, Iterable<Line> lines, Double yMin, Double yMax) {
        XYSeriesCollection data = new XYSeriesCollection();
        Map<Integer, Color> colours = new LinkedHashMap<>();
        int i = 0;
        for (Line l : lines) {
            XYSeries s = new XYSeries(l.name(), false, true);
            for (int k = 0; k < l.x().length; k++) if (!Double.isNaN(l.y()[k])) s.add(l.x()[k], l.y()[k]);
            data.addSeries(s);
            colours.put(i++, l.colour());
        }
        JFreeChart chart = ChartFactory.createXYLineChart(title, xLabel, yLabel, data, PlotOrientation.VERTICAL, true, false, false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.getTitle().setFont(new Font(Font.SANS_SERIF, Font.BOLD, 14));
        XYPlot plot = chart.getXYPlot();
        plot.setBackgroundPaint(new Color(250, 250, 250));
        plot.setDomainGridlinePaint(new Color(210, 210, 210));
        plot.setRangeGridlinePaint(new Color(210, 210, 210));
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, true);
        for (var e : colours.entrySet()) {
            r.setSeriesPaint(e.getKey(), e.getValue());
            r.setSeriesStroke(e.getKey(), new BasicStroke(2f));
        }
        plot.setRenderer(r);
        NumberAxis y = (NumberAxis) plot.getRangeAxis();
        if (yMin != null && yMax != null) y.setRange(yMin, yMax);
        ((NumberAxis) plot.getDomainAxis()).setAutoRangeIncludesZero(false);
        return chart;
    }

    public static BufferedImage render(JFreeChart chart) {
        return chart.createBufferedImage(WIDTH, HEIGHT);
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
}
