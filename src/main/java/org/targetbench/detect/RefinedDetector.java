package org.targetbench.detect;

import boofcv.struct.image.GrayF32;

import java.util.List;

/**
 * A detector followed by the sub-pixel refinement stage: the detector's points, refined under
 * {@link RefineConfig}'s keep rule, then any point that refinement moved within {@code nmsRadius} of a stronger one
 * dropped (neighbouring peaks of one corner converge on the same spot), strongest first as before.
 */
final class RefinedDetector implements PointDetector {
    private final PointDetector detector;
    private final SubpixelRefiner refiner;
    private final int nmsRadius;

    RefinedDetector(PointDetector detector, DetectorConfig config) {
        this.detector = detector;
        this.refiner = new SubpixelRefiner(config.refine);
        this.nmsRadius = config.nmsRadius;
    }

    @Override public DetectorType type() { return detector.type(); }

    @Override
    public List<Detection> detect(GrayF32 image) {
        return List.copyOf(Detectors.suppressNear(refiner.refine(image, detector.detect(image)), nmsRadius));
    }
}
