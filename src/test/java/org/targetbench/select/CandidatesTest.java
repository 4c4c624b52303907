package org.targetbench.select;

import org.junit.jupiter.api.Test;
import org.targetbench.TestScenes;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/** Servo candidates built directly: the found-again rule, designed features and depths. */
class CandidatesTest {
    /** Depths agree with the projection's to this, metres (derived: both are exact pinhole geometry, double round-off). */
    static final double DEPTH_TOL_M = 1e-9;
    /** Ray-plane round trips agree to this, mm, m or px (derived: exact geometry, undistortion iterated to convergence). */
    static final double PLANE_TOL = 1e-6;
    static final TargetDesign DESIGN = TestScenes.checkerboard();
    static final Pose POSE = Pose.facing(DESIGN.widthMm(), DESIGN.heightMm(), 0.35, 0, 0, 0, 0, 0);

    @Test
    void repeatabilityCountsFramesWherePointIsFoundAgainOneToOne() {
        List<ProjectedFeature> truth = Projection.visibleFeatures(DESIGN, TestScenes.VGA, POSE);
        ProjectedFeature a = truth.get(0), b = truth.get(1);
        List<Detection> ref = List.of(det(a.u(), a.v()), det(b.u(), b.v()));
        Homography shift = Homography.translation(4, 0);
        // frame 1: both found again 0.5 px from where the homography puts them
        Candidates.Frame f1 = frame("f1", List.of(det(a.u() + 4.5, a.v()), det(b.u() + 4.5, b.v())), shift);
        // frame 2: only a is found again
        Candidates.Frame f2 = frame("f2", List.of(det(a.u() + 4, a.v() + 0.5)), shift);
        // frame 3: no homography: does not count
        Candidates.Frame f3 = new Candidates.Frame("f3", List.of(), Optional.empty(), List.of());
        List<Candidate> c = Candidates.build(new Candidates.Frame("ref", ref, Optional.empty(), truth), List.of(f1, f2, f3), TestScenes.VGA,
                DESIGN, POSE, new CandidateConfig());
        assertEquals(2, c.size());
        assertEquals(2, c.get(0).framesVisible());
        assertEquals(2, c.get(0).framesFound());
        assertEquals(1.0, c.get(0).robustness().repeatability().getAsDouble());
        assertEquals(1, c.get(1).framesFound());
        assertEquals(0.5, c.get(1).robustness().repeatability().getAsDouble());
    }

    @Test
    void oneDetectionIsFoundAgainForOneReferencePointOnly() {
        // two reference points 1 px apart and one detection between them: the one-to-one rule pairs it with the nearer
        List<Detection> ref = List.of(det(300, 200), det(301, 200));
        Candidates.Frame f = frame("f", List.of(det(300.8, 200)), Homography.identity());
        List<Candidate> c = Candidates.build(new Candidates.Frame("ref", ref, Optional.empty(), List.of()), List.of(f), TestScenes.VGA,
                null, POSE, new CandidateConfig());
        assertEquals(0, c.get(0).framesFound());
        assertEquals(1, c.get(1).framesFound());
    }

    @Test
    void designedFeaturesTakeTheirDepthAndOthersTheRayOnThePlane() {
        List<ProjectedFeature> truth = Projection.visibleFeatures(DESIGN, TestScenes.VGA, POSE);
        ProjectedFeature a = truth.get(5);
        List<Detection> ref = new ArrayList<>(List.of(det(a.u(), a.v()), det(320, 240)));
        List<Candidate> c = Candidates.build(new Candidates.Frame("ref", ref, Optional.empty(), truth), List.of(), TestScenes.VGA,
                DESIGN, POSE, new CandidateConfig());
        assertEquals(a.featureId(), c.get(0).featureId());
        assertTrue(c.get(0).designed());
        assertEquals(a.depthM(), c.get(0).zM(), DEPTH_TOL_M);
        assertEquals(DESIGN.features().get(a.featureId()).xMm(), c.get(0).targetXMm(), PLANE_TOL);
        // the image centre of a square-on view at 0.35 m: on the plane at the stand-off
        assertEquals(-1, c.get(1).featureId());
        assertEquals(0.35, c.get(1).zM(), PLANE_TOL);
        double[] back = Projection.projectTargetPoint(TestScenes.VGA, POSE, c.get(1).targetXMm(), c.get(1).targetYMm());
        assertEquals(320, back[0], PLANE_TOL);
        assertEquals(240, back[1], PLANE_TOL);
    }

    private static Candidates.Frame frame(String name, List<Detection> d, Homography h) {
        return new Candidates.Frame(name, d, Optional.of(h), List.of());
    }

    private static Detection det(double x, double y) { return new Detection(x, y, 1, 1); }
}
