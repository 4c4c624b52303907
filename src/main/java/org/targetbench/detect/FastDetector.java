package org.targetbench.detect;

import boofcv.alg.misc.ImageMiscOps;
import boofcv.struct.ListIntPoint2D;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayU8;
import georegression.struct.point.Point2D_I16;
import org.targetbench.Simd;

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
 * ({@link FastSegmentTest}), and non-maximum suppression (strict: a point must beat every other score within
 * {@code nmsRadius}) visits only the pixels that passed the segment test rather than the whole score image, and
 * rejects most of them on their four neighbours before reading the window. Every other pixel scores exactly 0 and is
 * never reported, so both shortcuts find the same points as BoofCV's general FAST detector. With the Vector API
 * ({@link org.targetbench.Simd#ENABLED}) the 8-bit rounding and the segment test run on 8 floats or 32 bytes per
 * instruction ({@link FastVectorKernels}); without it, on their scalar twins ({@link FastScalarKernels}), with
 * identical output. The 8-bit frame and the score image are reused: only corners are written and only they are reset
 * after the frame, and only the strongest {@code maxFeatures} are ordered ({@link CornerPeaks}).
 *
 * <p>Caveats: integer-pixel positions (the segment test gives no sub-pixel information); no smoothing, so noise
 * creates corners. Works on the 8-bit rounding of the frame. Single threaded.
 *
 * <p>Reference: [1] E. Rosten, T. Drummond, "Machine learning for high-speed corner detection", ECCV 2006.
 */
final class FastDetector implements PointDetector {
    /** Radius of the Bresenham circle of 16 pixels, pixels. */
    static final double CIRCLE_RADIUS = FastSegmentTest.RADIUS;

    private final FastConfig config;
    private final boolean vector;
    private final FastSegmentTest segmentTest;
    private final CornerPeaks peaks = new CornerPeaks();
    private final Point2D_I16 point = new Point2D_I16();
    private final GrayU8 bytes = new GrayU8(1, 1);
    /** Signed FAST score per pixel: negative for the one polarity, positive for the other, 0 for no corner. */
    private final GrayF32 score = new GrayF32(1, 1);

    FastDetector(FastConfig config) {
        this(config, Simd.ENABLED);
    }

    /** @param vector whether the rounding and the compass pre-check run on the Vector API (only when {@link Simd#ENABLED}) */
    FastDetector(FastConfig config, boolean vector) {
        this.config = config;
        this.vector = vector;
        segmentTest = new FastSegmentTest(config.pixelTolerance, config.minContinuous, vector);
    }

    @Override public DetectorType type() { return DetectorType.FAST; }

    @Override
    public List<Detection> detect(GrayF32 image) {
        GrayU8 u8 = toU8(image);
        if (score.width != u8.width || score.height != u8.height) {
            score.reshape(u8.width, u8.height);
            ImageMiscOps.fill(score, 0); // the segment test writes only corners; everything else must read 0
        }
        segmentTest.process(u8, score);
        peaks.reset();
        float strongest = 0;
        int border = Math.max(config.nmsRadius, FastSegmentTest.RADIUS);
        strongest = suppress(segmentTest.negative, -1, border, strongest);
        strongest = suppress(segmentTest.positive, +1, border, strongest);
        segmentTest.clear(score);
        double cut = Math.max(config.minResponse,
                config.thresholdMode == ThresholdMode.RELATIVE ? config.threshold * (double) strongest : config.threshold);
        peaks.keepAtLeast(cut);
        return peaks.top(config.maxFeatures, CIRCLE_RADIUS);
    }

    /** The 8-bit rounding of the frame into the reused buffer (the rule of {@link Detectors#toU8}). */
    private GrayU8 toU8(GrayF32 image) {
        bytes.reshape(image.width, image.height);
        if (vector) FastVectorKernels.toU8(image.data, image.startIndex, image.stride, bytes.data, bytes.startIndex, bytes.stride, image.width, image.height);
        else FastScalarKernels.toU8(image.data, image.startIndex, image.stride, bytes.data, bytes.startIndex, bytes.stride, image.width, image.height);
        return bytes;
    }

    /**
     * Strict non-maximum suppression of one polarity's candidates (as BoofCV's candidate search: a candidate at least
     * {@code border} from the edges, of the right sign, beating every other score within {@code nmsRadius}, the window
     * clipped to the frame); adds each survivor with its |score| and returns the largest |score| so far.
     */
    private float suppress(ListIntPoint2D candidates, int sign, int border, float strongest) {
        int w = score.width, h = score.height, radius = config.nmsRadius;
        float[] d = score.data;
        for (int i = 0; i < candidates.size(); i++) {
            candidates.get(i, point);
            int x = point.x, y = point.y;
            if (x < border || y < border || x >= w - border || y >= h - border) continue;
            int centre = score.startIndex + y * score.stride + x;
            float v = d[centre];
            if (sign < 0 ? (v > 0f || v == -Float.MAX_VALUE) : (v < 0f || v == Float.MAX_VALUE)) continue;
            // the same rule with the sign folded in (multiplying by -1f is exact): a peak beats every other s*score
            float sg = sign, sv = sg * v;
            int stride = score.stride;
            // the four neighbours first: corners cluster, and most that lose, lose to one of them
            if (sg * d[centre - 1] >= sv || sg * d[centre + 1] >= sv
                    || sg * d[centre - stride] >= sv || sg * d[centre + stride] >= sv) continue;
            int x0 = Math.max(0, x - radius), x1 = Math.min(w, x + radius + 1);
            int y0 = Math.max(0, y - radius), y1 = Math.min(h, y + radius + 1);
            boolean peak = true;
            for (int yy = y0; yy < y1 && peak; yy++) {
                int index = score.startIndex + yy * stride + x0;
                for (int xx = x0; xx < x1; xx++, index++) {
                    if (index != centre && sg * d[index] >= sv) { peak = false; break; }
                }
            }
            if (!peak) continue;
            float s = Math.abs(v);
            strongest = Math.max(strongest, s);
            peaks.addPoint(x, y, s);
        }
        return strongest;
    }
}
