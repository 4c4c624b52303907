package org.targetbench.detect;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;

/**
 * The scalar twins of {@link FastVectorKernels}: the float-to-8-bit rounding of the frame and the segment test, one
 * pixel (or eight bytes in a long) at a time. These are the paths taken without the Vector
 * API, and the definition the vector kernels must reproduce exactly ({@code FastEqualityTest}).
 */
final class FastScalarKernels {
    private FastScalarKernels() {}

    /** Rounds and clips a float frame to 8 bits, row by row: the rule of {@link Detectors#toU8}. */
    static void toU8(float[] src, int srcStart, int srcStride, byte[] dst, int dstStart, int dstStride, int width, int height) {
        for (int y = 0; y < height; y++) toU8Row(src, srcStart + y * srcStride, dst, dstStart + y * dstStride, width);
    }

    /** {@code count} pixels from {@code src[si]} to {@code dst[di]}: 0 for v &lt;= 0 or NaN, 255 for v &gt;= 255, else v rounded half up. */
    static void toU8Row(float[] src, int si, byte[] dst, int di, int count) {
        for (int x = 0; x < count; x++) {
            float v = src[si + x];
            dst[di + x] = (byte) (v <= 0 ? 0 : v >= 255 ? 255 : (int) (v + 0.5f));
        }
    }

    /**
     * The compass pre-check of the segment test over the pixels {@code from <= x < to} of one row: writes the x of
     * every pixel of grey c whose E or W ring pixel and whose S or N ring pixel are both brighter than c + t, or both
     * darker than c - t, into {@code out} in increasing order and returns their count (see {@link FastSegmentTest}
     * for why no other pixel can be a corner). Eight pixels are skipped at once when none of their E and W pixels
     * differs from its centre by more than t (bytes compared eight to a long, exactly).
     *
     * @param row index of the row's pixel x = 0 in {@code data}; the offsets are relative to a pixel's index
     */
    static int compassCandidates(byte[] data, int row, int from, int to, int east, int west, int south, int north,
                                 int tolerance, int[] out) {
        int t = tolerance, count = 0;
        long spread = BYTES * t;
        int index = row + from;
        for (int x = from; x < to; x++, index++) {
            // eight pixels at once: skip them when no E or W pixel differs from its centre by more than t
            if ((x - from & 7) == 0 && x + 8 <= to) {
                long cc = (long) LONGS.get(data, index);
                long ee = (long) LONGS.get(data, index + east), ww = (long) LONGS.get(data, index + west);
                long far = subSat(subSat(ee, cc) | subSat(cc, ee), spread) | subSat(subSat(ww, cc) | subSat(cc, ww), spread);
                if (far == 0) {
                    x += 7; index += 7;
                    continue;
                }
            }
            int c = data[index] & 0xFF, upper = c + t, lower = c - t;
            int e = data[index + east] & 0xFF, w = data[index + west] & 0xFF;
            if (e <= upper && w <= upper && e >= lower && w >= lower) continue;
            int s = data[index + south] & 0xFF, n = data[index + north] & 0xFF;
            boolean brighter = (e > upper || w > upper) && (s > upper || n > upper);
            boolean darker = (e < lower || w < lower) && (s < lower || n < lower);
            if (brighter || darker) out[count++] = x;
        }
        return count;
    }

    /** Flag on an x from {@link #corners}: the ring is darker than the centre (else brighter). */
    static final int DARK = 1 << 30;

    /**
     * The segment test over the pixels {@code from <= x < to} of one row: writes the x of every corner into
     * {@code out} in increasing order, or'ed with {@link #DARK} when its arc is darker than the centre, and returns
     * their count. Only the pixels that pass {@link #compassCandidates} are tested further: their ring becomes two bit
     * patterns (bit k set when ring pixel k is brighter than c + t, or darker than c - t), searched for an arc of n
     * by {@link #hasArc}.
     *
     * @param ring the 16 ring offsets ({@code DiscretizedCircle.imageOffsets(3, stride)}); E, S, W, N at 0, 4, 8, 12
     */
    static int corners(byte[] data, int row, int from, int to, int[] ring, int tolerance, int n, int[] out) {
        int candidates = compassCandidates(data, row, from, to, ring[0], ring[8], ring[4], ring[12], tolerance, out);
        int count = 0;
        for (int k = 0; k < candidates; k++) {
            int x = out[k], index = row + x;
            int c = data[index] & 0xFF, upper = c + tolerance, lower = c - tolerance;
            int bright = 0, dark = 0;
            for (int j = 0; j < 16; j++) {
                int p = data[index + ring[j]] & 0xFF;
                bright |= ((upper - p) >>> 31) << j;
                dark |= ((p - lower) >>> 31) << j;
            }
            if (hasArc(bright, n)) out[count++] = x;
            else if (hasArc(dark, n)) out[count++] = x | DARK;
        }
        return count;
    }

    /**
     * Whether the 16-bit ring pattern holds {@code n} (9..12) cyclically contiguous ones: the pattern written twice in
     * an int, runs doubled (bit k of r<sub>2m</sub> = r<sub>m</sub> &amp; (r<sub>m</sub> &gt;&gt;&gt; m): bits
     * k..k+2m-1 all set) up to 8, then joined with the run of n - 8 that follows.
     */
    static boolean hasArc(int pattern, int n) {
        int d = pattern | pattern << 16;
        int r2 = d & (d >>> 1), r4 = r2 & (r2 >>> 2), r8 = r4 & (r4 >>> 4);
        int tail = switch (n) {
            case 9 -> d;
            case 10 -> r2;
            case 11 -> r2 & (d >>> 2);
            default -> r4;
        };
        return (r8 & (tail >>> 8) & 0xFFFF) != 0;
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
}
