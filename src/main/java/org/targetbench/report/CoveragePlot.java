package org.targetbench.report;

import org.targetbench.camera.CalibrationResult;
import org.targetbench.export.AtomicOutput;
import org.targetbench.source.ImageFiles;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.util.Locale;

/**
 * The calibration coverage image: a canvas of the frame size showing where the detected chessboard corners fell, each
 * view's board outline and corners in its own colour (outlier views in red), over the coverage grid with the cells that
 * hold a corner shaded. A frame that is covered well, edges and corners included, constrains the distortion terms;
 * empty regions mean the distortion there is extrapolated.
 *
 * <p>Convention: corner pixels are in the pixel-centre convention; Java2D puts pixel centres at +0.5, so every
 * coordinate is shifted by 0.5 when drawn.
 */
public final class CoveragePlot {
    private static final Color BACKGROUND = new Color(250, 250, 250);
    private static final Color GRID = new Color(200, 200, 200);
    private static final Color COVERED = new Color(214, 234, 214);
    private static final Color OUTLIER = new Color(220, 30, 30);
    /** View colours, cycled: blues, greens, purples and browns that stay apart from the outlier red. */
    private static final Color[] SERIES = {new Color(0, 114, 178), new Color(0, 158, 115), new Color(204, 121, 167),
            new Color(86, 180, 233), new Color(120, 90, 40), new Color(90, 60, 160), new Color(0, 100, 60), new Color(150, 150, 0)};

    private CoveragePlot() {}

    /** Writes the image to {@code relative} in the output and returns that name. */
    public static String write(CalibrationResult r, AtomicOutput out, String relative) throws IOException {
        ImageFiles.writePng(draw(r), out.file(relative));
        return relative;
    }

    public static BufferedImage draw(CalibrationResult r) {
        int w = r.camera().width(), h = r.camera().height();
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            g.setColor(BACKGROUND);
            g.fillRect(0, 0, w, h);
            int gc = r.coverageCols(), gr = r.coverageRows();
            boolean[] hit = new boolean[gc * gr];
            for (CalibrationResult.View v : r.views()) {
                double[] c = v.corners();
                for (int k = 0; k + 1 < c.length; k += 2) {
                    int cx = (int) Math.floor((c[k] + 0.5) / w * gc), cy = (int) Math.floor((c[k + 1] + 0.5) / h * gr);
                    if (cx >= 0 && cy >= 0 && cx < gc && cy < gr) hit[cy * gc + cx] = true;
                }
            }
            for (int j = 0; j < gr; j++)
                for (int i = 0; i < gc; i++) {
                    Rectangle2D cell = new Rectangle2D.Double((double) i * w / gc, (double) j * h / gr, (double) w / gc, (double) h / gr);
                    if (hit[j * gc + i]) { g.setColor(COVERED); g.fill(cell); }
                    g.setColor(GRID);
                    g.draw(cell);
                }
            int nb = r.board().innerCols(), rows = r.board().innerRows();
            int colour = 0;
            for (CalibrationResult.View v : r.views()) {
                if (!v.found()) continue;
                Color col = v.outlier() ? OUTLIER : SERIES[colour++ % SERIES.length];
                double[] c = v.corners();
                int[] ends = {0, nb - 1, nb * rows - 1, nb * (rows - 1)};
                Path2D.Double hull = new Path2D.Double();
                for (int k = 0; k < 4; k++) {
                    double x = c[2 * ends[k]] + 0.5, y = c[2 * ends[k] + 1] + 0.5;
                    if (k == 0) hull.moveTo(x, y); else hull.lineTo(x, y);
                }
                hull.closePath();
                g.setColor(col);
                g.setStroke(new BasicStroke(v.outlier() ? 2f : 1f));
                g.draw(hull);
                for (int k = 0; k + 1 < c.length; k += 2) g.fill(new Ellipse2D.Double(c[k] + 0.5 - 2, c[k + 1] + 0.5 - 2, 4, 4));
            }
            g.setColor(Color.BLACK);
            g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
            g.drawString(String.format(Locale.ROOT, "%d views, %d corners; corners in %.0f %% of %d x %d cells; RMS %.3f px; outliers in red",
                    r.usedViews(), r.views().stream().mapToInt(CalibrationResult.View::cornerCount).sum(), 100 * r.coverageFraction(), gc, gr, r.rmsPx()), 8, h - 10);
        } finally {
            g.dispose();
        }
        return img;
    }
}
