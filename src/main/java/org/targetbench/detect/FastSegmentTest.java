package org.targetbench.detect;

import boofcv.alg.feature.detect.intensity.impl.FastCornerInterface;
import boofcv.alg.feature.detect.intensity.impl.ImplFastCorner10_U8;
import boofcv.alg.feature.detect.intensity.impl.ImplFastCorner11_U8;
import boofcv.alg.feature.detect.intensity.impl.ImplFastCorner12_U8;
import boofcv.alg.feature.detect.intensity.impl.ImplFastCorner9_U8;
import boofcv.misc.DiscretizedCircle;
import boofcv.struct.ListIntPoint2D;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayU8;

import org.targetbench.Simd;

import java.util.Arrays;

/**
 * The FAST segment test over a whole 8-bit image: BoofCV's generated decision tree and score, preceded by a cheap
 * rejection of pixels that cannot be corners.
 *
 * <p>A pixel of grey c is a corner when at least n (9..12) contiguous pixels of the 16-pixel ring of radius 3 are all
 * brighter than c + t, or all darker than c - t. The ring's compass pixels E, S, W, N (offsets (3,0), (0,3), (-3,0),
 * (0,-3)) sit at ring positions 0, 4, 8 and 12, so every arc of 9 or more contiguous positions holds two neighbouring
 * compass pixels: one of E and W, and one of S and N. A pixel is therefore only handed to the decision tree when
 * (E or W) and (S or N) are beyond the tolerance on the same side; for every other pixel the tree would answer "no
 * corner" and the score is 0. This is the high-speed test of Rosten &amp; Drummond 2006 [1], in the form that holds
 * for n = 9. Before that, eight neighbouring pixels are checked at once: their centres, E and W pixels are read as
 * three longs, and the group is skipped when every |E - c| and |W - c| is within the tolerance (lane-wise
 * saturating byte arithmetic, exact), which is the first half of the same test. The output (score image and
 * candidate lists) is the same as BoofCV's {@code FastCornerDetector}.
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
    private final FastCornerInterface<GrayU8> tree;
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
        this.tolerance = tolerance;
        tree = switch (minContinuous) {
            case 9 -> new ImplFastCorner9_U8(tolerance);
            case 10 -> new ImplFastCorner10_U8(tolerance);
            case 11 -> new ImplFastCorner11_U8(tolerance);
            case 12 -> new ImplFastCorner12_U8(tolerance);
            default -> throw new IllegalArgumentException("FAST needs 9..12 contiguous pixels, got " + minContinuous);
        };
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
        tree.setImage(image, ring);
        byte[] data = image.data;
        float[] out = score.data;
        int[] found = candidates;
        int east = ring[0], south = ring[4], west = ring[8], north = ring[12];
        for (int y = RADIUS; y < image.height - RADIUS; y++) {
            int row = image.startIndex + y * image.stride, scoreRow = score.startIndex + y * score.stride;
            int end = image.width - RADIUS;
            int count = vector
                    ? FastVectorKernels.compassCandidates(data, row, RADIUS, end, east, west, south, north, tolerance, found)
                    : FastScalarKernels.compassCandidates(data, row, RADIUS, end, east, west, south, north, tolerance, found);
            for (int k = 0; k < count; k++) {
                int x = found[k], index = row + x;
                int result = tree.checkPixel(index);
                if (result < 0) {
                    out[scoreRow + x] = tree.scoreLower(index);
                    negative.add(x, y);
                    written(scoreRow + x);
                } else if (result > 0) {
                    out[scoreRow + x] = tree.scoreUpper(index);
                    positive.add(x, y);
                    written(scoreRow + x);
                }
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
