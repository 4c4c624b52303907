package org.targetbench.detect;

import boofcv.alg.feature.detect.intensity.impl.FastCornerInterface;
import boofcv.alg.feature.detect.intensity.impl.ImplFastCorner10_U8;
import boofcv.alg.feature.detect.intensity.impl.ImplFastCorner11_U8;
import boofcv.alg.feature.detect.intensity.impl.ImplFastCorner12_U8;
import boofcv.alg.feature.detect.intensity.impl.ImplFastCorner9_U8;
import boofcv.misc.DiscretizedCircle;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayU8;
import org.junit.jupiter.api.Test;
import org.targetbench.Simd;
import org.targetbench.detect.reference.ReferenceFastDetector;

import java.util.Arrays;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * FAST's Vector API kernels against their scalar twins, run directly side by side, and both whole paths against the
 * detector as it was before (kept frozen in test scope, {@code detect.reference}): identical points on a demo frame,
 * the same frame perturbed and the Oxford Graffiti image graf1 (frames of {@link FusedKernelEqualityTest}). The
 * vector tests need the module {@code jdk.incubator.vector}, which surefire passes; without it they are skipped and
 * the scalar path is still checked against the reference.
 */
class FastEqualityTest {
    @Test
    void bothPathsFindTheReferencePoints() throws Exception {
        List<GrayF32> frames = new java.util.ArrayList<>(frames());
        // seeded noise, where arcs of 10 to 12 pixels occur too (the renders have few or none)
        Random random = new Random(20261203L);
        GrayF32 noise = new GrayF32(203, 157);
        for (int i = 0; i < noise.data.length; i++) noise.data[i] = random.nextInt(256);
        frames.add(noise);
        for (GrayF32 frame : frames) {
            for (int tolerance : new int[]{10, 20, 40}) {
                for (int contiguous : frame == noise ? new int[]{9, 10, 11, 12} : new int[]{9}) {
                    for (int max : tolerance == 20 ? new int[]{100, 100_000} : new int[]{100_000}) {
                        FastConfig c = new FastConfig();
                        c.pixelTolerance = tolerance;
                        c.minContinuous = contiguous;
                        c.maxFeatures = max;
                        List<Detection> expected = new ReferenceFastDetector(c).detect(frame);
                        String what = "fast t=" + tolerance + " n=" + contiguous + " max=" + max;
                        FusedKernelEqualityTest.assertSamePoints(expected, new FastDetector(c, false).detect(frame), what + " scalar");
                        if (!Simd.ENABLED) continue;
                        FastDetector vector = new FastDetector(c, true);
                        FusedKernelEqualityTest.assertSamePoints(expected, vector.detect(frame), what + " vector");
                        // buffers reused from call to call must not leak into the next frame
                        FusedKernelEqualityTest.assertSamePoints(expected, vector.detect(frame), what + " vector, again");
                    }
                }
            }
        }
    }

    @Test
    void vectorRoundingEqualsScalarRounding() throws Exception {
        assumeTrue(Simd.ENABLED, "needs --add-modules jdk.incubator.vector");
        Random random = new Random(20261202L);
        // edge values: around 0, every half between 0 and 256 and its neighbouring floats, 255 and above, specials
        float[] edges = new float[4 * 520 + 16];
        int k = 0;
        for (int h = -4; h < 516; h++) {
            float half = h * 0.5f;
            edges[k++] = half;
            edges[k++] = Math.nextUp(half);
            edges[k++] = Math.nextDown(half);
            edges[k++] = half + 0.25f;
        }
        for (float f : new float[]{Float.NaN, Float.NEGATIVE_INFINITY, Float.POSITIVE_INFINITY, -0f, Float.MIN_VALUE,
                -Float.MIN_VALUE, Float.MAX_VALUE, -Float.MAX_VALUE, 1e9f, -1e9f, 254.49998f, 254.50002f, 0.49999997f})
            edges[k++] = f;
        assertRoundingEqual(image(Arrays.copyOf(edges, k), 97), "edge values");
        // random floats over -20..300 in images whose width is no multiple of the lane count
        for (int width : new int[]{1, 7, 17, 33, 640}) {
            float[] values = new float[width * 9];
            for (int i = 0; i < values.length; i++) values[i] = -20 + 320 * random.nextFloat();
            assertRoundingEqual(image(values, width), "random, width " + width);
        }
        for (GrayF32 frame : frames()) assertRoundingEqual(frame, "frame");
        // a sub-image (start index and stride differ from a packed image)
        GrayF32 frame = frames().get(0);
        assertRoundingEqual(frame.subimage(5, 3, 600, 400), "sub-image");
    }

    @Test
    void vectorSegmentTestEqualsScalarSegmentTest() {
        assumeTrue(Simd.ENABLED, "needs --add-modules jdk.incubator.vector");
        Random random = new Random(7);
        for (int width : new int[]{7, 20, 70, 71, 133, 640}) {
            for (int blur = 0; blur < 3; blur++) {
                GrayU8 image = new GrayU8(width, 11);
                for (int i = 0; i < image.data.length; i++) image.data[i] = (byte) random.nextInt(256);
                for (int b = 0; b < blur; b++) // smoother rows: fewer candidates, longer runs of skipped pixels
                    for (int i = 1; i < image.data.length; i++)
                        image.data[i] = (byte) (((image.data[i] & 0xFF) + (image.data[i - 1] & 0xFF)) / 2);
                int[] ring = DiscretizedCircle.imageOffsets(FastSegmentTest.RADIUS, image.stride);
                for (int tolerance : new int[]{1, 20, 60, 200, 254})
                    for (int n = 9; n <= 12; n++) {
                        int[] scalar = new int[width], vector = new int[width];
                        byte[] flags = new byte[Math.max(8, FastVectorKernels.LANES)];
                        for (int y = 3; y < image.height - 3; y++) {
                            int row = y * image.stride;
                            for (int from : new int[]{3, 4})
                                for (int to : new int[]{width - 3, width - 4}) {
                                    if (to < from) continue;
                                    int ns = FastScalarKernels.corners(image.data, row, from, to, ring, tolerance, n, scalar);
                                    int nv = FastVectorKernels.corners(image.data, row, from, to, ring, tolerance, n, vector, flags);
                                    String what = "width " + width + " blur " + blur + " t " + tolerance + " n " + n + " row " + y + " x " + from + ".." + to;
                                    assertArrayEquals(Arrays.copyOf(scalar, ns), Arrays.copyOf(vector, nv), what);
                                }
                        }
                    }
            }
        }
    }

    /**
     * The arc test that replaced BoofCV's generated decision trees answers as they do (derived: both decide "n
     * contiguous ring pixels beyond the tolerance on one side"; checked by hand on all 3^16 patterns for n = 9..12,
     * here on a seeded sample and on every single arc of 7 to 16 pixels).
     */
    @Test
    void arcTestAnswersAsBoofCvsDecisionTree() {
        Random random = new Random(3);
        int tolerance = 20, centre = 3 * 7 + 3;
        GrayU8 image = new GrayU8(7, 7);
        int[] ring = DiscretizedCircle.imageOffsets(FastSegmentTest.RADIUS, image.stride);
        image.data[centre] = (byte) 128;
        for (int n = 9; n <= 12; n++) {
            FastCornerInterface<GrayU8> tree = switch (n) {
                case 9 -> new ImplFastCorner9_U8(tolerance);
                case 10 -> new ImplFastCorner10_U8(tolerance);
                case 11 -> new ImplFastCorner11_U8(tolerance);
                default -> new ImplFastCorner12_U8(tolerance);
            };
            tree.setImage(image, ring);
            int corners = 0;
            for (int trial = 0; trial < 200_000; trial++) {
                int[] classes = new int[16]; // 0 neither, 1 brighter, 2 darker
                if (trial < 16 * 10) { // one arc of 7..16 brighter or darker pixels from every start, the rest neither
                    int start = trial % 16, length = 7 + trial / 16 % 10;
                    for (int k = 0; k < length; k++) classes[(start + k) % 16] = 1 + trial % 2;
                } else {
                    int bias = random.nextInt(3); // mostly one class, so that long arcs occur
                    for (int k = 0; k < 16; k++) classes[k] = random.nextInt(4) == 0 ? random.nextInt(3) : bias;
                }
                int bright = 0, dark = 0;
                for (int k = 0; k < 16; k++) {
                    image.data[centre + ring[k]] = (byte) (classes[k] == 0 ? 128 : classes[k] == 1 ? 200 : 50);
                    if (classes[k] == 1) bright |= 1 << k;
                    if (classes[k] == 2) dark |= 1 << k;
                }
                int expected = Integer.signum(tree.checkPixel(centre));
                int actual = FastScalarKernels.hasArc(bright, n) ? 1 : FastScalarKernels.hasArc(dark, n) ? -1 : 0;
                int b = bright, d = dark, length = n;
                assertEquals(expected, actual, () -> "n " + length + ", brighter " + Integer.toBinaryString(b) + ", darker " + Integer.toBinaryString(d));
                if (actual != 0) corners++;
            }
            assertTrue(corners > 1000, "n " + n + ": the sample must hold corners");
        }
    }

    @Test
    void theFramesGiveCandidatesAndCorners() throws Exception {
        // guards the checks above against passing on frames where the compass check finds nothing
        GrayF32 frame = frames().get(0);
        FastConfig c = new FastConfig();
        c.maxFeatures = 100_000;
        assertTrue(new FastDetector(c, false).detect(frame).size() > 100, "the demo frame must give FAST corners");
    }

    private static List<GrayF32> frames;

    /** The demo, perturbed and graf1 frames, rendered and read once for all tests of this class. */
    private static synchronized List<GrayF32> frames() throws Exception {
        if (frames == null) frames = FusedKernelEqualityTest.frames();
        return frames;
    }

    private static void assertRoundingEqual(GrayF32 image, String what) {
        GrayU8 scalar = Detectors.toU8(image, new GrayU8(1, 1));
        GrayU8 vector = new GrayU8(image.width, image.height);
        FastVectorKernels.toU8(image.data, image.startIndex, image.stride, vector.data, vector.startIndex, vector.stride, image.width, image.height);
        GrayU8 twin = new GrayU8(image.width, image.height);
        FastScalarKernels.toU8(image.data, image.startIndex, image.stride, twin.data, twin.startIndex, twin.stride, image.width, image.height);
        for (int y = 0; y < image.height; y++)
            for (int x = 0; x < image.width; x++) {
                int px = x, py = y;
                assertEquals(scalar.get(x, y), vector.get(x, y), () -> what + ": pixel " + px + "," + py + " = " + image.get(px, py));
                assertEquals(scalar.get(x, y), twin.get(x, y), () -> what + ": scalar twin, pixel " + px + "," + py);
            }
    }

    private static GrayF32 image(float[] values, int width) {
        int height = (values.length + width - 1) / width;
        GrayF32 g = new GrayF32(width, height);
        System.arraycopy(values, 0, g.data, 0, values.length);
        return g;
    }
}
