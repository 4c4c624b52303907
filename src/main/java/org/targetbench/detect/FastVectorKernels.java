package org.targetbench.detect;

import jdk.incubator.vector.ByteVector;
import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.IntVector;
import jdk.incubator.vector.VectorMask;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorShape;
import jdk.incubator.vector.VectorSpecies;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;

/**
 * The Vector API kernels of FAST (the incubator module {@code jdk.incubator.vector}): the float-to-8-bit rounding of
 * the frame and the segment test, many pixels per instruction. Load this class only behind
 * {@link org.targetbench.Simd#ENABLED}.
 *
 * <p>Each kernel has a scalar twin with identical output ({@link FastScalarKernels}); {@code FastEqualityTest} runs
 * both directly and compares them. Every operation is lane-wise (no reduction, no reordering of float arithmetic),
 * and the pixels left over at the end of a row are handled by the scalar twin or by re-reading an overlapping block,
 * so the output does not depend on the lane count (the preferred shape capped at 256 bits: 8 float or 32 byte lanes
 * with AVX2 or AVX-512; 128-bit machines get 4 and 16, and round in scalar code).
 */
final class FastVectorKernels {
    private FastVectorKernels() {}

    /**
     * The preferred shape, at most 256 bits: on the AVX-512 machine the rounding ran at 0.044 ms per 640 x 480 frame
     * with 256-bit vectors and 0.079 ms with 512-bit ones (the wide narrowing conversion and double-pumped 512-bit
     * operations), and the segment test was not faster with 512 either. AVX2 machines get 256 bits as well.
     */
    private static final VectorShape SHAPE = VectorShape.forBitSize(Math.min(256, VectorShape.preferredShape().vectorBitSize()));
    private static final VectorSpecies<Float> FLOATS = FloatVector.SPECIES_PREFERRED.withShape(SHAPE);
    private static final VectorSpecies<Integer> INTS = IntVector.SPECIES_PREFERRED.withShape(SHAPE);
    /** As many byte lanes as {@link #FLOATS} has float lanes (a quarter of the bits; 64 at least, as the API has). */
    private static final VectorSpecies<Byte> NARROW =
            VectorSpecies.of(byte.class, VectorShape.forBitSize(Math.max(64, FLOATS.vectorBitSize() / 4)));
    /** Whether {@link #NARROW} holds exactly one byte per float lane (256 bits up); else the rounding stays scalar. */
    private static final boolean ROUND_IN_VECTORS = FLOATS.length() == NARROW.length();
    private static final VectorSpecies<Byte> BYTES = ByteVector.SPECIES_PREFERRED.withShape(SHAPE);
    /** Byte lanes of the segment test (16 or 32: a multiple of 8). */
    static final int LANES = BYTES.length();
    /** Eight bytes of an array read as one long (little-endian: lane j in byte j). */
    private static final VarHandle LONGS = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);

    /** 2^23: adding it to a float in [0, 2^23) leaves that float rounded to an integer in the low mantissa bits. */
    private static final float MAGIC = 8388608f;

    /**
     * Rounds and clips a float frame to 8 bits: 0 for v &lt;= 0 (and NaN), 255 for v &gt;= 255, otherwise
     * {@code (int) (v + 0.5f)}; the rule of {@link FastScalarKernels#toU8}, giving the same byte for every float
     * (derived, and checked over every float from -1 to 300 by {@code FastEqualityTest}'s sampling and by hand).
     *
     * <p>How (JDK 17 compiles no vector float-to-int conversion, so this avoids one): r = min(v + 0.5, 255.5) where
     * v &gt; 0, else 0 (v + 0.5 is the same float addition as the scalar rule's, a NaN fails v &gt; 0, and everything
     * from 254.5 up ends in 255). Then r + 2^23 holds q, r rounded to the nearest integer, in its low mantissa bits
     * (exactly: the floats in [2^23, 2^24) are the integers), floor(r) = q - 1 where q &gt; r, else q, and the
     * narrowing int-to-byte conversion keeps the low byte of those bits, floor(r).
     */
    static void toU8(float[] src, int srcStart, int srcStride, byte[] dst, int dstStart, int dstStride, int width, int height) {
        int lanes = FLOATS.length();
        int bound = ROUND_IN_VECTORS ? width - width % lanes : 0;
        for (int y = 0; y < height; y++) {
            int si = srcStart + y * srcStride, di = dstStart + y * dstStride;
            int x = 0;
            for (; x < bound; x += lanes) {
                FloatVector v = FloatVector.fromArray(FLOATS, src, si + x);
                FloatVector r = v.add(0.5f);
                r = r.blend(255.5f, r.compare(VectorOperators.GT, 255.5f)).blend(0f, v.compare(VectorOperators.GT, 0f).not());
                FloatVector shifted = r.add(MAGIC); // bits: 2^23 + q, q = r rounded to the nearest integer
                VectorMask<Integer> roundedUp = shifted.sub(MAGIC).compare(VectorOperators.GT, r).cast(INTS);
                IntVector bits = shifted.reinterpretAsInts().sub(1, roundedUp); // 2^23 + floor(r)
                ((ByteVector) bits.convertShape(VectorOperators.I2B, NARROW, 0)).intoArray(dst, di + x);
            }
            FastScalarKernels.toU8Row(src, si + x, dst, di + x, width - x);
        }
    }

    /**
     * The segment test over the pixels {@code from <= x < to} of one row: the rule, output and order of
     * {@link FastScalarKernels#corners}. Per block of {@link #LANES} pixels: the compass pre-check (E and W first, and
     * the block skipped when no lane passes), then, when a lane passes, the whole ring: for each of the 16 + n - 1
     * ring positions in turn (the first n - 1 twice, so arcs through position 0 count), the length of the current run
     * of brighter (darker) pixels per lane, and its maximum; a corner where the maximum reaches n.
     *
     * @param row   index of the row's pixel x = 0 in {@code data}
     * @param ring  the 16 ring offsets ({@code DiscretizedCircle.imageOffsets(3, stride)}); E, S, W, N at 0, 4, 8, 12
     * @param flags scratch of at least {@link #LANES} bytes
     */
    static int corners(byte[] data, int row, int from, int to, int[] ring, int tolerance, int n, int[] out, byte[] flags) {
        int lanes = LANES;
        if (to - from < lanes) return FastScalarKernels.corners(data, row, from, to, ring, tolerance, n, out);
        int count = 0;
        int east = ring[0], south = ring[4], west = ring[8], north = ring[12];
        byte t = (byte) tolerance, top = (byte) (255 - tolerance), one = 1, length = (byte) n;
        ByteVector zero = ByteVector.zero(BYTES);
        for (int x0 = from; x0 < to; x0 += lanes) {
            // the last block overlaps the one before; its lanes below x0 were already tested
            int start = Math.min(x0, to - lanes);
            int i = row + start;
            ByteVector c = ByteVector.fromArray(BYTES, data, i);
            // c + t and c - t, clipped to 0..255 (a clipped bound can never be passed, as with the int arithmetic)
            ByteVector upper = c.add(t).blend((byte) -1, c.compare(VectorOperators.UNSIGNED_GT, top));
            ByteVector lower = c.sub(t).blend((byte) 0, c.compare(VectorOperators.UNSIGNED_LT, t));
            ByteVector e = ByteVector.fromArray(BYTES, data, i + east), w = ByteVector.fromArray(BYTES, data, i + west);
            VectorMask<Byte> brightEW = e.compare(VectorOperators.UNSIGNED_GT, upper).or(w.compare(VectorOperators.UNSIGNED_GT, upper));
            VectorMask<Byte> darkEW = e.compare(VectorOperators.UNSIGNED_LT, lower).or(w.compare(VectorOperators.UNSIGNED_LT, lower));
            if (!brightEW.or(darkEW).anyTrue()) continue;
            ByteVector s = ByteVector.fromArray(BYTES, data, i + south), nn = ByteVector.fromArray(BYTES, data, i + north);
            VectorMask<Byte> bright = brightEW.and(s.compare(VectorOperators.UNSIGNED_GT, upper).or(nn.compare(VectorOperators.UNSIGNED_GT, upper)));
            VectorMask<Byte> dark = darkEW.and(s.compare(VectorOperators.UNSIGNED_LT, lower).or(nn.compare(VectorOperators.UNSIGNED_LT, lower)));
            if (!bright.or(dark).anyTrue()) continue;
            ByteVector runBright = zero, runDark = zero, longestBright = zero, longestDark = zero;
            for (int k = 0; k < 15 + n; k++) {
                ByteVector p = ByteVector.fromArray(BYTES, data, i + ring[k & 15]);
                runBright = zero.blend(runBright.add(one), p.compare(VectorOperators.UNSIGNED_GT, upper));
                runDark = zero.blend(runDark.add(one), p.compare(VectorOperators.UNSIGNED_LT, lower));
                longestBright = longestBright.max(runBright);
                longestDark = longestDark.max(runDark);
            }
            VectorMask<Byte> brightCorner = longestBright.compare(VectorOperators.GE, length);
            VectorMask<Byte> darkCorner = longestDark.compare(VectorOperators.GE, length);
            if (!brightCorner.or(darkCorner).anyTrue()) continue;
            // the masks as bytes, 1 brighter and 2 darker (JDK 17 compiles no mask-to-long), read back eight to a long
            zero.blend((byte) 1, brightCorner).blend((byte) 2, darkCorner).intoArray(flags, 0);
            for (int j = 0; j < lanes; j += 8) {
                long bits = (long) LONGS.get(flags, j);
                while (bits != 0) {
                    int lowest = Long.numberOfTrailingZeros(bits) & ~7;
                    int x = start + j + (lowest >>> 3);
                    if (x >= x0) out[count++] = (bits >>> lowest & 0xFF) == 2 ? x | FastScalarKernels.DARK : x;
                    bits &= ~(0xFFL << lowest);
                }
            }
        }
        return count;
    }
}
