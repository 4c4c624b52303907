package org.targetbench.detect;

import boofcv.abst.feature.detect.interest.ConfigFastHessian;
import boofcv.alg.feature.detect.interest.FastHessianFeatureDetector;
import boofcv.alg.transform.ii.IntegralImageOps;
import boofcv.factory.feature.detect.interest.FactoryInterestPointAlgs;
import boofcv.struct.feature.ScalePoint;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayS32;
import boofcv.struct.image.GrayU8;

import java.util.ArrayList;
import java.util.List;

/**
 * Fast-Hessian blobs, the detector stage of SURF (Bay et al. 2008 [1]), via BoofCV.
 *
 * <p>Box-filter approximations of the Hessian determinant on an integral image, over octaves of growing filter
 * size; extrema in (x, y, scale) with interpolated position. The integral image is 32-bit integer over the 8-bit
 * frame, which keeps sums exact (a float integral image loses precision on VGA frames).
 *
 * <p>{@link Detection#scale()} is the blob scale s = 1.2 L / 9 of Bay et al. for a filter of side L, pixels.
 *
 * <p>Reference: [1] H. Bay, A. Ess, T. Tuytelaars, L. Van Gool, "Speeded-up robust features (SURF)", CVIU 110(3),
 * 2008.
 */
final class FastHessianDetector implements PointDetector {
    private final SurfConfig config;
    private final FastHessianFeatureDetector<GrayS32> detector;
    private final GrayU8 bytes = new GrayU8(1, 1);
    private GrayS32 integral = new GrayS32(1, 1);

    FastHessianDetector(SurfConfig config) {
        this.config = config;
        ConfigFastHessian c = new ConfigFastHessian();
        c.extract.threshold = 0;
        c.extract.radius = config.nmsRadius;
        c.maxFeaturesPerScale = config.maxPerScale > 0 ? config.maxPerScale : -1;
        c.maxFeaturesAll = -1;
        c.numberOfOctaves = config.octaves;
        c.numberScalesPerOctave = config.scalesPerOctave;
        c.initialSize = config.initialSize;
        c.initialSampleStep = config.initialSampleStep;
        detector = FactoryInterestPointAlgs.fastHessian(c);
    }

    @Override public DetectorType type() { return DetectorType.SURF; }

    @Override
    public List<Detection> detect(GrayF32 image) {
        integral.reshape(image.width, image.height);
        integral = IntegralImageOps.transform(Detectors.toU8(image, bytes), integral);
        detector.detect(integral);
        List<Detection> candidates = new ArrayList<>();
        double strongest = 0;
        for (ScalePoint p : detector.getFoundFeatures()) {
            double s = Math.abs(p.intensity);
            if (!Double.isFinite(s)) continue;
            strongest = Math.max(strongest, s);
            candidates.add(new Detection(p.pixel.x, p.pixel.y, s, p.scale));
        }
        return Detectors.select(candidates, config, strongest);
    }
}
