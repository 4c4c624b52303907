package org.targetbench.score;

/**
 * Summary of a distribution of non-negative values (pixels unless stated). Percentiles by the nearest-rank method;
 * every statistic is NaN when {@code count} is 0.
 */
public record Distribution(long count, double mean, double p50, double p90, double p95, double p99, double max) {
    public static final Distribution EMPTY = new Distribution(0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN);

    /** Exact summary of a small sample (sorted in place). */
    public static Distribution of(double[] values) {
        if (values.length == 0) return EMPTY;
        java.util.Arrays.sort(values);
        return new Distribution(values.length, Stats.mean(values), Stats.percentile(values, 50), Stats.percentile(values, 90),
                Stats.percentile(values, 95), Stats.percentile(values, 99), values[values.length - 1]);
    }
}
