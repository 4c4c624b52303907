package org.targetbench.pipeline;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.targetbench.camera.Homography;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.source.FrameTruth;
import org.targetbench.track.TrackScenes;

import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/** Live scoring: what repeatability is measured against, with and without the registration hook. */
class LiveScoringTest {
    /** Derived: the same figures computed twice by the same arithmetic, equal up to double rounding. */
    static final double TOL = 1e-9;

    static List<DetectorConfig> configs() {
        return List.of(DetectorConfig.defaults(DetectorType.SHI_TOMASI), DetectorConfig.defaults(DetectorType.FAST));
    }

    @Test
    void withoutRegistrationTheSameImageTwiceRepeatsFullyAgainstThePreviousFrame() {
        GrayF32 img = TrackScenes.texture(160, 120, 4, 0, 0);
        LiveScoring s = new LiveScoring(configs(), LiveScoring.NO_REGISTRATION);
        LiveScoring.Scored first = s.score(img);
        assertEquals(LiveScoring.Against.NOTHING, first.against());
        assertTrue(Double.isNaN(first.figures().get(DetectorType.FAST).repeatability()));
        LiveScoring.Scored second = s.score(img.clone());
        assertEquals(LiveScoring.Against.PREVIOUS_FRAME, second.against());
        for (var f : second.figures().values()) {
            assertTrue(f.points() > 0);
            assertEquals(1.0, f.repeatability(), TOL, "identical frames, identity mapping");
            assertTrue(Double.isNaN(f.localisationPx()), "no truth, no localisation");
        }
    }

    @Test
    void aRegistrationMapsTheReferenceThroughItsHomography() {
        // derived: a frame shifted by (3, 2) px registers with H = translation(3, 2) from the reference
        GrayF32 ref = TrackScenes.texture(160, 120, 4, 0, 0), moved = TrackScenes.texture(160, 120, 4, 3, 2);
        Homography shift = new Homography(new double[]{1, 0, 3, 0, 1, 2, 0, 0, 1});
        int[] calls = {0};
        LiveScoring s = new LiveScoring(configs(), f -> Optional.of(FrameTruth.homography(calls[0]++ == 0 ? Homography.identity() : shift)));
        assertEquals(LiveScoring.Against.NOTHING, s.score(ref).against());
        LiveScoring.Scored second = s.score(moved);
        assertEquals(LiveScoring.Against.REGISTERED_REFERENCE, second.against());
        assertTrue(second.figures().get(DetectorType.SHI_TOMASI).repeatability() > 0.8,
                "repeatability through the registered shift: " + second.figures().get(DetectorType.SHI_TOMASI).repeatability());
    }
}
