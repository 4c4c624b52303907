package org.targetbench.detect;

import boofcv.abst.feature.detect.interest.ConfigFastCorner;
import boofcv.abst.feature.detect.interest.ConfigGeneralDetector;
import boofcv.alg.feature.detect.intensity.FastCornerDetector;
import boofcv.alg.feature.detect.interest.GeneralFeatureDetector;
import boofcv.factory.feature.detect.intensity.FactoryIntensityPointAlg;
import boofcv.factory.feature.detect.interest.FactoryDetectPoint;
import boofcv.struct.ListIntPoint2D;
import boofcv.struct.QueueCorner;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayS16;
import boofcv.struct.image.GrayU8;
import georegression.struct.point.Point2D_I16;
import org.junit.jupiter.api.Test;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.SyntheticSource;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * {@link FastDetector} must find exactly what BoofCV's general FAST detector finds (segment test, full-image strict
 * non-maximum suppression per polarity), merged by |score| and cut to maxFeatures. The reference below is that
 * straightforward pipeline; the detector takes shortcuts that must not change a single point. The segment test on its
 * own must reproduce BoofCV's score image exactly.
 */
class FastDetectorTest {
    @Test
    void matchesReferenceOnDemoFrames() {
        List<GrayF32> frames = new ArrayList<>();
        try (SyntheticSource source = DemoScenario.source()) {
            for (Optional<SourceFrame> f = source.next(); f.isPresent() && frames.size() < 4; f = source.next())
                frames.add(f.get().image());
        }
        for (GrayF32 frame : frames) assertSame(new FastConfig(), frame);
    }

    @Test
    void matchesReferenceOnHardImagesAndSettings() {
        Random random = new Random(20261202L);
        List<GrayF32> images = List.of(noise(random, 97, 71, 0), noise(random, 160, 120, 2), checkerboard(random, 128, 96));
        for (GrayF32 image : images)
            for (int tolerance : new int[]{3, 20, 60})
                for (int contiguous = 9; contiguous <= 12; contiguous++)
                    for (int nms : new int[]{1, 3, 6})
                        for (int max : new int[]{50, 100_000}) {
                            FastConfig c = new FastConfig();
                            c.pixelTolerance = tolerance;
                            c.minContinuous = contiguous;
                            c.nmsRadius = nms;
                            c.maxFeatures = max;
                            assertSame(c, image);
                        }
    }

    @Test
    void segmentTestMatchesBoofCvScoreForScore() {
        Random random = new Random(7);
        List<GrayF32> images = List.of(noise(random, 90, 64, 0), noise(random, 90, 64, 1), noise(random, 90, 64, 3),
                checkerboard(random, 90, 64));
        for (GrayF32 image : images) {
            GrayU8 u8 = Detectors.toU8(image, new GrayU8(1, 1));
            for (int tolerance : new int[]{1, 10, 20, 40, 90})
                for (int contiguous = 9; contiguous <= 12; contiguous++) {
                    FastCornerDetector<GrayU8> boof = FactoryIntensityPointAlg.fast(tolerance, contiguous, GrayU8.class);
                    GrayF32 expected = new GrayF32(u8.width, u8.height), actual = new GrayF32(u8.width, u8.height);
                    boof.process(u8, expected);
                    FastSegmentTest ours = new FastSegmentTest(tolerance, contiguous);
                    ours.process(u8, actual);
                    String what = "tolerance " + tolerance + ", n " + contiguous;
                    assertArrayEquals(expected.data, actual.data, what);
                    assertEquals(points(boof.getCandidatesLow()), points(ours.negative), what);
                    assertEquals(points(boof.getCandidatesHigh()), points(ours.positive), what);
                }
        }
    }

    private static Set<Point2D_I16> points(ListIntPoint2D list) {
        Set<Point2D_I16> out = new HashSet<>();
        for (int i = 0; i < list.size(); i++) {
            Point2D_I16 p = new Point2D_I16();
            list.get(i, p);
            out.add(p);
        }
        return out;
    }

    private static void assertSame(FastConfig config, GrayF32 image) {
        List<Detection> expected = reference(config, image);
        List<Detection> actual = Detectors.create(config).detect(image);
        String what = "tolerance " + config.pixelTolerance + ", n " + config.minContinuous + ", nms " + config.nmsRadius
                + ", max " + config.maxFeatures + ", " + image.width + "x" + image.height;
        assertEquals(expected, actual, what);
        // the same detector twice in a row (buffers reused) must agree with itself as well
        PointDetector again = Detectors.create(config);
        again.detect(image);
        assertEquals(expected, again.detect(image), what + " (second call)");
    }

    /** The plain pipeline: BoofCV's general FAST detector without a cap, both polarities merged by |score|. */
    private static List<Detection> reference(FastConfig config, GrayF32 image) {
        GeneralFeatureDetector<GrayU8, GrayS16> detector = FactoryDetectPoint.createFast(
                new ConfigGeneralDetector(-1, config.nmsRadius, 0f),
                new ConfigFastCorner(config.pixelTolerance, config.minContinuous), GrayU8.class);
        detector.setFeatureLimit(-1);
        detector.process(Detectors.toU8(image, new GrayU8(1, 1)), null, null, null, null, null);
        GrayF32 score = detector.getIntensity();
        List<Detection> candidates = new ArrayList<>();
        double strongest = 0;
        for (QueueCorner set : new QueueCorner[]{detector.getMinimums(), detector.getMaximums()}) {
            for (int i = 0; i < set.size; i++) {
                Point2D_I16 p = set.get(i);
                double s = Math.abs(score.unsafe_get(p.x, p.y));
                strongest = Math.max(strongest, s);
                candidates.add(new Detection(p.x, p.y, s, FastDetector.CIRCLE_RADIUS));
            }
        }
        List<Detection> out = Detectors.select(candidates, config, strongest);
        return out;
    }

    /** Uniform noise, optionally box-blurred {@code blur} times so that corners cluster and scores tie. */
    private static GrayF32 noise(Random random, int w, int h, int blur) {
        GrayF32 g = new GrayF32(w, h);
        for (int i = 0; i < g.data.length; i++) g.data[i] = random.nextInt(256);
        for (int k = 0; k < blur; k++) {
            GrayF32 b = g.createSameShape();
            for (int y = 0; y < h; y++)
                for (int x = 0; x < w; x++) {
                    float sum = 0;
                    int n = 0;
                    for (int j = Math.max(0, y - 1); j <= Math.min(h - 1, y + 1); j++)
                        for (int i = Math.max(0, x - 1); i <= Math.min(w - 1, x + 1); i++) { sum += g.get(i, j); n++; }
                    b.set(x, y, sum / n);
                }
            g = b;
        }
        return g;
    }

    /** A hard-edged checkerboard of 8 px squares with mild noise: many equal scores next to each other. */
    private static GrayF32 checkerboard(Random random, int w, int h) {
        GrayF32 g = new GrayF32(w, h);
        for (int y = 0; y < h; y++)
            for (int x = 0; x < w; x++)
                g.set(x, y, (((x / 8) + (y / 8)) % 2 == 0 ? 40 : 210) + (float) random.nextGaussian());
        return g;
    }
}
