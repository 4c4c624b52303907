package org.targetbench.track;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.targetbench.detect.Detection;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.ShiTomasiConfig;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The KLT tracker on exact analytic textures: known sub-pixel translations are recovered (the Lucas-Kanade property,
 * Lucas &amp; Kanade 1981), the forward-backward error is zero on identical frames (Kalal, Mikolajczyk &amp; Matas 2010,
 * sec. 2: a point tracked forward and back along the same path returns to itself), and failures are outcomes.
 */
class KltTrackerTest {
    static final int W = 640, H = 480;
    static final long SEED = 7;
    /** Largest error on a pure translation, pixels (common practice, no source; measured max 0.034 px, median 0.008 px). */
    static final double SHIFT_TOL_PX = 0.05;
    /**
     * Forward-backward error on identical frames, pixels: zero up to float rounding (positions are floats: one ulp at
     * 640 px is 6e-5 px; the drift correction's last sub-epsilon step leaves up to about 2e-6 px).
     */
    static final double FB_IDENTICAL_TOL_PX = 1e-5;

    static List<double[]> seeds(GrayF32 img, int n) {
        ShiTomasiConfig c = new ShiTomasiConfig();
        c.maxFeatures = n;
        List<double[]> out = new ArrayList<>();
        for (Detection d : Detectors.create(c).detect(img)) out.add(new double[]{d.x(), d.y()});
        return out;
    }

    static KltConfig config() {
        KltConfig c = new KltConfig();
        c.maxTracks = 1000;
        return c;
    }

    @ParameterizedTest(name = "shift ({0}, {1}) px")
    @CsvSource({"0.3, 0.7", "-0.45, 0.2", "0.05, -0.95", "2.25, -1.6", "7.3, 4.1", "15.6, -9.2"})
    void recoversSubPixelTranslations(double dx, double dy) {
        GrayF32 a = TrackScenes.texture(W, H, SEED, 0, 0), b = TrackScenes.texture(W, H, SEED, dx, dy);
        KltTracker t = new KltTracker(config(), null);
        TrackFrame f0 = t.start(a, 0, seeds(a, 300));
        assertTrue(f0.points().size() > 250, "seeds started: " + f0.points().size());
        Map<Integer, TrackPoint> start = new HashMap<>();
        for (TrackPoint p : f0.points()) start.put(p.trackId(), p);
        TrackFrame f1 = t.process(b, 1);
        int tracked = 0;
        for (TrackPoint p : f1.points()) {
            TrackPoint s = start.get(p.trackId());
            boolean insideAfter = s.x() + dx >= 0 && s.x() + dx <= W - 1 && s.y() + dy >= 0 && s.y() + dy <= H - 1;
            if (p.outcome() == TrackOutcome.LEFT_IMAGE && !insideAfter) continue;
            assertEquals(TrackOutcome.TRACKED, p.outcome(), "track " + p.trackId() + " at " + s.x() + "," + s.y());
            double err = Math.hypot(p.x() - s.x() - dx, p.y() - s.y() - dy);
            assertTrue(err < SHIFT_TOL_PX, "track " + p.trackId() + " error " + err + " px");
            tracked++;
        }
        assertTrue(tracked > 240, "tracked " + tracked);
    }

    @Test
    void forwardBackwardErrorIsZeroOnIdenticalFrames() {
        GrayF32 a = TrackScenes.quantised(TrackScenes.texture(W, H, SEED, 0, 0));
        KltTracker t = new KltTracker(config(), null);
        t.start(a, 0, seeds(a, 300));
        for (int frame = 1; frame <= 3; frame++) {
            TrackFrame f = t.process(a.clone(), frame);
            assertFalse(f.points().isEmpty());
            for (TrackPoint p : f.points()) {
                assertEquals(TrackOutcome.TRACKED, p.outcome());
                assertEquals(0, p.fbError(), FB_IDENTICAL_TOL_PX, "track " + p.trackId());
            }
        }
    }

    @Test
    void failuresAreOutcomesNotExceptions() {
        GrayF32 a = TrackScenes.texture(W, H, SEED, 0, 0);
        // a different texture: nothing can be followed
        GrayF32 other = TrackScenes.texture(W, H, SEED + 99, 0, 0);
        KltTracker t = new KltTracker(config(), null);
        int started = t.start(a, 0, seeds(a, 200)).points().size();
        TrackFrame f = t.process(other, 1);
        assertEquals(started, f.points().size(), "one row per track that entered the frame");
        long lost = f.points().stream().filter(p -> p.outcome().isLoss()).count();
        assertTrue(lost > 0.9 * started, "lost " + lost + " of " + started);
        assertEquals(started - lost, f.alive());

        // a flat frame: every track ends, as too flat or residual, and no exception is thrown
        GrayF32 flat = new GrayF32(W, H);
        java.util.Arrays.fill(flat.data, 128f);
        KltTracker t2 = new KltTracker(config(), null);
        t2.start(a, 0, seeds(a, 50));
        TrackFrame g = t2.process(flat, 1);
        assertTrue(g.points().stream().allMatch(p -> p.outcome().isLoss()), g.points().toString());
        assertEquals(0, g.alive());
        assertTrue(t2.process(flat, 2).points().isEmpty(), "dead tracks are not reported again");
    }

    @Test
    void trackLeavingTheImageIsReportedAsSuch() {
        GrayF32 a = TrackScenes.texture(W, H, SEED, 0, 0), b = TrackScenes.texture(W, H, SEED, 12, 0);
        KltTracker t = new KltTracker(config(), null);
        List<double[]> near = new ArrayList<>();
        for (double[] p : seeds(a, 400)) if (p[0] > W - 10) near.add(p);
        assertFalse(near.isEmpty());
        t.start(a, 0, near);
        TrackFrame f = t.process(b, 1);
        assertTrue(f.points().stream().anyMatch(p -> p.outcome() == TrackOutcome.LEFT_IMAGE), f.points().toString());
    }

    @Test
    void respawnPolicies() {
        GrayF32 a = TrackScenes.texture(W, H, SEED, 0, 0);
        GrayF32 b = TrackScenes.texture(W, H, SEED, 40, 0); // a big jump: many tracks lost or off the image
        GrayF32 c = TrackScenes.texture(W, H, SEED, 40.5, 0.5);
        for (RespawnPolicy policy : RespawnPolicy.values()) {
            KltConfig k = config();
            k.maxTracks = 120;
            k.respawn = policy;
            KltTracker t = new KltTracker(k, new ShiTomasiConfig());
            TrackFrame f0 = t.process(a, 0);
            assertEquals(120, f0.alive());
            TrackFrame f1 = t.process(b, 1);
            TrackFrame f2 = t.process(c, 2);
            long startedLater = f1.points().stream().filter(p -> p.outcome() == TrackOutcome.STARTED).count()
                    + f2.points().stream().filter(p -> p.outcome() == TrackOutcome.STARTED).count();
            if (policy == RespawnPolicy.OFF) {
                assertEquals(0, startedLater);
                assertEquals(f2.alive(), f2.initialAlive());
            } else {
                assertTrue(startedLater > 0);
                assertEquals(120, f2.alive(), "topped up to maxTracks");
                assertTrue(f2.initialAlive() < f2.alive());
            }
        }
    }

    @Test
    void seedsKeepTheMinimumSpacing() {
        GrayF32 a = TrackScenes.texture(W, H, SEED, 0, 0);
        KltConfig k = config();
        k.minSpacing = 20;
        TrackFrame f = new KltTracker(k, new ShiTomasiConfig()).process(a, 0);
        List<TrackPoint> p = f.points();
        for (int i = 0; i < p.size(); i++)
            for (int j = i + 1; j < p.size(); j++)
                assertTrue(Math.hypot(p.get(i).x() - p.get(j).x(), p.get(i).y() - p.get(j).y()) >= k.minSpacing);
    }

    @Test
    void misuseIsRefusedWithTheNumbers() {
        KltConfig k = new KltConfig();
        k.windowRadius = 0;
        var e = assertThrows(IllegalArgumentException.class, () -> new KltTracker(k, null));
        assertTrue(e.getMessage().contains("windowRadius") && e.getMessage().contains("0"), e.getMessage());
        KltConfig k2 = new KltConfig();
        k2.fbThreshold = -1;
        assertThrows(IllegalArgumentException.class, k2::checkValidity);
        KltTracker t = new KltTracker(new KltConfig(), null);
        var small = assertThrows(IllegalArgumentException.class, () -> t.start(new GrayF32(100, 80), 0, List.of()));
        assertTrue(small.getMessage().contains("120"), small.getMessage());
        KltTracker t2 = new KltTracker(new KltConfig(), null);
        t2.start(new GrayF32(W, H), 0, List.of());
        assertThrows(IllegalArgumentException.class, () -> t2.process(new GrayF32(W / 2, H / 2), 1));
    }
}
