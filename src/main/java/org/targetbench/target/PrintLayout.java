package org.targetbench.target;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Where everything goes on a printed target sheet, in millimetres on the paper (origin top-left, x right, y down).
 * The PDF, SVG and PNG writers draw exactly this, so the three agree.
 *
 * <p>The sheet carries the design at 1:1 scale, the quiet zone outlined to size just outside the design's edge, cut
 * marks on the extensions of the edges at each corner, and below them a footer: a verification bar of
 * {@link PrintConfig#barLengthMm} with 10 mm ticks, the target id and size, and the printing guidance. The design is
 * placed on the sheet as given, or turned through 90 degrees (landscape) when only that fits.
 *
 * <p>Caveat: text widths are estimated from an average character width ({@link PrintConfig#charWidthFraction}); a
 * font with wider glyphs could run a line slightly past the reserved width (never past the page margin on the
 * named sizes, where the lines are much shorter than the sheet).
 *
 * @param page       the sheet as printed (possibly turned)
 * @param turned     true when the sheet was turned to landscape to make the design fit
 * @param design     the design
 * @param targetXMm  left edge of the design on the sheet
 * @param targetYMm  top edge of the design on the sheet
 * @param bar        the verification bar, filled black
 * @param quietZone  the design's outer edge (the quiet zone's outside), outlined with a thin grey line just outside it
 * @param cutMarks   cut mark lines
 * @param ticks      tick lines under the bar, every 10 mm
 * @param texts      text lines, left-aligned at their baseline
 * @param lineWidthMm width of every line
 */
public record PrintLayout(PageSize page, boolean turned, TargetDesign design, double targetXMm, double targetYMm, Box bar,
                          Box quietZone, List<Line> cutMarks, List<Line> ticks, List<Text> texts, double lineWidthMm) {

    /** Grey of the quiet-zone outline, 0 = black, 1 = white: visible, yet light enough not to read as an edge. */
    public static final double OUTLINE_GREY = 0.6;
    /** Spacing of the ticks under the verification bar, millimetres. */
    public static final double TICK_SPACING_MM = 10;
    /** Length of the ticks under the verification bar, millimetres. */
    public static final double TICK_LENGTH_MM = 2;

    /** An axis-aligned box, millimetres. */
    public record Box(double x, double y, double w, double h) {}

    /** A straight line, millimetres. */
    public record Line(double x0, double y0, double x1, double y1) {}

    /** A line of text; (x, y) is the start of its baseline, {@code sizeMm} the font size. */
    public record Text(double x, double y, double sizeMm, String text) {}

    public PrintLayout {
        cutMarks = List.copyOf(cutMarks);
        ticks = List.copyOf(ticks);
        texts = List.copyOf(texts);
    }

    /** The text lines of the sheet, in order. */
    public static List<String> textLines(TargetDesign d, PrintConfig c) {
        return List.of(
                "Target " + d.id() + ": " + d.name() + "; cut size " + PageSize.mm(d.widthMm()) + " x " + PageSize.mm(d.heightMm())
                        + " mm with a " + PageSize.mm(d.quietZoneMm()) + " mm quiet zone (white, inside the grey outline).",
                "The bar above is " + PageSize.mm(c.barLengthMm) + " mm. Print at 100 % (actual size), never 'fit to page';"
                        + " use matte stock on a rigid, flat backing.",
                "After printing, measure the bar: if it is not " + PageSize.mm(c.barLengthMm) + " mm, the print is off scale;"
                        + " do not use it.");
    }

    /** The smallest sheet (width, height in mm, design upright) that holds the design with everything around it. */
    public static double[] neededSize(TargetDesign d, PrintConfig c) {
        c.checkValidity();
        double ext = c.cutMarkGapMm + c.cutMarkLengthMm;
        double textW = 0;
        for (String s : textLines(d, c)) textW = Math.max(textW, s.length() * c.charWidthFraction * c.textSizeMm);
        double w = Math.max(d.widthMm() + 2 * ext, Math.max(c.barLengthMm, textW)) + 2 * c.pageMarginMm;
        double h = d.heightMm() + 2 * ext + footerHeight(c) + 2 * c.pageMarginMm;
        return new double[]{w, h};
    }

    private static double footerHeight(PrintConfig c) {
        return c.footerGapMm + c.barHeightMm + TICK_LENGTH_MM + 3 * c.lineSpacingMm + 0.5 * c.lineSpacingMm;
    }

    /**
     * The layout of {@code d} on {@code page}, turned to landscape when only that fits; empty when the design does
     * not fit either way (see {@link #doesNotFit}).
     */
    public static Optional<PrintLayout> of(TargetDesign d, PageSize page, PrintConfig c) {
        double[] need = neededSize(d, c);
        if (need[0] <= page.widthMm() && need[1] <= page.heightMm()) return Optional.of(place(d, page, false, c));
        PageSize t = page.turned();
        if (need[0] <= t.widthMm() && need[1] <= t.heightMm()) return Optional.of(place(d, t, true, c));
        return Optional.empty();
    }

    /** One line saying that {@code d} does not fit {@code page} and which sheet would. */
    public static String doesNotFit(TargetDesign d, PageSize page, PrintConfig c) {
        double[] need = neededSize(d, c);
        String suggestion = null;
        for (PageSize p : PageSize.NAMED)
            if (of(d, p, c).isPresent()) { suggestion = p.describe(); break; }
        return String.format(Locale.ROOT, "target %s (%s x %s mm) needs a sheet of at least %s x %s mm with its cut marks, "
                        + "verification bar and %s mm margins; it does not fit %s in either orientation; %s",
                d.id(), PageSize.mm(d.widthMm()), PageSize.mm(d.heightMm()), PageSize.mm(Math.ceil(need[0])), PageSize.mm(Math.ceil(need[1])),
                PageSize.mm(c.pageMarginMm), page.describe(),
                (suggestion != null ? suggestion + " would fit, or use --page " : "use --page ")
                        + PageSize.mm(Math.ceil(need[0])) + "x" + PageSize.mm(Math.ceil(need[1])));
    }

    private static PrintLayout place(TargetDesign d, PageSize page, boolean turned, PrintConfig c) {
        double ext = c.cutMarkGapMm + c.cutMarkLengthMm;
        double stack = d.heightMm() + 2 * ext + footerHeight(c);
        double top = (page.heightMm() - stack) / 2;
        double tx = (page.widthMm() - d.widthMm()) / 2, ty = top + ext;
        double tw = d.widthMm(), th = d.heightMm();
        List<Line> marks = new ArrayList<>();
        double g = c.cutMarkGapMm, l = c.cutMarkLengthMm;
        for (double x : new double[]{tx, tx + tw})
            for (double y : new double[]{ty, ty + th}) {
                double sx = x == tx ? -1 : 1, sy = y == ty ? -1 : 1;
                marks.add(new Line(x + sx * g, y, x + sx * (g + l), y)); // extends the horizontal edge
                marks.add(new Line(x, y + sy * g, x, y + sy * (g + l))); // extends the vertical edge
            }
        double textW = 0;
        List<String> lines = textLines(d, c);
        for (String s : lines) textW = Math.max(textW, s.length() * c.charWidthFraction * c.textSizeMm);
        double left = Math.max(c.pageMarginMm, (page.widthMm() - Math.max(c.barLengthMm, textW)) / 2);
        double barY = ty + th + ext + c.footerGapMm;
        Box bar = new Box(left, barY, c.barLengthMm, c.barHeightMm);
        List<Line> ticks = new ArrayList<>();
        for (int k = 0; k * TICK_SPACING_MM <= c.barLengthMm + 1e-9; k++) {
            double x = left + k * TICK_SPACING_MM;
            ticks.add(new Line(x, barY + c.barHeightMm, x, barY + c.barHeightMm + TICK_LENGTH_MM));
        }
        List<Text> texts = new ArrayList<>();
        double base = barY + c.barHeightMm + TICK_LENGTH_MM + c.lineSpacingMm;
        for (int i = 0; i < lines.size(); i++) texts.add(new Text(left, base + i * c.lineSpacingMm, c.textSizeMm, lines.get(i)));
        double lw = c.lineWidthMm;
        Box outline = new Box(tx - lw / 2, ty - lw / 2, tw + lw, th + lw);
        return new PrintLayout(page, turned, d, tx, ty, bar, outline, marks, ticks, texts, lw);
    }
}
