package org.targetbench.detect;

import boofcv.abst.feature.detect.interest.ConfigGeneralDetector;
import boofcv.abst.feature.detect.interest.ConfigHarrisCorner;
import boofcv.abst.feature.detect.interest.ConfigShiTomasi;
import boofcv.abst.filter.derivative.ImageGradient;
import boofcv.alg.feature.detect.interest.GeneralFeatureDetector;
import boofcv.alg.misc.ImageStatistics;
import boofcv.factory.feature.detect.interest.FactoryDetectPoint;
import boofcv.factory.filter.derivative.FactoryDerivative;
import boofcv.struct.QueueCorner;
import boofcv.struct.image.GrayF32;
import georegression.struct.point.Point2D_I16;

import java.util.ArrayList;
import java.util.List;

/**
 * Harris and Shi-Tomasi corners on BoofCV's structure-tensor intensities, with sub-pixel refinement.
 *
 * <p>Steps: 3x3 Sobel gradient; structure tensor M summed over a (2r+1)² window (Gaussian weighted by default);
 * response R = det M - k (tr M)² (Harris &amp; Stephens 1988 [1]) or R = λ_min(M) (Shi &amp; Tomasi 1994 [2]);
 * non-maximum suppression within {@code nmsRadius} (non-strict, so flat-topped peaks are kept); threshold; each peak
 * moved by a three-point parabola fit of R and then by gradient-orthogonality refinement ({@link SubpixelCorner},
 * Förstner &amp; Gülch 1987 [3]); peaks that converge within {@code nmsRadius} of a stronger one are dropped;
 * strongest {@code maxFeatures} kept.
 *
 * <p>Caveat: single scale. Points near the border (window radius plus one pixel) are never reported.
 *
 * <p>References: [1] C. Harris, M. Stephens, "A combined corner and edge detector", Alvey Vision Conf. 1988.
 * [2] J. Shi, C. Tomasi, "Good features to track", CVPR 1994. [3] see {@link SubpixelCorner}.
 */
final class CornerDetector implements PointDetector {
    private final CornerConfig config;
    private final GeneralFeatureDetector<GrayF32, GrayF32> detector;
    private final ImageGradient<GrayF32, GrayF32> gradient = FactoryDerivative.sobel(GrayF32.class, GrayF32.class);
    private final GrayF32 dx = new GrayF32(1, 1), dy = new GrayF32(1, 1);

    CornerDetector(CornerConfig config) {
        this.config = config;
        ConfigGeneralDetector general = new ConfigGeneralDetector(-1, config.nmsRadius, 0f);
        general.useStrictRule = false;
        if (config instanceof HarrisConfig h) {
            detector = FactoryDetectPoint.createHarris(general, new ConfigHarrisCorner(h.weighted, h.windowRadius, h.kappa), GrayF32.class);
        } else {
            detector = FactoryDetectPoint.createShiTomasi(general, new ConfigShiTomasi(config.weighted, config.windowRadius), GrayF32.class);
        }
        detector.setFeatureLimit(-1);
    }

    @Override public DetectorType type() { return config.type(); }

    @Override
    public List<Detection> detect(GrayF32 image) {
        dx.reshape(image.width, image.height);
        dy.reshape(image.width, image.height);
        gradient.process(image, dx, dy);
        detector.process(image, dx, dy, null, null, null);
        GrayF32 r = detector.getIntensity();
        double strongest = ImageStatistics.max(r);
        double cut = Math.max(config.minResponse,
                config.thresholdMode == ThresholdMode.RELATIVE ? config.threshold * strongest : config.threshold);
        QueueCorner peaks = detector.getMaximums();
        List<Detection> candidates = new ArrayList<>(peaks.size);
        for (int i = 0; i < peaks.size; i++) {
            Point2D_I16 p = peaks.get(i);
            double c = r.unsafe_get(p.x, p.y);
            if (!(c > 0) || c < cut) continue; // threshold before the costly refinement
            double ox = 0, oy = 0;
            if (p.x > 0 && p.x < image.width - 1) ox = Detectors.parabolaOffset(r.unsafe_get(p.x - 1, p.y), c, r.unsafe_get(p.x + 1, p.y));
            if (p.y > 0 && p.y < image.height - 1) oy = Detectors.parabolaOffset(r.unsafe_get(p.x, p.y - 1), c, r.unsafe_get(p.x, p.y + 1));
            double x = p.x + ox, y = p.y + oy;
            if (config.refineRadius > 0) {
                double[] q = SubpixelCorner.refine(dx, dy, x, y, config.refineRadius);
                x = q[0];
                y = q[1];
            }
            candidates.add(new Detection(x, y, c, config.windowRadius));
        }
        return Detectors.select(Detectors.suppressNear(candidates, config.nmsRadius), config, strongest);
    }
}
