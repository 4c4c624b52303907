package org.targetbench.detect;

import boofcv.abst.feature.detect.interest.ConfigGeneralDetector;
import boofcv.alg.feature.detect.interest.GeneralFeatureDetector;
import boofcv.abst.feature.detect.interest.ConfigFastCorner;
import boofcv.factory.feature.detect.interest.FactoryDetectPoint;
import boofcv.struct.QueueCorner;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayS16;
import boofcv.struct.image.GrayU8;
import georegression.struct.point.Point2D_I16;

import java.util.ArrayList;
import java.util.List;

/**
 * FAST segment-test corners (Rosten &amp; Drummond 2006 [1]) of both polarities, merged honestly.
 *
 * <p>BoofCV reports corners darker than their ring (minima of a signed score) and brighter than their ring
 * (maxima) as two separate sets, and would cap each at half the requested count. Here both sets are extracted
 * without a cap, their score magnitudes compared on one scale, and the strongest {@code maxFeatures} kept
 * whatever their polarity. Non-maximum suppression runs within each polarity.
 *
 * <p>Caveats: integer-pixel positions (the segment test gives no sub-pixel information); no smoothing, so noise
 * creates corners. Works on the 8-bit rounding of the frame.
 *
 * <p>Reference: [1] E. Rosten, T. Drummond, "Machine learning for high-speed corner detection", ECCV 2006.
 */
final class FastDetector implements PointDetector {
    /** Radius of the Bresenham circle of 16 pixels, pixels. */
    static final double CIRCLE_RADIUS = 3;

    private final FastConfig config;
    private final GeneralFeatureDetector<GrayU8, GrayS16> detector;
    private final GrayU8 bytes = new GrayU8(1, 1);

    FastDetector(FastConfig config) {
        this.config = config;
        ConfigGeneralDetector general = new ConfigGeneralDetector(-1, config.nmsRadius, 0f);
        detector = FactoryDetectPoint.createFast(general, new ConfigFastCorner(config.pixelTolerance, config.minContinuous), GrayU8.class);
        detector.setFeatureLimit(-1);
    }

    @Override public DetectorType type() { return DetectorType.FAST; }

    @Override
    public List<Detection> detect(GrayF32 image) {
        detector.process(Detectors.toU8(image, bytes), null, null, null, null, null);
        GrayF32 score = detector.getIntensity();
        List<Detection> candidates = new ArrayList<>();
        double strongest = 0;
        for (QueueCorner set : new QueueCorner[]{detector.getMinimums(), detector.getMaximums()}) {
            for (int i = 0; i < set.size; i++) {
                Point2D_I16 p = set.get(i);
                double s = Math.abs(score.unsafe_get(p.x, p.y));
                strongest = Math.max(strongest, s);
                candidates.add(new Detection(p.x, p.y, s, CIRCLE_RADIUS));
            }
        }
        return Detectors.select(candidates, config, strongest);
    }
}
