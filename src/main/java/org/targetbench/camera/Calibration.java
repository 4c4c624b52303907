package org.targetbench.camera;

import boofcv.abst.fiducial.calib.CalibrationDetectorChessboardX;
import boofcv.abst.fiducial.calib.ConfigGridDimen;
import boofcv.abst.geo.calibration.CalibrateMonoPlanar;
import boofcv.abst.geo.calibration.ImageResults;
import boofcv.alg.geo.calibration.CalibrationObservation;
import boofcv.factory.fiducial.FactoryFiducialCalibration;
import boofcv.struct.calib.CameraPinholeBrown;
import boofcv.struct.geo.PointIndex2D_F64;
import boofcv.struct.image.GrayF32;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * Camera calibration from views of a planar chessboard: BoofCV's x-corner chessboard detector finds the inner corners
 * of each frame [2], and BoofCV's implementation of Zhang's method estimates the intrinsics from the views [1]: a
 * closed-form start from the plane homographies, then non-linear least squares over the intrinsics, the distortion
 * (k1, k2[, k3], p1, p2 of the Brown-Conrady model, see {@link CameraModel}) and every view's pose, minimising the
 * reprojection error. Skew is fixed at zero.
 *
 * <p>Use: {@link #detect} each frame (one calibration per thread: the detector keeps state), then {@link #solve}.
 * Reprojection errors are reported per view as RMS, sqrt(Σ e² / n), and overall as the RMS over every corner of every
 * used view, the same definition as OpenCV's calibration sample's {@code avg_reprojection_error} [3].
 *
 * <p>Caveats: the board must be seen whole in a frame to be used (partial boards are skipped); the aspect ratio is
 * not fixed, so fx and fy are estimated separately; one board per frame.
 *
 * <p>References: [1] Z. Zhang, "A flexible new technique for camera calibration", IEEE TPAMI 22(11), 2000,
 * 1330-1334. [2] P. Abeles, BoofCV 1.2.2, FactoryFiducialCalibration.chessboardX and CalibrateMonoPlanar. [3] OpenCV
 * 4.6 samples/cpp/calibration.cpp (the program that wrote Debian opencv-doc's left_intrinsics.yml; from memory).
 */
public final class Calibration {
    /**
     * A chessboard of {@code innerCols} x {@code innerRows} inner corners (a board of (innerCols + 1) x (innerRows + 1)
     * squares) with squares of side {@code squareMm}.
     */
    public record Board(int innerCols, int innerRows, double squareMm) {
        public Board {
            if (innerCols < 2 || innerRows < 2)
                throw new IllegalArgumentException("board needs at least 2 x 2 inner corners, got " + innerCols + " x " + innerRows);
            if (!(squareMm > 0) || !Double.isFinite(squareMm)) throw new IllegalArgumentException("square must be > 0 mm, got " + squareMm);
        }
        public int corners() { return innerCols * innerRows; }
        @Override public String toString() { return innerCols + "x" + innerRows + " inner corners, " + squareMm + " mm squares"; }
    }

    /** What {@link #solve} gives: a {@link CalibrationResult} or a {@link Failure}. */
    public sealed interface Outcome permits CalibrationResult, Failure {}

    /**
     * Expected failure of {@link #solve}, with its numbers; {@code pipeline.Reasons.calibrationFailure} renders it.
     *
     * @param found    frames in which the board was found
     * @param frames   frames given
     * @param minViews views needed ({@link CalibrationConfig#minViews})
     * @param detail   NOT_CONVERGED: the optimiser's own message; else empty
     */
    public record Failure(Kind kind, int found, int frames, int minViews, String detail) implements Outcome {
        public enum Kind {
            /** The board was found in fewer than {@code minViews} frames. */
            TOO_FEW_VIEWS,
            /** The optimisation did not converge. */
            NOT_CONVERGED
        }
    }

    /**
     * BoofCV 1.2.2's x-corner chessboard detector reports corners half a pixel right of and below the pixel-centre
     * convention of this tool (its DetectChessboardCornersX adds 0.5 "for bias due to discretisation"); measured on
     * renders with exact ground truth: +0.50 px in x and y, within 0.01 px, on every pose of the synthetic calibration
     * test. Subtracted from every detected corner; {@code SyntheticCalibrationTest} guards the figure.
     */
    static final double BOOFCV_CORNER_OFFSET_PX = 0.5;

    private final Board board;
    private final CalibrationConfig config;
    private final CalibrationDetectorChessboardX detector;

    public Calibration(Board board, CalibrationConfig config) {
        config.checkValidity();
        this.board = board;
        this.config = config.copy();
        this.detector = FactoryFiducialCalibration.chessboardX(null,
                new ConfigGridDimen(board.innerRows() + 1, board.innerCols() + 1, board.squareMm()));
    }

    public Board board() { return board; }

    /** The board's inner corners in {@link #detect} order, in the detector's planar board frame, millimetres {x, y}. */
    public List<double[]> layoutMm() {
        List<double[]> out = new ArrayList<>();
        for (var p : detector.getLayout()) out.add(new double[]{p.x, p.y});
        return out;
    }

    /**
     * The inner corners of the board in one frame, {u0, v0, u1, v1, ...} in board order and in the pixel-centre
     * convention; empty when the board is not found whole.
     */
    public Optional<double[]> detect(GrayF32 image) {
        if (!detector.process(image)) return Optional.empty();
        CalibrationObservation obs = detector.getDetectedPoints();
        if (obs.size() != board.corners()) return Optional.empty();
        double[] out = new double[2 * obs.size()];
        for (int i = 0; i < obs.size(); i++) {
            PointIndex2D_F64 p = obs.get(i);
            if (p.index != i) return Optional.empty();
            out[2 * i] = p.p.x - BOOFCV_CORNER_OFFSET_PX; // BoofCV's convention -> pixel centres
            out[2 * i + 1] = p.p.y - BOOFCV_CORNER_OFFSET_PX;
        }
        return Optional.of(out);
    }

    /**
     * Estimates the intrinsics from the frames' detections.
     *
     * @param width      frame width, pixels
     * @param height     frame height, pixels
     * @param names      frame names, one per frame offered
     * @param detections the corners of each frame from {@link #detect}, or empty where the board was not found
     * @return the result, or a {@link Failure} when there are too few views or the optimisation fails
     */
    public Outcome solve(int width, int height, List<String> names, List<Optional<double[]>> detections) {
        if (names.size() != detections.size())
            throw new IllegalArgumentException("need one name per detection, got " + names.size() + " names and " + detections.size() + " detections");
        List<Integer> used = new ArrayList<>();
        for (int i = 0; i < detections.size(); i++) if (detections.get(i).isPresent()) used.add(i);
        if (used.size() < config.minViews)
            return new Failure(Failure.Kind.TOO_FEW_VIEWS, used.size(), names.size(), config.minViews, "");
        CalibrateMonoPlanar cal = new CalibrateMonoPlanar();
        cal.configurePinhole(true, config.radialTerms, config.tangential);
        cal.initialize(width, height, List.of(detector.getLayout()));
        for (int i : used) {
            double[] c = detections.get(i).get();
            List<PointIndex2D_F64> pts = new ArrayList<>();
            for (int k = 0; k < c.length / 2; k++) pts.add(new PointIndex2D_F64(c[2 * k], c[2 * k + 1], k));
            cal.addImage(new CalibrationObservation(0, pts));
        }
        CameraPinholeBrown found;
        try {
            found = cal.process();
        } catch (RuntimeException e) {
            return new Failure(Failure.Kind.NOT_CONVERGED, used.size(), names.size(), config.minViews, String.valueOf(e.getMessage()));
        }
        found.skew = 0; // zero skew was imposed; clear rounding dust
        CameraModel camera = CameraModel.fromBoofcv(found);

        List<ImageResults> errors = cal.getErrors();
        double[] viewRms = new double[used.size()];
        double sumSq = 0;
        int n = 0;
        for (int j = 0; j < used.size(); j++) {
            double s = 0;
            for (double e : errors.get(j).pointError) s += e * e;
            sumSq += s;
            n += errors.get(j).pointError.length;
            viewRms[j] = Math.sqrt(s / errors.get(j).pointError.length);
        }
        double[] sorted = viewRms.clone();
        Arrays.sort(sorted);
        double median = sorted.length % 2 == 1 ? sorted[sorted.length / 2] : (sorted[sorted.length / 2 - 1] + sorted[sorted.length / 2]) / 2;
        List<CalibrationResult.View> views = new ArrayList<>();
        int j = 0;
        for (int i = 0; i < names.size(); i++) {
            if (detections.get(i).isEmpty()) {
                views.add(new CalibrationResult.View(names.get(i), false, new double[0], Double.NaN, Double.NaN, false));
                continue;
            }
            views.add(new CalibrationResult.View(names.get(i), true, detections.get(i).get(), viewRms[j], errors.get(j).maxError,
                    viewRms[j] > config.outlierFactor * median));
            j++;
        }
        return new CalibrationResult(camera, board, Math.sqrt(sumSq / n), views, coverage(width, height, detections),
                config.coverageCols, config.coverageRows);
    }

    /** Fraction of coverage-grid cells holding at least one detected corner. */
    private double coverage(int width, int height, List<Optional<double[]>> detections) {
        boolean[] hit = new boolean[config.coverageCols * config.coverageRows];
        for (Optional<double[]> d : detections)
            d.ifPresent(c -> {
                for (int k = 0; k + 1 < c.length; k += 2) {
                    int cx = (int) Math.floor((c[k] + 0.5) / width * config.coverageCols);
                    int cy = (int) Math.floor((c[k + 1] + 0.5) / height * config.coverageRows);
                    if (cx >= 0 && cy >= 0 && cx < config.coverageCols && cy < config.coverageRows) hit[cy * config.coverageCols + cx] = true;
                }
            });
        int count = 0;
        for (boolean b : hit) if (b) count++;
        return (double) count / hit.length;
    }
}
