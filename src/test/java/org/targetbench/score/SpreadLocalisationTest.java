package org.targetbench.score;

import org.junit.jupiter.api.Test;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** Hand-worked spread and localisation figures. */
class SpreadLocalisationTest {
    private static final double EXACT = 1e-12;

    private static Detection p(double x, double y) { return new Detection(x, y, 1, 1); }

    @Test
    void hullOfASquareAndOccupancy() {
        // 40 x 40 px square in a 100 x 100 image: hull fraction 0.16; corners fall in cells (0,0),(2,0),(0,2),(2,2)
        var pts = List.of(p(10, 10), p(50, 10), p(10, 50), p(50, 50), p(30, 30));
        var s = Spread.score(pts, 100, 100);
        assertEquals(0.16, s.hullAreaFraction(), EXACT);
        assertEquals(5 / 16.0, s.cellOccupancy(), EXACT, "cells (0,0),(2,0),(0,2),(2,2),(1,1)");
        assertEquals(Math.hypot(20, 20), s.minDistancePx(), EXACT);
        assertEquals(5, s.count());
    }

    @Test
    void degenerateSets() {
        assertEquals(0, Spread.hullArea(List.of(p(1, 1), p(2, 2))), EXACT);
        assertEquals(0, Spread.hullArea(List.of(p(1, 1), p(2, 2), p(3, 3))), EXACT, "collinear");
        assertTrue(Double.isNaN(Spread.score(List.of(p(1, 1)), 10, 10).minDistancePx()));
    }

    @Test
    void localisationCountsOnlyFeaturesWithinTheRadius() {
        var truth = List.of(new ProjectedFeature(0, 10, 10, 1), new ProjectedFeature(1, 50, 50, 1), new ProjectedFeature(2, 80, 80, 1));
        var det = List.of(p(10.3, 10.4), p(50, 51), p(90, 90));
        var r = Localisation.score(truth, det, 3);
        assertEquals(3, r.nTrue());
        assertEquals(2, r.nFound());
        assertEquals(2 / 3.0, r.foundFraction(), EXACT);
        assertEquals(Math.sqrt((0.25 + 1) / 2), r.rmsPx(), 1e-9);
        assertEquals(0.5, r.medianPx(), 1e-9, "nearest-rank median of {0.5, 1.0}");
        assertEquals(1.0, r.p95Px(), 1e-9);
    }

    @Test
    void percentileIsNearestRank() {
        double[] d = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10};
        assertEquals(5, Stats.percentile(d, 50), EXACT);
        assertEquals(10, Stats.percentile(d, 95), EXACT);
        assertEquals(1, Stats.percentile(d, 1), EXACT);
    }
}
