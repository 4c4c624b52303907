/*
 * Frozen copy of the detector as it was before the fused kernels (commit 907b02e), kept in test scope as the
 * reference the faster kernel must reproduce: identical points, equal responses. Do not optimise this copy.
 */
package org.targetbench.detect.reference;

import org.targetbench.detect.*;


import boofcv.alg.feature.detect.extract.NonMaxCandidate;
import boofcv.alg.misc.ImageMiscOps;
import boofcv.struct.QueueCorner;
import boofcv.struct.image.GrayF32;
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
 * <p>Speed without changing the result: the segment test skips pixels that fail a necessary compass-point check
 * ({@link ReferenceFastSegmentTest}), and non-maximum suppression (strict: a point must beat every other score within
 * {@code nmsRadius}) visits only the pixels that passed the segment test rather than the whole score image. Every
 * other pixel scores exactly 0 and is never reported, so both shortcuts find the same points as BoofCV's general
 * FAST detector.
 *
 * <p>Caveats: integer-pixel positions (the segment test gives no sub-pixel information); no smoothing, so noise
 * creates corners. Works on the 8-bit rounding of the frame. Single threaded.
 *
 * <p>Reference: [1] E. Rosten, T. Drummond, "Machine learning for high-speed corner detection", ECCV 2006.
 */
public final class ReferenceFastDetector implements PointDetector {
    /** Radius of the Bresenham circle of 16 pixels, pixels. */
    static final double CIRCLE_RADIUS = ReferenceFastSegmentTest.RADIUS;

    private final FastConfig config;
    private final ReferenceFastSegmentTest segmentTest;
    private final NonMaxCandidate nonMax = new NonMaxCandidate(new NonMaxCandidate.Strict());
    private final GrayU8 bytes = new GrayU8(1, 1);
    /** Signed FAST score per pixel: negative for the one polarity, positive for the other, 0 for no corner. */
    private final GrayF32 score = new GrayF32(1, 1);
    private final QueueCorner negativePeaks = new QueueCorner(), positivePeaks = new QueueCorner();

    public ReferenceFastDetector(FastConfig config) {
        this.config = config;
        segmentTest = new ReferenceFastSegmentTest(config.pixelTolerance, config.minContinuous);
        nonMax.setSearchRadius(config.nmsRadius);
        nonMax.setThresholdMin(0f);
        nonMax.setThresholdMax(0f);
        // peaks closer to the edge than the search radius or the circle are ignored, as in BoofCV's general detector
        nonMax.setBorder(Math.max(config.nmsRadius, ReferenceFastSegmentTest.RADIUS));
    }

    @Override public DetectorType type() { return DetectorType.FAST; }

    @Override
    public List<Detection> detect(GrayF32 image) {
        GrayU8 u8 = ReferenceSelect.toU8(image, bytes);
        if (score.width != u8.width || score.height != u8.height) {
            score.reshape(u8.width, u8.height);
            ImageMiscOps.fill(score, 0); // the segment test never writes the border; it must read as "no corner"
        }
        segmentTest.process(u8, score);
        nonMax.process(score, segmentTest.negative, segmentTest.positive, negativePeaks, positivePeaks);
        List<Detection> candidates = new ArrayList<>(negativePeaks.size + positivePeaks.size);
        double strongest = 0;
        for (QueueCorner set : new QueueCorner[]{negativePeaks, positivePeaks}) {
            for (int i = 0; i < set.size; i++) {
                Point2D_I16 p = set.get(i);
                double s = Math.abs(score.unsafe_get(p.x, p.y));
                strongest = Math.max(strongest, s);
                candidates.add(new Detection(p.x, p.y, s, CIRCLE_RADIUS));
            }
        }
        return ReferenceSelect.select(candidates, config, strongest);
    }
}
