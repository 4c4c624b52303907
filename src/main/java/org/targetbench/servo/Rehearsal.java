package org.targetbench.servo;

import georegression.struct.se.Se3_F64;
import org.targetbench.camera.Pose;
import org.targetbench.camera.PoseEstimation;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Rehearses a servo set in simulation before any robot moves: the closed loop v = -λ L̂⁺ (s - s*) with the camera
 * as a free-flying rigid body driven by the commanded twist, from many start poses.
 *
 * <p>Each step: the target's true 3-D points are projected with the real intrinsics and distortion; a point outside
 * the image or behind the camera ends the run (a real tracker would lose it); the true image error (RMS over points of
 * the pixel distance to the reference pixel) is checked against the convergence threshold; pixel noise is added, the
 * points are undistorted, the controller's depths are taken per {@link DepthMode}; the commanded twist is held for one
 * period and integrated with the exponential map ({@link RigidMotion}). Points with a measured track survival s are
 * dropped, with probability 1 - s, at a uniformly drawn step of the run, which ends the run.
 *
 * <p>Start poses: the reference camera pose moved by a translation and a rotation vector drawn uniformly per axis
 * within the envelope (in the reference camera frame); starts with a point out of view are drawn again (the servo
 * cannot start without seeing its points). Run i draws from its own generator seeded by (seed, i), so the results do
 * not depend on the number of threads. Runs are spread over a fixed pool of worker threads.
 *
 * <p>Caveats: robot dynamics, joint limits, latency and lighting are not modelled; the convergence test uses the true
 * (noise-free) image error, which a real controller does not see.
 *
 * <p>References: [1] F. Chaumette, S. Hutchinson, "Visual servo control, Part I: Basic approaches", IEEE RAM 13(4),
 * 2006 (control law and exponential decrease of the error). [2] F. Chaumette, "Potential problems of stability and
 * convergence in image-based and position-based visual servoing", LNCIS 237, Springer 1998 (retreat under rotation
 * about the optical axis, local minima, singularities).
 */
public final class Rehearsal {
    /** Envelope rotation about the optical axis from which the known retreat problem is flagged, degrees (common practice, no source). */
    public static final double OPTICAL_AXIS_WARN_DEG = 150;
    /** Depth ratio above which a retreat is flagged (common practice, no source). */
    public static final double RETREAT_WARN_RATIO = 1.2;
    /** Runs are handed to workers in blocks of this many. */
    private static final int BLOCK = 8;

    private Rehearsal() {}

    /**
     * Runs the rehearsal.
     *
     * @throws IllegalArgumentException when the set has fewer than 3 points or no pose can be found for it
     */
    public static RehearsalResult run(ServoSet set, RehearsalConfig config) throws InterruptedException {
        config.checkValidity();
        RehearsalConfig c = config.copy();
        List<ServoPoint> pts = set.points();
        int k = pts.size();
        if (k < 3) throw new IllegalArgumentException("a rehearsal needs at least 3 points, got " + k);
        String poseMethod = set.poseMethod();
        Pose pose;
        if (set.referencePose().isPresent()) {
            pose = set.referencePose().get();
        } else {
            List<double[]> px = pts.stream().map(p -> new double[]{p.u(), p.v()}).toList();
            List<double[]> mm = pts.stream().map(p -> new double[]{p.targetXMm(), p.targetYMm()}).toList();
            Optional<PoseEstimation.Estimate> est = PoseEstimation.planar(set.camera(), px, mm);
            if (est.isEmpty()) throw new IllegalArgumentException("the set has no reference pose and PnP on its " + k + " points failed");
            pose = est.get().pose();
            poseMethod = PoseEstimation.METHOD + " from the set's own " + k + " points";
        }
        ClosedLoop.Scene scene = scene(set, pose, c);
        int n = c.starts;
        RunResult[] results = new RunResult[n];
        RunTrace[] traces = new RunTrace[Math.min(n, c.tracedRuns)];
        ParallelRuns.run(n, c.threads, BLOCK, "targetbench-rehearse", () -> new ClosedLoop(scene, c), (loop, i) -> {
            RunTrace[] slot = i < traces.length ? new RunTrace[1] : null;
            results[i] = loop.run(i, slot, null);
            if (slot != null) traces[i] = slot[0];
        });
        List<RunResult> runs = List.of(results);
        RehearsalResult.Summary summary = RehearsalResult.Summary.of(runs);
        return new RehearsalResult(c, poseMethod, runs, List.of(traces), summary, warnings(set, c, summary), scene.referenceDistanceM());
    }

    /**
     * One run from a given start offset (in the reference camera frame), with its full trace (every step). For checks
     * of the closed loop and for what-if questions; noise and losses are drawn from the config's seed.
     */
    public static RunTrace single(ServoSet set, RehearsalConfig config, RunResult.StartOffset start, RunResult[] resultOut) {
        config.checkValidity();
        RehearsalConfig c = config.copy();
        c.traceEvery = 1;
        Pose pose = set.referencePose().orElseThrow(() -> new IllegalArgumentException("a single run needs the set's reference pose"));
        RunTrace[] slot = new RunTrace[1];
        RunResult r = new ClosedLoop(scene(set, pose, c), c).run(0, slot, start);
        if (resultOut != null && resultOut.length > 0) resultOut[0] = r;
        return slot[0];
    }

    static ClosedLoop.Scene scene(ServoSet set, Pose pose, RehearsalConfig c) {
        List<ServoPoint> pts = set.points();
        int k = pts.size();
        double[][] world = new double[k][];
        double[] uS = new double[k], vS = new double[k], xS = new double[k], yS = new double[k], zS = new double[k];
        double[] noise = new double[k], surv = new double[k];
        int[] ids = new int[k];
        for (int i = 0; i < k; i++) {
            ServoPoint p = pts.get(i);
            world[i] = new double[]{p.targetXMm() / 1000, p.targetYMm() / 1000, 0};
            uS[i] = p.u(); vS[i] = p.v(); xS[i] = p.x(); yS[i] = p.y(); zS[i] = p.zM();
            ids[i] = p.id();
            noise[i] = Double.isNaN(c.noiseSigmaPx) ? p.robustness().jitterPx().orElse(0) : c.noiseSigmaPx;
            surv[i] = p.robustness().trackSurvival().orElse(Double.NaN);
        }
        Se3_F64 cameraToWorld = pose.toSe3().invert(null);
        return new ClosedLoop.Scene(set.camera(), world, cameraToWorld, uS, vS, xS, yS, zS, ids, noise, surv, Math.abs(cameraToWorld.T.z));
    }

    /** Known failure modes of this set, this envelope and these results, with their numbers. */
    static List<RehearsalWarning> warnings(ServoSet set, RehearsalConfig c, RehearsalResult.Summary s) {
        List<RehearsalWarning> w = new ArrayList<>();
        for (SetDiagnostics.Finding f : SetDiagnostics.check(set.points())) w.add(RehearsalWarning.of(f));
        if (c.envelopeDeg[2] >= OPTICAL_AXIS_WARN_DEG) w.add(RehearsalWarning.value(RehearsalWarning.Kind.TURNED_ABOUT_AXIS, c.envelopeDeg[2], c.law));
        if (s.maxDepthRatio() > RETREAT_WARN_RATIO) w.add(RehearsalWarning.value(RehearsalWarning.Kind.FAR_RETREAT, s.maxDepthRatio(), c.law));
        if (s.lostFieldOfView() > 0) w.add(RehearsalWarning.runs(RehearsalWarning.Kind.LOST_VIEW, s.lostFieldOfView(), s.runs(), Double.NaN));
        if (s.redrawnStarts() > s.runs()) w.add(RehearsalWarning.runs(RehearsalWarning.Kind.REDRAWN_STARTS, s.redrawnStarts(), s.runs(), Double.NaN));
        if (s.trackLost() > 0) w.add(RehearsalWarning.runs(RehearsalWarning.Kind.TRACK_LOST, s.trackLost(), s.runs(), Double.NaN));
        if (s.timeouts() > 0) w.add(RehearsalWarning.runs(RehearsalWarning.Kind.TIMED_OUT, s.timeouts(), s.runs(), c.timeoutS));
        if (s.retreated() > 0) w.add(RehearsalWarning.runs(RehearsalWarning.Kind.RETREAT_STOPPED, s.retreated(), s.runs(), c.retreatLimit));
        if (s.singular() > 0) w.add(RehearsalWarning.runs(RehearsalWarning.Kind.SINGULAR, s.singular(), s.runs(), Double.NaN));
        if (c.depthMode == DepthMode.SCALED && (c.depthErrorFactor < 0.5 || c.depthErrorFactor > 2))
            w.add(RehearsalWarning.value(RehearsalWarning.Kind.LARGE_DEPTH_FACTOR, c.depthErrorFactor, c.law));
        return w;
    }
}
