package org.targetbench.export;

import org.targetbench.target.PrintLayout;
import org.targetbench.target.Shape;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Writes a printed target sheet ({@link PrintLayout}) as SVG 1.1 with physical units: the root element's width and
 * height are in millimetres and its viewBox makes one user unit one millimetre (SVG 1.1, W3C Recommendation 2011,
 * 7.2 and 7.7 [1]), so the drawing uses the layout's numbers unchanged and prints at exact scale from any viewer that
 * honours the units.
 *
 * <p>References: [1] Scalable Vector Graphics (SVG) 1.1 (Second Edition), W3C Recommendation, 16 August 2011 (from
 * memory).
 */
public final class TargetSvg {
    private TargetSvg() {}

    public static void write(PrintLayout layout, Path file) throws IOException {
        Files.writeString(file, toSvg(layout));
    }

    public static String toSvg(PrintLayout layout) {
        StringBuilder b = new StringBuilder();
        double w = layout.page().widthMm(), h = layout.page().heightMm();
        b.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
        b.append("<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"").append(n(w)).append("mm\" height=\"").append(n(h))
                .append("mm\" viewBox=\"0 0 ").append(n(w)).append(' ').append(n(h)).append("\">\n");
        b.append("  <title>").append(esc("Target " + layout.design().id() + ": " + layout.design().name() + " (print at 100 %)")).append("</title>\n");
        b.append("  <rect x=\"0\" y=\"0\" width=\"").append(n(w)).append("\" height=\"").append(n(h)).append("\" fill=\"#ffffff\"/>\n");
        b.append("  <g id=\"design\" transform=\"translate(").append(n(layout.targetXMm())).append(' ').append(n(layout.targetYMm())).append(")\">\n");
        for (Shape s : layout.design().drawing()) {
            String fill = " fill=\"" + grey(s.grey()) + "\"";
            if (s instanceof Shape.Rect r) {
                b.append("    <rect x=\"").append(n(r.x0())).append("\" y=\"").append(n(r.y0())).append("\" width=\"").append(n(r.x1() - r.x0()))
                        .append("\" height=\"").append(n(r.y1() - r.y0())).append('"').append(fill).append("/>\n");
            } else if (s instanceof Shape.Circle c) {
                b.append("    <circle cx=\"").append(n(c.cx())).append("\" cy=\"").append(n(c.cy())).append("\" r=\"").append(n(c.r()))
                        .append('"').append(fill).append("/>\n");
            } else if (s instanceof Shape.Polygon p) {
                b.append("    <polygon points=\"");
                double[] xs = p.xs(), ys = p.ys();
                for (int i = 0; i < xs.length; i++) b.append(i == 0 ? "" : " ").append(n(xs[i])).append(',').append(n(ys[i]));
                b.append("\" fill-rule=\"evenodd\"").append(fill).append("/>\n");
            }
        }
        b.append("  </g>\n");
        String lw = n(layout.lineWidthMm());
        PrintLayout.Box q = layout.quietZone();
        b.append("  <rect id=\"quiet-zone-outline\" x=\"").append(n(q.x())).append("\" y=\"").append(n(q.y())).append("\" width=\"").append(n(q.w()))
                .append("\" height=\"").append(n(q.h())).append("\" fill=\"none\" stroke=\"").append(grey(PrintLayout.OUTLINE_GREY))
                .append("\" stroke-width=\"").append(lw).append("\"/>\n");
        b.append("  <g id=\"cut-marks\" stroke=\"#000000\" stroke-width=\"").append(lw).append("\">\n");
        for (PrintLayout.Line l : layout.cutMarks()) line(b, l);
        b.append("  </g>\n");
        PrintLayout.Box bar = layout.bar();
        b.append("  <g id=\"verification-bar\" stroke=\"#000000\" stroke-width=\"").append(lw).append("\">\n");
        b.append("    <rect x=\"").append(n(bar.x())).append("\" y=\"").append(n(bar.y())).append("\" width=\"").append(n(bar.w()))
                .append("\" height=\"").append(n(bar.h())).append("\" fill=\"#000000\" stroke=\"none\"/>\n");
        for (PrintLayout.Line l : layout.ticks()) line(b, l);
        b.append("  </g>\n");
        for (PrintLayout.Text t : layout.texts())
            b.append("  <text x=\"").append(n(t.x())).append("\" y=\"").append(n(t.y())).append("\" font-size=\"").append(n(t.sizeMm()))
                    .append("\" font-family=\"Helvetica, Arial, sans-serif\" fill=\"#000000\">").append(esc(t.text())).append("</text>\n");
        b.append("</svg>\n");
        return b.toString();
    }

    private static void line(StringBuilder b, PrintLayout.Line l) {
        b.append("    <line x1=\"").append(n(l.x0())).append("\" y1=\"").append(n(l.y0())).append("\" x2=\"").append(n(l.x1()))
                .append("\" y2=\"").append(n(l.y1())).append("\"/>\n");
    }

    /** A length with up to four decimals (0.1 µm), no exponent, locale-independent. */
    static String n(double v) {
        String s = String.format(Locale.ROOT, "%.4f", v);
        s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        return s.equals("-0") ? "0" : s;
    }

    private static String grey(double g) {
        int v = (int) Math.round(Math.max(0, Math.min(1, g)) * 255);
        return String.format(Locale.ROOT, "#%02x%02x%02x", v, v, v);
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }
}
