package org.targetbench.servo;

import boofcv.struct.distort.Point2Transform2_F64;
import georegression.geometry.ConvertRotation3D_F64;
import georegression.struct.point.Point2D_F64;
import georegression.struct.se.Se3_F64;
import org.ejml.data.DMatrixRMaj;
import org.targetbench.camera.CameraModel;

import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * One closed-loop run of the servo on the simulated cell, see {@link Rehearsal}. Holds its own workspace, so one
 * instance per thread; the shared {@link Scene} is read only.
 */
final class ClosedLoop {
    /** Attempts at drawing a start pose from which every point is visible. */
    static final int START_TRIES = 1000;

    /** Everything that does not change between runs. */
    record Scene(CameraModel camera, double[][] worldPoints, Se3_F64 referenceCameraToWorld, double[] uStar, double[] vStar,
                 double[] xStar, double[] yStar, double[] zStar, int[] ids, double[] noisePx, double[] survival,
                 double referenceDistanceM) {}

    private final Scene s;
    private final RehearsalConfig c;
    private final int k;
    private final boolean pinhole;
    private final Point2Transform2_F64 toPixel;
    private final Point2Transform2_F64 toNorm;
    private final ServoController controller;
    private final RigidMotion motion = new RigidMotion();
    private final Point2D_F64 p2 = new Point2D_F64();
    private final double[] u, v, x, y, z, xm, ym, zEst, vel = new double[6];
    private final int[] lossStep;

    ClosedLoop(Scene scene, RehearsalConfig config) {
        this.s = scene;
        this.c = config;
        this.k = scene.ids().length;
        this.pinhole = !scene.camera().isDistorted();
        this.toPixel = scene.camera().normalisedToPixel();
        this.toNorm = scene.camera().pixelToNormalised();
        double[] zStarEst = scene.zStar().clone();
        if (config.depthMode == DepthMode.SCALED) for (int i = 0; i < k; i++) zStarEst[i] *= config.depthErrorFactor;
        this.controller = new ServoController(scene.xStar(), scene.yStar(), zStarEst, config.lambda, config.law);
        u = new double[k]; v = new double[k]; x = new double[k]; y = new double[k]; z = new double[k];
        xm = new double[k]; ym = new double[k]; zEst = new double[k];
        lossStep = new int[k];
    }

    /** Seed of run {@code index}: a SplitMix64 step of the seed and index, so runs are independent of thread order. */
    static long runSeed(long seed, int index) {
        long h = seed * 0x9E3779B97F4A7C15L + index;
        h = (h ^ (h >>> 30)) * 0xBF58476D1CE4E5B9L;
        h = (h ^ (h >>> 27)) * 0x94D049BB133111EBL;
        return h ^ (h >>> 31);
    }

    /**
     * One run; {@code fixedStart} null draws the start from the envelope. {@code traceOut} null keeps no trace,
     * otherwise its first slot receives it.
     */
    private int redraws;

    RunResult run(int index, RunTrace[] traceOut, RunResult.StartOffset fixedStart) {
        redraws = 0;
        SplittableRandom rng = new SplittableRandom(runSeed(c.seed, index));
        Se3_F64 g = new Se3_F64();
        RunResult.StartOffset start = fixedStart == null ? drawStart(rng, g) : place(fixedStart, g);
        int maxSteps = c.maxSteps();
        Arrays.fill(lossStep, Integer.MAX_VALUE);
        if (c.useSurvival)
            for (int i = 0; i < k; i++)
                if (!Double.isNaN(s.survival()[i]) && rng.nextDouble() >= s.survival()[i]) lossStep[i] = rng.nextInt(maxSteps);
        boolean trace = traceOut != null;
        int cap = trace ? maxSteps / c.traceEvery + 2 : 0;
        double[] tt = new double[cap], te = new double[cap], tx = new double[cap], ty = new double[cap], tz = new double[cap];
        int nt = 0;
        Se3_F64 ref = s.referenceCameraToWorld();
        DMatrixRMaj rRef = ref.R;
        double startZ = 0, initialErr = Double.NaN, err = Double.NaN, maxRetreat = 0, minDist = Double.POSITIVE_INFINITY, maxRatio = 0;
        RunOutcome outcome = RunOutcome.TIMEOUT;
        int lost = -1, step = 0;
        for (; ; step++) {
            int out = project(g);
            double dist = Math.abs(g.T.z); // the target plane is z = 0 of the world (target) frame
            minDist = Math.min(minDist, dist);
            maxRatio = Math.max(maxRatio, dist / s.referenceDistanceM());
            double dx = g.T.x - ref.T.x, dy = g.T.y - ref.T.y, dz = g.T.z - ref.T.z;
            // camera centre in the reference camera frame: R_ref^T (c - c_ref)
            double cx = rRef.data[0] * dx + rRef.data[3] * dy + rRef.data[6] * dz;
            double cy = rRef.data[1] * dx + rRef.data[4] * dy + rRef.data[7] * dz;
            double cz = rRef.data[2] * dx + rRef.data[5] * dy + rRef.data[8] * dz;
            if (step == 0) startZ = cz;
            // backward motion beyond both the start and the reference position
            maxRetreat = Math.max(maxRetreat, Math.min(startZ, 0) - cz);
            if (out >= 0) {
                outcome = RunOutcome.LEFT_FIELD_OF_VIEW;
                lost = s.ids()[out];
                break;
            }
            err = errorRms();
            if (step == 0) initialErr = err;
            if (trace && step % c.traceEvery == 0) {
                tt[nt] = step * c.dtS; te[nt] = err; tx[nt] = cx * 1000; ty[nt] = cy * 1000; tz[nt] = cz * 1000;
                nt++;
            }
            if (err < c.convergedPx) {
                outcome = RunOutcome.CONVERGED;
                break;
            }
            if (step >= maxSteps) break;
            if (dist > c.retreatLimit * s.referenceDistanceM()) {
                outcome = RunOutcome.RETREATED;
                break;
            }
            int dropped = -1;
            for (int i = 0; i < k; i++) if (lossStep[i] == step) dropped = i;
            if (dropped >= 0) {
                outcome = RunOutcome.TRACK_LOST;
                lost = s.ids()[dropped];
                break;
            }
            measure(rng);
            if (!controller.velocity(xm, ym, zEst, vel)) {
                outcome = RunOutcome.SINGULAR;
                break;
            }
            motion.integrate(g, vel, c.dtS);
        }
        if (trace) traceOut[0] = new RunTrace(index, outcome, Arrays.copyOf(tt, nt), Arrays.copyOf(te, nt), Arrays.copyOf(tx, nt),
                Arrays.copyOf(ty, nt), Arrays.copyOf(tz, nt));
        return new RunResult(index, start, outcome, step * c.dtS, step, initialErr, err, maxRetreat * 1000, minDist, maxRatio, lost, redraws);
    }

    /** Draws a start pose (camera to world) within the envelope from which every point is in view. */
    private RunResult.StartOffset drawStart(SplittableRandom rng, Se3_F64 g) {
        RunResult.StartOffset off = null;
        for (int attempt = 0; attempt < START_TRIES; attempt++) {
            double[] t = new double[3], r = new double[3];
            for (int i = 0; i < 3; i++) t[i] = (2 * rng.nextDouble() - 1) * c.envelopeMm[i];
            for (int i = 0; i < 3; i++) r[i] = (2 * rng.nextDouble() - 1) * c.envelopeDeg[i];
            off = place(new RunResult.StartOffset(t[0], t[1], t[2], r[0], r[1], r[2]), g);
            if (project(g) < 0) return off;
            redraws++;
        }
        return off; // every attempt had a point out of view: the run ends at once as LEFT_FIELD_OF_VIEW
    }

    /** Sets {@code g} to the reference camera pose moved by {@code off}. */
    private RunResult.StartOffset place(RunResult.StartOffset off, Se3_F64 g) {
        Se3_F64 delta = new Se3_F64();
        double ang = Math.toRadians(off.rotationDeg());
        if (ang > 0) ConvertRotation3D_F64.rodriguesToMatrix(Math.toRadians(off.rxDeg()) / ang, Math.toRadians(off.ryDeg()) / ang,
                Math.toRadians(off.rzDeg()) / ang, ang, delta.R);
        delta.T.setTo(off.txMm() / 1000, off.tyMm() / 1000, off.tzMm() / 1000);
        delta.concat(s.referenceCameraToWorld(), g); // start camera pose in the reference camera frame, then to world
        return off;
    }

    /** Projects the true points; returns the index of the first point out of view, or -1. */
    private int project(Se3_F64 g) {
        double[] r = g.R.data;
        double[][] pw = s.worldPoints();
        CameraModel cam = s.camera();
        for (int i = 0; i < k; i++) {
            double dx = pw[i][0] - g.T.x, dy = pw[i][1] - g.T.y, dz = pw[i][2] - g.T.z;
            double X = r[0] * dx + r[3] * dy + r[6] * dz, Y = r[1] * dx + r[4] * dy + r[7] * dz, Z = r[2] * dx + r[5] * dy + r[8] * dz;
            if (!(Z > 0)) return i;
            x[i] = X / Z;
            y[i] = Y / Z;
            z[i] = Z;
            if (pinhole) {
                u[i] = cam.fx() * x[i] + cam.cx();
                v[i] = cam.fy() * y[i] + cam.cy();
            } else {
                toPixel.compute(x[i], y[i], p2);
                u[i] = p2.x;
                v[i] = p2.y;
            }
            if (!cam.inImage(u[i], v[i])) return i;
        }
        return -1;
    }

    private double errorRms() {
        double sum = 0;
        for (int i = 0; i < k; i++) {
            double du = u[i] - s.uStar()[i], dv = v[i] - s.vStar()[i];
            sum += du * du + dv * dv;
        }
        return Math.sqrt(sum / k);
    }

    /** Noisy measurement of the features and the controller's depth estimates. */
    private void measure(SplittableRandom rng) {
        CameraModel cam = s.camera();
        for (int i = 0; i < k; i++) {
            double sigma = s.noisePx()[i];
            if (sigma > 0) {
                double um = u[i] + sigma * gaussian(rng), vm = v[i] + sigma * gaussian(rng);
                if (pinhole) {
                    xm[i] = (um - cam.cx()) / cam.fx();
                    ym[i] = (vm - cam.cy()) / cam.fy();
                } else {
                    toNorm.compute(um, vm, p2);
                    xm[i] = p2.x;
                    ym[i] = p2.y;
                }
            } else {
                xm[i] = x[i];
                ym[i] = y[i];
            }
            zEst[i] = switch (c.depthMode) {
                case TRUE -> z[i];
                case CONSTANT -> s.zStar()[i];
                case SCALED -> s.zStar()[i] * c.depthErrorFactor;
            };
        }
    }

    /** Standard normal deviate (Box-Muller, one of the pair). */
    private static double gaussian(SplittableRandom rng) {
        double a = rng.nextDouble();
        double b = rng.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - a)) * Math.cos(2 * Math.PI * b);
    }
}
