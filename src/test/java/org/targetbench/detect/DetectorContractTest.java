package org.targetbench.detect;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.targetbench.TestScenes;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** The contract every detector keeps (see {@link PointDetector}). */
class DetectorContractTest {
    private static final GrayF32 TEXTURE = TestScenes.texture(320, 240, 7);

    @ParameterizedTest
    @EnumSource(DetectorType.class)
    void findsPointsInsideTheImageStrongestFirst(DetectorType type) {
        List<Detection> d = Detectors.create(type).detect(TEXTURE);
        assertFalse(d.isEmpty(), type + " found nothing on a textured image");
        for (int i = 0; i < d.size(); i++) {
            Detection p = d.get(i);
            assertTrue(p.x() >= 0 && p.y() >= 0 && p.x() <= TEXTURE.width - 1 && p.y() <= TEXTURE.height - 1, "outside: " + p);
            assertTrue(p.response() > 0 && Double.isFinite(p.response()), "response: " + p);
            assertTrue(p.scale() > 0, "scale: " + p);
            if (i > 0) assertTrue(d.get(i - 1).response() >= p.response(), "not sorted at " + i);
        }
    }

    @ParameterizedTest
    @EnumSource(DetectorType.class)
    void respectsMaxFeatures(DetectorType type) {
        DetectorConfig c = DetectorConfig.defaults(type);
        c.maxFeatures = 7;
        List<Detection> d = Detectors.create(c).detect(TEXTURE);
        assertEquals(7, d.size());
        List<Detection> all = Detectors.create(type).detect(TEXTURE);
        assertEquals(all.subList(0, 7), d, "the cap keeps the strongest points of the uncapped run");
    }

    @ParameterizedTest
    @EnumSource(DetectorType.class)
    void isDeterministicAndLeavesTheInputAlone(DetectorType type) {
        GrayF32 copy = TEXTURE.clone();
        PointDetector det = Detectors.create(type);
        List<Detection> a = det.detect(TEXTURE);
        List<Detection> b = det.detect(TEXTURE);
        assertEquals(a, b, "a reused detector must give the same answer");
        assertEquals(a, Detectors.create(type).detect(TEXTURE), "a fresh detector must give the same answer");
        assertArrayEquals(copy.data, TEXTURE.data, "input modified");
    }

    @ParameterizedTest
    @EnumSource(DetectorType.class)
    void findsNothingOnAFlatImage(DetectorType type) {
        GrayF32 flat = new GrayF32(200, 150);
        java.util.Arrays.fill(flat.data, 128f);
        assertEquals(List.of(), Detectors.create(type).detect(flat));
    }

    @ParameterizedTest
    @EnumSource(DetectorType.class)
    void handlesOddSizesAndReshaping(DetectorType type) {
        PointDetector det = Detectors.create(type);
        det.detect(TestScenes.texture(97, 61, 3));
        List<Detection> d = det.detect(TEXTURE);
        assertEquals(Detectors.create(type).detect(TEXTURE), d, "results must not depend on the previous frame size");
    }

    @ParameterizedTest
    @EnumSource(DetectorType.class)
    void badSettingsNameTheValue(DetectorType type) {
        DetectorConfig c = DetectorConfig.defaults(type);
        c.maxFeatures = 0;
        var ex = assertThrows(IllegalArgumentException.class, () -> Detectors.create(c));
        assertTrue(ex.getMessage().contains("maxFeatures") && ex.getMessage().contains("0"), ex.getMessage());
        DetectorConfig r = DetectorConfig.defaults(type);
        r.threshold = 1.5;
        var ex2 = assertThrows(IllegalArgumentException.class, () -> Detectors.create(r));
        assertTrue(ex2.getMessage().contains("1.5"), ex2.getMessage());
    }

    @ParameterizedTest
    @EnumSource(DetectorType.class)
    void copiesAreIndependent(DetectorType type) {
        DetectorConfig c = DetectorConfig.defaults(type);
        DetectorConfig d = c.copy();
        d.maxFeatures = 3;
        assertNotEquals(c.maxFeatures, d.maxFeatures);
        assertEquals(type, d.type());
    }
}
