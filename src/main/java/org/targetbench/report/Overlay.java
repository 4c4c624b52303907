package org.targetbench.report;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorType;
import org.targetbench.source.ImageFiles;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Line2D;
import java.awt.image.BufferedImage;
import java.util.List;
import java.util.Map;

/**
 * Draws detections over a grey frame: each point an outlined ring (dark outline, detector colour inside) so it reads on
 * dark and light image areas alike; true feature positions as small white-outlined crosses; a legend box.
 */
public final class Overlay {
    private Overlay() {}

    public static BufferedImage draw(GrayF32 frame, Map<DetectorType, List<Detection>> detections, List<ProjectedFeature> truth) {
        BufferedImage grey = ImageFiles.toBuffered(frame);
        BufferedImage img = new BufferedImage(frame.width, frame.height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.drawImage(grey, 0, 0, null);
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
            for (ProjectedFeature f : truth) cross(g, f.u() + 0.5, f.v() + 0.5);
            for (var e : detections.entrySet()) {
                Color c = Palette.of(e.getKey());
                for (Detection d : e.getValue()) ring(g, d.x() + 0.5, d.y() + 0.5, c);
            }
            legend(g, detections, !truth.isEmpty());
        } finally {
            g.dispose();
        }
        return img;
    }

    /**
     * An outlined ring: a dark outline with the colour inside, readable on dark and light image areas. (x, y) are
     * Java2D coordinates: Java2D puts pixel centres at +0.5, so callers shift image points by half a pixel.
     */
    public static void ring(Graphics2D g, double x, double y, Color c) {
        ring(g, x, y, c, 4);
    }

    public static void ring(Graphics2D g, double x, double y, Color c, double r) {
        Ellipse2D e = new Ellipse2D.Double(x - r, y - r, 2 * r, 2 * r);
        g.setColor(Color.BLACK);
        g.setStroke(new BasicStroke(3f));
        g.draw(e);
        g.setColor(c);
        g.setStroke(new BasicStroke(1.5f));
        g.draw(e);
    }

    /** An outlined cross marking a true feature position (Java2D coordinates, see {@link #ring}). */
    public static void cross(Graphics2D g, double x, double y) {
        double r = 3;
        g.setStroke(new BasicStroke(2.5f));
        g.setColor(Color.BLACK);
        g.draw(new Line2D.Double(x - r, y, x + r, y));
        g.draw(new Line2D.Double(x, y - r, x, y + r));
        g.setStroke(new BasicStroke(1f));
        g.setColor(Color.WHITE);
        g.draw(new Line2D.Double(x - r, y, x + r, y));
        g.draw(new Line2D.Double(x, y - r, x, y + r));
    }

    /** The legend box: one ring and label per detector with its point count, and the true-feature cross. */
    public static void legend(Graphics2D g, Map<DetectorType, List<Detection>> detections, boolean truth) {
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
        int rows = detections.size() + (truth ? 1 : 0);
        int x = 8, y = 8, lh = 16, w = 170;
        g.setColor(new Color(0, 0, 0, 170));
        g.fillRoundRect(x, y, w, rows * lh + 8, 8, 8);
        int yy = y + 4 + lh - 4;
        for (var e : detections.entrySet()) {
            ring(g, x + 12, yy - 4, Palette.of(e.getKey()));
            g.setColor(Color.WHITE);
            g.drawString(e.getKey().label() + " (" + e.getValue().size() + ")", x + 24, yy);
            yy += lh;
        }
        if (truth) {
            cross(g, x + 12, yy - 4);
            g.setColor(Color.WHITE);
            g.drawString("true feature", x + 24, yy);
        }
    }
}
