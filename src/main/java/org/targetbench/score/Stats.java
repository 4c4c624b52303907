package org.targetbench.score;

/** Small statistics helpers. */
public final class Stats {
    private Stats() {}

    /**
     * Percentile of sorted data by the nearest-rank method (the smallest value with at least p% of the data at or
     * below it); NaN for empty data.
     */
    public static double percentile(double[] sorted, double p) {
        if (sorted.length == 0) return Double.NaN;
        if (!(p > 0 && p <= 100)) throw new IllegalArgumentException("percentile must be in (0, 100], got " + p);
        int rank = (int) Math.ceil(p / 100.0 * sorted.length);
        return sorted[Math.max(0, Math.min(sorted.length - 1, rank - 1))];
    }

    /** Mean, NaN for empty data. */
    public static double mean(double[] v) {
        if (v.length == 0) return Double.NaN;
        double s = 0;
        for (double x : v) s += x;
        return s / v.length;
    }
}
