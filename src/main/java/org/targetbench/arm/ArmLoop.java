package org.targetbench.arm;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;
import org.targetbench.camera.CameraModel;
import org.targetbench.servo.PointProjection;
import org.targetbench.servo.DepthMode;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.ServoController;

import java.util.Arrays;
import java.util.EnumSet;
import java.util.Set;
import java.util.SplittableRandom;

/**
 * One closed-loop run on the arm, see {@link ArmRehearsal}. Holds its own workspace: one instance per thread.
 */
final class ArmLoop {
    /** Everything that does not change between runs. Transforms are 4 x 4 row major. */
    record Scene(ArmModel arm, CameraModel camera, double[][] targetPoints, double[] uStar, double[] vStar, double[] xStar, double[] yStar,
                 double[] zStar, double[] noisePx, double[] baseToTarget, double[] handEyeTrue, double[] handEyeBelieved,
                 double[] referenceJoints, double[] referenceCameraInTarget, double referenceDistanceM) {}

    private static final int J = ArmModel.JOINTS;

    private final Scene s;
    private final ArmRehearsalConfig c;
    private final RehearsalConfig sc;
    private final int k;
    private final ServoController controller;
    private final PointProjection projection;
    private final double[] u, v, x, y, z;
    private final double[][] bufX, bufY, bufZ;
    private final double[] xi = new double[6], twist = new double[6], qd = new double[J];
    private final double[][] frames = new double[J + 1][16];
    private final DMatrixRMaj jac = new DMatrixRMaj(6, J), jjt = new DMatrixRMaj(6, 6), rhs = new DMatrixRMaj(6, 1), sol = new DMatrixRMaj(6, 1);
    private final LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(6);
    private final LinearSolverDense<DMatrixRMaj> pinv = LinearSolverFactory_DDRM.pseudoInverse(true);
    private final double[] targetToBase;

    ArmLoop(Scene scene, ArmRehearsalConfig config) {
        s = scene;
        c = config;
        sc = config.servo;
        k = scene.uStar().length;
        projection = new PointProjection(scene.camera());
        double[] zStarEst = scene.zStar().clone();
        if (sc.depthMode == DepthMode.SCALED) for (int i = 0; i < k; i++) zStarEst[i] *= sc.depthErrorFactor;
        controller = new ServoController(scene.xStar(), scene.yStar(), zStarEst, sc.lambda, sc.law);
        u = new double[k]; v = new double[k]; x = new double[k]; y = new double[k]; z = new double[k];
        int n = config.latencyFrames + 1;
        bufX = new double[n][k]; bufY = new double[n][k]; bufZ = new double[n][k];
        targetToBase = Rigid.inverse(scene.baseToTarget());
    }

    /** Camera pose in the target frame for joints q (true hand-eye). */
    double[] cameraInTarget(double[] q, double[] flange) {
        return Rigid.mul(targetToBase, Rigid.mul(flange, s.handEyeTrue()));
    }

    ArmRunResult run(int index, double[] q0, ArmRunTrace[] traceOut) {
        SplittableRandom rng = new SplittableRandom(runSeed(sc.seed, index));
        double[] q = q0.clone();
        ArmModel arm = s.arm();
        int maxSteps = sc.maxSteps();
        boolean trace = traceOut != null;
        int every = trace ? sc.traceEvery : 1;
        int cap = trace ? maxSteps / every + 2 : 0;
        double[] tt = new double[cap], te = new double[cap], tw = new double[cap], tm = new double[cap], tx = new double[cap], ty = new double[cap], tz = new double[cap];
        double[][] tq = new double[J][cap];
        int nt = 0;
        double[] ref = s.referenceCameraInTarget();
        EnumSet<ArmFlag> flags = EnumSet.noneOf(ArmFlag.class);
        ArmOutcome outcome = ArmOutcome.TIMEOUT;
        double initialErr = Double.NaN, err = Double.NaN;
        double[] errHistory = new double[2 * (2 * c.latencyFrames + 1) + 1];
        double minW = Double.POSITIVE_INFINITY, minWTime = 0, minMargin = Double.POSITIVE_INFINITY, peakRatio = 0;
        int minMarginJoint = 1, peakJoint = 1, damped = 0, scaled = 0, growth = 0, step = 0;
        double[] worst = q.clone();
        double startSign5 = Math.signum(q[4]);
        double[] cam = null;
        for (; ; step++) {
            double[] flange = arm.jacobian(q, frames, jac);
            double w = ArmModel.manipulability(jac);
            if (w < minW) {
                minW = w;
                minWTime = step * sc.dtS;
                worst = q.clone();
            }
            for (int i = 0; i < J; i++) {
                double m = Math.min(q[i] - arm.lower(i), arm.upper(i) - q[i]);
                if (m < minMargin) { minMargin = m; minMarginJoint = i + 1; }
            }
            if (Math.signum(q[4]) != startSign5 && startSign5 != 0) flags.add(ArmFlag.WRIST_SINGULARITY_CROSSED);
            if (w < c.singularThreshold) flags.add(ArmFlag.WRIST_SINGULARITY_CROSSED);
            cam = cameraInTarget(q, flange);
            int out = project(cam);
            if (trace && step % every == 0) {
                double[] rel = Rigid.mul(Rigid.inverse(ref), cam);
                tt[nt] = step * sc.dtS;
                te[nt] = out >= 0 ? Double.NaN : errorRms();
                tw[nt] = w;
                tm[nt] = Math.toDegrees(arm.limitMargin(q));
                tx[nt] = rel[3] * 1000; ty[nt] = rel[7] * 1000; tz[nt] = rel[11] * 1000;
                for (int j = 0; j < J; j++) tq[j][nt] = Math.toDegrees(q[j]);
                nt++;
            }
            if (out >= 0) {
                outcome = ArmOutcome.LEFT_FIELD_OF_VIEW;
                flags.add(ArmFlag.TARGET_LEFT_VIEW);
                break;
            }
            err = errorRms();
            if (step == 0) initialErr = err;
            if (err < sc.convergedPx) {
                outcome = ArmOutcome.CONVERGED;
                break;
            }
            // oscillation: the error exceeds its value one oscillation cycle earlier (2(2d+1) periods, the cycle of the
            // delayed loop at its stability bound, derived) for several periods in a row
            int lag = errHistory.length - 1;
            errHistory[step % errHistory.length] = err;
            if (step >= lag && err > errHistory[(step - lag) % errHistory.length]) {
                if (++growth >= c.oscillationPeriods) flags.add(ArmFlag.OSCILLATION);
            } else growth = 0;
            if (step >= maxSteps) break;
            if (Math.abs(cam[11]) > sc.retreatLimit * s.referenceDistanceM()) {
                outcome = ArmOutcome.RETREATED;
                break;
            }
            // measurement now, used latencyFrames periods later
            int slot = step % bufX.length;
            measure(rng, bufX[slot], bufY[slot], bufZ[slot]);
            Arrays.fill(qd, 0);
            if (step >= c.latencyFrames) {
                int used = (step - c.latencyFrames) % bufX.length;
                if (!controller.velocity(bufX[used], bufY[used], bufZ[used], xi)) {
                    outcome = ArmOutcome.SINGULAR;
                    break;
                }
                flangeTwistInBase(xi, flange, twist);
                double mu2 = c.dampingSquared(w);
                if (mu2 > 0) damped++;
                if (!solve(twist, mu2, qd)) {
                    outcome = ArmOutcome.SINGULAR;
                    break;
                }
                // uniform scaling keeps the direction of the joint motion
                double ratio = 0;
                int rj = 0;
                for (int i = 0; i < J; i++) {
                    double r = Math.abs(qd[i]) / arm.maxSpeed(i);
                    if (r > ratio) { ratio = r; rj = i; }
                }
                if (ratio > 1) {
                    scaled++;
                    for (int i = 0; i < J; i++) qd[i] /= ratio;
                }
                if (Math.min(ratio, 1) > peakRatio) { peakRatio = Math.min(ratio, 1); peakJoint = rj + 1; }
            }
            boolean hit = false;
            for (int i = 0; i < J; i++) {
                q[i] += qd[i] * sc.dtS; // joint speeds held for one controller period
                if (q[i] < arm.lower(i) || q[i] > arm.upper(i)) {
                    q[i] = Math.max(arm.lower(i), Math.min(arm.upper(i), q[i]));
                    hit = true;
                }
            }
            if (hit) {
                flags.add(ArmFlag.JOINT_LIMIT_REACHED);
                outcome = ArmOutcome.JOINT_LIMIT;
                minMargin = 0;
                cam = cameraInTarget(q, arm.forward(q));
                step++;
                break;
            }
        }
        if (damped > 0) flags.add(ArmFlag.DAMPING_ACTIVE);
        if (step > 0 && scaled > step / 2) flags.add(ArmFlag.SPEED_LIMITED_MOST);
        double camMm = Rigid.distance(cam, ref) * 1000, camDeg = Math.toDegrees(Rigid.angleBetween(cam, ref));
        if (outcome == ArmOutcome.CONVERGED) {
            for (int i = 0; i < J; i++)
                if (Math.abs(Math.toDegrees(q[i] - s.referenceJoints()[i])) > c.configurationTolDeg) flags.add(ArmFlag.OTHER_CONFIGURATION);
        }
        if (trace) {
            double[][] jq = new double[J][];
            for (int j = 0; j < J; j++) jq[j] = Arrays.copyOf(tq[j], nt);
            traceOut[0] = new ArmRunTrace(index, outcome, Arrays.copyOf(tt, nt), Arrays.copyOf(te, nt), jq, Arrays.copyOf(tw, nt),
                    Arrays.copyOf(tm, nt), Arrays.copyOf(tx, nt), Arrays.copyOf(ty, nt), Arrays.copyOf(tz, nt));
        }
        Set<ArmFlag> fl = flags;
        return new ArmRunResult(index, q0, outcome, step * sc.dtS, step, initialErr, err, minW, minWTime, worst, Math.toDegrees(minMargin),
                minMarginJoint, peakRatio, peakJoint, damped * sc.dtS, scaled * sc.dtS, q, camMm, camDeg, fl);
    }

    /**
     * Camera twist (camera frame) to the flange twist in the base frame through the believed hand-eye X = (R, t):
     * ω_f = R ω_c, v_f = R v_c + t × ω_f (the adjoint, Murray, Li &amp; Sastry 1994 sec. 2.4), then rotated into the base.
     */
    private void flangeTwistInBase(double[] xiC, double[] flange, double[] out) {
        double[] X = s.handEyeBelieved();
        double wx = X[0] * xiC[3] + X[1] * xiC[4] + X[2] * xiC[5];
        double wy = X[4] * xiC[3] + X[5] * xiC[4] + X[6] * xiC[5];
        double wz = X[8] * xiC[3] + X[9] * xiC[4] + X[10] * xiC[5];
        double tx = X[3], ty = X[7], tz = X[11];
        double vx = X[0] * xiC[0] + X[1] * xiC[1] + X[2] * xiC[2] + (ty * wz - tz * wy);
        double vy = X[4] * xiC[0] + X[5] * xiC[1] + X[6] * xiC[2] + (tz * wx - tx * wz);
        double vz = X[8] * xiC[0] + X[9] * xiC[1] + X[10] * xiC[2] + (tx * wy - ty * wx);
        double[] f = flange;
        out[0] = f[0] * vx + f[1] * vy + f[2] * vz;
        out[1] = f[4] * vx + f[5] * vy + f[6] * vz;
        out[2] = f[8] * vx + f[9] * vy + f[10] * vz;
        out[3] = f[0] * wx + f[1] * wy + f[2] * wz;
        out[4] = f[4] * wx + f[5] * wy + f[6] * wz;
        out[5] = f[8] * wx + f[9] * wy + f[10] * wz;
    }

    /**
     * Damped least squares q̇ = Jᵀ (J Jᵀ + μ² I)⁻¹ V (Nakamura &amp; Hanafusa 1986; Wampler 1986); μ = 0 away from
     * singularities gives J⁻¹ V. Falls back to the pseudo-inverse when J Jᵀ + μ² I cannot be factored.
     */
    private boolean solve(double[] V, double mu2, double[] out) {
        CommonOps_DDRM.multTransB(jac, jac, jjt);
        for (int i = 0; i < 6; i++) jjt.add(i, i, mu2);
        System.arraycopy(V, 0, rhs.data, 0, 6);
        DMatrixRMaj a = jjt.copy();
        if (lu.setA(a) && Math.abs(CommonOps_DDRM.det(jjt)) > 1e-30) {
            lu.solve(rhs, sol);
            for (int i = 0; i < J; i++) {
                double sum = 0;
                for (int r = 0; r < 6; r++) sum += jac.get(r, i) * sol.data[r];
                out[i] = sum;
            }
        } else {
            if (!pinv.setA(jac.copy())) return false;
            pinv.solve(rhs, sol);
            System.arraycopy(sol.data, 0, out, 0, J);
        }
        for (int i = 0; i < J; i++) if (!Double.isFinite(out[i])) return false;
        return true;
    }

    /** Projects the true points for a camera pose in the target frame; returns the first point out of view, or -1. */
    int project(double[] g) {
        return projection.project(s.targetPoints(), g, 4, g[3], g[7], g[11], x, y, z, u, v);
    }

    private double errorRms() {
        return PointProjection.errorRms(u, v, s.uStar(), s.vStar());
    }

    private void measure(SplittableRandom rng, double[] xm, double[] ym, double[] zEst) {
        projection.measure(rng, s.noisePx(), x, y, z, u, v, s.zStar(), sc.depthMode, sc.depthErrorFactor, xm, ym, zEst);
    }

    static long runSeed(long seed, int index) {
        long h = seed * 0x9E3779B97F4A7C15L + index;
        h = (h ^ (h >>> 30)) * 0xBF58476D1CE4E5B9L;
        h = (h ^ (h >>> 27)) * 0x94D049BB133111EBL;
        return h ^ (h >>> 31);
    }

}
