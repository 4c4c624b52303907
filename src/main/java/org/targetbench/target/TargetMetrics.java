package org.targetbench.target;

import java.util.List;
import java.util.Map;

/**
 * The physical sizes of a design that decide whether a camera can resolve it: the smallest printed feature, the
 * smallest distance between two designed feature points, and the quiet zone. All lengths are millimetres.
 *
 * <p>For the generators' patterns the smallest feature comes from the recorded parameters (a checkerboard square, the
 * smaller of a dot's diameter and the white gap between dots, an x-corner arm, ...). For a hand-made design
 * ({@code custom}) it is the smallest shape extent: a rectangle's shorter side, a circle's diameter or a polygon's
 * shortest edge. Caveat: that fallback does not see white gaps between shapes.
 *
 * @param smallestFeatureMm smallest printed feature, millimetres
 * @param smallestFeature   what that feature is, for people ("square", "gap between dots", ...)
 * @param featureSpacingMm  smallest distance between two designed feature points, millimetres; NaN with fewer than two
 * @param quietZoneMm       plain white border around the pattern, millimetres
 * @param squareMm          the square side of a checkerboard, millimetres; NaN for other patterns
 */
public record TargetMetrics(double smallestFeatureMm, String smallestFeature, double featureSpacingMm, double quietZoneMm,
                            double squareMm) {

    /** True for a checkerboard, whose quiet zone is judged against its square. */
    public boolean isCheckerboard() { return !Double.isNaN(squareMm); }

    /** The metrics of a design. */
    public static TargetMetrics of(TargetDesign d) {
        Map<String, Object> p = d.parameters();
        double square = Double.NaN;
        double smallest;
        String what;
        switch (d.pattern()) {
            case "checkerboard" -> {
                square = num(p, "square_mm");
                smallest = square;
                what = "square";
            }
            case "dots" -> {
                double dia = num(p, "diameter_mm"), gap = num(p, "pitch_mm") - dia;
                smallest = Math.min(dia, gap);
                what = dia <= gap ? "dot diameter" : "gap between dots";
            }
            case "squares" -> {
                double side = num(p, "square_mm"), gap = num(p, "pitch_mm") - side;
                smallest = Math.min(side, gap);
                what = side <= gap ? "square" : "gap between squares";
            }
            case "xcorners", "markers" -> {
                smallest = num(p, "arm_mm");
                what = "x-corner arm";
            }
            default -> {
                smallest = Double.NaN;
                what = "smallest shape";
            }
        }
        if (Double.isNaN(smallest)) {
            smallest = smallestShape(d.drawing());
            what = "smallest shape";
            if (d.pattern().equals("checkerboard")) square = Double.NaN;
        }
        return new TargetMetrics(smallest, what, nearestPair(d.features()), d.quietZoneMm(), square);
    }

    private static double num(Map<String, Object> p, String key) {
        Object v = p.get(key);
        return v instanceof Number n ? n.doubleValue() : Double.NaN;
    }

    private static double smallestShape(List<Shape> shapes) {
        double best = Double.POSITIVE_INFINITY;
        for (Shape s : shapes) {
            if (s instanceof Shape.Rect r) best = Math.min(best, Math.min(r.x1() - r.x0(), r.y1() - r.y0()));
            else if (s instanceof Shape.Circle c) best = Math.min(best, 2 * c.r());
            else if (s instanceof Shape.Polygon g) {
                double[] xs = g.xs(), ys = g.ys();
                for (int i = 0, j = xs.length - 1; i < xs.length; j = i++) {
                    double e = Math.hypot(xs[i] - xs[j], ys[i] - ys[j]);
                    if (e > 0) best = Math.min(best, e);
                }
            }
        }
        return Double.isInfinite(best) ? Double.NaN : best;
    }

    /** Smallest distance between two feature points (all pairs; designs hold at most a few thousand features). */
    private static double nearestPair(List<TargetFeature> f) {
        double best = Double.POSITIVE_INFINITY;
        for (int i = 0; i < f.size(); i++)
            for (int j = i + 1; j < f.size(); j++) {
                double dx = f.get(i).xMm() - f.get(j).xMm(), dy = f.get(i).yMm() - f.get(j).yMm();
                best = Math.min(best, dx * dx + dy * dy);
            }
        return Double.isInfinite(best) ? Double.NaN : Math.sqrt(best);
    }
}
