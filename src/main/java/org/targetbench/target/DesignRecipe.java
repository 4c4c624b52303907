package org.targetbench.target;

import java.util.Locale;

/**
 * A design request as a person states it: a pattern name and whichever sizes they care to give, the rest taken from
 * the defaults below. Shared by the {@code design} command and the workbench's target view, so both make the same
 * design from the same request. Lengths in millimetres; null means "use the default".
 */
public final class DesignRecipe {
    /** checkerboard, dots, xcorners, squares or markers. */
    public String pattern = "checkerboard";
    public String id;
    public Integer rows, cols, count;
    public Double squareMm, pitchMm, diameterMm, spacingMm, armMm, widthMm, heightMm, marginMm;
    public Long seed;

    /** The patterns, in menu order. */
    public static final String[] PATTERNS = {"checkerboard", "dots", "xcorners", "squares", "markers"};

    /**
     * The design. Defaults: checkerboard 7 x 9 squares of 15 mm, margin one square; dots 6 x 8 at 20 mm pitch, 10 mm
     * diameter, 10 mm margin; xcorners 14 at 28 mm spacing, 8 mm arms on 180 x 130 mm, 10 mm margin, seed 1; squares
     * 12 x 16 of 5 mm at 10 mm pitch, 10 mm margin; markers 2 x 3 with 25 mm arms at 60 mm spacing, 15 mm margin.
     *
     * @throws IllegalArgumentException for an unknown pattern or impossible sizes, naming the value
     */
    public TargetDesign build() {
        String p = pattern == null ? "" : pattern.toLowerCase(Locale.ROOT);
        return switch (p) {
            case "checkerboard" -> {
                int r = or(rows, 7), c = or(cols, 9);
                double s = or(squareMm, 15);
                yield TargetGenerators.checkerboard(or(id, "checkerboard-" + c + "x" + r + "-" + num(s) + "mm"), r, c, s, or(marginMm, s));
            }
            case "dots" -> {
                int r = or(rows, 6), c = or(cols, 8);
                double pitch = or(pitchMm, 20);
                yield TargetGenerators.dotGrid(or(id, "dots-" + c + "x" + r + "-" + num(pitch) + "mm"), r, c, pitch, or(diameterMm, 10), or(marginMm, 10));
            }
            case "xcorners" -> {
                int n = or(count, 14);
                long sd = seed == null ? 1 : seed;
                yield TargetGenerators.xCornerField(or(id, "xcorners-" + n + "-seed" + sd), n, or(spacingMm, 28), or(armMm, 8),
                        or(widthMm, 180), or(heightMm, 130), or(marginMm, 10), sd);
            }
            case "squares" -> {
                int r = or(rows, 12), c = or(cols, 16);
                double s = or(squareMm, 5);
                yield TargetGenerators.squareGrid(or(id, "squares-" + c + "x" + r + "-" + num(s) + "mm"), r, c, s, or(pitchMm, 10), or(marginMm, 10));
            }
            case "markers" -> {
                int r = or(rows, 2), c = or(cols, 3);
                double a = or(armMm, 25);
                yield TargetGenerators.markerGrid(or(id, "markers-" + c + "x" + r + "-" + num(a) + "mm"), r, c, a, or(spacingMm, 60), or(marginMm, 15));
            }
            default -> throw new IllegalArgumentException("unknown pattern \"" + pattern + "\"; use checkerboard, dots, xcorners, squares or markers");
        };
    }

    private static int or(Integer v, int fallback) { return v == null ? fallback : v; }
    private static double or(Double v, double fallback) { return v == null ? fallback : v; }
    private static String or(String v, String fallback) { return v == null ? fallback : v; }

    /** A length as written in ids: whole numbers without decimals. */
    public static String num(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%.2f", v).replaceAll("0+$", "");
    }
}
