package org.targetbench.target;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

class TargetGeneratorsTest {
    private static final double EXACT = 1e-12;

    @Test
    void checkerboardGeometry() {
        TargetDesign d = TargetGenerators.checkerboard("cb", 7, 9, 15, 12);
        assertEquals(9 * 15 + 24, d.widthMm(), EXACT);
        assertEquals(7 * 15 + 24, d.heightMm(), EXACT);
        assertEquals(6 * 8, d.features().size());
        TargetFeature first = d.features().get(0);
        assertEquals(27, first.xMm(), EXACT);
        assertEquals(27, first.yMm(), EXACT);
        assertEquals(FeatureKind.X_CORNER, first.kind());
        // around an x-corner the four quadrants alternate
        assertEquals(0.0, d.reflectance(26, 26), EXACT, "top-left square of corner (1,1) is square (0,0): black");
        assertEquals(1.0, d.reflectance(28, 26), EXACT);
        assertEquals(1.0, d.reflectance(26, 28), EXACT);
        assertEquals(0.0, d.reflectance(28, 28), EXACT);
        assertEquals(1.0, d.reflectance(5, 5), EXACT, "quiet zone is white");
        assertTrue(Double.isNaN(d.reflectance(-1, 5)), "off the page");
    }

    @Test
    void dotGridGeometry() {
        TargetDesign d = TargetGenerators.dotGrid("dots", 3, 4, 20, 10, 5);
        assertEquals(12, d.features().size());
        assertEquals(10, d.features().get(0).xMm(), EXACT);
        assertEquals(0.0, d.reflectance(10, 10), EXACT);
        assertEquals(1.0, d.reflectance(20, 10), EXACT);
        assertThrows(IllegalArgumentException.class, () -> TargetGenerators.dotGrid("x", 3, 4, 10, 10, 5));
    }

    @Test
    void xCornerFieldIsSeededAndSpaced() {
        TargetDesign a = TargetGenerators.xCornerField("xc", 20, 25, 6, 200, 160, 10, 7);
        TargetDesign b = TargetGenerators.xCornerField("xc", 20, 25, 6, 200, 160, 10, 7);
        TargetDesign c = TargetGenerators.xCornerField("xc", 20, 25, 6, 200, 160, 10, 8);
        assertEquals(a, b, "same seed, same design");
        assertNotEquals(a.features(), c.features());
        for (TargetFeature f : a.features())
            for (TargetFeature g : a.features())
                if (f != g) assertTrue(Math.hypot(f.xMm() - g.xMm(), f.yMm() - g.yMm()) >= 25);
        // each x-corner: opposite quadrants share a shade
        TargetFeature f = a.features().get(0);
        double r = 2;
        double q1 = a.reflectance(f.xMm() + r, f.yMm() + 0.5), q3 = a.reflectance(f.xMm() - r, f.yMm() - 0.5);
        assertEquals(q1, q3, EXACT);
    }

    @Test
    void impossibleFieldSaysHowManyFitted() {
        var e = assertThrows(IllegalArgumentException.class, () -> TargetGenerators.xCornerField("xc", 500, 30, 6, 100, 100, 5, 1));
        assertTrue(e.getMessage().contains("of 500"), e.getMessage());
        var e2 = assertThrows(IllegalArgumentException.class, () -> TargetGenerators.xCornerField("xc", 5, 10, 6, 100, 100, 5, 1));
        assertTrue(e2.getMessage().contains("overlap"), e2.getMessage());
    }
}
