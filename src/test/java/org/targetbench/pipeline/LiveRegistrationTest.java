package org.targetbench.pipeline;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.register.RegisterConfig;
import org.targetbench.register.RegistrationNote;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Live scoring with frame-to-design registration on renders of the demo target through a lens with barrel distortion
 * (k1 = -0.25): registered frames are scored against the target (repeatability through the plane-induced homography
 * between undistorted points, localisation against the registered corners), a frame without the target is marked
 * and not scored, and intrinsics of another image size are said to be so.
 */
class LiveRegistrationTest {
    /** A detector on clean renders of a checkerboard finds most designed corners again (common practice, no source). */
    static final double MIN_REPEATABILITY = 0.5;
    /** Localisation of Harris on clean renders against registered truth, pixels (common practice, no source). */
    static final double MAX_LOCALISATION_PX = 0.5;

    @Test
    void registeredFramesAreScoredAgainstTheTargetAndOthersAreMarked() throws Exception {
        TargetDesign d = TargetFile.read(Path.of("target-designs/fixture-cb15/target.json"));
        CameraModel lens = new CameraModel(640, 480, 532, 532, 319.5, 239.5, -0.25, 0.05, 0, 0, 0);
        RenderConfig rc = new RenderConfig();
        rc.noiseSigma = 1;
        SyntheticRenderer r = new SyntheticRenderer(lens, rc);
        LiveScoring s = new LiveScoring(List.of(DetectorConfig.defaults(DetectorType.HARRIS)),
                new LiveRegistration(d, Optional.of(lens), new RegisterConfig()));
        for (int i = 0; i < 3; i++) {
            GrayF32 img = r.render(d, Pose.facing(d.widthMm(), d.heightMm(), 0.26, 6 + 2 * i, -5 + 2 * i, 2, 0.002 * i, 0), i).image();
            LiveScoring.Scored sc = s.score(img);
            assertEquals(LiveScoring.RegistrationState.REGISTERED, sc.registration(), "frame " + i + ": " + sc.note());
            LiveScoring.Figures f = sc.figures().get(DetectorType.HARRIS);
            if (i > 0) {
                assertEquals(LiveScoring.Against.REGISTERED_REFERENCE, sc.against());
                assertTrue(f.repeatability() >= MIN_REPEATABILITY, "repeatability " + f.repeatability());
            }
            assertTrue(f.localisationPx() <= MAX_LOCALISATION_PX, "localisation " + f.localisationPx());
            assertTrue(f.foundShare() > 0.9, "found " + f.foundShare());
        }
        GrayF32 blank = new GrayF32(640, 480);
        java.util.Arrays.fill(blank.data, 110f);
        LiveScoring.Scored sc = s.score(blank);
        assertEquals(LiveScoring.RegistrationState.NOT_REGISTERED, sc.registration());
        assertEquals(Optional.of(RegistrationNote.NOT_FOUND), sc.note());
        assertEquals(LiveScoring.Against.NOTHING, sc.against());
        assertTrue(Double.isNaN(sc.figures().get(DetectorType.HARRIS).repeatability()));

        LiveScoring wrong = new LiveScoring(List.of(DetectorConfig.defaults(DetectorType.HARRIS)),
                new LiveRegistration(d, Optional.of(lens), new RegisterConfig()));
        assertEquals(LiveScoring.RegistrationState.WRONG_SIZE, wrong.score(new GrayF32(320, 240)).registration());
    }
}
