package org.targetbench.detect;

import boofcv.abst.feature.detect.interest.ConfigSiftDetector;
import boofcv.alg.feature.detect.interest.SiftDetector;
import boofcv.alg.feature.detect.interest.SiftScaleSpace;
import boofcv.factory.feature.detect.interest.FactoryInterestPointAlgs;
import boofcv.struct.image.GrayF32;

import java.util.ArrayList;
import java.util.List;

/**
 * Difference-of-Gaussian extrema, the detector stage of SIFT (Lowe 2004 [1]), via BoofCV.
 *
 * <p>Gaussian scale space with {@code scalesPerOctave} intervals per octave starting at σ0 (optionally on the image
 * doubled in size), extrema of the DoG over space and scale with interpolated position, edge responses with a
 * Hessian ratio above r rejected (Lowe 2004, eq. 4.4). Responses are |DoG| at the extremum; the relative threshold
 * plays the part of Lowe's contrast threshold.
 *
 * <p>{@link Detection#scale()} is the Gaussian σ of the extremum, pixels of the input frame.
 *
 * <p>Reference: [1] D. G. Lowe, "Distinctive image features from scale-invariant keypoints", IJCV 60(2), 2004.
 */
final class DogDetector implements PointDetector {
    private final SiftConfig config;
    private final SiftScaleSpace scaleSpace;
    private final SiftDetector detector;

    DogDetector(SiftConfig config) {
        this.config = config;
        scaleSpace = new SiftScaleSpace(config.firstOctave, config.lastOctave, config.scalesPerOctave, (float) config.sigma0);
        ConfigSiftDetector c = ConfigSiftDetector.createPaper();
        c.extract.threshold = 0;
        c.extract.radius = config.nmsRadius;
        c.maxFeaturesPerScale = 0;
        c.maxFeaturesAll = -1;
        c.edgeR = config.edgeRatio;
        detector = FactoryInterestPointAlgs.sift(c);
    }

    @Override public DetectorType type() { return DetectorType.SIFT; }

    @Override
    public List<Detection> detect(GrayF32 image) {
        scaleSpace.process(image);
        detector.process(scaleSpace);
        List<Detection> candidates = new ArrayList<>();
        double strongest = 0;
        for (SiftDetector.SiftPoint p : detector.getDetections()) {
            double s = Math.abs(p.intensity);
            if (!Double.isFinite(s)) continue;
            strongest = Math.max(strongest, s);
            candidates.add(new Detection(p.pixel.x, p.pixel.y, s, p.scale));
        }
        return Detectors.select(candidates, config, strongest);
    }
}
