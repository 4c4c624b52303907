package org.targetbench.target;

/**
 * Settings of a printed target sheet ({@link PrintLayout}). All lengths are millimetres on the paper.
 */
public final class PrintConfig {
    /**
     * Border kept free of ink on every side of the sheet. Desktop printers leave roughly 3 to 6 mm unprinted (common
     * practice, no source), so 8 mm keeps everything printable.
     */
    public double pageMarginMm = 8;
    /** Gap between the target's edge and the start of each cut mark, so cutting never touches the target. */
    public double cutMarkGapMm = 2;
    /** Length of each cut mark line. */
    public double cutMarkLengthMm = 7;
    /** Line width of cut marks, the quiet-zone outline and the bar's ticks. */
    public double lineWidthMm = 0.2;
    /** Length of the verification bar; a person measures it with a ruler after printing. */
    public double barLengthMm = 100;
    /** Height of the verification bar. */
    public double barHeightMm = 3;
    /** Space between the cut marks and the verification bar below the target. */
    public double footerGapMm = 5;
    /** Cap height of the text, approximately; the font size is this value. */
    public double textSizeMm = 2.6;
    /** Baseline-to-baseline distance of text lines. */
    public double lineSpacingMm = 4.2;
    /**
     * Average character width of the sans-serif text as a fraction of the font size, used to reserve room for the
     * text lines (Helvetica's lower-case average is about half its size; from memory).
     */
    public double charWidthFraction = 0.52;

    public PrintConfig copy() {
        PrintConfig c = new PrintConfig();
        c.pageMarginMm = pageMarginMm; c.cutMarkGapMm = cutMarkGapMm; c.cutMarkLengthMm = cutMarkLengthMm;
        c.lineWidthMm = lineWidthMm; c.barLengthMm = barLengthMm; c.barHeightMm = barHeightMm; c.footerGapMm = footerGapMm;
        c.textSizeMm = textSizeMm; c.lineSpacingMm = lineSpacingMm; c.charWidthFraction = charWidthFraction;
        return c;
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        check("pageMarginMm", pageMarginMm, 0);
        check("cutMarkGapMm", cutMarkGapMm, 0);
        check("cutMarkLengthMm", cutMarkLengthMm, 1e-9);
        check("lineWidthMm", lineWidthMm, 1e-9);
        check("barLengthMm", barLengthMm, 1e-9);
        check("barHeightMm", barHeightMm, 1e-9);
        check("footerGapMm", footerGapMm, 0);
        check("textSizeMm", textSizeMm, 1e-9);
        check("lineSpacingMm", lineSpacingMm, 1e-9);
        if (!(charWidthFraction > 0 && charWidthFraction <= 1))
            throw new IllegalArgumentException("charWidthFraction must be within (0, 1], got " + charWidthFraction);
    }

    private static void check(String name, double v, double min) {
        if (!(v >= min) || !Double.isFinite(v))
            throw new IllegalArgumentException(name + " must be " + (min == 0 ? ">= 0" : "> 0") + " mm and finite, got " + v);
    }
}
