package org.targetbench.camera;

import java.util.List;

/**
 * The outcome of a chessboard calibration.
 *
 * @param camera           the estimated intrinsics (zero skew, Brown-Conrady distortion)
 * @param board            the board used
 * @param rmsPx            RMS reprojection error over every corner of every used view, pixels
 * @param views            one entry per frame offered, in the order offered, used or not
 * @param coverageFraction fraction of the coverage grid's cells that hold at least one detected corner
 * @param coverageCols     columns of the coverage grid
 * @param coverageRows     rows of the coverage grid
 */
public record CalibrationResult(CameraModel camera, Calibration.Board board, double rmsPx, List<View> views,
                                double coverageFraction, int coverageCols, int coverageRows) implements Calibration.Outcome {
    public CalibrationResult {
        views = List.copyOf(views);
    }

    /**
     * One frame.
     *
     * @param name    frame name
     * @param found   true when the board was found (the view is used)
     * @param corners detected corner pixels {u0, v0, u1, v1, ...} in board order (empty when not found)
     * @param rmsPx   RMS reprojection error of this view's corners, pixels; NaN when not used
     * @param maxPx   largest reprojection error in this view, pixels; NaN when not used
     * @param outlier true when the view's RMS error is an outlier among the views
     */
    public record View(String name, boolean found, double[] corners, double rmsPx, double maxPx, boolean outlier) {
        public View {
            corners = corners.clone();
        }
        @Override public double[] corners() { return corners.clone(); }
        public int cornerCount() { return corners.length / 2; }
    }

    public long usedViews() { return views.stream().filter(View::found).count(); }

    public List<View> outliers() { return views.stream().filter(View::outlier).toList(); }
}
