package org.targetbench.track;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.pipeline.MotionScenarios;
import org.targetbench.perturb.MotionSource;
import org.targetbench.source.SourceFrame;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Output equality of the tracker's own Lucas-Kanade step ({@link TranslationLk}) with the engine it replaced, BoofCV
 * 1.2.2's float KLT, kept in test scope as {@link BoofKltReference}: on the same frames and points both give the
 * same outcome for every track on every frame and positions within {@value #TRACK_TOL_PX} px (the agreement asked of a
 * faster kernel: identical tracks within a thousandth of a pixel; derived from the two implementing the same
 * equations in the same float arithmetic). Measured before the window sums took their fixed eight-way order
 * ({@link LkKernels}): 0.0 px, bit-identical rows; after it, with the drift correction's one-pass sums: at most
 * 1.7e-4 px on the translations (the 40 px shift), same outcomes everywhere (the reference uses the drift correction as
 * it was, {@link AffineAnchorReference}).
 */
class KltEqualityTest {
    static final double TRACK_TOL_PX = 1e-3;
    static final int W = 640, H = 480;
    static final long SEED = 7;
    static final int CONVERGE_FRAMES = 30;

    /** Largest position difference over all rows; fails on any difference of outcome or row. */
    static double compare(List<GrayF32> frames, List<double[]> seeds, KltConfig k) {
        KltTracker ours = new KltTracker(k, null);
        BoofKltReference ref = new BoofKltReference(k, null);
        double worst = 0;
        for (int i = 0; i < frames.size(); i++) {
            TrackFrame a = i == 0 ? ours.start(frames.get(0), 0, seeds) : ours.process(frames.get(i), i);
            TrackFrame b = i == 0 ? ref.start(frames.get(0), 0, seeds) : ref.process(frames.get(i), i);
            assertEquals(b.points().size(), a.points().size(), "rows on frame " + i);
            for (int j = 0; j < a.points().size(); j++) {
                TrackPoint p = a.points().get(j), q = b.points().get(j);
                assertEquals(q.trackId(), p.trackId(), "frame " + i);
                assertEquals(q.outcome(), p.outcome(), "frame " + i + " track " + p.trackId() + " at " + q.x() + "," + q.y());
                worst = Math.max(worst, Math.hypot(p.x() - q.x(), p.y() - q.y()));
                if (q.outcome() == TrackOutcome.TRACKED && k.forwardBackward)
                    worst = Math.max(worst, Math.abs(p.fbError() - q.fbError()));
            }
        }
        return worst;
    }

    static KltConfig config(boolean drift, boolean fb) {
        KltConfig k = new KltConfig();
        k.maxTracks = 1000;
        k.driftCorrection = drift;
        k.forwardBackward = fb;
        return k;
    }

    /** The translations of {@code KltTrackerTest} (analytic texture, exact shifts), with and without correction. */
    @ParameterizedTest(name = "shift ({0}, {1}) px, drift correction {2}")
    @CsvSource({"0.3, 0.7, true", "-0.45, 0.2, false", "2.25, -1.6, true", "7.3, 4.1, false", "15.6, -9.2, true", "40, 0, true"})
    void sameTracksOnTranslations(double dx, double dy, boolean drift) {
        GrayF32 a = TrackScenes.quantised(TrackScenes.texture(W, H, SEED, 0, 0));
        List<GrayF32> frames = List.of(a, TrackScenes.quantised(TrackScenes.texture(W, H, SEED, dx, dy)),
                TrackScenes.quantised(TrackScenes.texture(W, H, SEED, 2 * dx, 2 * dy)));
        double worst = compare(frames, KltTrackerTest.seeds(a, 300), config(drift, true));
        assertTrue(worst <= TRACK_TOL_PX, "largest difference " + worst + " px");
    }

    /**
     * The servo convergence of {@code ConvergeTrackingTest} (roll, zoom, lens distortion, blur, noise), its first
     * {@value #CONVERGE_FRAMES} frames (the render dominates the test's time).
     */
    @ParameterizedTest(name = "converge, drift correction {0}")
    @CsvSource({"true", "false"})
    void sameTracksOnTheConvergence(boolean drift) {
        List<GrayF32> frames = new ArrayList<>();
        List<double[]> seeds = new ArrayList<>();
        try (MotionSource s = MotionScenarios.open("converge,frames=90")) {
            for (SourceFrame f; frames.size() < CONVERGE_FRAMES && (f = s.next().orElse(null)) != null; ) {
                if (frames.isEmpty())
                    for (ProjectedFeature p : f.truth().features())
                        if (p.featureId() >= 0) seeds.add(new double[]{p.u(), p.v()});
                frames.add(f.image());
            }
        }
        double worst = compare(frames, seeds, config(drift, true));
        assertTrue(worst <= TRACK_TOL_PX, "largest difference " + worst + " px");
    }
}
