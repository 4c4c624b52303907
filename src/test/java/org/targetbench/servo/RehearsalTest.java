package org.targetbench.servo;

import org.targetbench.score.Robustness;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.OptionalDouble;
import java.util.stream.Collectors;

import static org.junit.jupiter.api.Assertions.*;

/** The closed loop against published behaviour, and the Monte-Carlo machinery. */
class RehearsalTest {
    /** Allowed relative deviation from the exponential decrease (common practice, no source). */
    private static final double DECAY_TOL = 0.02;
    /** Allowed relative deviation of the retreat ratio from 1/cos(θ/2) (common practice, no source). */
    private static final double RETREAT_TOL = 0.02;
    /** The mean law keeps the depth within this fraction of Z* (common practice, no source). */
    private static final double MEAN_DEPTH_TOL = 0.02;

    private static RehearsalConfig config(ControlLaw law) {
        RehearsalConfig c = new RehearsalConfig();
        c.law = law;
        c.depthMode = DepthMode.TRUE;
        c.lambda = 0.5;
        c.noiseSigmaPx = 0;
        c.convergedPx = 1e-3;
        c.timeoutS = 30;
        return c;
    }

    @Test
    void errorDecreasesExponentially() {
        // de/dt = -λ e (Chaumette & Hutchinson 2006): with true depths and a small start error, ||e(1 s)|| / ||e(0)|| = e^-0.5.
        ServoSet set = ServoFixtures.centredSquare(100, 0.5);
        RehearsalConfig c = config(ControlLaw.CURRENT);
        RunResult[] r = new RunResult[1];
        RunTrace t = Rehearsal.single(set, c, new RunResult.StartOffset(2, -1.5, 3, 0.4, -0.3, 0.8), r);
        int oneSecond = (int) Math.round(1.0 / c.dtS);
        double ratio = t.errorPx()[oneSecond] / t.errorPx()[0];
        assertEquals(Math.exp(-0.5), ratio, DECAY_TOL * Math.exp(-0.5), "ratio " + ratio);
        assertEquals(RunOutcome.CONVERGED, r[0].outcome());
    }

    @Test
    void currentLawRetreatsUnderOpticalAxisRotationAndMeanLawDoesNot() {
        // Known behaviour (Chaumette 1998): for a pure rotation θ about the optical axis, the current-L law moves the points
        // on straight lines, so the camera backs off to 1/cos(θ/2) of the depth; the mean law (Malis 2004) turns in place.
        ServoSet set = ServoFixtures.centredSquare(100, 0.5);
        RunResult.StartOffset start = new RunResult.StartOffset(0, 0, 0, 0, 0, 90);
        RunResult[] cur = new RunResult[1], mean = new RunResult[1];
        Rehearsal.single(set, config(ControlLaw.CURRENT), start, cur);
        Rehearsal.single(set, config(ControlLaw.MEAN), start, mean);
        double expected = 1 / Math.cos(Math.toRadians(45));
        assertEquals(RunOutcome.CONVERGED, cur[0].outcome());
        assertEquals(expected, cur[0].maxDepthRatio(), RETREAT_TOL * expected, "current law depth ratio");
        assertEquals(RunOutcome.CONVERGED, mean[0].outcome());
        assertTrue(mean[0].maxDepthRatio() < 1 + MEAN_DEPTH_TOL, "mean law max depth ratio " + mean[0].maxDepthRatio());
        assertTrue(mean[0].minPlaneDistanceM() > 0.5 * (1 - MEAN_DEPTH_TOL), "mean law min distance " + mean[0].minPlaneDistanceM());
    }

    @Test
    void monteCarloIsDeterministicAndIndependentOfThreads() throws InterruptedException {
        ServoSet set = ServoFixtures.centredSquare(120, 0.4);
        RehearsalConfig c = new RehearsalConfig();
        c.starts = 40;
        c.noiseSigmaPx = 0.2;
        c.seed = 99;
        c.threads = 1;
        RehearsalResult one = Rehearsal.run(set, c);
        c.threads = 2;
        RehearsalResult two = Rehearsal.run(set, c);
        assertEquals(one.runs(), two.runs());
        assertEquals(40, one.summary().runs());
        // a modest envelope around a well-spread square converges every time
        assertEquals(1.0, one.summary().convergenceRate(), 0.0, () -> outcomes(one));
        assertTrue(one.summary().medianTimeS() > 0 && one.summary().p95TimeS() >= one.summary().medianTimeS());
        assertEquals(Math.min(40, c.tracedRuns), one.traces().size());
    }

    @Test
    void pointsNearTheBorderLeaveTheFieldOfView() throws InterruptedException {
        // the desired-L law with large rotations about the optical axis sends the image points on wide curves
        // (Chaumette 1998); with the points well out towards the border, some leave the image
        ServoSet set = ServoFixtures.centredSquare(200, 0.4);
        RehearsalConfig c = new RehearsalConfig();
        c.starts = 30;
        c.law = ControlLaw.DESIRED;
        c.envelopeMm = new double[]{30, 30, 50};
        c.envelopeDeg = new double[]{30, 30, 120};
        RehearsalResult r = Rehearsal.run(set, c);
        assertTrue(r.summary().lostFieldOfView() > 0, () -> outcomes(r));
        assertTrue(r.warnings().stream().anyMatch(w -> w.kind() == RehearsalWarning.Kind.LOST_VIEW && w.count() == r.summary().lostFieldOfView()),
                r.warnings().toString());
    }

    @Test
    void measuredSurvivalDropsTracks() throws InterruptedException {
        ServoSet base = ServoFixtures.centredSquare(100, 0.5);
        Robustness fragile = new Robustness(OptionalDouble.empty(), OptionalDouble.of(0.0), OptionalDouble.empty(), OptionalDouble.empty());
        List<ServoPoint> pts = base.points().stream().map(p -> p.withRobustness(fragile)).toList();
        ServoSet set = new ServoSet(base.toolVersion(), base.created(), base.camera(), base.targetId(), base.targetDesign(),
                base.referencePose(), base.poseMethod(), base.detector(), base.detectorConfig(), base.trackerConfig(), pts,
                base.condition(), base.sigmaMin());
        RehearsalConfig c = new RehearsalConfig();
        c.starts = 10;
        c.convergedPx = 1e-6; // never converges first
        c.timeoutS = 2;
        RehearsalResult r = Rehearsal.run(set, c);
        assertEquals(10, r.summary().trackLost(), () -> outcomes(r));
        c.useSurvival = false;
        assertEquals(0, Rehearsal.run(set, c).summary().trackLost());
    }

    @Test
    void flagsKnownFailureModes() throws InterruptedException {
        RehearsalConfig c = new RehearsalConfig();
        c.starts = 4;
        c.envelopeDeg = new double[]{0, 0, 170};
        c.law = ControlLaw.CURRENT;
        RehearsalResult r = Rehearsal.run(ServoFixtures.centredSquare(100, 0.5), c);
        assertTrue(r.warnings().stream().anyMatch(w -> w.kind() == RehearsalWarning.Kind.TURNED_ABOUT_AXIS && w.value() == 170), r.warnings().toString());
        // a tiny square: near-singular L
        var tiny = SetDiagnostics.check(ServoFixtures.centredSquare(0.5, 0.5).points());
        assertTrue(tiny.stream().anyMatch(f -> f.kind() == SetDiagnostics.Kind.NEAR_SINGULAR || f.kind() == SetDiagnostics.Kind.COINCIDENT
                || f.kind() == SetDiagnostics.Kind.DUPLICATE), tiny.toString());
        var three = SetDiagnostics.check(ServoFixtures.centredSquare(100, 0.5).points().subList(0, 3));
        assertTrue(SetDiagnostics.hasError(three));
    }

    @Test
    void misuseIsRefusedWithNumbers() {
        RehearsalConfig c = new RehearsalConfig();
        c.lambda = 0;
        var e = assertThrows(IllegalArgumentException.class, c::checkValidity);
        assertTrue(e.getMessage().contains("lambda") && e.getMessage().contains("0.0"), e.getMessage());
    }

    private static String outcomes(RehearsalResult r) {
        return r.runs().stream().collect(Collectors.groupingBy(RunResult::outcome, Collectors.counting())).toString();
    }
}
