package org.targetbench.score;

import org.junit.jupiter.api.Test;
import org.targetbench.camera.Homography;
import org.targetbench.detect.Detection;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Hand-worked cases of the repeatability rules of Schmid, Mohr &amp; Bauckhage 2000 (IJCV 37(2)) as stated in
 * {@link Repeatability}: common-region restriction, greedy one-to-one pairing by increasing distance, r = matches /
 * min(|P'|, |Q'|).
 */
class RepeatabilityTest {
    private static final double EXACT = 1e-12;

    private static Detection p(double x, double y) { return new Detection(x, y, 1, 1); }

    @Test
    void identicalSetsUnderIdentityRepeatFully() {
        var pts = List.of(p(10, 10), p(50, 20), p(30, 40));
        var r = Repeatability.score(pts, pts, Homography.identity(), 100, 100, 100, 100, 1.5);
        assertEquals(1.0, r.repeatability().getAsDouble(), EXACT);
        assertEquals(3, r.nReference());
        assertEquals(3, r.nFrame());
        assertEquals(3, r.nMatched());
    }

    @Test
    void translationIsAppliedBeforeMatching() {
        // frame = reference shifted by (+5, -2); H maps reference pixels to frame pixels
        var ref = List.of(p(10, 10), p(50, 20), p(30, 40));
        var frame = List.of(p(15, 8), p(55, 18), p(35.9, 38.5)); // third within 1.5 px? distance 0.9+0.5 -> hypot(0.9,0.5)=1.03
        var r = Repeatability.score(ref, frame, Homography.translation(5, -2), 100, 100, 100, 100, 1.5);
        assertEquals(3, r.nMatched());
        var tight = Repeatability.score(ref, frame, Homography.translation(5, -2), 100, 100, 100, 100, 1.0);
        assertEquals(2, tight.nMatched(), "1.03 px is outside eps = 1.0");
        assertEquals(2 / 3.0, tight.repeatability().getAsDouble(), EXACT);
    }

    @Test
    void pointsOutsideTheCommonRegionAreNotCounted() {
        // shift by +10 px in x: reference points with x > 89 leave a 100-wide frame; frame points with x < 10 have no
        // counterpart in the reference.
        var ref = List.of(p(20, 50), p(89, 50), p(89.5, 50), p(99, 50));
        var frame = List.of(p(30, 50), p(99, 50), p(5, 50), p(9.9, 60));
        var r = Repeatability.score(ref, frame, Homography.translation(10, 0), 100, 100, 100, 100, 1.5);
        // P' = {20, 89} (89 -> 99 is on the border pixel centre, inside [0, w-1]); 89.5 -> 99.5 and 99 -> 109 are out
        assertEquals(2, r.nReference());
        // Q' = {30, 99}: 5 -> -5 and 9.9 -> -0.1 fall outside the reference
        assertEquals(2, r.nFrame());
        assertEquals(2, r.nMatched());
        assertEquals(1.0, r.repeatability().getAsDouble(), EXACT);
    }

    @Test
    void borderPixelCentresAreInside() {
        var ref = List.of(p(0, 0), p(99, 99));
        var r = Repeatability.score(ref, ref, Homography.identity(), 100, 100, 100, 100, 1.5);
        assertEquals(2, r.nReference());
        assertEquals(2, r.nFrame());
    }

    @Test
    void pairingIsOneToOneAndGreedyByDistance() {
        // two reference points compete for one frame point: only one match
        var ref = List.of(p(10, 10), p(11, 10));
        var frame = List.of(p(10.6, 10));
        var r = Repeatability.score(ref, frame, Homography.identity(), 100, 100, 100, 100, 1.5);
        assertEquals(1, r.nMatched());
        assertEquals(1.0, r.repeatability().getAsDouble(), EXACT, "min(|P'|, |Q'|) = 1");

        // greedy order: A=(0,0) B=(1.2,0); a=(1.0,0) b=(-1.2,0). Closest pair is (B,a) at 0.2, then (A,b) at 1.2.
        var ref2 = List.of(p(20, 20), p(21.2, 20));
        var frame2 = List.of(p(21.0, 20), p(18.8, 20));
        assertEquals(2, Repeatability.score(ref2, frame2, Homography.identity(), 100, 100, 100, 100, 1.5).nMatched());
        // with eps 1.1 the (A,b) pair is too far: only one match although A-a (1.0) would have been possible
        assertEquals(1, Repeatability.score(ref2, frame2, Homography.identity(), 100, 100, 100, 100, 1.1).nMatched());
    }

    @Test
    void undefinedWhenOneSideIsEmpty() {
        var r = Repeatability.score(List.of(p(10, 10)), List.of(), Homography.identity(), 100, 100, 100, 100, 1.5);
        assertTrue(r.repeatability().isEmpty());
        assertEquals(1, r.nReference());
        assertEquals(0, r.nFrame());
    }

    @Test
    void denominatorIsTheSmallerCount() {
        var ref = List.of(p(10, 10), p(20, 20), p(30, 30), p(40, 40));
        var frame = List.of(p(10, 10), p(70, 70));
        var r = Repeatability.score(ref, frame, Homography.identity(), 100, 100, 100, 100, 1.5);
        assertEquals(0.5, r.repeatability().getAsDouble(), EXACT);
    }

    @Test
    void nonPositiveEpsilonIsMisuse() {
        var ex = assertThrows(IllegalArgumentException.class,
                () -> Repeatability.score(List.of(), List.of(), Homography.identity(), 10, 10, 10, 10, 0));
        assertTrue(ex.getMessage().contains("0.0"));
    }

    @Test
    void projectiveMapUsesTheDivision() {
        // H with a perspective row: (x, y) -> (x / (1 + 0.001 x), y / (1 + 0.001 x))
        var h = new Homography(new double[]{1, 0, 0, 0, 1, 0, 0.001, 0, 1});
        var ref = List.of(p(100, 50));
        var frame = List.of(p(100 / 1.1, 50 / 1.1));
        assertEquals(1, Repeatability.score(ref, frame, h, 200, 200, 200, 200, 0.01).nMatched());
    }
}
