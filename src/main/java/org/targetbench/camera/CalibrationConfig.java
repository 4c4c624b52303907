package org.targetbench.camera;

/**
 * Settings of chessboard calibration ({@link Calibration}).
 */
public final class CalibrationConfig {
    /** Radial distortion terms estimated: 2 (k1, k2) or 3 (k1, k2, k3); the rest are fixed at 0. */
    public int radialTerms = 3;
    /** Estimate the tangential terms p1, p2 (otherwise fixed at 0). */
    public boolean tangential = true;
    /**
     * Fewest views with the board found that calibration accepts. Zhang's method needs at least 3 views of the plane
     * to determine all five pinhole parameters (Zhang 2000, section 3.1; two suffice only with skew fixed, and then
     * without redundancy), so 3 is the floor.
     */
    public int minViews = 3;
    /**
     * A view whose RMS reprojection error exceeds this factor times the median of the views' RMS errors is flagged as
     * an outlier (rule of thumb, common practice, no source).
     */
    public double outlierFactor = 2.5;
    /** Columns of the coverage grid over the image, in which the fraction of cells holding a corner is counted. */
    public int coverageCols = 8;
    /** Rows of the coverage grid over the image. */
    public int coverageRows = 6;

    public CalibrationConfig copy() {
        CalibrationConfig c = new CalibrationConfig();
        c.radialTerms = radialTerms; c.tangential = tangential; c.minViews = minViews; c.outlierFactor = outlierFactor;
        c.coverageCols = coverageCols; c.coverageRows = coverageRows;
        return c;
    }

    /** @throws IllegalArgumentException naming the first bad value */
    public void checkValidity() {
        if (radialTerms < 2 || radialTerms > 3) throw new IllegalArgumentException("radialTerms must be 2 or 3, got " + radialTerms);
        if (minViews < 3) throw new IllegalArgumentException("minViews must be >= 3 (Zhang's method), got " + minViews);
        if (!(outlierFactor > 1) || !Double.isFinite(outlierFactor)) throw new IllegalArgumentException("outlierFactor must be > 1, got " + outlierFactor);
        if (coverageCols < 1 || coverageRows < 1 || coverageCols > 100 || coverageRows > 100)
            throw new IllegalArgumentException("coverage grid must be 1..100 x 1..100 cells, got " + coverageCols + " x " + coverageRows);
    }
}
