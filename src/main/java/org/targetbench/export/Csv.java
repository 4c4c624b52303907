package org.targetbench.export;

import java.util.Locale;

/** CSV cell formatting: locale-independent numbers, empty cells for undefined values. */
public final class Csv {
    private Csv() {}

    /** A number with up to {@code decimals} decimals, trailing zeros kept off; empty for NaN. */
    public static String num(double v, int decimals) {
        if (Double.isNaN(v)) return "";
        if (Double.isInfinite(v)) return v > 0 ? "inf" : "-inf";
        String s = String.format(Locale.ROOT, "%." + decimals + "f", v);
        if (s.contains(".")) s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        return s.equals("-0") ? "0" : s;
    }

    /** Quotes a text cell when it holds a comma, quote or newline (RFC 4180). */
    public static String text(String s) {
        if (s.contains(",") || s.contains("\"") || s.contains("\n")) return "\"" + s.replace("\"", "\"\"") + "\"";
        return s;
    }
}
