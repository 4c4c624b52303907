package org.targetbench.servo;

import georegression.geometry.ConvertRotation3D_F64;
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
    private final ServoController controller;
    private final RigidMotion motion = new RigidMotion();
    private final PointProjection projection;
    private final double[] u, v, x, y, z, xm, ym, zEst, vel = new double[6];
    private final int[] lossStep;

    ClosedLoop(Scene scene, RehearsalConfig config) {
        this.s = scene;
        this.c = config;
        this.k = scene.ids().length;
        this.projection = new PointProjection(scene.camera());
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
        return projection.project(s.worldPoints(), g.R.data, 3, g.T.x, g.T.y, g.T.z, x, y, z, u, v);
    }

    private double errorRms() {
        return PointProjection.errorRms(u, v, s.uStar(), s.vStar());
    }

    /** Noisy measurement of the features and the controller's depth estimates. */
    private void measure(SplittableRandom rng) {
        projection.measure(rng, s.noisePx(), x, y, z, u, v, s.zStar(), c.depthMode, c.depthErrorFactor, xm, ym, zEst);
    }

    /** Standard normal deviate (Box-Muller, one of the pair). */
}
