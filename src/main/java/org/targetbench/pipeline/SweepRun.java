package org.targetbench.pipeline;

import java.util.Optional;
import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.PointDetector;
import org.targetbench.perturb.Perturbation;
import org.targetbench.perturb.Perturbed;
import org.targetbench.perturb.Perturber;
import org.targetbench.score.Localisation;
import org.targetbench.score.Repeatability;
import org.targetbench.score.RepeatabilityResult;
import org.targetbench.score.Spread;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.BooleanSupplier;

/**
 * The stress sweep shared by the CLI and the app: detectors x parameters x levels x base frames. Each cell degrades
 * one base frame by one parameter at one level and scores every detector on it against the same detector on the
 * unperturbed frame: repeatability (with the perturbation's homography as truth), localisation against the moved
 * true features, count and coverage.
 *
 * <p>Cells are independent and run on a pool of worker threads; every random choice is seeded from the sweep seed
 * and the cell's coordinates, so the result does not depend on thread count or timing. A tilt of a rendered base
 * frame is re-rendered at the tilted pose (exact, with new perspective and sampling); without a design, or with a
 * distorted camera, tilt is a homography warp ({@link Perturber}).
 */
public final class SweepRun {
    /** Image drift of the survival motion per frame, pixels along x (half of it along y). */
    public static final double MOTION_PX_PER_FRAME = 1.5;
    /** In-plane turn of the survival motion per frame, degrees. */
    public static final double MOTION_DEG_PER_FRAME = 0.4;
    /** Most tracks started per detector for the survival measurement (the strongest points). */
    public static final int MAX_SURVIVAL_TRACKS = 100;

    private final SweepConfig config;

    public SweepRun(SweepConfig config) {
        config.checkValidity();
        this.config = config.copy();
    }

    /** Cells in a sweep of {@code base}. */
    public int cellCount(SweepBase base) {
        int n = 0;
        for (Perturbation p : config.parameters) n += config.valuesOf(p).length;
        return n * base.frames().size();
    }

    private record Cell(Perturbation p, int level, double value, int frame) {}

    public SweepResult run(SweepBase base, Progress progress, BooleanSupplier cancelled) throws InterruptedException {
        return run(base, progress, cancelled, rows -> { });
    }

    /**
     * As {@link #run(SweepBase, Progress, BooleanSupplier)}, handing each finished cell's rows to {@code cellDone}
     * (called from worker threads, in completion order) so that a screen can fill in as the sweep goes.
     */
    public SweepResult run(SweepBase base, Progress progress, BooleanSupplier cancelled,
                           java.util.function.Consumer<List<SweepRow>> cellDone) throws InterruptedException {
        long t0 = System.nanoTime();
        List<DetectorConfig> dets = config.detectors;
        List<ThreadLocal<PointDetector>> detectors = dets.stream().map(c -> ThreadLocal.withInitial(() -> Detectors.create(c))).toList();
        Perturber perturber = new Perturber(config.perturb);
        var first = base.frames().isEmpty() ? null : base.frames().get(0).image();
        int workers = first == null ? config.threads : MemoryBudget.plan(first.width, first.height, dets, config.threads, 3).workers();
        ExecutorService pool = Executors.newFixedThreadPool(workers, r -> {
            Thread t = new Thread(r, "targetbench-sweep");
            t.setDaemon(true);
            return t;
        });
        try {
            // phase 1: every detector on every unperturbed frame
            int nf = base.frames().size();
            @SuppressWarnings("unchecked") List<Detection>[][] ref = new List[dets.size()][nf];
            List<Future<?>> fs = new ArrayList<>();
            for (int f = 0; f < nf; f++)
                for (int d = 0; d < dets.size(); d++) {
                    int ff = f, dd = d;
                    fs.add(pool.submit(() -> ref[dd][ff] = detectors.get(dd).get().detect(base.frames().get(ff).image())));
                }
            waitAll(fs);
            // phase 2: the cells
            List<Cell> cells = new ArrayList<>();
            Map<Perturbation, double[]> values = new LinkedHashMap<>();
            for (Perturbation p : config.parameters) {
                double[] v = config.valuesOf(p);
                values.put(p, v);
                for (int l = 0; l < v.length; l++)
                    for (int f = 0; f < nf; f++) cells.add(new Cell(p, l, v[l], f));
            }
            ConcurrentLinkedQueue<SweepRow> rows = new ConcurrentLinkedQueue<>();
            AtomicInteger done = new AtomicInteger();
            fs.clear();
            for (Cell c : cells)
                fs.add(pool.submit(() -> {
                    if (cancelled.getAsBoolean()) return;
                    List<SweepRow> cellRows = runCell(c, base, perturber, detectors, ref);
                    rows.addAll(cellRows);
                    cellDone.accept(cellRows);
                    progress.update(done.incrementAndGet(), cells.size(), c.p().id() + " level " + c.level());
                }));
            waitAll(fs);
            List<SweepRow> sorted = new ArrayList<>(rows);
            List<DetectorType> order = dets.stream().map(DetectorConfig::type).toList();
            sorted.sort(Comparator.comparingInt((SweepRow r) -> order.indexOf(r.detector()))
                    .thenComparingInt(r -> config.parameters.indexOf(r.parameter()))
                    .thenComparingInt(SweepRow::level).thenComparingInt(SweepRow::frame));
            Map<DetectorType, List<Detection>> sample = new LinkedHashMap<>();
            for (int d = 0; d < dets.size(); d++) sample.put(dets.get(d).type(), ref[d][0]);
            var firstFrame = base.frames().get(0);
            return new SweepResult(base.description(), dets, config.parameters, values, nf, config.seed, config.epsilon,
                    sorted, cancelled.getAsBoolean() && done.get() < cells.size(), done.get(), cells.size(),
                    (System.nanoTime() - t0) / 1e9, firstFrame.image(), firstFrame.truth(), sample);
        } finally {
            pool.shutdownNow();
        }
    }

    private List<SweepRow> runCell(Cell c, SweepBase base, Perturber perturber, List<ThreadLocal<PointDetector>> detectors,
                                   List<Detection>[][] ref) {
        SweepBase.BaseFrame bf = base.frames().get(c.frame());
        long seed = mix(config.seed, c.p().ordinal(), c.level(), c.frame());
        View v = degrade(bf, base.scene(), perturber, c.p(), c.value(), seed);
        GrayF32 image = v.image();
        Homography warp = v.warp();
        List<ProjectedFeature> truth = v.truth();
        List<SweepRow> out = new ArrayList<>();
        for (int d = 0; d < detectors.size(); d++) {
            PointDetector det = detectors.get(d).get();
            List<Detection> found = det.detect(image);
            FrameScoring.Scored sc = FrameScoring.score(ref[d][c.frame()], found, Optional.of(warp), bf.image().width, bf.image().height,
                    Localisation.findableBy(det.type(), truth), image.width, image.height, config.epsilon);
            double survival = config.trackFrames > 0 ? survival(c, bf, image, found, perturber, seed) : Double.NaN;
            out.add(new SweepRow(det.type(), c.p(), c.level(), c.value(), c.frame(), sc.repeatability().orElseThrow().repeatability(),
                    sc.localisationRmsPx(), found.size(), sc.spread().cellOccupancy(), survival));
        }
        return out;
    }

    /**
     * KLT survival at this cell: tracks start at the strongest points found on the degraded view, which then drifts
     * slowly (a similarity about the image centre, growing per frame); photometric degradations are applied afresh to
     * every moved frame, geometric ones are already in the view. Returns alive / started at the last frame.
     */
    private double survival(Cell c, SweepBase.BaseFrame bf, GrayF32 view, List<Detection> found, Perturber perturber, long seed) {
        if (found.isEmpty()) return 0;
        List<double[]> pts = new ArrayList<>();
        for (Detection d : found.subList(0, Math.min(MAX_SURVIVAL_TRACKS, found.size()))) pts.add(new double[]{d.x(), d.y()});
        org.targetbench.track.KltTracker klt = new org.targetbench.track.KltTracker(config.tracker, null);
        int started = klt.start(view, 0, pts).alive();
        if (started == 0) return 0;
        for (int k = 1; k <= config.trackFrames && klt.alive() > 0; k++) {
            Homography move = Homography.translation(MOTION_PX_PER_FRAME * k, 0.5 * MOTION_PX_PER_FRAME * k)
                    .after(Perturber.similarity(view, Math.toRadians(MOTION_DEG_PER_FRAME * k), 1));
            GrayF32 frame;
            if (c.p().geometric()) {
                frame = Perturber.warp(view, move);
            } else {
                frame = perturber.apply(c.p(), c.value(), Perturber.warp(bf.image(), move), mix(seed, k, 0, 0)).image();
            }
            klt.process(frame, k);
        }
        return klt.alive() / (double) started;
    }

    /** A degraded view of a base frame: its pixels, the warp from the base frame and the moved true features. */
    public record View(GrayF32 image, Homography warp, List<ProjectedFeature> truth) {}

    /**
     * One sweep cell's view: the base frame degraded by {@code p} at {@code value}. A tilt of a rendered base frame (with
     * its scene, undistorted camera) is re-rendered at the tilted pose; everything else goes through {@code perturber}.
     */
    public static View degrade(SweepBase.BaseFrame bf, Optional<SweepBase.Scene> scene, Perturber perturber, Perturbation p, double value, long seed) {
        if (p == Perturbation.TILT && scene.isPresent() && bf.facing().isPresent() && !scene.get().camera().isDistorted()) {
            SweepBase.Scene s = scene.get();
            Pose from = bf.facing().get().pose(s.design(), 0), to = bf.facing().get().pose(s.design(), value);
            var r = s.renderer().render(s.design(), to, seed);
            return new View(r.image(), Projection.referenceToFrame(s.camera(), from, to), r.features());
        }
        Perturbed d = perturber.apply(p, value, bf.image(), seed);
        return new View(d.image(), d.warp(), moveTruth(bf.truth(), d.warp(), d.image().width, d.image().height));
    }

    /** True feature positions carried through a warp; those leaving the image are dropped. */
    public static List<ProjectedFeature> moveTruth(List<ProjectedFeature> truth, Homography warp, int w, int h) {
        List<ProjectedFeature> out = new ArrayList<>();
        for (ProjectedFeature f : truth) {
            double[] m = warp.apply(f.u(), f.v());
            if (m[0] >= 0 && m[1] >= 0 && m[0] <= w - 1 && m[1] <= h - 1) out.add(f.at(m[0], m[1]));
        }
        return out;
    }

    /** SplitMix64 finaliser over the cell coordinates: a well-spread seed per cell. */
    static long mix(long seed, long a, long b, long c) {
        long z = seed + 0x9E3779B97F4A7C15L * (1 + a * 1_000_003L + b * 10_007L + c);
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    private static void waitAll(List<Future<?>> fs) throws InterruptedException {
        for (Future<?> f : fs) {
            try {
                f.get();
            } catch (ExecutionException e) {
                Throwable t = e.getCause();
                if (t instanceof RuntimeException re) throw re;
                if (t instanceof Error er) throw er;
                throw new IllegalStateException(t);
            }
        }
    }

    /** Mean of the defined repeatabilities in {@code rows}; empty when none is defined. */
    public static OptionalDouble meanRepeatability(List<SweepRow> rows) {
        return rows.stream().filter(r -> r.repeatability().isPresent()).mapToDouble(r -> r.repeatability().getAsDouble()).average();
    }
}
