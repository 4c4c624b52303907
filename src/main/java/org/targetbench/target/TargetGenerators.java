package org.targetbench.target;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * Parameterised generators of planar target designs. All lengths are millimetres; random designs are fully
 * determined by their seed. Patterns: {@code checkerboard}, {@code dots}, {@code xcorners} (random x-corner field),
 * {@code squares} (grid of separate squares, dense when small) and {@code markers} (sparse grid of large x-corner
 * markers).
 */
public final class TargetGenerators {
    /** Ink reflectance used by every generator (black). */
    public static final double INK = 0.0;
    /** Dart-throwing attempts per requested feature before the random field gives up. */
    private static final int ATTEMPTS_PER_FEATURE = 2000;

    private TargetGenerators() {}

    /**
     * Checkerboard of {@code rows} x {@code cols} squares, the top-left square black, inside a white margin.
     * Features are the (rows-1) x (cols-1) inner x-corners, numbered row by row, then the outer L-corners: the corners of
     * the squares on the board's boundary that meet the white margin (every grid point on the boundary next to a
     * black square, the four outer board corners among them when those squares are black), numbered row by row over
     * the grid points. The inner x-corners keep ids 0..(rows-1)(cols-1)-1 whatever follows them.
     */
    public static TargetDesign checkerboard(String id, int rows, int cols, double squareMm, double marginMm) {
        if (rows < 2 || cols < 2) throw new IllegalArgumentException("checkerboard needs at least 2 x 2 squares, got " + rows + " x " + cols);
        requirePositive("square", squareMm);
        requireNonNegative("margin", marginMm);
        List<Shape> shapes = new ArrayList<>();
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < cols; c++)
                if ((r + c) % 2 == 0) {
                    double x0 = marginMm + c * squareMm, y0 = marginMm + r * squareMm;
                    shapes.add(new Shape.Rect(x0, y0, x0 + squareMm, y0 + squareMm, INK));
                }
        List<TargetFeature> features = new ArrayList<>();
        for (int r = 1; r < rows; r++)
            for (int c = 1; c < cols; c++)
                features.add(new TargetFeature(features.size(), marginMm + c * squareMm, marginMm + r * squareMm, FeatureKind.X_CORNER));
        for (int r = 0; r <= rows; r++)
            for (int c = 0; c <= cols; c++) {
                if (r > 0 && r < rows && c > 0 && c < cols) continue; // inner grid point: an x-corner, listed above
                boolean black = false;
                for (int sr = r - 1; sr <= r; sr++)
                    for (int sc = c - 1; sc <= c; sc++)
                        black |= sr >= 0 && sr < rows && sc >= 0 && sc < cols && (sr + sc) % 2 == 0;
                if (black) features.add(new TargetFeature(features.size(), marginMm + c * squareMm, marginMm + r * squareMm, FeatureKind.CORNER));
            }
        Map<String, Object> p = new LinkedHashMap<>();
        p.put("rows", rows); p.put("cols", cols); p.put("square_mm", squareMm); p.put("margin_mm", marginMm);
        return new TargetDesign(id, "Checkerboard " + cols + "x" + rows + " @ " + fmt(squareMm) + " mm", 2 * marginMm + cols * squareMm,
                2 * marginMm + rows * squareMm, marginMm, shapes, features, "checkerboard", p);
    }

    /** Grid of {@code rows} x {@code cols} black dots at {@code pitchMm} centre spacing inside a white margin. */
    public static TargetDesign dotGrid(String id, int rows, int cols, double pitchMm, double diameterMm, double marginMm) {
        if (rows < 1 || cols < 1) throw new IllegalArgumentException("dot grid needs at least 1 x 1 dots, got " + rows + " x " + cols);
        requirePositive("pitch", pitchMm);
        requirePositive("diameter", diameterMm);
        requireNonNegative("margin", marginMm);
        if (diameterMm >= pitchMm) throw new IllegalArgumentException("dot diameter " + diameterMm + " mm must be smaller than the pitch " + pitchMm + " mm");
        List<Shape> shapes = new ArrayList<>();
        List<TargetFeature> features = new ArrayList<>();
        double edge = marginMm + diameterMm / 2;
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < cols; c++) {
                double x = edge + c * pitchMm, y = edge + r * pitchMm;
                shapes.add(new Shape.Circle(x, y, diameterMm / 2, INK));
                features.add(new TargetFeature(features.size(), x, y, FeatureKind.DOT_CENTRE));
            }
        Map<String, Object> p = new LinkedHashMap<>();
        p.put("rows", rows); p.put("cols", cols); p.put("pitch_mm", pitchMm); p.put("diameter_mm", diameterMm); p.put("margin_mm", marginMm);
        return new TargetDesign(id, "Dot grid " + cols + "x" + rows + " @ " + fmt(pitchMm) + " mm", 2 * edge + (cols - 1) * pitchMm,
                2 * edge + (rows - 1) * pitchMm, marginMm, shapes, features, "dots", p);
    }

    /**
     * Random field of {@code count} x-corners on a {@code widthMm} x {@code heightMm} page. Each x-corner is a pair
     * of black squares of side {@code armMm} meeting at the feature point, turned by a random angle; centres are at
     * least {@code minSpacingMm} apart (dart throwing, seeded).
     *
     * @throws IllegalArgumentException when the spacing lets neighbouring x-corners overlap, or the page cannot hold
     *                                  {@code count} of them (the message gives how many fitted)
     */
    public static TargetDesign xCornerField(String id, int count, double minSpacingMm, double armMm,
                                            double widthMm, double heightMm, double marginMm, long seed) {
        if (count < 1) throw new IllegalArgumentException("x-corner field needs at least 1 feature, got " + count);
        requirePositive("arm", armMm);
        requireNonNegative("margin", marginMm);
        double reach = armMm * Math.sqrt(2);
        if (minSpacingMm < 2 * reach)
            throw new IllegalArgumentException("minimum spacing " + minSpacingMm + " mm lets x-corners of arm " + armMm
                    + " mm overlap; use at least " + fmt(2 * reach) + " mm");
        double lo = marginMm + reach, hiX = widthMm - marginMm - reach, hiY = heightMm - marginMm - reach;
        if (!(hiX > lo) || !(hiY > lo))
            throw new IllegalArgumentException("page " + widthMm + " x " + heightMm + " mm is too small for margin " + marginMm + " mm and arm " + armMm + " mm");
        SplittableRandom rng = new SplittableRandom(seed);
        List<double[]> placed = new ArrayList<>();
        for (int attempt = 0; attempt < ATTEMPTS_PER_FEATURE * count && placed.size() < count; attempt++) {
            double x = lo + rng.nextDouble() * (hiX - lo), y = lo + rng.nextDouble() * (hiY - lo);
            boolean ok = true;
            for (double[] q : placed) {
                double dx = q[0] - x, dy = q[1] - y;
                if (dx * dx + dy * dy < minSpacingMm * minSpacingMm) { ok = false; break; }
            }
            if (ok) placed.add(new double[]{x, y, rng.nextDouble() * Math.PI / 2});
        }
        if (placed.size() < count)
            throw new IllegalArgumentException("only " + placed.size() + " of " + count + " x-corners fit on " + widthMm + " x "
                    + heightMm + " mm at " + minSpacingMm + " mm spacing");
        List<Shape> shapes = new ArrayList<>();
        List<TargetFeature> features = new ArrayList<>();
        for (double[] q : placed) {
            double c = Math.cos(q[2]), s = Math.sin(q[2]);
            for (int sign : new int[]{1, -1}) {
                double[] ux = {0, armMm, armMm, 0}, uy = {0, 0, armMm, armMm};
                double[] xs = new double[4], ys = new double[4];
                for (int k = 0; k < 4; k++) {
                    double a = sign * ux[k], b = sign * uy[k];
                    xs[k] = q[0] + c * a - s * b;
                    ys[k] = q[1] + s * a + c * b;
                }
                shapes.add(new Shape.Polygon(xs, ys, INK));
            }
            features.add(new TargetFeature(features.size(), q[0], q[1], FeatureKind.X_CORNER));
        }
        Map<String, Object> p = new LinkedHashMap<>();
        p.put("count", count); p.put("min_spacing_mm", minSpacingMm); p.put("arm_mm", armMm);
        p.put("width_mm", widthMm); p.put("height_mm", heightMm); p.put("margin_mm", marginMm); p.put("seed", seed);
        return new TargetDesign(id, "Random x-corner field, " + count + " features", widthMm, heightMm, marginMm, shapes, features, "xcorners", p);
    }

    /**
     * Grid of {@code rows} x {@code cols} separate black squares of side {@code squareMm} at {@code pitchMm} centre
     * spacing inside a white margin (a dense small-square pattern when the squares are small). Features are the four
     * L-corners of every square, square by square row by row, each square's corners clockwise from its top-left.
     */
    public static TargetDesign squareGrid(String id, int rows, int cols, double squareMm, double pitchMm, double marginMm) {
        if (rows < 1 || cols < 1) throw new IllegalArgumentException("square grid needs at least 1 x 1 squares, got " + rows + " x " + cols);
        requirePositive("square", squareMm);
        requirePositive("pitch", pitchMm);
        requireNonNegative("margin", marginMm);
        if (squareMm >= pitchMm) throw new IllegalArgumentException("square side " + squareMm + " mm must be smaller than the pitch " + pitchMm + " mm, or the squares touch");
        List<Shape> shapes = new ArrayList<>();
        List<TargetFeature> features = new ArrayList<>();
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < cols; c++) {
                double x0 = marginMm + c * pitchMm, y0 = marginMm + r * pitchMm, x1 = x0 + squareMm, y1 = y0 + squareMm;
                shapes.add(new Shape.Rect(x0, y0, x1, y1, INK));
                for (double[] q : new double[][]{{x0, y0}, {x1, y0}, {x1, y1}, {x0, y1}})
                    features.add(new TargetFeature(features.size(), q[0], q[1], FeatureKind.CORNER));
            }
        Map<String, Object> p = new LinkedHashMap<>();
        p.put("rows", rows); p.put("cols", cols); p.put("square_mm", squareMm); p.put("pitch_mm", pitchMm); p.put("margin_mm", marginMm);
        return new TargetDesign(id, "Square grid " + cols + "x" + rows + ", " + fmt(squareMm) + " mm squares @ " + fmt(pitchMm) + " mm",
                2 * marginMm + (cols - 1) * pitchMm + squareMm, 2 * marginMm + (rows - 1) * pitchMm + squareMm, marginMm,
                shapes, features, "squares", p);
    }

    /**
     * Sparse grid of {@code rows} x {@code cols} large x-corner markers at {@code spacingMm} centre spacing inside a
     * white margin. Each marker is a 2 x 2 checker cell of side {@code 2 armMm} (black top-left and bottom-right
     * quadrants of side {@code armMm}) whose single x-corner is the feature; features are numbered row by row.
     */
    public static TargetDesign markerGrid(String id, int rows, int cols, double armMm, double spacingMm, double marginMm) {
        if (rows < 1 || cols < 1) throw new IllegalArgumentException("marker grid needs at least 1 x 1 markers, got " + rows + " x " + cols);
        requirePositive("arm", armMm);
        requirePositive("spacing", spacingMm);
        requireNonNegative("margin", marginMm);
        if (spacingMm < 2 * armMm)
            throw new IllegalArgumentException("marker spacing " + spacingMm + " mm lets markers of arm " + armMm + " mm overlap; use at least " + fmt(2 * armMm) + " mm");
        List<Shape> shapes = new ArrayList<>();
        List<TargetFeature> features = new ArrayList<>();
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < cols; c++) {
                double x = marginMm + armMm + c * spacingMm, y = marginMm + armMm + r * spacingMm;
                shapes.add(new Shape.Rect(x - armMm, y - armMm, x, y, INK));
                shapes.add(new Shape.Rect(x, y, x + armMm, y + armMm, INK));
                features.add(new TargetFeature(features.size(), x, y, FeatureKind.X_CORNER));
            }
        Map<String, Object> p = new LinkedHashMap<>();
        p.put("rows", rows); p.put("cols", cols); p.put("arm_mm", armMm); p.put("spacing_mm", spacingMm); p.put("margin_mm", marginMm);
        return new TargetDesign(id, "Marker grid " + cols + "x" + rows + ", " + fmt(armMm) + " mm arms @ " + fmt(spacingMm) + " mm",
                2 * marginMm + 2 * armMm + (cols - 1) * spacingMm, 2 * marginMm + 2 * armMm + (rows - 1) * spacingMm, marginMm,
                shapes, features, "markers", p);
    }

    private static void requirePositive(String what, double v) {
        if (!(v > 0) || !Double.isFinite(v)) throw new IllegalArgumentException(what + " must be > 0 mm, got " + v);
    }

    private static void requireNonNegative(String what, double v) {
        if (!(v >= 0) || !Double.isFinite(v)) throw new IllegalArgumentException(what + " must be >= 0 mm, got " + v);
    }

    private static String fmt(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
    }
}
