package org.targetbench.register;

import boofcv.abst.fiducial.calib.ConfigCircleRegularGrid;
import boofcv.abst.fiducial.calib.ConfigGridDimen;
import boofcv.abst.fiducial.calib.ConfigSquareGrid;
import boofcv.abst.geo.calibration.DetectSingleFiducialCalibration;
import boofcv.alg.geo.calibration.CalibrationObservation;
import boofcv.factory.fiducial.FactoryFiducialCalibration;
import boofcv.struct.geo.PointIndex2D_F64;
import boofcv.struct.image.GrayF32;
import georegression.struct.point.Point2D_F64;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetFeature;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The library's grid finders for designs that have one [1]: the x-corner chessboard finder for {@code checkerboard}
 * designs (the one {@code calibrate} uses), the regular circle-grid finder for {@code dots} and the square-grid finder
 * for {@code squares}. The finder reports its key points with indices into its own layout; the layout is tied to
 * the design's millimetres by the one turn or mirror of the layout (about its centroid) that lays its anchors (the
 * inner corners, dot centres or square corners) onto the designed features of that kind (a checkerboard's outer
 * L-corners are no anchors). A symmetric layout fits in several ways:
 * each is returned, and {@link FrameRegistrar} keeps the one the image and the page facing the camera agree with.
 *
 * <p>For a dot grid the key points are the circles' tangent points, which a perspective view keeps exactly (a
 * projected circle's centre is not the centre of its image ellipse); the dot centres are then predicted from the
 * fitted model.
 *
 * <p>[1] P. Abeles, BoofCV 1.2.2: FactoryFiducialCalibration.chessboardX, circleRegularGrid, squareGrid.
 */
final class GridFinder {
    /**
     * BoofCV's x-corner chessboard detector reports corners half a pixel right of and below the pixel-centre
     * convention (see {@code Calibration.BOOFCV_CORNER_OFFSET_PX}, measured on renders).
     */
    static final double CHESS_OFFSET_PX = 0.5;
    /**
     * The square-grid finder's corners sit the same half pixel right of and below the pixel-centre convention:
     * measured on renders with exact truth (RegistrationRenderTest, 0.71 px = 0.5 px in x and y before the offset).
     */
    static final double SQUARE_OFFSET_PX = 0.5;
    /** The circle-grid finder's tangent points likewise (measured the same way, 0.5 px in x and y). */
    static final double CIRCLE_OFFSET_PX = 0.5;
    /** Tolerance when laying the finder's layout onto the design, millimetres. */
    private static final double LAYOUT_TOL_MM = 1e-3;

    private final DetectSingleFiducialCalibration detector;
    private final double offset;
    /** The kind of designed feature the layout's anchors are (inner x-corners, square corners, dot centres). */
    private final FeatureKind anchorKind;
    /** Layout key points in design millimetres, one list per way the layout fits the design. */
    private final List<double[][]> layouts = new ArrayList<>();

    private GridFinder(DetectSingleFiducialCalibration detector, double offset, List<Point2D_F64> layout,
                       List<double[]> layoutAnchors, TargetDesign design, FeatureKind anchorKind) {
        this.detector = detector;
        this.offset = offset;
        this.anchorKind = anchorKind;
        List<TargetFeature> anchors = design.features().stream().filter(f -> f.kind() == anchorKind).toList();
        if (anchors.isEmpty()) return;
        double lx = 0, ly = 0, dx = 0, dy = 0;
        for (double[] a : layoutAnchors) { lx += a[0]; ly += a[1]; }
        for (TargetFeature f : anchors) { dx += f.xMm(); dy += f.yMm(); }
        lx /= layoutAnchors.size(); ly /= layoutAnchors.size();
        dx /= anchors.size(); dy /= anchors.size();
        int[][] turns = {{1, 0, 0, 1}, {0, -1, 1, 0}, {-1, 0, 0, -1}, {0, 1, -1, 0},
                {1, 0, 0, -1}, {0, 1, 1, 0}, {-1, 0, 0, 1}, {0, -1, -1, 0}};
        for (int[] a : turns) {
            boolean fits = layoutAnchors.size() == anchors.size();
            for (double[] p : layoutAnchors) {
                if (!fits) break;
                double x = a[0] * (p[0] - lx) + a[1] * (p[1] - ly) + dx, y = a[2] * (p[0] - lx) + a[3] * (p[1] - ly) + dy;
                fits = nearestFeature(design, x, y, anchorKind) >= 0;
            }
            if (!fits) continue;
            double[][] mm = new double[layout.size()][];
            for (int i = 0; i < layout.size(); i++) {
                Point2D_F64 p = layout.get(i);
                mm[i] = new double[]{a[0] * (p.x - lx) + a[1] * (p.y - ly) + dx, a[2] * (p.x - lx) + a[3] * (p.y - ly) + dy};
            }
            layouts.add(mm);
        }
    }

    /** The grid finder for the design's pattern, or empty when the design has none (or its layout does not fit). */
    static Optional<GridFinder> forDesign(TargetDesign design) {
        Map<String, Object> p = design.parameters();
        try {
            switch (design.pattern()) {
                case "checkerboard" -> {
                    int rows = num(p, "rows").intValue(), cols = num(p, "cols").intValue();
                    var d = FactoryFiducialCalibration.chessboardX(null, new ConfigGridDimen(rows, cols, num(p, "square_mm").doubleValue()));
                    return usable(new GridFinder(d, CHESS_OFFSET_PX, d.getLayout(), xy(d.getLayout()), design, FeatureKind.X_CORNER));
                }
                case "squares" -> {
                    int rows = num(p, "rows").intValue(), cols = num(p, "cols").intValue();
                    double sq = num(p, "square_mm").doubleValue(), pitch = num(p, "pitch_mm").doubleValue();
                    var d = FactoryFiducialCalibration.squareGrid(new ConfigSquareGrid(), new ConfigGridDimen(rows, cols, sq, pitch - sq));
                    return usable(new GridFinder(d, SQUARE_OFFSET_PX, d.getLayout(), xy(d.getLayout()), design, FeatureKind.CORNER));
                }
                case "dots" -> {
                    int rows = num(p, "rows").intValue(), cols = num(p, "cols").intValue();
                    double dia = num(p, "diameter_mm").doubleValue(), pitch = num(p, "pitch_mm").doubleValue();
                    var d = FactoryFiducialCalibration.circleRegularGrid(new ConfigCircleRegularGrid(), new ConfigGridDimen(rows, cols, dia, pitch));
                    List<Point2D_F64> layout = d.getLayout();
                    List<double[]> centres = new ArrayList<>();
                    for (int i = 0; i + 3 < layout.size(); i += 4) {
                        double x = 0, y = 0;
                        for (int k = 0; k < 4; k++) { x += layout.get(i + k).x; y += layout.get(i + k).y; }
                        centres.add(new double[]{x / 4, y / 4});
                    }
                    return usable(new GridFinder(d, CIRCLE_OFFSET_PX, layout, centres, design, FeatureKind.DOT_CENTRE));
                }
                default -> { return Optional.empty(); }
            }
        } catch (RuntimeException e) { // parameters missing or not numbers: a hand-made design, no grid finder
            return Optional.empty();
        }
    }

    private static Optional<GridFinder> usable(GridFinder g) {
        return g.layouts.isEmpty() ? Optional.empty() : Optional.of(g);
    }

    private static Number num(Map<String, Object> p, String key) {
        Object o = p.get(key);
        if (o instanceof Number n) return n;
        if (o instanceof String s) return Double.parseDouble(s);
        throw new IllegalArgumentException("design parameter " + key + " missing");
    }

    private static List<double[]> xy(List<Point2D_F64> pts) {
        List<double[]> out = new ArrayList<>();
        for (Point2D_F64 p : pts) out.add(new double[]{p.x, p.y});
        return out;
    }

    private static int nearestFeature(TargetDesign design, double x, double y, FeatureKind kind) {
        for (TargetFeature f : design.features())
            if (f.kind() == kind && Math.abs(f.xMm() - x) < LAYOUT_TOL_MM && Math.abs(f.yMm() - y) < LAYOUT_TOL_MM) return f.id();
        return -1;
    }

    /**
     * Runs the finder; one list of correspondences per way the layout fits the design, empty when the grid is not
     * found.
     */
    List<List<Match>> find(GrayF32 image, TargetDesign design) {
        if (!detector.process(image)) return List.of();
        CalibrationObservation obs = detector.getDetectedPoints();
        if (obs.points.size() < 4) return List.of();
        List<List<Match>> out = new ArrayList<>();
        for (double[][] mm : layouts) {
            List<Match> ms = new ArrayList<>();
            for (PointIndex2D_F64 p : obs.points) {
                double[] d = mm[p.index];
                ms.add(new Match(d[0], d[1], p.p.x - offset, p.p.y - offset, nearestFeature(design, d[0], d[1], anchorKind)));
            }
            out.add(ms);
        }
        return out;
    }
}
