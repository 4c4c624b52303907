package org.targetbench.detect;

import boofcv.alg.feature.detect.chess.ChessboardCorner;
import boofcv.alg.feature.detect.chess.DetectChessboardCornersX;
import boofcv.alg.feature.detect.chess.DetectChessboardCornersXPyramid;
import boofcv.alg.filter.blur.GBlurImageOps;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.ImageType;

import java.util.ArrayList;
import java.util.List;

/**
 * X-corner saddle points: the detector matched to checkerboards and x-corner fields.
 *
 * <p>Candidates come from BoofCV's x-corner detector ({@code DetectChessboardCornersX}, optionally over its image
 * pyramid): the x-corner intensity of Abeles 2019 [1] (an x-junction's four quadrants alternate in shade; the
 * intensity compares the means along the two diagonals of a small circle), non-maximum suppression, a mean-shift
 * position and the library's checks of edge intensity and symmetry, which turn away L-corners, blobs and edges. Each
 * candidate is then moved to the sub-pixel saddle of the Gaussian-blurred frame by {@link SaddleRefinement}
 * (Lucchese &amp; Mitra 2002 [2]); candidates where no saddle is found within the window are dropped, and refined
 * points closer than {@code nmsRadius} to a stronger one are merged.
 *
 * <p>Coordinates: BoofCV 1.2.2 reports its x-corners half a pixel right of and below this tool's pixel-centre
 * convention (see {@code camera.Calibration#BOOFCV_CORNER_OFFSET_PX}); the offset is removed before refinement.
 *
 * <p>Response: the library's x-corner intensity. Scale: the saddle window radius, pixels.
 *
 * <p>Caveats: only x-junctions (where two dark and two light regions meet crosswise) are found, not L-corners or
 * blobs; that is the point of a design-matched detector.
 *
 * <p>References: [1] P. Abeles, "BoofCV chessboard x-corner detector", boofcv.org, 2019 (the library's own
 * description; from memory). [2] see {@link SaddleRefinement}.
 */
final class XCornerDetector implements PointDetector {
    /** BoofCV's x-corners sit this far right of and below pixel centres, pixels. */
    static final double BOOFCV_OFFSET_PX = 0.5;

    private final XCornerConfig config;
    private final DetectChessboardCornersX single;
    private final DetectChessboardCornersXPyramid<GrayF32> pyramid;
    private final SaddleRefinement saddle;
    private final GrayF32 blurred = new GrayF32(1, 1), work = new GrayF32(1, 1);

    XCornerDetector(XCornerConfig config) {
        this.config = config;
        single = new DetectChessboardCornersX();
        single.setNonmaxRadius(config.nmsRadius);
        single.setEdgeIntensityRatioThreshold(config.edgeIntensityRatio);
        pyramid = config.pyramid ? new DetectChessboardCornersXPyramid<>(single, ImageType.single(GrayF32.class)) : null;
        saddle = config.saddleRadius > 0 ? new SaddleRefinement(config.saddleRadius) : null;
    }

    @Override public DetectorType type() { return DetectorType.XCORNER; }

    @Override
    public List<Detection> detect(GrayF32 image) {
        List<ChessboardCorner> found;
        if (pyramid != null) {
            pyramid.process(image);
            found = new ArrayList<>(pyramid.getCorners().toList());
        } else {
            single.process(image);
            found = new ArrayList<>(single.getCorners());
        }
        if (saddle != null) {
            blurred.reshape(image.width, image.height);
            work.reshape(image.width, image.height);
            GBlurImageOps.gaussian(image, blurred, config.saddleSigma, -1, work);
        }
        List<Detection> candidates = new ArrayList<>(found.size());
        double strongest = 0;
        for (ChessboardCorner c : found) {
            double s = c.intensity;
            if (!(s > 0) || !Double.isFinite(s)) continue;
            double x = c.x - BOOFCV_OFFSET_PX, y = c.y - BOOFCV_OFFSET_PX;
            if (saddle != null) {
                double[] q = saddle.refine(blurred, x, y);
                if (q == null) continue;
                x = q[0];
                y = q[1];
            }
            if (x < 0 || y < 0 || x > image.width - 1 || y > image.height - 1) continue;
            strongest = Math.max(strongest, s);
            candidates.add(new Detection(x, y, s, Math.max(1, config.saddleRadius)));
        }
        return Detectors.select(Detectors.suppressNear(candidates, config.nmsRadius), config, strongest);
    }
}
