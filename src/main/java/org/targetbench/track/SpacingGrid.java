package org.targetbench.track;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** Points in buckets of the spacing's size, to ask quickly whether a new point lies within the spacing of any. */
final class SpacingGrid {
    private final double spacing;
    private final Map<Long, List<double[]>> cells = new HashMap<>();

    SpacingGrid(double spacing) {
        this.spacing = spacing;
    }

    private long key(long cx, long cy) { return (cx << 32) ^ (cy & 0xffffffffL); }

    void add(double x, double y) {
        if (spacing <= 0) return;
        long cx = (long) Math.floor(x / spacing), cy = (long) Math.floor(y / spacing);
        cells.computeIfAbsent(key(cx, cy), k -> new ArrayList<>()).add(new double[]{x, y});
    }

    /** True when (x, y) is closer than the spacing to a point already added. */
    boolean near(double x, double y) {
        if (spacing <= 0) return false;
        long cx = (long) Math.floor(x / spacing), cy = (long) Math.floor(y / spacing);
        double s2 = spacing * spacing;
        for (long j = cy - 1; j <= cy + 1; j++)
            for (long i = cx - 1; i <= cx + 1; i++)
                for (double[] p : cells.getOrDefault(key(i, j), List.of())) {
                    double dx = p[0] - x, dy = p[1] - y;
                    if (dx * dx + dy * dy < s2) return true;
                }
        return false;
    }
}
