package org.targetbench.detect;

import boofcv.abst.feature.detect.extract.ConfigExtract;
import boofcv.abst.feature.detect.extract.NonMaxSuppression;
import boofcv.abst.filter.derivative.ImageGradient;
import boofcv.alg.feature.detect.intensity.GradientCornerIntensity;
import boofcv.alg.misc.ImageStatistics;
import boofcv.factory.feature.detect.extract.FactoryFeatureExtractor;
import boofcv.factory.feature.detect.intensity.FactoryIntensityPointAlg;
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
 * moved by a three-point parabola fit of R; strongest {@code maxFeatures} kept. Sub-pixel refinement is a stage of
 * its own ({@link SubpixelRefiner}, applied by {@link Detectors#create}).
 *
 * <p>Speed without changing the result: with the Gaussian window (the default) the gradient, tensor window and
 * response run as one streaming pass ({@link CornerResponse}, the same floats as BoofCV's pipeline bit for bit),
 * suppression visits only the pixels at or above the threshold and only the kept points are ordered
 * ({@link CornerPeaks}). The box window and frames smaller than the window stay on BoofCV's pipeline.
 *
 * <p>Caveat: single scale. Points near the border (window radius plus one pixel) are never reported.
 *
 * <p>References: [1] C. Harris, M. Stephens, "A combined corner and edge detector", Alvey Vision Conf. 1988.
 * [2] J. Shi, C. Tomasi, "Good features to track", CVPR 1994.
 */
final class CornerDetector implements PointDetector {
    private final CornerConfig config;
    private final GradientCornerIntensity<GrayF32> intensity;
    private final NonMaxSuppression nonMax;
    private final ImageGradient<GrayF32, GrayF32> gradient = FactoryDerivative.sobel(GrayF32.class, GrayF32.class);
    private final GrayF32 dx = new GrayF32(1, 1), dy = new GrayF32(1, 1), response = new GrayF32(1, 1);
    private final QueueCorner peaks = new QueueCorner();
    /** The fused streaming response (Gaussian window only); null for the box window, which stays on the library. */
    private final CornerResponse fused;
    private final int ignoreBorder;
    private final CornerPeaks peakFinder;

    CornerDetector(CornerConfig config) {
        this(config, org.targetbench.Simd.ENABLED);
    }

    /** @param simd the vector loops of the fused kernel (only when the vector module is present); same output */
    CornerDetector(CornerConfig config, boolean simd) {
        this.config = config;
        peakFinder = new CornerPeaks(simd);
        intensity = config instanceof HarrisConfig h
                ? FactoryIntensityPointAlg.harris(h.windowRadius, (float) h.kappa, h.weighted, GrayF32.class)
                : FactoryIntensityPointAlg.shiTomasi(config.windowRadius, config.weighted, GrayF32.class);
        // non-strict, so flat-topped peaks are kept; maxima only; the border the window cannot see is skipped
        nonMax = FactoryFeatureExtractor.nonmax(new ConfigExtract(config.nmsRadius, 0f,
                Math.max(config.nmsRadius, intensity.getIgnoreBorder()), false, false, true));
        ignoreBorder = Math.max(config.nmsRadius, intensity.getIgnoreBorder());
        fused = config.weighted ? new CornerResponse(config.windowRadius, config instanceof HarrisConfig,
                config instanceof HarrisConfig h ? h.kappa : 0, simd) : null;
    }

    @Override public DetectorType type() { return config.type(); }

    @Override
    public List<Detection> detect(GrayF32 image) {
        if (fused != null && fused.handles(image.width, image.height)) return detectFused(image);
        dx.reshape(image.width, image.height);
        dy.reshape(image.width, image.height);
        gradient.process(image, dx, dy);
        response.reshape(image.width, image.height);
        intensity.process(dx, dy, response);
        GrayF32 r = response;
        double strongest = ImageStatistics.max(r);
        double cut = Math.max(config.minResponse,
                config.thresholdMode == ThresholdMode.RELATIVE ? config.threshold * strongest : config.threshold);
        // thresholding inside the suppression spares it the many weak maxima of texture and noise
        nonMax.setThresholdMaximum((float) Math.max(cut, Float.MIN_VALUE));
        peaks.reset();
        nonMax.process(r, null, null, null, peaks);
        List<Detection> candidates = new ArrayList<>(peaks.size);
        for (int i = 0; i < peaks.size; i++) {
            Point2D_I16 p = peaks.get(i);
            double c = r.unsafe_get(p.x, p.y);
            if (!(c > 0) || c < cut) continue; // threshold before the costly refinement
            double ox = 0, oy = 0;
            if (p.x > 0 && p.x < image.width - 1) ox = Detectors.parabolaOffset(r.unsafe_get(p.x - 1, p.y), c, r.unsafe_get(p.x + 1, p.y));
            if (p.y > 0 && p.y < image.height - 1) oy = Detectors.parabolaOffset(r.unsafe_get(p.x, p.y - 1), c, r.unsafe_get(p.x, p.y + 1));
            candidates.add(new Detection(p.x + ox, p.y + oy, c, config.windowRadius));
        }
        return Detectors.select(candidates, config, strongest);
    }

    /**
     * The same steps as {@link #detect} on the fused response: non-maximum suppression visits only the pixels at or
     * above the threshold (the library's relaxed block search keeps exactly those that no pixel within the radius
     * exceeds), and only the strongest {@code maxFeatures} are ordered.
     */
    private List<Detection> detectFused(GrayF32 image) {
        double strongest = fused.process(image, response);
        double cut = Math.max(config.minResponse,
                config.thresholdMode == ThresholdMode.RELATIVE ? config.threshold * strongest : config.threshold);
        float threshold = (float) Math.max(cut, Float.MIN_VALUE);
        return peakFinder.find(response, threshold, cut, config.nmsRadius, ignoreBorder, config.windowRadius,
                config.maxFeatures);
    }
}
