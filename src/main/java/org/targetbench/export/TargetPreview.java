package org.targetbench.export;

import org.targetbench.source.ImageFiles;
import org.targetbench.target.PrintLayout;
import org.targetbench.target.Shape;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;

/**
 * Writes a grey preview PNG of a printed target sheet ({@link PrintLayout}), for looking at, not for printing (the
 * PDF and SVG are the printable files).
 *
 * <p>Convention: the sheet's millimetres are scaled by {@code pxPerMm} into Java2D user space, where pixel (i, j)
 * covers [i, i+1) x [j, j+1) and has its centre at (i + 0.5, j + 0.5); the sheet's top-left corner is the top-left
 * corner of pixel (0, 0). Edges are anti-aliased.
 */
public final class TargetPreview {
    /** Default preview resolution, pixels per millimetre (about 100 dpi). */
    public static final double PX_PER_MM = 4;

    private TargetPreview() {}

    public static BufferedImage draw(PrintLayout layout, double pxPerMm) {
        if (!(pxPerMm > 0) || pxPerMm > 50) throw new IllegalArgumentException("pxPerMm must be within (0, 50], got " + pxPerMm);
        int w = (int) Math.round(layout.page().widthMm() * pxPerMm), h = (int) Math.round(layout.page().heightMm() * pxPerMm);
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_BYTE_GRAY);
        Graphics2D g = img.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            g.setColor(Color.WHITE);
            g.fillRect(0, 0, w, h);
            g.scale(pxPerMm, pxPerMm);
            double ox = layout.targetXMm(), oy = layout.targetYMm();
            for (Shape s : layout.design().drawing()) {
                g.setColor(grey(s.grey()));
                if (s instanceof Shape.Rect r) {
                    g.fill(new Rectangle2D.Double(ox + r.x0(), oy + r.y0(), r.x1() - r.x0(), r.y1() - r.y0()));
                } else if (s instanceof Shape.Circle c) {
                    g.fill(new Ellipse2D.Double(ox + c.cx() - c.r(), oy + c.cy() - c.r(), 2 * c.r(), 2 * c.r()));
                } else if (s instanceof Shape.Polygon p) {
                    Path2D.Double path = new Path2D.Double(Path2D.WIND_EVEN_ODD);
                    double[] xs = p.xs(), ys = p.ys();
                    path.moveTo(ox + xs[0], oy + ys[0]);
                    for (int i = 1; i < xs.length; i++) path.lineTo(ox + xs[i], oy + ys[i]);
                    path.closePath();
                    g.fill(path);
                }
            }
            g.setStroke(new BasicStroke((float) layout.lineWidthMm()));
            g.setColor(grey(PrintLayout.OUTLINE_GREY));
            PrintLayout.Box q = layout.quietZone();
            g.draw(new Rectangle2D.Double(q.x(), q.y(), q.w(), q.h()));
            g.setColor(Color.BLACK);
            for (PrintLayout.Line l : layout.cutMarks()) g.draw(new Line2D.Double(l.x0(), l.y0(), l.x1(), l.y1()));
            for (PrintLayout.Line l : layout.ticks()) g.draw(new Line2D.Double(l.x0(), l.y0(), l.x1(), l.y1()));
            PrintLayout.Box b = layout.bar();
            g.fill(new Rectangle2D.Double(b.x(), b.y(), b.w(), b.h()));
            for (PrintLayout.Text t : layout.texts()) {
                g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 1).deriveFont((float) t.sizeMm()));
                g.drawString(t.text(), (float) t.x(), (float) t.y());
            }
        } finally {
            g.dispose();
        }
        return img;
    }

    public static void write(PrintLayout layout, Path file) throws IOException {
        ImageFiles.writePng(draw(layout, PX_PER_MM), file);
    }

    private static Color grey(double g) {
        int v = (int) Math.round(Math.max(0, Math.min(1, g)) * 255);
        return new Color(v, v, v);
    }
}
