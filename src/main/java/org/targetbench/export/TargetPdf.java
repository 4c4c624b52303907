package org.targetbench.export;

import org.apache.pdfbox.cos.COSDictionary;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.pdmodel.font.PDType1Font;
import org.apache.pdfbox.pdmodel.font.Standard14Fonts;
import org.apache.pdfbox.pdmodel.interactive.viewerpreferences.PDViewerPreferences;
import org.apache.pdfbox.util.Matrix;
import org.targetbench.target.PrintLayout;
import org.targetbench.target.Shape;

import java.io.IOException;
import java.util.logging.Level;
import java.util.logging.Logger;
import java.nio.file.Path;

/**
 * Writes a printed target sheet ({@link PrintLayout}) as a one-page vector PDF at exact scale, with Apache PDFBox.
 *
 * <p>The page's media box is the sheet in PostScript points (1 mm = 72 / 25.4 pt, PDF 1.7, ISO 32000-1:2008, 8.3.2.3:
 * default user space unit 1/72 inch [1]). Everything is drawn in millimetres through one current transformation
 * matrix that scales by 72 / 25.4 and flips y, so the drawing uses the layout's numbers unchanged. Circles are four
 * cubic Béziers with the control distance 4/3 (√2 − 1) r, whose radial error is below 0.03 % of r [2]. The viewer
 * preference PrintScaling=None asks viewers not to fit the page to the paper (the printed guidance says so as well,
 * since not every viewer honours it).
 *
 * <p>References: [1] ISO 32000-1:2008, Document management — Portable document format — Part 1: PDF 1.7 (from
 * memory). [2] T. Dokken, M. Dæhlen, T. Lyche, K. Mørken, "Good approximation of circles by curvature-continuous
 * Bézier curves", Computer Aided Geometric Design 7, 1990 (from memory).
 */
public final class TargetPdf {
    /** Points per millimetre. */
    public static final double PT_PER_MM = 72 / 25.4;
    /** Bézier control distance of a quarter circle, as a fraction of the radius: 4/3 (√2 − 1). */
    static final double KAPPA = 4.0 / 3.0 * (Math.sqrt(2) - 1);

    /**
     * PDFBox logs through java.util.logging (font-cache notes, the Helvetica fallback used only for its own rendering);
     * none of it concerns the written file, and the command line keeps stderr for one-line errors, so it is silenced.
     * The logger is held here so the setting is not garbage-collected away.
     */
    private static final Logger PDFBOX_LOG = Logger.getLogger("org.apache.pdfbox");

    static {
        PDFBOX_LOG.setLevel(Level.OFF);
    }

    private TargetPdf() {}

    public static void write(PrintLayout layout, Path file) throws IOException {
        double pageW = layout.page().widthMm(), pageH = layout.page().heightMm();
        try (PDDocument doc = new PDDocument()) {
            PDPage page = new PDPage(new PDRectangle((float) (pageW * PT_PER_MM), (float) (pageH * PT_PER_MM)));
            doc.addPage(page);
            var info = doc.getDocumentInformation();
            info.setTitle("Target " + layout.design().id() + " (print at 100 %)");
            info.setSubject(layout.design().name());
            info.setCreator("TargetBench");
            PDViewerPreferences prefs = new PDViewerPreferences(new COSDictionary());
            prefs.setPrintScaling(PDViewerPreferences.PRINT_SCALING.None);
            doc.getDocumentCatalog().setViewerPreferences(prefs);
            try (PDPageContentStream cs = new PDPageContentStream(doc, page)) {
                cs.saveGraphicsState();
                // millimetres, origin top-left, y down
                cs.transform(new Matrix((float) PT_PER_MM, 0, 0, (float) -PT_PER_MM, 0, (float) (pageH * PT_PER_MM)));
                drawShapes(cs, layout);
                double lw = layout.lineWidthMm();
                cs.setLineWidth((float) lw);
                cs.setStrokingColor((float) PrintLayout.OUTLINE_GREY);
                PrintLayout.Box q = layout.quietZone();
                cs.addRect((float) q.x(), (float) q.y(), (float) q.w(), (float) q.h());
                cs.stroke();
                cs.setStrokingColor(0f);
                for (PrintLayout.Line l : layout.cutMarks()) line(cs, l);
                for (PrintLayout.Line l : layout.ticks()) line(cs, l);
                cs.setNonStrokingColor(0f);
                PrintLayout.Box b = layout.bar();
                cs.addRect((float) b.x(), (float) b.y(), (float) b.w(), (float) b.h());
                cs.fill();
                cs.restoreGraphicsState();
                PDType1Font font = new PDType1Font(Standard14Fonts.FontName.HELVETICA);
                cs.setNonStrokingColor(0f);
                for (PrintLayout.Text t : layout.texts()) {
                    cs.beginText();
                    cs.setFont(font, (float) (t.sizeMm() * PT_PER_MM));
                    cs.newLineAtOffset((float) (t.x() * PT_PER_MM), (float) ((pageH - t.y()) * PT_PER_MM));
                    cs.showText(t.text());
                    cs.endText();
                }
            }
            doc.save(file.toFile());
        }
    }

    private static void line(PDPageContentStream cs, PrintLayout.Line l) throws IOException {
        cs.moveTo((float) l.x0(), (float) l.y0());
        cs.lineTo((float) l.x1(), (float) l.y1());
        cs.stroke();
    }

    private static void drawShapes(PDPageContentStream cs, PrintLayout layout) throws IOException {
        double ox = layout.targetXMm(), oy = layout.targetYMm();
        for (Shape s : layout.design().drawing()) {
            cs.setNonStrokingColor((float) s.grey());
            if (s instanceof Shape.Rect r) {
                cs.addRect((float) (ox + r.x0()), (float) (oy + r.y0()), (float) (r.x1() - r.x0()), (float) (r.y1() - r.y0()));
                cs.fill();
            } else if (s instanceof Shape.Circle c) {
                double x = ox + c.cx(), y = oy + c.cy(), r = c.r(), k = KAPPA * r;
                cs.moveTo((float) (x + r), (float) y);
                cs.curveTo((float) (x + r), (float) (y + k), (float) (x + k), (float) (y + r), (float) x, (float) (y + r));
                cs.curveTo((float) (x - k), (float) (y + r), (float) (x - r), (float) (y + k), (float) (x - r), (float) y);
                cs.curveTo((float) (x - r), (float) (y - k), (float) (x - k), (float) (y - r), (float) x, (float) (y - r));
                cs.curveTo((float) (x + k), (float) (y - r), (float) (x + r), (float) (y - k), (float) (x + r), (float) y);
                cs.closePath();
                cs.fill();
            } else if (s instanceof Shape.Polygon p) {
                double[] xs = p.xs(), ys = p.ys();
                cs.moveTo((float) (ox + xs[0]), (float) (oy + ys[0]));
                for (int i = 1; i < xs.length; i++) cs.lineTo((float) (ox + xs[i]), (float) (oy + ys[i]));
                cs.closePath();
                cs.fillEvenOdd();
            }
        }
    }
}
