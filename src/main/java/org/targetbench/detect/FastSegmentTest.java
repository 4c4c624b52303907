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

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;
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
    private final FastCornerInterface<GrayU8> tree;
    private int[] ring = new int[0];
    private int ringStride = -1;

    /** Pixels whose ring is darker than the centre: negative score. */
    final ListIntPoint2D negative = new ListIntPoint2D();
    /** Pixels whose ring is brighter than the centre: positive score. */
    final ListIntPoint2D positive = new ListIntPoint2D();

    FastSegmentTest(int tolerance, int minContinuous) {
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
        tree.setImage(image, ring);
        byte[] data = image.data;
        float[] out = score.data;
        int east = ring[0], south = ring[4], west = ring[8], north = ring[12];
        int t = tolerance;
        long spread = BYTES * t;
        for (int y = RADIUS; y < image.height - RADIUS; y++) {
            int index = image.startIndex + y * image.stride + RADIUS;
            int scoreIndex = score.startIndex + y * score.stride + RADIUS;
            int x = RADIUS;
            for (int end = image.width - RADIUS; x < end; x++, index++, scoreIndex++) {
                // eight pixels at once: skip them when no E or W pixel differs from its centre by more than t
                if ((x - RADIUS & 7) == 0 && x + 8 <= end) {
                    long cc = (long) LONGS.get(data, index);
                    long ee = (long) LONGS.get(data, index + east), ww = (long) LONGS.get(data, index + west);
                    long far = subSat(subSat(ee, cc) | subSat(cc, ee), spread) | subSat(subSat(ww, cc) | subSat(cc, ww), spread);
                    if (far == 0) {
                        x += 7; index += 7; scoreIndex += 7;
                        continue;
                    }
                }
                int c = data[index] & 0xFF, upper = c + t, lower = c - t;
                int e = data[index + east] & 0xFF, w = data[index + west] & 0xFF;
                if (e <= upper && w <= upper && e >= lower && w >= lower) continue;
                int s = data[index + south] & 0xFF, n = data[index + north] & 0xFF;
                boolean brighter = (e > upper || w > upper) && (s > upper || n > upper);
                boolean darker = (e < lower || w < lower) && (s < lower || n < lower);
                if (!brighter && !darker) continue;
                int result = tree.checkPixel(index);
                if (result < 0) {
                    out[scoreIndex] = tree.scoreLower(index);
                    negative.add(x, y);
                    written(scoreIndex);
                } else if (result > 0) {
                    out[scoreIndex] = tree.scoreUpper(index);
                    positive.add(x, y);
                    written(scoreIndex);
                }
            }
        }
    }

    /** Eight bytes of a row read as one long (little-endian: pixel x in the low byte). */
    private static final VarHandle LONGS = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final long BYTES = 0x0101010101010101L, HIGH = 0x8080808080808080L, LOW = 0x7F7F7F7F7F7F7F7FL;

    /**
     * max(a - b, 0) in each of the eight byte lanes (SWAR: lane-wise subtraction without borrow across lanes, then
     * lanes that borrowed cleared; Warren, "Hacker's Delight", 2nd ed., section 2-18).
     */
    static long subSat(long a, long b) {
        long d = ((a | HIGH) - (b & LOW)) ^ ((a ^ ~b) & HIGH);
        long borrow = ((~a & b) | (~(a ^ b) & d)) & HIGH;
        return d & ~((borrow >>> 7) * 0xFF);
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
