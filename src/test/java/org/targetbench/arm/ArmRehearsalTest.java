package org.targetbench.arm;

import org.junit.jupiter.api.Test;
import org.targetbench.pipeline.ArmWords;
import org.targetbench.servo.ControlLaw;
import org.targetbench.servo.DepthMode;
import org.targetbench.servo.Rehearsal;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RunResult;
import org.targetbench.servo.RunTrace;
import org.targetbench.servo.ServoFixtures;
import org.targetbench.servo.ServoSet;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** The closed loop on the arm against the free-flying rehearsal, a published delay bound and wrist behaviour. */
class ArmRehearsalTest {
    /** The ideal arm must follow the free-flying camera path to this, metres (common practice, no source). */
    static final double PATH_TOL_M = 1e-6;
    /** Camera pose error at the end of the redundant-wrist run (common practice, no source). */
    static final double POSE_TOL_MM = 0.1, POSE_TOL_DEG = 0.01;
    /** The moving combination of joints 4 and 6 must match the reference to this, degrees. */
    static final double COMBINATION_TOL_DEG = 0.01;

    static ServoSet set() {
        return ServoFixtures.centredSquare(100, 0.4);
    }

    static ArmRehearsalConfig config(double lambda, double dt) {
        ArmRehearsalConfig c = new ArmRehearsalConfig();
        RehearsalConfig s = c.servo;
        s.law = ControlLaw.MEAN;
        s.depthMode = DepthMode.TRUE;
        s.lambda = lambda;
        s.dtS = dt;
        s.noiseSigmaPx = 0;
        s.useSurvival = false;
        s.convergedPx = 1e-3;
        s.timeoutS = 20;
        s.threads = 1;
        s.traceEvery = 1;
        c.referenceJointsRad = DemoArm.rad(DemoArm.REFERENCE_DEG);
        return c;
    }

    /** Joints that put the camera at {@code offset} from the reference view. */
    static double[] startFor(ServoSet set, ArmModel arm, HandEye he, ArmRehearsalConfig c, RunResult.StartOffset off) {
        ArmLoop.Scene s = ArmRehearsal.scene(set, arm, he, c, new String[1]);
        double ang = Math.toRadians(off.rotationDeg());
        double[] delta = ang > 0 ? Rigid.fromRotationVector(Math.toRadians(off.rxDeg()), Math.toRadians(off.ryDeg()), Math.toRadians(off.rzDeg()))
                : Rigid.identity();
        delta[3] = off.txMm() / 1000; delta[7] = off.tyMm() / 1000; delta[11] = off.tzMm() / 1000;
        double[] cam = Rigid.mul(s.referenceCameraInTarget(), delta);
        double[] flange = Rigid.mul(Rigid.mul(s.baseToTarget(), cam), Rigid.inverse(s.handEyeTrue()));
        return ArmRehearsal.inverse(arm, flange, s.referenceJoints()).orElseThrow();
    }

    @Test
    void idealArmFollowsTheFreeFlyingCamera() throws InterruptedException {
        // derived: without limits, far from singularities, with zero latency the arm realises the commanded twist; the
        // only difference is holding joint speeds instead of the camera twist over a period, O(T^2) per period
        ServoSet set = set();
        ArmModel arm = DemoArm.model().unlimited();
        HandEye he = HandEye.demo();
        double dt = 1e-3;
        ArmRehearsalConfig c = config(0.5, dt);
        c.servo.timeoutS = 4;
        c.dampingMax = 0;
        RunResult.StartOffset off = new RunResult.StartOffset(8, -5, 10, 2, -3, 6);
        RunResult[] free = new RunResult[1];
        RunTrace ft = Rehearsal.single(set, c.servo, off, free);
        ArmRehearsalResult r = ArmRehearsal.run(set, arm, he, c, List.of(startFor(set, arm, he, c, off)));
        ArmRunTrace at = r.traces().get(0);
        int n = Math.min(ft.timeS().length, at.timeS().length);
        assertTrue(n > 3000, "compared steps " + n);
        double worst = 0;
        for (int i = 0; i < n; i++) {
            double d = Math.sqrt(sq(ft.cameraXMm()[i] - at.cameraXMm()[i]) + sq(ft.cameraYMm()[i] - at.cameraYMm()[i])
                    + sq(ft.cameraZMm()[i] - at.cameraZMm()[i])) / 1000;
            worst = Math.max(worst, d);
        }
        assertTrue(worst < PATH_TOL_M, "largest path difference " + worst + " m");
    }

    @Test
    void delayedLoopFollowsTheLevinMayBound() throws InterruptedException {
        // e[k+1] = e[k] - g e[k-d] is stable iff 0 < g < 2 cos(dπ/(2d+1)) (Levin & May, Theor. Pop. Biol. 9, 1976):
        // 1.0 for d = 1, 0.618 for d = 2. Exact depths, no noise, a pure translation start.
        assertEquals(1.0, GainAdvice.boundOnGain(1), 1e-12);
        assertEquals(0.6180339887, GainAdvice.boundOnGain(2), 1e-9);
        ServoSet set = set();
        ArmModel arm = DemoArm.model().unlimited();
        HandEye he = HandEye.demo();
        double dt = 0.01;
        for (int d : new int[]{1, 2}) {
            double g = GainAdvice.boundOnGain(d);
            for (double f : new double[]{0.95, 1.05}) {
                ArmRehearsalConfig c = config(f * g / dt, dt);
                c.latencyFrames = d;
                c.servo.law = ControlLaw.CURRENT;
                c.servo.convergedPx = 0.01;
                c.servo.timeoutS = 10;
                c.servo.traceEvery = 50;
                double[] q0 = startFor(set, arm, he, c, new RunResult.StartOffset(3, -2, 2, 0, 0, 0));
                ArmRunResult run = ArmRehearsal.run(set, arm, he, c, List.of(q0)).runs().get(0);
                if (f < 1) assertEquals(ArmOutcome.CONVERGED, run.outcome(), "d=" + d + " g=" + f * g);
                else {
                    assertNotEquals(ArmOutcome.CONVERGED, run.outcome(), "d=" + d + " g=" + f * g);
                    assertTrue(run.flags().contains(ArmFlag.OSCILLATION), "d=" + d + " g=" + f * g + " flags " + run.flags());
                }
            }
        }
    }

    @Test
    void redundantWristEndsInAnotherConfigurationWithTheSameView() throws InterruptedException {
        // A fact of the trade: at the wrist singularity (joint 5 = 0) joints 4 and 6 turn about one line, here pointing the
        // same way, so only q4 + q6 moves the camera; from a pure turn of joint 6 about the optical axis the minimum-norm
        // (damped least-squares) motion splits the return equally, leaving equal and opposite offsets.
        ServoSet set = set();
        ArmModel arm = DemoArm.model();
        HandEye onAxis = new HandEye(new double[]{1, 0, 0, 0, 1, 0, 0, 0, 1}, new double[]{0, 0, 0.04}, List.of(), "on-axis test mount");
        ArmRehearsalConfig c = config(1.0, 0.01);
        c.servo.convergedPx = 1e-4;
        c.referenceJointsRad = DemoArm.rad(new double[]{0, 10, 20, 0, 0, 0});
        double[] start = DemoArm.rad(new double[]{0, 10, 20, 0, 0, 22});
        ArmRehearsalResult r = ArmRehearsal.run(set, arm, onAxis, c, List.of(start));
        ArmRunResult run = r.runs().get(0);
        assertEquals(ArmOutcome.CONVERGED, run.outcome());
        assertTrue(run.cameraErrorMm() < POSE_TOL_MM, "camera error " + run.cameraErrorMm() + " mm");
        assertTrue(run.cameraErrorDeg() < POSE_TOL_DEG, "camera error " + run.cameraErrorDeg() + " deg");
        double[] q = run.finalJointsRad();
        double d4 = Math.toDegrees(q[3]), d6 = Math.toDegrees(q[5]);
        assertEquals(0, d4 + d6, COMBINATION_TOL_DEG, "q4 + q6 returns to its reference");
        assertEquals(-11, d4, 0.05);
        assertEquals(11, d6, 0.05);
        assertTrue(run.flags().contains(ArmFlag.OTHER_CONFIGURATION));
        assertTrue(ArmWords.warnings(r).stream().anyMatch(w -> w.contains("reached the same camera pose") && w.contains("another joint configuration")),
                ArmWords.warnings(r).toString());
    }

    @Test
    void pathThroughTheWristSingularityIsFlagged() throws InterruptedException {
        ServoSet set = set();
        ArmModel arm = DemoArm.model();
        ArmRehearsalConfig c = config(1.0, 0.01);
        c.servo.convergedPx = 0.05;
        c.referenceJointsRad = DemoArm.rad(new double[]{0, 10, 20, 30, -6, -30});
        double[] start = DemoArm.rad(new double[]{0, 10, 20, 30, 6, -30});
        ArmRunResult run = ArmRehearsal.run(set, arm, HandEye.demo(), c, List.of(start)).runs().get(0);
        assertTrue(run.flags().contains(ArmFlag.WRIST_SINGULARITY_CROSSED), run.flags().toString());
        assertTrue(run.minManipulability() < arm.manipulability(start) / 3, "min w " + run.minManipulability());
    }

    @Test
    void anOvershootIntoAJointLimitEndsTheRunAndIsFlagged() throws InterruptedException {
        // one period of latency at g = 0.9 overshoots (derived from e[k+1] = e[k] - g e[k-1]); joint 6 may go 1 deg past its reference
        ServoSet set = set();
        double[] upper = DemoArm.UPPER_DEG.clone();
        upper[5] = 1;
        ArmModel arm = ArmModel.fromDh("tight wrist", "test", false, DhConvention.STANDARD, DemoArm.DH, null, DemoArm.rad(DemoArm.LOWER_DEG),
                DemoArm.rad(upper), DemoArm.rad(DemoArm.MAX_SPEED_DEG_S));
        HandEye onAxis = new HandEye(new double[]{1, 0, 0, 0, 1, 0, 0, 0, 1}, new double[]{0, 0, 0.04}, List.of(), "on-axis test mount");
        ArmRehearsalConfig c = config(90, 0.01);
        c.latencyFrames = 1;
        c.servo.law = ControlLaw.CURRENT;
        c.referenceJointsRad = DemoArm.rad(DemoArm.REFERENCE_DEG);
        double[] start = DemoArm.rad(new double[]{0, 10, 20, 0, 60, -10});
        ArmRunResult run = ArmRehearsal.run(set, arm, onAxis, c, List.of(start)).runs().get(0);
        assertEquals(ArmOutcome.JOINT_LIMIT, run.outcome());
        assertTrue(run.flags().contains(ArmFlag.JOINT_LIMIT_REACHED));
        assertEquals(0, run.minLimitMarginDeg(), 1e-12);
    }

    @Test
    void injectedHandEyeErrorIsReportedAndTheServoStillConverges() throws InterruptedException {
        // common practice, no source: image-based servoing tolerates a few degrees of hand-eye error
        ArmRehearsalConfig c = config(1.0, 0.01);
        c.handEyeErrorDeg = new double[]{0, 3, 0};
        c.handEyeErrorMm = new double[]{5, 0, 0};
        c.servo.convergedPx = 0.5;
        ServoSet set = set();
        ArmModel arm = DemoArm.model();
        double[] q0 = startFor(set, arm, HandEye.demo(), c, new RunResult.StartOffset(10, -5, 8, 2, -3, 8));
        ArmRehearsalResult r = ArmRehearsal.run(set, arm, HandEye.demo(), c, List.of(q0));
        assertEquals(ArmOutcome.CONVERGED, r.runs().get(0).outcome());
        assertTrue(Rigid.angleBetween(r.handEye().transform(), r.handEyeBelieved().transform()) > Math.toRadians(2.9));
        assertTrue(ArmWords.warnings(r).stream().anyMatch(w -> w.contains("hand-eye transform off by 3.00 deg and 5.0 mm")), ArmWords.warnings(r).toString());
    }

    @Test
    void startOutsideTheLimitsIsRefused() {
        ServoSet set = set();
        double[] start = DemoArm.rad(new double[]{175, 10, 20, 0, 60, 0});
        var e = assertThrows(IllegalArgumentException.class, () -> ArmRehearsal.run(set, DemoArm.model(), HandEye.demo(), config(1, 0.01), List.of(start)));
        assertTrue(e.getMessage().contains("outside its limits"), e.getMessage());
    }

    @Test
    void envelopeStartsAreReachedByInverseKinematicsAndConverge() throws InterruptedException {
        ArmRehearsalConfig c = config(1.0, 0.01);
        c.servo.starts = 6;
        c.servo.convergedPx = 0.5;
        c.servo.traceEvery = 10;
        ArmRehearsalResult r = ArmRehearsal.run(set(), DemoArm.model(), HandEye.demo(), c, null);
        assertEquals(6, r.runs().size());
        assertEquals(6, r.converged(), r.runs().toString());
        assertTrue(ArmWords.warnings(r).get(0).contains("invented demo arm"));
    }

    private static double sq(double v) { return v * v; }
}
