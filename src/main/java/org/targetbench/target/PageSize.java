package org.targetbench.target;

import java.util.List;
import java.util.Locale;

/**
 * A sheet of paper, millimetres, portrait (width &lt;= height for the named sizes). Named sizes: ISO 216 A-series
 * (A4 210 x 297 mm, A3 297 x 420 mm, ...) and the North American Letter (8.5 x 11 in = 215.9 x 279.4 mm) and Tabloid
 * (11 x 17 in = 279.4 x 431.8 mm) [1, 2]; any other size is given as {@code WIDTHxHEIGHT} in millimetres.
 *
 * <p>References: [1] ISO 216:2007, Writing paper and certain classes of printed matter — Trimmed sizes — A and B
 * series (from memory). [2] ANSI/ASME Y14.1, Decimal inch drawing sheet size and format (from memory).
 *
 * @param name     "A4", "Letter", ... or "custom"
 * @param widthMm  sheet width, millimetres
 * @param heightMm sheet height, millimetres
 */
public record PageSize(String name, double widthMm, double heightMm) {
    public static final PageSize A4 = new PageSize("A4", 210, 297);
    public static final PageSize LETTER = new PageSize("Letter", 215.9, 279.4);
    /** Named sizes, smallest first; the order in which a bigger sheet is suggested. */
    public static final List<PageSize> NAMED = List.of(A4, LETTER, new PageSize("A3", 297, 420),
            new PageSize("Tabloid", 279.4, 431.8), new PageSize("A2", 420, 594), new PageSize("A1", 594, 841),
            new PageSize("A0", 841, 1189));

    public PageSize {
        if (!(widthMm > 0) || !(heightMm > 0) || !Double.isFinite(widthMm) || !Double.isFinite(heightMm))
            throw new IllegalArgumentException("page size must be positive and finite, got " + widthMm + " x " + heightMm + " mm");
    }

    /**
     * A named size (any case) or {@code WIDTHxHEIGHT} in millimetres, e.g. {@code 300x200}.
     *
     * @throws IllegalArgumentException naming the text that is neither
     */
    public static PageSize parse(String text) {
        String t = text.trim();
        for (PageSize p : NAMED) if (p.name.equalsIgnoreCase(t)) return p;
        String[] parts = t.toLowerCase(Locale.ROOT).split("x");
        if (parts.length == 2) {
            try {
                double w = Double.parseDouble(parts[0].trim()), h = Double.parseDouble(parts[1].trim());
                if (!(w > 0) || !(h > 0) || !Double.isFinite(w) || !Double.isFinite(h))
                    throw new IllegalArgumentException("page size must be positive, got " + text + " mm");
                return new PageSize("custom", w, h);
            } catch (NumberFormatException e) {
                // fall through to the message below
            }
        }
        throw new IllegalArgumentException("unknown page \"" + text + "\"; use A4, Letter, A3, Tabloid, A2, A1, A0 or WIDTHxHEIGHT in mm (e.g. 300x200)");
    }

    /** The same sheet turned through 90 degrees. */
    public PageSize turned() { return new PageSize(name, heightMm, widthMm); }

    /** "A4 (210 x 297 mm)". */
    public String describe() {
        return (name.equals("custom") ? "a " : name + " (") + mm(widthMm) + " x " + mm(heightMm) + " mm" + (name.equals("custom") ? " page" : ")");
    }

    static String mm(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%.1f", v);
    }
}
