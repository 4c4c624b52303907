package org.targetbench.score;

import org.junit.jupiter.api.Test;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.track.TrackFrame;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/** Survival, drift and jitter on hand-made tracker output whose answers are known. */
class TrackingMetricsTest {
    /** Derived: hand-made inputs with exact answers, equal up to double rounding. */
    static final double TOL = 1e-9;
    /** Streaming percentiles are exact to one bin of 0.001 px, plus rounding at the bin edge. */
    static final double BIN_TOL = 0.0015;

    static TrackPoint row(int id, int frame, double x, double y, TrackOutcome o) {
        return new TrackPoint(id, frame, x, y, o, o == TrackOutcome.STARTED ? Double.NaN : 0.01);
    }

    @Test
    void survivalCurveMedianLifetimeAndSurvivalAtN() {
        // 4 tracks on frame 0; one dies on frames 2, 3, 5; the fourth lives to the end (frame 7)
        TrackingMetrics m = new TrackingMetrics(100, 100, 4, false);
        int[] death = {2, 3, 5, Integer.MAX_VALUE};
        List<Double> curve = new ArrayList<>();
        for (int f = 0; f <= 7; f++) {
            List<TrackPoint> rows = new ArrayList<>();
            int alive = 0;
            for (int id = 0; id < 4; id++) {
                if (f == 0) rows.add(row(id, 0, 10 + id, 10, TrackOutcome.STARTED));
                else if (f < death[id]) rows.add(row(id, f, 10 + id, 10, TrackOutcome.TRACKED));
                else if (f == death[id]) rows.add(row(id, f, 10 + id, 10, id == 0 ? TrackOutcome.LOST_FORWARD_BACKWARD : TrackOutcome.LEFT_IMAGE));
                if (f < death[id]) alive++;
            }
            curve.add(m.add(new TrackFrame(f, rows, alive, alive), Optional.empty(), List.of()).aliveFraction());
        }
        assertEquals(List.of(1.0, 1.0, 0.75, 0.5, 0.5, 0.25, 0.25, 0.25), curve);
        TrackingScore s = m.result();
        assertEquals(4, s.initialTracks());
        assertEquals(3, s.medianLifetime().getAsInt(), "half dead by frame 3");
        assertEquals(0.5, s.survivalAtN(), TOL);
        assertEquals(0.25, s.survivalAtEnd(), TOL);
        assertEquals(1, s.ended().get(TrackOutcome.LOST_FORWARD_BACKWARD));
        assertEquals(2, s.ended().get(TrackOutcome.LEFT_IMAGE));
        assertEquals(0, s.ended().get(TrackOutcome.TOO_FLAT));
        assertEquals(1, s.aliveAtEnd());
        assertNull(s.ended().get(TrackOutcome.TRACKED), "only losses are counted");
    }

    @Test
    void survivalBeyondTheRunIsUndefinedAndLifetimeCensored() {
        TrackingMetrics m = new TrackingMetrics(100, 100, 50, false);
        m.add(new TrackFrame(0, List.of(row(0, 0, 5, 5, TrackOutcome.STARTED)), 1, 1), Optional.empty(), List.of());
        m.add(new TrackFrame(1, List.of(row(0, 1, 5, 5, TrackOutcome.TRACKED)), 1, 1), Optional.empty(), List.of());
        TrackingScore s = m.result();
        assertTrue(Double.isNaN(s.survivalAtN()));
        assertTrue(s.medianLifetime().isEmpty());
    }

    @Test
    void driftFollowsThePlanePointThroughTheHomographies() {
        // frame f moves the scene by (f, 0); the track stays behind by 0.1 px per frame after frame 0
        TrackingMetrics m = new TrackingMetrics(200, 200, 0, false);
        m.add(new TrackFrame(0, List.of(row(0, 0, 50, 60, TrackOutcome.STARTED)), 1, 1), Optional.of(Homography.identity()), List.of());
        for (int f = 1; f <= 4; f++) {
            var fig = m.add(new TrackFrame(f, List.of(row(0, f, 50 + f - 0.1 * f, 60, TrackOutcome.TRACKED)), 1, 1),
                    Optional.of(Homography.translation(f, 0)), List.of());
            assertEquals(0.1 * f, fig.drift().max(), TOL);
        }
        TrackingScore s = m.result();
        assertEquals(4, s.framesWithTruth());
        assertEquals(0.4, s.drift().max(), TOL);
        assertEquals(0.2, s.drift().p50(), BIN_TOL);
    }

    @Test
    void driftWithFeaturePointsKeepsTheStartingOffset() {
        TrackingMetrics m = new TrackingMetrics(200, 200, 0, false);
        m.add(new TrackFrame(0, List.of(row(0, 0, 50.3, 60, TrackOutcome.STARTED)), 1, 1), Optional.empty(),
                List.of(new ProjectedFeature(7, 50, 60, 0.3)));
        var fig = m.add(new TrackFrame(1, List.of(row(0, 1, 55.3, 60.2, TrackOutcome.TRACKED)), 1, 1), Optional.empty(),
                List.of(new ProjectedFeature(7, 55, 60, 0.3)));
        assertEquals(0.2, fig.drift().max(), 1e-6, "the 0.3 px offset at the start is not drift");
    }

    @Test
    void jitterIsThePositionStandardDeviationOverStaticFrames() {
        // 12 frames, the truth never moves; positions scatter with known sample deviation
        SplittableRandom rng = new SplittableRandom(3);
        double[] xs = new double[12], ys = new double[12];
        for (int i = 0; i < 12; i++) {
            xs[i] = 100 + 0.05 * (rng.nextDouble() - 0.5);
            ys[i] = 80 + 0.05 * (rng.nextDouble() - 0.5);
        }
        double mx = 0, my = 0;
        for (int i = 0; i < 12; i++) { mx += xs[i] / 12; my += ys[i] / 12; }
        double ss = 0;
        for (int i = 0; i < 12; i++) ss += (xs[i] - mx) * (xs[i] - mx) + (ys[i] - my) * (ys[i] - my);
        double expected = Math.sqrt(ss / 11);
        TrackingMetrics m = new TrackingMetrics(200, 200, 0, false);
        Optional<Homography> still = Optional.of(Homography.translation(3, 4));
        for (int f = 0; f < 12; f++)
            m.add(new TrackFrame(f, List.of(row(0, f, xs[f], ys[f], f == 0 ? TrackOutcome.STARTED : TrackOutcome.TRACKED)), 1, 1), still, List.of());
        TrackingScore s = m.result();
        assertEquals(11, s.staticFrames());
        assertEquals(1, s.jitter().count());
        assertEquals(expected, s.jitter().max(), 1e-9);

        // without truth nothing is static, unless the user says the whole run is
        TrackingMetrics none = new TrackingMetrics(200, 200, 0, false), marked = new TrackingMetrics(200, 200, 0, true);
        for (int f = 0; f < 12; f++) {
            TrackFrame tf = new TrackFrame(f, List.of(row(0, f, xs[f], ys[f], f == 0 ? TrackOutcome.STARTED : TrackOutcome.TRACKED)), 1, 1);
            none.add(tf, Optional.empty(), List.of());
            marked.add(tf, Optional.empty(), List.of());
        }
        assertEquals(0, none.result().jitter().count());
        assertEquals(expected, marked.result().jitter().max(), 1e-9);
    }

    @Test
    void motionBreaksAStaticRunAndShortRunsGiveNoJitter() {
        TrackingMetrics m = new TrackingMetrics(200, 200, 0, false);
        for (int f = 0; f < 10; f++) {
            // moves on frame 4: a still run of positions 0..3 (too short) and one of positions 4..9
            Homography h = Homography.translation(f < 4 ? 0 : 2, 0);
            m.add(new TrackFrame(f, List.of(row(0, f, 10 + (f < 4 ? 0 : 2), 10, f == 0 ? TrackOutcome.STARTED : TrackOutcome.TRACKED)), 1, 1),
                    Optional.of(h), List.of());
        }
        TrackingScore s = m.result();
        assertEquals(8, s.staticFrames());
        assertEquals(1, s.jitter().count(), "a run needs " + TrackingMetrics.JITTER_MIN_FRAMES + " positions");
        assertEquals(0, s.jitter().max(), TOL, "the track did not move within the run");
    }

    @Test
    void histogramPercentilesAreExactToOneBin() {
        ValueHistogram h = new ValueHistogram(0.001, 10);
        double[] v = new double[1000];
        SplittableRandom rng = new SplittableRandom(11);
        for (int i = 0; i < v.length; i++) {
            v[i] = rng.nextDouble() * 3;
            h.add(v[i]);
        }
        h.add(Double.NaN);
        Distribution exact = Distribution.of(v.clone()), streamed = h.summary();
        assertEquals(1000, streamed.count());
        assertEquals(exact.p50(), streamed.p50(), BIN_TOL);
        assertEquals(exact.p95(), streamed.p95(), BIN_TOL);
        assertEquals(exact.max(), streamed.max(), 0);
        assertEquals(exact.mean(), streamed.mean(), 1e-9);
        h.add(50);
        assertEquals(50, h.summary().max(), 0, "values above the ceiling keep their exact maximum");
    }
}
