package org.targetbench.detect;

import boofcv.misc.DiscretizedCircle;
import boofcv.struct.ListIntPoint2D;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayU8;
import org.targetbench.Simd;

import java.util.Arrays;

/**
 * The FAST segment test over a whole 8-bit image: a cheap rejection of pixels that cannot be corners, then the exact
 * segment test on the rest, then BoofCV's score for the corners.
 *
 * <p>A pixel of grey c is a corner when at least n (9..12) contiguous pixels of the 16-pixel ring of radius 3 are all
 * brighter than c + t, or all darker than c - t [1]. The ring's compass pixels E, S, W, N (offsets (3,0), (0,3),
 * (-3,0), (0,-3)) sit at ring positions 0, 4, 8 and 12, so every arc of 9 or more contiguous positions holds two
 * neighbouring compass pixels: one of E and W, and one of S and N. A pixel is therefore only tested further when
 * (E or W) and (S or N) are beyond the tolerance on the same side (the high-speed test of [1], in the form that holds
 * for n = 9); every other pixel scores 0.
 *
 * <p>Two implementations with the same output, one row at a time: with the Vector API ({@link FastVectorKernels}),
 * 32 pixels per block, the compass check and, in blocks where a lane passes it, the run lengths around the whole
 * ring per lane; without it ({@link FastScalarKernels}), the compass check eight pixels to a long, then per
 * candidate two 16-bit ring patterns searched for an arc by doubling. Both decide the rule BoofCV's generated decision
 * trees ({@code ImplFastCorner9_U8} .. {@code 12}) decide: the trees were replaced after checking by hand that they
 * answer alike on all 3^16 ways of a ring being brighter, darker or neither, for each n ({@code FastEqualityTest}
 * repeats the check on a sample and runs the two kernels against each other). The score of a corner is BoofCV's:
 * the sum of p - c over the ring pixels beyond the tolerance on the corner's side (negative for darker rings). The
 * output (score image and candidate lists) is the same as BoofCV's {@code FastCornerDetector}.
 *
 * <p>Caveat: single threaded, whatever BoofCV's concurrency setting.
 *
 * <p>Reference: [1] E. Rosten, T. Drummond, "Machine learning for high-speed corner detection", ECCV 2006.
 */
final class FastSegmentTest {
    /** Radius of the ring, pixels; nothing closer to the image edge is tested. */
    static final int RADIUS = 3;

    private final int tolerance;
    private final boolean vector;
    private int[] candidates = new int[0];
    private final byte[] flags;
    private final int minContinuous;
    private int[] ring = new int[0];
    private int ringStride = -1;

    /** Pixels whose ring is darker than the centre: negative score. */
    final ListIntPoint2D negative = new ListIntPoint2D();
    /** Pixels whose ring is brighter than the centre: positive score. */
    final ListIntPoint2D positive = new ListIntPoint2D();

    FastSegmentTest(int tolerance, int minContinuous) {
        this(tolerance, minContinuous, Simd.ENABLED);
    }

    /** @param vector whether the compass pre-check runs on the Vector API (only when {@link Simd#ENABLED}) */
    FastSegmentTest(int tolerance, int minContinuous, boolean vector) {
        if (vector && !Simd.ENABLED) throw new IllegalArgumentException("the Vector API is not available");
        this.vector = vector;
        flags = new byte[vector ? Math.max(8, FastVectorKernels.LANES) : 0];
        if (minContinuous < 9 || minContinuous > 12)
            throw new IllegalArgumentException("FAST needs 9..12 contiguous pixels, got " + minContinuous);
        this.tolerance = tolerance;
        this.minContinuous = minContinuous;
    }

    /**
     * Tests every pixel at least {@link #RADIUS} from the edge, fills {@link #negative} and {@link #positive} and
     * writes the signed score of each corner into {@code score}. Only corners are written: every other pixel must
     * already read 0 (a fresh image, or one whose corners {@link #clear} has reset).
     *
     * @param score same size as {@code image}
     */
    void process(GrayU8 image, GrayF32 score) {
        writtenCount = 0;
        negative.configure(image.width, image.height);
        positive.configure(image.width, image.height);
        if (ringStride != image.stride) {
            ring = DiscretizedCircle.imageOffsets(RADIUS, image.stride);
            ringStride = image.stride;
        }
        if (candidates.length < image.width) candidates = new int[image.width];
        byte[] data = image.data;
        float[] out = score.data;
        int[] found = candidates, r = ring;
        int t = tolerance, n = minContinuous;
        for (int y = RADIUS; y < image.height - RADIUS; y++) {
            int row = image.startIndex + y * image.stride, scoreRow = score.startIndex + y * score.stride;
            int end = image.width - RADIUS;
            int count = vector
                    ? FastVectorKernels.corners(data, row, RADIUS, end, r, t, n, found, flags)
                    : FastScalarKernels.corners(data, row, RADIUS, end, r, t, n, found);
            for (int k = 0; k < count; k++) {
                boolean darker = (found[k] & FastScalarKernels.DARK) != 0;
                int x = found[k] & ~FastScalarKernels.DARK, index = row + x;
                // BoofCV's score: the sum of p - c over the ring pixels beyond the tolerance on the corner's side
                int c = data[index] & 0xFF, upper = c + t, lower = c - t, sum = 0;
                for (int j = 0; j < 16; j++) {
                    int p = data[index + r[j]] & 0xFF;
                    sum += (p - c) & (darker ? (p - lower) >> 31 : (upper - p) >> 31);
                }
                out[scoreRow + x] = sum;
                if (darker) negative.add(x, y);
                else positive.add(x, y);
                written(scoreRow + x);
            }
        }
    }

    private int[] writtenAt = new int[1024];
    private int writtenCount;

    private void written(int scoreIndex) {
        if (writtenCount == writtenAt.length) writtenAt = Arrays.copyOf(writtenAt, 2 * writtenCount);
        writtenAt[writtenCount++] = scoreIndex;
    }

    /** Resets to 0 every score the last {@link #process} wrote, so the score image can be reused without a fill. */
    void clear(GrayF32 score) {
        float[] out = score.data;
        for (int i = 0; i < writtenCount; i++) out[writtenAt[i]] = 0f;
        writtenCount = 0;
    }
}
