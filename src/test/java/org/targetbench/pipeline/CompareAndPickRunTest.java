package org.targetbench.pipeline;

import org.targetbench.formats.PickRefusals;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.targetbench.camera.Pose;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.select.CandidateConfig;
import org.targetbench.select.SelectConfig;
import org.targetbench.servo.ServoPoint;
import org.targetbench.source.FrameList;
import org.targetbench.source.FrameTruth;
import org.targetbench.source.SourceFrame;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/** CompareRun and PickRun called directly on the demo scenario's frames, without the command line. */
class CompareAndPickRunTest {
    /** A chosen point's pixel agrees with its designed feature's projection within this, px (common practice, no source). */
    static final double CHOSEN_PX = 1.0;
    /** The summary mean against the mean of its frames (derived: the same sum in the same order, one rounding). */
    static final double MEAN_TOL = 1e-12;
    static List<SourceFrame> frames;
    static CompareResult compare;

    @BeforeAll
    static void compareDemo() throws Exception {
        frames = FrameList.readAll(DemoScenario.source());
        compare = new CompareRun(List.of(DetectorConfig.defaults(DetectorType.SHI_TOMASI), DetectorConfig.defaults(DetectorType.HARRIS)), 1.5, 2)
                .run(new FrameList("demo", frames, frames.get(0).name()), Progress.NONE);
    }

    @Test
    void compareScoresEveryFrameAndDoesNotDependOnThreads() throws Exception {
        assertEquals(frames.size(), compare.frameCount());
        assertEquals(2 * frames.size(), compare.frames().size());
        for (FrameScore s : compare.frames()) {
            boolean ref = s.frameName().equals(compare.referenceName());
            assertEquals(!ref, s.repeatability().isPresent(), s.frameName());
            assertTrue(s.localisation().isPresent(), "rendered frames carry their true features");
        }
        CompareResult one = new CompareRun(compare.configs(), 1.5, 1).run(new FrameList("demo", frames, frames.get(0).name()), Progress.NONE);
        for (int i = 0; i < one.frames().size(); i++) {
            assertEquals(compare.frames().get(i).detections(), one.frames().get(i).detections());
            assertEquals(compare.frames().get(i).repeatability(), one.frames().get(i).repeatability());
        }
        // the summary's mean is the mean of the per-frame figures
        DetectorSummary top = compare.ranked().get(0);
        double mean = compare.frames().stream().filter(s -> s.detector() == top.detector()).flatMap(s -> s.repeatability().stream())
                .filter(r -> r.repeatability().isPresent()).mapToDouble(r -> r.repeatability().getAsDouble()).average().orElseThrow();
        assertEquals(mean, top.meanRepeatability().getAsDouble(), MEAN_TOL);
    }

    @Test
    void pickChoosesDesignedPointsWithTheKnownPose() throws Exception {
        PickRun.Result r = PickRun.run(input(Optional.of(DemoScenario.poses().get(0)), true), null, new CandidateConfig(), new SelectConfig(), "test", "now");
        var set = r.set().orElseThrow();
        assertEquals(new SelectConfig().count, set.points().size());
        assertEquals("known: pose 0 of poses.json", r.poseMethod());
        for (ServoPoint p : set.points()) {
            assertTrue(p.featureId() >= 0, "a chosen point is a designed feature");
            double[] px = org.targetbench.camera.Projection.projectTargetPoint(DemoScenario.camera(), DemoScenario.poses().get(0), p.targetXMm(), p.targetYMm());
            assertEquals(px[0], p.u(), CHOSEN_PX);
            assertEquals(px[1], p.v(), CHOSEN_PX);
        }
        // without the pose it is estimated from the design and the truth (PnP), and the same kind of set results
        PickRun.Result est = PickRun.run(input(Optional.empty(), true), null, new CandidateConfig(), new SelectConfig(), "test", "now");
        assertTrue(est.poseMethod().contains("detections matched to designed features"), est.poseMethod());
        assertTrue(est.set().isPresent());
    }

    @Test
    void pickRefusesWithTypedProblems() {
        PickRun.Input ok = input(Optional.of(DemoScenario.poses().get(0)), true);
        assertProblem(PickRun.Problem.UNKNOWN_DETECTOR, ok, "sift");
        PickRun.Input noCamera = new PickRun.Input(ok.referenceFrame(), ok.epsilonPx(), ok.ranking(), ok.detectorSettings(), ok.detections(),
                ok.truth(), Optional.empty(), ok.design(), ok.referencePose(), "p", "d");
        assertProblem(PickRun.Problem.NO_CAMERA, noCamera, null);
        PickRun.Input noRanking = new PickRun.Input(ok.referenceFrame(), ok.epsilonPx(), List.of(), ok.detectorSettings(), ok.detections(),
                ok.truth(), ok.camera(), ok.design(), ok.referencePose(), "p", "d");
        assertProblem(PickRun.Problem.EMPTY_RANKING, noRanking, null);
        PickRun.Input noDepth = input(Optional.empty(), false);
        PickRun.Refused e = assertProblem(PickRun.Problem.NO_DEPTH, noDepth, null);
        assertTrue(e.designMissing);
        // pose 5 is not the reference view: the designed features land far from their true pixels
        Pose wrong = DemoScenario.poses().get(5);
        PickRun.Refused m = assertProblem(PickRun.Problem.POSE_MISMATCH, input(Optional.of(wrong), true), null);
        assertTrue(m.medianPx > PickRun.POSE_CHECK_PX, "median " + m.medianPx);
    }

    private static PickRun.Refused assertProblem(PickRun.Problem p, PickRun.Input in, String detector) {
        PickRun.Refused e = assertThrows(PickRun.Refused.class, () -> PickRun.run(in, detector, new CandidateConfig(), new SelectConfig(), "t", "n"));
        assertEquals(p, e.problem);
        assertFalse(PickRefusals.explain(e, new PickRefusals.Where("f", "t", "p", "r")).isBlank());
        return e;
    }

    private static PickRun.Input input(Optional<Pose> pose, boolean withDesign) {
        Map<String, Map<String, List<Detection>>> dets = new LinkedHashMap<>();
        for (FrameScore s : compare.frames())
            dets.computeIfAbsent(s.detector().cliName(), k -> new LinkedHashMap<>()).put(s.frameName(), s.detections());
        Map<String, FrameTruth> truth = new LinkedHashMap<>();
        for (SourceFrame f : frames) truth.put(f.name(), f.truth());
        List<String> ranking = compare.ranked().stream().map(s -> s.detector().cliName()).toList();
        return new PickRun.Input(compare.referenceName(), compare.epsilon(), ranking, Map.of(), dets, Optional.of(truth),
                Optional.of(DemoScenario.camera()), withDesign ? Optional.of(DemoScenario.target()) : Optional.empty(), pose, "poses.json", "target.json");
    }
}
