package org.targetbench.detect;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.targetbench.detect.reference.ReferenceCornerDetector;
import org.targetbench.detect.reference.ReferenceFastDetector;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.SyntheticSource;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The fused Harris / Shi-Tomasi kernel and the faster FAST must give the same output as the detectors they replaced,
 * kept frozen in test scope ({@code detect.reference}): identical points (same count, same order, positions within
 * {@link #POSITION_TOL} px, sub-pixel peak fit included, sub-pixel refinement excluded) and responses within
 * {@link #RESPONSE_REL} relative. Frames: a demo frame, the same frame perturbed (seeded noise, gain and offset), and
 * the Oxford Graffiti image graf1 (Mikolajczyk et al. 2005, IJCV 65; Debian opencv-doc, see
 * reference/PROVENANCE.md), with the default settings and a few others.
 */
class FusedKernelEqualityTest {
    /** Positions of the same point, px (before refinement the kernels must agree to rounding). */
    static final double POSITION_TOL = 1e-9;
    /** Relative tolerance on responses. */
    static final double RESPONSE_REL = 1e-4;

    @Test
    void harrisAndShiTomasiMatchTheReference() throws Exception {
        for (GrayF32 frame : frames()) {
            for (CornerConfig c : cornerConfigs()) {
                c.refine = RefineConfig.off();
                List<Detection> expected = new ReferenceCornerDetector(c).detect(frame);
                List<Detection> actual = Detectors.create(c).detect(frame);
                assertSamePoints(expected, actual, c.type() + " r=" + c.windowRadius + " nms=" + c.nmsRadius);
            }
        }
    }

    @Test
    void fusedResponseEqualsTheLibraryPipelineEverywhere() throws Exception {
        GrayF32 frame = frames().get(1);
        for (int radius : new int[]{1, 2, 3}) {
            for (boolean harris : new boolean[]{true, false}) {
                var intensity = harris
                        ? boofcv.factory.feature.detect.intensity.FactoryIntensityPointAlg.harris(radius, 0.04f, true, GrayF32.class)
                        : boofcv.factory.feature.detect.intensity.FactoryIntensityPointAlg.shiTomasi(radius, true, GrayF32.class);
                GrayF32 dx = frame.createSameShape(), dy = frame.createSameShape(), expected = frame.createSameShape();
                boofcv.factory.filter.derivative.FactoryDerivative.sobel(GrayF32.class, GrayF32.class).process(frame, dx, dy);
                intensity.process(dx, dy, expected);
                GrayF32 actual = new GrayF32(1, 1);
                float max = new CornerResponse(radius, harris, 0.04).process(frame, actual);
                for (int i = 0; i < expected.data.length; i++)
                    assertEquals(Float.floatToIntBits(expected.data[i]), Float.floatToIntBits(actual.data[i]),
                            "r=" + radius + " harris=" + harris + " pixel " + (i % frame.width) + "," + (i / frame.width));
                assertEquals(boofcv.alg.misc.ImageStatistics.max(expected), max, 0f);
            }
        }
    }

    @Test
    void fastMatchesTheReference() throws Exception {
        for (GrayF32 frame : frames()) {
            for (int tolerance : new int[]{10, 40}) {
                FastConfig c = new FastConfig();
                c.pixelTolerance = tolerance;
                for (int max : new int[]{100, 100_000}) {
                    c.maxFeatures = max;
                    List<Detection> expected = new ReferenceFastDetector(c).detect(frame);
                    List<Detection> actual = Detectors.create(c).detect(frame);
                    assertSamePoints(expected, actual, "fast t=" + tolerance + " max=" + max);
                }
            }
        }
    }

    /** The eight-lane saturating subtraction of the FAST scan, for every pair of bytes in every lane (derived). */
    @Test
    void laneSubtractionSaturatesAtZero() {
        Random random = new Random(11);
        for (int a = 0; a < 256; a++)
            for (int b = 0; b < 256; b++) {
                int lane = (a * 256 + b) % 8, shift = 8 * lane;
                long la = (random.nextLong() & ~(0xFFL << shift)) | ((long) a << shift);
                long lb = (random.nextLong() & ~(0xFFL << shift)) | ((long) b << shift);
                assertEquals(Math.max(a - b, 0), (int) ((FastScalarKernels.subSat(la, lb) >>> shift) & 0xFF), a + " - " + b);
            }
    }

    /** The settings both paths of the corner kernels are checked with, plus the box window. */
    private static List<CornerConfig> cornerConfigs() {
        List<CornerConfig> out = CornerSimdEqualityTest.configs();
        ShiTomasiConfig box = new ShiTomasiConfig();
        box.weighted = false;
        out.add(box);
        return out;
    }

    static void assertSamePoints(List<Detection> expected, List<Detection> actual, String what) {
        assertEquals(expected.size(), actual.size(), what + ": count");
        assertTrue(!expected.isEmpty(), what + ": the frame must give points");
        for (int i = 0; i < expected.size(); i++) {
            Detection e = expected.get(i), a = actual.get(i);
            assertEquals(e.x(), a.x(), POSITION_TOL, what + ": x of point " + i);
            assertEquals(e.y(), a.y(), POSITION_TOL, what + ": y of point " + i);
            assertEquals(e.response(), a.response(), RESPONSE_REL * Math.abs(e.response()), what + ": response of point " + i);
            assertEquals(e.scale(), a.scale(), 0, what + ": scale of point " + i);
        }
    }

    static List<GrayF32> frames() throws Exception {
        GrayF32 demo;
        try (SyntheticSource source = DemoScenario.source()) {
            Optional<SourceFrame> f = source.next();
            demo = f.orElseThrow().image().clone();
        }
        GrayF32 perturbed = demo.createSameShape();
        Random random = new Random(20261202L);
        for (int i = 0; i < demo.data.length; i++)
            perturbed.data[i] = (float) Math.max(0, Math.min(255, 0.8 * demo.data[i] + 20 + 6 * random.nextGaussian()));
        GrayF32 graf = ImageFiles.read(Path.of("src/test/resources/reference/graf1.png"));
        return List.of(demo, perturbed, graf);
    }
}
