package org.targetbench.score;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** Uniform-grid bucketing of 2-D points for radius queries. */
final class GridIndex {
    private final double cell;
    private final Map<Long, List<Integer>> buckets = new HashMap<>();

    GridIndex(List<double[]> points, double cell) {
        this.cell = cell;
        for (int i = 0; i < points.size(); i++)
            buckets.computeIfAbsent(key(cx(points.get(i)[0]), cx(points.get(i)[1])), k -> new ArrayList<>()).add(i);
    }

    private long cx(double v) { return (long) Math.floor(v / cell); }

    private static long key(long x, long y) { return (x << 32) ^ (y & 0xffffffffL); }

    /** Indices of points in the 3x3 cells around (x, y): a superset of those within one cell size. */
    List<Integer> near(double x, double y) {
        List<Integer> out = new ArrayList<>();
        long gx = cx(x), gy = cx(y);
        for (long dy = -1; dy <= 1; dy++)
            for (long dx = -1; dx <= 1; dx++) {
                List<Integer> b = buckets.get(key(gx + dx, gy + dy));
                if (b != null) out.addAll(b);
            }
        return out;
    }
}
