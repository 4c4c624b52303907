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
 * {@code nmsRadius}) visits only the pixels that passed the segment test rather than the whole score image. Every
 * other pixel scores exactly 0 and is never reported, so both shortcuts find the same points as BoofCV's general
 * FAST detector. The compass scan skips eight pixels at a time when none of their E and W pixels is beyond the
 * tolerance (bytes compared eight at a time in a long, exactly). The score image is reused: only corners are written and only they are reset after the frame, and
 * only the strongest {@code maxFeatures} are ordered ({@link CornerPeaks}).
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
     *
     * <p>Only corners of the same polarity can beat a candidate (every other pixel scores 0 or has the other sign),
     * so the window is searched in the polarity's own list, which is in raster order: for each row of the window, the
     * corners of that row with x within the radius. The same rule as reading the whole window of the score image,
     * without touching it.
     */
    private float suppress(ListIntPoint2D candidates, int sign, int border, float strongest) {
        int w = score.width, h = score.height, radius = config.nmsRadius, size = candidates.size();
        if (xs.length < size) { xs = new int[2 * size]; ys = new int[2 * size]; values = new float[2 * size]; }
        if (rowStart.length < h + 1) rowStart = new int[h + 1];
        float[] d = score.data;
        // the list by rows: rowStart[y] .. rowStart[y + 1] - 1 are the corners of row y, in increasing x
        int row = 0;
        for (int i = 0; i < size; i++) {
            candidates.get(i, point);
            xs[i] = point.x; ys[i] = point.y;
            values[i] = d[score.startIndex + point.y * score.stride + point.x];
            while (row <= point.y) rowStart[row++] = i;
        }
        while (row <= h) rowStart[row++] = size;
        float sg = sign;
        for (int i = 0; i < size; i++) {
            int x = xs[i], y = ys[i];
            if (x < border || y < border || x >= w - border || y >= h - border) continue;
            float v = values[i];
            if (sign < 0 ? (v > 0f || v == -Float.MAX_VALUE) : (v < 0f || v == Float.MAX_VALUE)) continue;
            // with the sign folded in (multiplying by -1f is exact), a peak beats every other s * score in the window
            float sv = sg * v;
            int x0 = x - radius, x1 = x + radius;
            int y0 = Math.max(0, y - radius), y1 = Math.min(h - 1, y + radius);
            boolean peak = true;
            for (int yy = y0; yy <= y1 && peak; yy++) {
                int j = rowStart[yy], end = rowStart[yy + 1];
                for (int hi = end; j < hi; ) { // the first corner of the row with x >= x0 (rows can hold dozens)
                    int mid = (j + hi) >>> 1;
                    if (xs[mid] < x0) j = mid + 1; else hi = mid;
                }
                for (; j < end; j++) {
                    if (xs[j] > x1) break;
                    if (j != i && sg * values[j] >= sv) { peak = false; break; }
                }
            }
            if (!peak) continue;
            float s = Math.abs(v);
            strongest = Math.max(strongest, s);
            peaks.addPoint(x, y, s);
        }
        return strongest;
    }

    private int[] xs = new int[0], ys = new int[0], rowStart = new int[0];
    private float[] values = new float[0];
}
