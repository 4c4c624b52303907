package org.targetbench.arm;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;
import org.targetbench.camera.Pose;
import org.targetbench.camera.PoseEstimation;
import org.targetbench.servo.ParallelRuns;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;

/**
 * Rehearses a servo set on a six-axis arm with the camera on its flange, before the robot moves.
 *
 * <p>Each controller period T: forward kinematics gives the flange pose, the true hand-eye X the camera pose; the
 * target's points are projected as in the free-flying rehearsal; the law v = -λ L̂⁺ (s - s*) runs on the image of
 * {@code latencyFrames} periods ago (no command until the first image arrives); the camera twist becomes the flange
 * twist through the adjoint of the believed hand-eye X̂ (X with any injected error) and is rotated into the base
 * frame; damped least squares q̇ = Jᵀ (J Jᵀ + μ² I)⁻¹ V gives joint speeds [1, 2], with the damping schedule
 * μ² = μ0² (1 - w/w0)² for manipulability w below w0 and 0 above [1, from memory]; if any |q̇i| exceeds its limit all
 * joint speeds are scaled by the same factor (the path keeps its direction); the speeds are held for the period
 * (q += q̇ T). A joint that reaches a position limit ends the run there.
 *
 * <p>The target sits where the reference view puts it: with the reference joints q*, T_base_target =
 * T(q*) · X · T_camera_target(reference pose of the set). Starts are joint vectors given by the caller, or camera
 * offsets drawn from the servo envelope as in the free-flying rehearsal and turned into joints by damped
 * least-squares inverse kinematics from q* (a start the arm cannot reach within its limits is drawn again).
 *
 * <p>Caveats: kinematics only. No dynamics, payload, collisions with the cell or controller limits (acceleration,
 * filters, interpolation) are modelled.
 *
 * <p>References: [1] Y. Nakamura, H. Hanafusa, "Inverse kinematic solutions with singularity robustness for robot
 * manipulator control", ASME J. Dyn. Sys. Meas. Control 108, 1986. [2] C. W. Wampler, "Manipulator inverse
 * kinematic solutions based on vector formulations and damped least-squares methods", IEEE Trans. SMC 16(1), 1986.
 * [3] T. Yoshikawa, IJRR 4(2), 1985 (manipulability). [4] S. A. Levin, R. M. May, Theor. Pop. Biol. 9, 1976 (delay
 * bound, see {@link GainAdvice}).
 */
public final class ArmRehearsal {
    /** Attempts at drawing a reachable, in-view start from the envelope. */
    static final int START_TRIES = 200;
    /** Inverse kinematics: iterations and the pose tolerance (metres and radians). */
    static final int IK_ITERATIONS = 200;
    static final double IK_TOL = 1e-10;
    private static final int BLOCK = 4;

    private ArmRehearsal() {}

    /**
     * Runs the rehearsal.
     *
     * @param startJointsRad the starts, or null to draw {@code config.servo.starts} from the servo envelope
     * @throws IllegalArgumentException for a set without a usable reference pose, start joints outside the limits or
     *                                  a reference the arm cannot hold
     */
    public static ArmRehearsalResult run(ServoSet set, ArmModel arm, HandEye handEye, ArmRehearsalConfig config, List<double[]> startJointsRad)
            throws InterruptedException {
        config.checkValidity();
        ArmRehearsalConfig c = config.copy();
        String[] method = new String[1];
        ArmLoop.Scene scene = scene(set, arm, handEye, c, method);
        List<double[]> starts = startJointsRad != null ? checkStarts(arm, startJointsRad) : drawStarts(scene, c);
        ArmRunResult[] results = new ArmRunResult[starts.size()];
        ArmRunTrace[] traces = new ArmRunTrace[Math.min(starts.size(), c.servo.tracedRuns)];
        runAll(scene, c, starts, results, traces);
        HandEye believed = handEye.perturbed(c.handEyeErrorDeg, c.handEyeErrorMm);
        return new ArmRehearsalResult(arm, handEye, believed, c, scene.referenceJoints(), method[0], List.of(results),
                List.of(traces), Optional.empty(), scene.baseToTarget());
    }

    /** As {@link #run} and then the gain sweep over {@code lambdas} (1/s) on the same starts. */
    public static ArmRehearsalResult runWithAdvice(ServoSet set, ArmModel arm, HandEye handEye, ArmRehearsalConfig config,
                                                   List<double[]> startJointsRad, double[] lambdas) throws InterruptedException {
        ArmRehearsalResult r = run(set, arm, handEye, config, startJointsRad);
        List<double[]> starts = r.runs().stream().map(ArmRunResult::startJointsRad).toList();
        GainAdvice a = advise(set, arm, handEye, config, starts, lambdas);
        return new ArmRehearsalResult(r.arm(), r.handEye(), r.handEyeBelieved(), r.config(), r.referenceJointsRad(), r.poseMethod(), r.runs(),
                r.traces(), Optional.of(a), r.baseToTarget());
    }

    /** The gain sweep: every λ from every start, without traces. */
    public static GainAdvice advise(ServoSet set, ArmModel arm, HandEye handEye, ArmRehearsalConfig config, List<double[]> starts,
                                    double[] lambdas) throws InterruptedException {
        List<GainAdvice.Row> rows = new ArrayList<>();
        double best = Double.NaN;
        double[] sorted = lambdas.clone();
        Arrays.sort(sorted);
        for (double lambda : sorted) {
            ArmRehearsalConfig c = config.copy();
            c.servo.lambda = lambda;
            c.servo.tracedRuns = 0;
            c.checkValidity();
            ArmLoop.Scene scene = scene(set, arm, handEye, c, new String[1]);
            ArmRunResult[] res = new ArmRunResult[starts.size()];
            runAll(scene, c, checkStarts(arm, starts), res, new ArmRunTrace[0]);
            int conv = 0, osc = 0;
            for (ArmRunResult x : res) {
                if (x.outcome() == ArmOutcome.CONVERGED) conv++;
                if (x.flags().contains(ArmFlag.OSCILLATION)) osc++;
            }
            GainAdvice.Row row = new GainAdvice.Row(lambda, conv, res.length, osc);
            rows.add(row);
            if (row.clean()) best = lambda;
        }
        return new GainAdvice(config.latencyFrames, config.servo.dtS, rows, best);
    }

    private static void runAll(ArmLoop.Scene scene, ArmRehearsalConfig c, List<double[]> starts, ArmRunResult[] results, ArmRunTrace[] traces)
            throws InterruptedException {
        int n = starts.size();
        ParallelRuns.run(n, Math.max(1, Math.min(c.servo.threads, n)), BLOCK, "targetbench-arm-rehearse", () -> new ArmLoop(scene, c), (loop, i) -> {
            ArmRunTrace[] slot = i < traces.length ? new ArmRunTrace[1] : null;
            results[i] = loop.run(i, starts.get(i), slot);
            if (slot != null) traces[i] = slot[0];
        });
    }

    /** Checks that every start is 6 finite joints within the limits. */
    public static List<double[]> checkStarts(ArmModel arm, List<double[]> starts) {
        if (starts.isEmpty()) throw new IllegalArgumentException("no start joints given");
        List<double[]> out = new ArrayList<>();
        for (int i = 0; i < starts.size(); i++) {
            double[] q = starts.get(i);
            if (q.length != ArmModel.JOINTS) throw new IllegalArgumentException("start " + (i + 1) + " has " + q.length + " joint values, needs 6");
            for (int j = 0; j < ArmModel.JOINTS; j++)
                if (!Double.isFinite(q[j]) || q[j] < arm.lower(j) || q[j] > arm.upper(j))
                    throw new IllegalArgumentException(String.format(java.util.Locale.ROOT,
                            "start %d: joint %d at %.3f deg is outside its limits %.1f..%.1f deg", i + 1, j + 1, Math.toDegrees(q[j]),
                            Math.toDegrees(arm.lower(j)), Math.toDegrees(arm.upper(j))));
            out.add(q.clone());
        }
        return out;
    }

    static ArmLoop.Scene scene(ServoSet set, ArmModel arm, HandEye handEye, ArmRehearsalConfig c, String[] methodOut) {
        List<ServoPoint> pts = set.points();
        int k = pts.size();
        if (k < 3) throw new IllegalArgumentException("a rehearsal needs at least 3 points, got " + k);
        Pose pose;
        methodOut[0] = set.poseMethod();
        if (set.referencePose().isPresent()) pose = set.referencePose().get();
        else {
            List<double[]> px = pts.stream().map(p -> new double[]{p.u(), p.v()}).toList();
            List<double[]> mm = pts.stream().map(p -> new double[]{p.targetXMm(), p.targetYMm()}).toList();
            pose = PoseEstimation.planar(set.camera(), px, mm).orElseThrow(() ->
                    new IllegalArgumentException("the set has no reference pose and PnP on its " + k + " points failed")).pose();
            methodOut[0] = PoseEstimation.METHOD + " from the set's own " + k + " points";
        }
        double[] qRef = c.referenceJointsRad != null ? c.referenceJointsRad.clone() : arm.isDemo() ? DemoArm.rad(DemoArm.REFERENCE_DEG) : new double[6];
        if (!arm.withinLimits(qRef)) throw new IllegalArgumentException("the reference joints " + Arrays.toString(deg(qRef)) + " deg are outside the arm's limits");
        double[][] world = new double[k][];
        double[] uS = new double[k], vS = new double[k], xS = new double[k], yS = new double[k], zS = new double[k], noise = new double[k];
        RehearsalConfig sc = c.servo;
        for (int i = 0; i < k; i++) {
            ServoPoint p = pts.get(i);
            world[i] = new double[]{p.targetXMm() / 1000, p.targetYMm() / 1000, 0};
            uS[i] = p.u(); vS[i] = p.v(); xS[i] = p.x(); yS[i] = p.y(); zS[i] = p.zM();
            noise[i] = Double.isNaN(sc.noiseSigmaPx) ? p.robustness().jitterPx().orElse(0) : sc.noiseSigmaPx;
        }
        double[] X = handEye.transform();
        double[] believed = handEye.perturbed(c.handEyeErrorDeg, c.handEyeErrorMm).transform();
        double[] camToTarget = Rigid.of(pose.rotation(), pose.translation()); // P_c = R P_t + t
        double[] baseToTarget = Rigid.mul(Rigid.mul(arm.forward(qRef), X), camToTarget);
        double[] refCamInTarget = Rigid.inverse(camToTarget);
        return new ArmLoop.Scene(arm, set.camera(), world, uS, vS, xS, yS, zS, noise, baseToTarget, X, believed, qRef, refCamInTarget,
                Math.abs(refCamInTarget[11]));
    }

    /** Starts from the servo envelope: camera offsets in the reference camera frame, turned into joints by IK. */
    static List<double[]> drawStarts(ArmLoop.Scene s, ArmRehearsalConfig c) {
        RehearsalConfig sc = c.servo;
        List<double[]> out = new ArrayList<>();
        ArmLoop probe = new ArmLoop(s, c);
        double[] targetToBase = Rigid.inverse(s.baseToTarget());
        double[] xInv = Rigid.inverse(s.handEyeTrue());
        for (int i = 0; i < sc.starts; i++) {
            SplittableRandom rng = new SplittableRandom(ArmLoop.runSeed(sc.seed ^ 0x5EEDL, i));
            double[] found = null;
            for (int attempt = 0; attempt < START_TRIES && found == null; attempt++) {
                double[] t = new double[3], r = new double[3];
                for (int a = 0; a < 3; a++) t[a] = (2 * rng.nextDouble() - 1) * sc.envelopeMm[a] / 1000;
                for (int a = 0; a < 3; a++) r[a] = Math.toRadians((2 * rng.nextDouble() - 1) * sc.envelopeDeg[a]);
                double[] delta = Rigid.fromRotationVector(r[0], r[1], r[2]);
                delta[3] = t[0]; delta[7] = t[1]; delta[11] = t[2];
                double[] camInTarget = Rigid.mul(s.referenceCameraInTarget(), delta);
                if (probe.project(camInTarget) >= 0) continue;
                double[] flange = Rigid.mul(Rigid.mul(s.baseToTarget(), camInTarget), xInv);
                Optional<double[]> q = inverse(s.arm(), flange, s.referenceJoints());
                if (q.isPresent() && s.arm().withinLimits(q.get())) found = q.get();
            }
            if (found == null) throw new IllegalArgumentException("no reachable start with every point in view after " + START_TRIES
                    + " draws for start " + (i + 1) + ": shrink the envelope");
            out.add(found);
        }
        return out;
    }

    /**
     * Inverse kinematics by damped Newton steps from {@code seed}: joints whose flange pose equals {@code target} to
     * {@link #IK_TOL}, or empty when the iteration does not get there.
     */
    public static Optional<double[]> inverse(ArmModel arm, double[] target, double[] seed) {
        double[] q = seed.clone();
        double[][] frames = new double[ArmModel.JOINTS + 1][16];
        DMatrixRMaj jac = new DMatrixRMaj(6, 6), e = new DMatrixRMaj(6, 1), dq = new DMatrixRMaj(6, 1);
        LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.pseudoInverse(true);
        for (int it = 0; it < IK_ITERATIONS; it++) {
            double[] f = arm.jacobian(q, frames, jac);
            double[] rel = Rigid.mul(target, Rigid.inverse(f)); // rotation error in the base frame
            double[] rv = Rigid.rotationVector(rel);
            e.data[0] = target[3] - f[3];
            e.data[1] = target[7] - f[7];
            e.data[2] = target[11] - f[11];
            e.data[3] = rv[0]; e.data[4] = rv[1]; e.data[5] = rv[2];
            double n = 0;
            for (double v : e.data) n = Math.max(n, Math.abs(v));
            if (n < IK_TOL) return Optional.of(q);
            if (!solver.setA(jac.copy())) return Optional.empty();
            solver.solve(e, dq);
            double step = 0;
            for (double v : dq.data) step = Math.max(step, Math.abs(v));
            double scale = step > 0.3 ? 0.3 / step : 1;
            for (int i = 0; i < 6; i++) q[i] += scale * dq.data[i];
        }
        return Optional.empty();
    }

    static double[] deg(double[] r) {
        double[] d = new double[r.length];
        for (int i = 0; i < r.length; i++) d[i] = Math.round(Math.toDegrees(r[i]) * 1000) / 1000.0;
        return d;
    }
}
