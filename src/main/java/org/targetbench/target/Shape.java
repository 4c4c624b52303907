package org.targetbench.target;

import java.util.Arrays;

/**
 * A filled primitive of a target drawing, in design millimetres. Shapes are painted in order over a white page;
 * {@code grey} is the reflectance of the ink, 0 = black, 1 = white.
 */
public sealed interface Shape permits Shape.Rect, Shape.Circle, Shape.Polygon {

    /** Reflectance of the fill, 0 (black) to 1 (white). */
    double grey();

    /** True when the design point (x, y), millimetres, lies inside the shape. */
    boolean contains(double x, double y);

    /** Axis-aligned bounds {minX, minY, maxX, maxY}, millimetres. */
    double[] bounds();

    /** Axis-aligned rectangle [x0, x1) x [y0, y1). */
    record Rect(double x0, double y0, double x1, double y1, double grey) implements Shape {
        public Rect {
            if (!(x1 > x0) || !(y1 > y0))
                throw new IllegalArgumentException("rectangle needs x1 > x0 and y1 > y0, got x " + x0 + ".." + x1 + ", y " + y0 + ".." + y1);
            checkGrey(grey);
        }
        @Override public boolean contains(double x, double y) { return x >= x0 && x < x1 && y >= y0 && y < y1; }
        @Override public double[] bounds() { return new double[]{x0, y0, x1, y1}; }
    }

    /** Filled circle of radius {@code r} about (cx, cy). */
    record Circle(double cx, double cy, double r, double grey) implements Shape {
        public Circle {
            if (!(r > 0)) throw new IllegalArgumentException("circle radius must be > 0 mm, got " + r);
            checkGrey(grey);
        }
        @Override public boolean contains(double x, double y) {
            double dx = x - cx, dy = y - cy;
            return dx * dx + dy * dy < r * r;
        }
        @Override public double[] bounds() { return new double[]{cx - r, cy - r, cx + r, cy + r}; }
    }

    /** Simple polygon (even-odd fill) with vertices (xs[i], ys[i]). */
    record Polygon(double[] xs, double[] ys, double grey) implements Shape {
        public Polygon {
            if (xs.length != ys.length || xs.length < 3)
                throw new IllegalArgumentException("polygon needs >= 3 vertices and equal x/y counts, got " + xs.length + " and " + ys.length);
            checkGrey(grey);
            xs = xs.clone();
            ys = ys.clone();
        }
        @Override public double[] xs() { return xs.clone(); }
        @Override public double[] ys() { return ys.clone(); }
        @Override public boolean contains(double x, double y) {
            boolean inside = false;
            for (int i = 0, j = xs.length - 1; i < xs.length; j = i++) {
                if ((ys[i] > y) != (ys[j] > y)
                        && x < (xs[j] - xs[i]) * (y - ys[i]) / (ys[j] - ys[i]) + xs[i])
                    inside = !inside;
            }
            return inside;
        }
        @Override public double[] bounds() {
            double[] b = {Double.MAX_VALUE, Double.MAX_VALUE, -Double.MAX_VALUE, -Double.MAX_VALUE};
            for (int i = 0; i < xs.length; i++) {
                b[0] = Math.min(b[0], xs[i]); b[1] = Math.min(b[1], ys[i]);
                b[2] = Math.max(b[2], xs[i]); b[3] = Math.max(b[3], ys[i]);
            }
            return b;
        }
        @Override public boolean equals(Object o) {
            return o instanceof Polygon p && Arrays.equals(xs, p.xs) && Arrays.equals(ys, p.ys) && grey == p.grey;
        }
        @Override public int hashCode() { return 31 * Arrays.hashCode(xs) + Arrays.hashCode(ys); }
        @Override public String toString() { return "Polygon" + Arrays.toString(xs) + Arrays.toString(ys) + " grey " + grey; }
    }

    private static void checkGrey(double grey) {
        if (!(grey >= 0 && grey <= 1)) throw new IllegalArgumentException("grey must be within [0, 1], got " + grey);
    }
}
