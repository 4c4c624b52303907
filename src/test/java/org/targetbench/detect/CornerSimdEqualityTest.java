package org.targetbench.detect;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.targetbench.detect.reference.ReferenceCornerDetector;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The vector loops of the Harris / Shi-Tomasi kernel ({@link CornerVectors}) against their scalar twins, both run
 * directly whatever {@code -Dtargetbench.simd} says: the response image bit for bit, the largest response, and the
 * points of the whole detector (on the crops also against the frozen reference, {@code detect.reference}; the full
 * frames are held to it by {@link FusedKernelEqualityTest}). Frames: a demo frame, the same frame perturbed, graf1 (Oxford Graffiti,
 * Mikolajczyk et al. 2005, IJCV 65; Debian opencv-doc, see reference/PROVENANCE.md), and crops of them whose widths are
 * not a multiple of any vector length and whose stride differs from their width (the scalar remainder, sub-images).
 */
class CornerSimdEqualityTest {
    /** Widths of the crops: below one vector, odd, one past a multiple of 16, not a multiple of 4. */
    static final int[] CROP_WIDTHS = {7, 13, 33, 97, 250};

    @Test
    void theVectorModuleIsPresentInTests() {
        // surefire passes --add-modules jdk.incubator.vector (pom.xml); without it the vector path below cannot run
        assertTrue(ModuleLayer.boot().findModule("jdk.incubator.vector").isPresent());
    }

    @Test
    void vectorResponseEqualsScalarResponseBitForBit() throws Exception {
        for (GrayF32 frame : frames()) {
            for (int radius : new int[]{1, 2, 3, 4}) {
                for (boolean harris : new boolean[]{true, false}) {
                    CornerResponse scalar = new CornerResponse(radius, harris, 0.04, false);
                    CornerResponse vector = new CornerResponse(radius, harris, 0.04, true);
                    String what = frame.width + "x" + frame.height + " r=" + radius + " harris=" + harris;
                    if (!scalar.handles(frame.width, frame.height)) continue;
                    GrayF32 a = new GrayF32(1, 1), b = new GrayF32(1, 1);
                    // twice each, so the reused buffers of a second call are checked too
                    for (int pass = 0; pass < 2; pass++) {
                        float maxA = scalar.process(frame, a), maxB = vector.process(frame, b);
                        assertEquals(Float.floatToIntBits(maxA), Float.floatToIntBits(maxB), what + ": largest response");
                        int differ = -1;
                        for (int i = 0; i < frame.width * frame.height && differ < 0; i++)
                            if (Float.floatToIntBits(a.data[i]) != Float.floatToIntBits(b.data[i])) differ = i;
                        assertEquals(-1, differ, what + ": first differing pixel (index y * width + x)");
                    }
                }
            }
        }
    }

    @Test
    void vectorDetectorGivesTheScalarAndReferencePoints() throws Exception {
        for (GrayF32 frame : frames()) {
            if (frame.width < 40) continue; // too few corners in the narrowest crops to say anything
            for (CornerConfig c : configs()) {
                c.refine = RefineConfig.off();
                String what = c.type() + " r=" + c.windowRadius + " nms=" + c.nmsRadius + " on " + frame.width + "x" + frame.height;
                List<Detection> scalar = new CornerDetector(c, false).detect(frame);
                List<Detection> vector = new CornerDetector(c, true).detect(frame);
                assertTrue(!scalar.isEmpty(), what + ": the frame must give points");
                assertEquals(scalar, vector, what + ": vector and scalar points");
                // the full frames are held to the reference by FusedKernelEqualityTest; here the crops
                if (frame.isSubimage())
                    FusedKernelEqualityTest.assertSamePoints(new ReferenceCornerDetector(c).detect(frame), scalar, what + " scalar");
            }
        }
    }

    @Test
    void thresholdScanFindsTheSameFirstPixel() {
        java.util.Random random = new java.util.Random(7);
        float[] d = new float[301];
        for (int trial = 0; trial < 2000; trial++) {
            for (int i = 0; i < d.length; i++) d[i] = random.nextFloat() < 0.02 ? 2f : random.nextFloat();
            if (trial % 7 == 0) d[random.nextInt(d.length)] = Float.NaN;
            int from = random.nextInt(d.length), to = from + random.nextInt(d.length - from + 1);
            int expected = to;
            for (int i = from; i < to; i++) if (d[i] >= 1.5f) { expected = i; break; }
            assertEquals(expected, CornerVectors.firstAtLeast(d, from, to, 1.5f), "trial " + trial);
        }
    }

    /** Default Harris and Shi-Tomasi, and both with window, suppression and count at unusual values. */
    static List<CornerConfig> configs() {
        List<CornerConfig> out = new ArrayList<>();
        out.add(new HarrisConfig());
        out.add(new ShiTomasiConfig());
        HarrisConfig h = new HarrisConfig();
        h.windowRadius = 3; h.nmsRadius = 5; h.maxFeatures = 100;
        out.add(h);
        ShiTomasiConfig s = new ShiTomasiConfig();
        s.windowRadius = 1; s.nmsRadius = 1; s.maxFeatures = 2000; s.threshold = 0.001;
        out.add(s);
        return out;
    }

    private static List<GrayF32> frames;

    /** The equality test's frames, then crops of the perturbed frame and graf1 (sub-images: stride > width). */
    static synchronized List<GrayF32> frames() throws Exception {
        if (frames != null) return frames;
        List<GrayF32> full = FusedKernelEqualityTest.frames();
        List<GrayF32> out = new ArrayList<>(full);
        for (int w : CROP_WIDTHS) {
            out.add(full.get(1).subimage(101, 57, 101 + w, 57 + Math.min(60, 2 * w)));
            out.add(full.get(2).subimage(203, 111, 203 + w, 111 + 41));
        }
        frames = List.copyOf(out);
        return frames;
    }
}
