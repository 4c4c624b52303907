package org.targetbench.target;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

/** Sheet layout: fit, orientation, refusal with a suggestion, page parsing, and the new generators' geometry. */
class PrintLayoutTest {
    static final PrintConfig CFG = new PrintConfig();

    @Test
    void designSitsInsideTheSheetWithEverythingAround() {
        TargetDesign cb = TargetGenerators.checkerboard("cb", 7, 9, 15, 15);
        PrintLayout l = PrintLayout.of(cb, PageSize.A4, CFG).orElseThrow();
        assertFalse(l.turned());
        assertTrue(l.targetXMm() >= CFG.pageMarginMm + CFG.cutMarkGapMm + CFG.cutMarkLengthMm);
        assertEquals(210, 2 * l.targetXMm() + cb.widthMm(), 1e-9, "centred across the sheet");
        assertEquals(100, l.bar().w(), 0);
        assertEquals(8, l.cutMarks().size());
        assertEquals(11, l.ticks().size()); // 0, 10, ..., 100 mm
        assertTrue(l.bar().y() > l.targetYMm() + cb.heightMm());
        PrintLayout.Text last = l.texts().get(l.texts().size() - 1);
        assertTrue(last.y() < 297 - CFG.pageMarginMm, "text inside the margin");
        assertTrue(l.texts().get(0).text().contains("cb"));
        assertTrue(l.texts().get(1).text().contains("100 %") && l.texts().get(1).text().contains("fit to page")
                && l.texts().get(1).text().contains("matte") && l.texts().get(2).text().contains("measure the bar"));
    }

    @Test
    void wideDesignTurnsTheSheet() {
        TargetDesign wide = TargetGenerators.markerGrid("mk", 2, 3, 25, 60, 15); // 200 x 140 mm
        PrintLayout l = PrintLayout.of(wide, PageSize.A4, CFG).orElseThrow();
        assertTrue(l.turned());
        assertEquals(297, l.page().widthMm(), 0);
    }

    @Test
    void tooLargeDesignIsRefusedNamingASheetThatFits() {
        TargetDesign big = TargetGenerators.checkerboard("big", 12, 16, 20, 20); // 360 x 280 mm
        assertTrue(PrintLayout.of(big, PageSize.A4, CFG).isEmpty());
        String m = PrintLayout.doesNotFit(big, PageSize.A4, CFG);
        assertTrue(m.contains("does not fit A4 (210 x 297 mm)"), m);
        assertTrue(m.contains("A2 (420 x 594 mm) would fit"), m);
        double[] need = PrintLayout.neededSize(big, CFG);
        assertTrue(PrintLayout.of(big, new PageSize("custom", Math.ceil(need[0]), Math.ceil(need[1])), CFG).isPresent());
    }

    @Test
    void pagesParse() {
        assertEquals(PageSize.A4, PageSize.parse("a4"));
        assertEquals(PageSize.LETTER, PageSize.parse("Letter"));
        assertEquals(new PageSize("custom", 300, 200.5), PageSize.parse("300x200.5"));
        for (String bad : new String[]{"B7", "300x", "-300x200", "0x10"}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> PageSize.parse(bad));
            assertTrue(e.getMessage().contains(bad), e.getMessage());
        }
    }

    @Test
    void newGeneratorsPlaceFeaturesWhereTheShapesAre() {
        TargetDesign sq = TargetGenerators.squareGrid("sq", 2, 3, 5, 10, 8);
        assertEquals(2 * 8 + 2 * 10 + 5, sq.widthMm(), 0);
        assertEquals(24, sq.features().size());
        assertEquals(0, sq.reflectance(8.5, 8.5), 0);          // inside the first square
        assertEquals(1, sq.reflectance(14, 8.5), 0);           // in the gap
        assertEquals(13, sq.features().get(1).xMm(), 0);       // top-right corner of the first square
        TargetDesign mk = TargetGenerators.markerGrid("mk", 1, 2, 25, 60, 15);
        TargetFeature f = mk.features().get(0);
        assertEquals(40, f.xMm(), 0);
        assertEquals(0, mk.reflectance(f.xMm() - 1, f.yMm() - 1), 0); // black top-left quadrant
        assertEquals(1, mk.reflectance(f.xMm() + 1, f.yMm() - 1), 0); // white top-right quadrant
        assertEquals(5, TargetMetrics.of(sq).smallestFeatureMm(), 0);
        assertEquals(5, TargetMetrics.of(sq).featureSpacingMm(), 1e-12);
        assertThrows(IllegalArgumentException.class, () -> TargetGenerators.squareGrid("x", 2, 2, 10, 10, 5));
        assertThrows(IllegalArgumentException.class, () -> TargetGenerators.markerGrid("x", 2, 2, 30, 50, 5));
    }
}
