package org.targetbench.score;

/**
 * Streaming summary of many non-negative values in constant memory: counts in bins of fixed width up to a ceiling,
 * with the exact mean and maximum. Percentiles are nearest-rank on the bins, reported at the bin's upper edge, so they
 * are exact to one bin width (values above the ceiling count in the last bin and report the exact maximum).
 */
public final class ValueHistogram {
    private final double binWidth;
    private final long[] bins;
    private long count;
    private double sum;
    private double max = Double.NaN;

    /**
     * @param binWidth resolution, in the values' unit (> 0)
     * @param ceiling  largest value resolved; larger ones are still counted
     */
    public ValueHistogram(double binWidth, double ceiling) {
        if (!(binWidth > 0) || !(ceiling > binWidth)) throw new IllegalArgumentException("need 0 < binWidth < ceiling, got " + binWidth + ", " + ceiling);
        int n = (int) Math.ceil(ceiling / binWidth);
        if (n > 10_000_000) throw new IllegalArgumentException("too many bins: " + n);
        this.binWidth = binWidth;
        this.bins = new long[n + 1];
    }

    /** Adds a value; NaN is ignored, negative values count as 0. */
    public void add(double v) {
        if (Double.isNaN(v)) return;
        v = Math.max(0, v);
        int b = (int) Math.min(bins.length - 1, Math.floor(v / binWidth));
        bins[b]++;
        count++;
        sum += v;
        max = Double.isNaN(max) ? v : Math.max(max, v);
    }

    public long count() { return count; }

    /** Nearest-rank percentile, p in (0, 100]. */
    public double percentile(double p) {
        if (count == 0) return Double.NaN;
        if (!(p > 0 && p <= 100)) throw new IllegalArgumentException("percentile must be in (0, 100], got " + p);
        long rank = (long) Math.ceil(p / 100.0 * count);
        long seen = 0;
        for (int b = 0; b < bins.length; b++) {
            seen += bins[b];
            if (seen >= Math.max(1, rank)) return b == bins.length - 1 ? max : Math.min(max, (b + 1) * binWidth);
        }
        return max;
    }

    public Distribution summary() {
        if (count == 0) return Distribution.EMPTY;
        return new Distribution(count, sum / count, percentile(50), percentile(90), percentile(95), percentile(99), max);
    }
}
