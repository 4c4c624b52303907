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
        assertEquals(6 * 8 + 2 * (7 + 9), d.features().size(), "48 inner x-corners, then every boundary grid point (all touch a black square on 7 x 9)");
        for (int i = 0; i < d.features().size(); i++)
            assertEquals(i < 48 ? FeatureKind.X_CORNER : FeatureKind.CORNER, d.features().get(i).kind(), "feature " + i);
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
    void checkerboardOuterLCornersAreTheBoundaryCornersOfBlackSquares() {
        TargetDesign d = TargetGenerators.checkerboard("cb", 7, 8, 15, 12);
        // 7 x 8: the top-right and bottom-right boundary squares are white, so those two board corners are no L-corners
        assertEquals(6 * 7 + 2 * (7 + 8) - 2, d.features().size());
        java.util.List<TargetFeature> l = d.features().stream().filter(f -> f.kind() == FeatureKind.CORNER).toList();
        assertEquals(28, l.size());
        assertTrue(l.stream().anyMatch(f -> f.xMm() == 12 && f.yMm() == 12), "top-left board corner");
        assertTrue(l.stream().anyMatch(f -> f.xMm() == 12 && f.yMm() == 12 + 7 * 15), "bottom-left board corner");
        assertTrue(l.stream().noneMatch(f -> f.xMm() == 12 + 8 * 15 && f.yMm() == 12), "top-right square is white");
        for (TargetFeature f : l) {
            // an L-corner: exactly one of the four quadrants around it is black (derived from the layout)
            int black = 0;
            for (double[] q : new double[][]{{-1, -1}, {1, -1}, {-1, 1}, {1, 1}}) if (d.reflectance(f.xMm() + q[0], f.yMm() + q[1]) == 0.0) black++;
            assertEquals(1, black, "L-corner at " + f.xMm() + ", " + f.yMm());
            assertTrue(FeatureVisibility.drawn(d, f));
        }
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
