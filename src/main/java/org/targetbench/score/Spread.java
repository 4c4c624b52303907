package org.targetbench.score;

import org.targetbench.detect.Detection;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Spread of a point set over the image: convex-hull area fraction (Andrew's monotone chain, 1979), occupancy of a
 * {@value #GRID}x{@value #GRID} grid of cells, and the minimum pairwise distance. Points in the pixel-centre
 * convention; the image spans [-0.5, w-0.5] x [-0.5, h-0.5].
 */
public final class Spread {
    /** Cells per side of the occupancy grid. */
    public static final int GRID = 4;

    private Spread() {}

    public static SpreadResult score(List<Detection> points, int width, int height) {
        int n = points.size();
        boolean[] cells = new boolean[GRID * GRID];
        for (Detection d : points) {
            int cx = (int) Math.floor((d.x() + 0.5) / width * GRID), cy = (int) Math.floor((d.y() + 0.5) / height * GRID);
            if (cx >= 0 && cy >= 0 && cx < GRID && cy < GRID) cells[cy * GRID + cx] = true;
        }
        int occupied = 0;
        for (boolean b : cells) if (b) occupied++;
        double minD = Double.NaN;
        if (n >= 2) {
            // sort by x and sweep: exact and fast enough for a few thousand points
            List<Detection> s = new ArrayList<>(points);
            s.sort(Comparator.comparingDouble(Detection::x));
            double best = Double.POSITIVE_INFINITY;
            for (int i = 0; i < n; i++)
                for (int j = i + 1; j < n && s.get(j).x() - s.get(i).x() < best; j++)
                    best = Math.min(best, Math.hypot(s.get(j).x() - s.get(i).x(), s.get(j).y() - s.get(i).y()));
            minD = best;
        }
        return new SpreadResult(n, hullArea(points) / ((double) width * height), occupied / (double) (GRID * GRID), minD);
    }

    /** Area of the convex hull, square pixels (0 for fewer than 3 points or collinear points). */
    public static double hullArea(List<Detection> points) {
        if (points.size() < 3) return 0;
        List<double[]> p = new ArrayList<>();
        for (Detection d : points) p.add(new double[]{d.x(), d.y()});
        p.sort(Comparator.<double[]>comparingDouble(a -> a[0]).thenComparingDouble(a -> a[1]));
        int n = p.size(), k = 0;
        double[][] hull = new double[2 * n][];
        for (int i = 0; i < n; i++) {
            while (k >= 2 && cross(hull[k - 2], hull[k - 1], p.get(i)) <= 0) k--;
            hull[k++] = p.get(i);
        }
        for (int i = n - 2, t = k + 1; i >= 0; i--) {
            while (k >= t && cross(hull[k - 2], hull[k - 1], p.get(i)) <= 0) k--;
            hull[k++] = p.get(i);
        }
        double area = 0;
        for (int i = 0; i < k - 1; i++) area += hull[i][0] * hull[i + 1][1] - hull[i + 1][0] * hull[i][1];
        return Math.abs(area) / 2;
    }

    private static double cross(double[] o, double[] a, double[] b) {
        return (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
    }
}
