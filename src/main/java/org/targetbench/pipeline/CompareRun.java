package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.PointDetector;
import org.targetbench.score.Localisation;
import org.targetbench.score.LocalisationResult;
import org.targetbench.score.Repeatability;
import org.targetbench.score.RepeatabilityResult;
import org.targetbench.score.Spread;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * The detector comparison shared by the CLI and the app: every configured detector on every frame of a source,
 * scored for repeatability against the reference frame (where a homography is known), localisation (where true
 * feature positions are known) and spread.
 *
 * <p>Frames are read one at a time; detection runs on a pool with one worker per core, each worker holding its own
 * detector instances. Results do not depend on the number of workers.
 */
public final class CompareRun {
    /** Ranking: mean repeatability (undefined last), then fraction of true features found, then mean count. */
    public static final Comparator<DetectorSummary> RANKING = Comparator
            .comparingDouble((DetectorSummary s) -> s.meanRepeatability().orElse(-1)).reversed()
            .thenComparing(Comparator.comparingDouble((DetectorSummary s) -> Double.isNaN(s.localisation().foundFraction()) ? -1 : s.localisation().foundFraction()).reversed())
            .thenComparing(Comparator.comparingDouble(DetectorSummary::meanCount).reversed());
    /** Frames kept for overlays, the reference included. */
    public static final int SAMPLE_FRAMES = 3;

    private final List<DetectorConfig> configs;
    private final double epsilon;
    private final int threads;
    /** Registered truth under lens distortion: intrinsics, and per frame the reference-to-frame homography between
     * undistorted images (see {@link #withRegisteredTruth}); empty otherwise. */
    private Optional<CameraModel> undistort = Optional.empty();
    private Map<String, Homography> undistortedH = Map.of();

    public CompareRun(List<DetectorConfig> configs, double epsilon, int threads) {
        if (configs.isEmpty()) throw new IllegalArgumentException("at least one detector is needed");
        if (!(epsilon > 0) || !Double.isFinite(epsilon)) throw new IllegalArgumentException("epsilon must be > 0 px, got " + epsilon);
        if (threads < 1) throw new IllegalArgumentException("threads must be >= 1, got " + threads);
        for (DetectorConfig c : configs) c.checkValidity();
        this.configs = configs.stream().map(DetectorConfig::copy).toList();
        this.epsilon = epsilon;
        this.threads = threads;
    }

    public CompareRun(List<DetectorConfig> configs, double epsilon) {
        this(configs, epsilon, Runtime.getRuntime().availableProcessors());
    }

    /** A frame without its pixels: scoring needs only its identity and truth. */
    private record FrameInfo(int index, String name, org.targetbench.source.FrameTruth truth) {}

    private record Raw(FrameInfo frame, DetectorType type, List<Detection> detections, double millis) {}

    /**
     * Scores repeatability through registered poses where lens distortion leaves no homography between raw frames:
     * both frames' points are undistorted with the intrinsics (eqs. 1-3 of {@link CameraModel} inverted), and the
     * plane induces the homography H = G_f G_ref^-1 between undistorted images, G = K [r1 r2 t] (Hartley &amp;
     * Zisserman 2004, eq. 13.1). The image-region rules of the score are applied in undistorted pixels, which differ
     * from the image rectangle near its edge under strong distortion.
     */
    public CompareRun withRegisteredTruth(CameraModel camera, Map<String, Homography> undistortedFromReference) {
        this.undistort = Optional.of(camera);
        this.undistortedH = Map.copyOf(undistortedFromReference);
        return this;
    }

    private List<Detection> undistorted(List<Detection> pts) {
        CameraModel c = undistort.orElseThrow();
        boofcv.struct.distort.Point2Transform2_F64 t = c.pixelToNormalised();
        georegression.struct.point.Point2D_F64 n = new georegression.struct.point.Point2D_F64();
        List<Detection> out = new ArrayList<>(pts.size());
        for (Detection p : pts) {
            t.compute(p.x(), p.y(), n);
            out.add(new Detection(c.fx() * n.x + c.cx(), c.fy() * n.y + c.cy(), p.response(), p.scale()));
        }
        return out;
    }

    public CompareResult run(FrameSource source, Progress progress) throws SourceException, InterruptedException {
        int total = source.frameCount();
        int threads = MemoryBudget.plan(source.width(), source.height(), configs, this.threads, 2).workers();
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "targetbench-detect");
            t.setDaemon(true);
            return t;
        });
        List<ThreadLocal<PointDetector>> detectors = configs.stream()
                .map(c -> ThreadLocal.withInitial(() -> Detectors.create(c))).toList();
        List<Future<Raw>> futures = new ArrayList<>();
        List<FrameInfo> frames = new ArrayList<>();
        List<SourceFrame> samples = new ArrayList<>();
        String refName = source.referenceName();
        AtomicInteger done = new AtomicInteger();
        try {
            Optional<SourceFrame> next;
            while ((next = source.next()).isPresent()) {
                SourceFrame f = next.get();
                FrameInfo info = new FrameInfo(f.index(), f.name(), f.truth());
                frames.add(info);
                // keep pixels only of the reference and the first few frames, for overlays
                boolean isRef = f.name().equals(refName);
                if (isRef || samples.size() < SAMPLE_FRAMES - 1) samples.add(f);
                for (int d = 0; d < configs.size(); d++) {
                    ThreadLocal<PointDetector> det = detectors.get(d);
                    futures.add(pool.submit(() -> {
                        long t0 = System.nanoTime();
                        PointDetector pd = det.get();
                        List<Detection> found = pd.detect(f.image());
                        Raw raw = new Raw(info, pd.type(), found, (System.nanoTime() - t0) / 1e6);
                        int n = done.incrementAndGet();
                        if (n % configs.size() == 0) progress.update(n / configs.size(), total, "frame " + f.name());
                        return raw;
                    }));
                }
            }
            List<Raw> raws = new ArrayList<>();
            for (Future<Raw> fu : futures) raws.add(fu.get());
            return score(source, frames, samples, raws);
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof RuntimeException re) throw re;
            if (c instanceof Error er) throw er;
            throw new IllegalStateException(c);
        } finally {
            pool.shutdownNow();
        }
    }

    private CompareResult score(FrameSource source, List<FrameInfo> frames, List<SourceFrame> samples, List<Raw> raws)
            throws SourceException {
        if (frames.isEmpty()) throw new SourceException("the source delivered no frames: " + source.description());
        String refName = source.referenceName();
        FrameInfo ref = frames.stream().filter(f -> f.name().equals(refName)).findFirst()
                .orElseThrow(() -> new SourceException("reference frame " + refName + " was not delivered by " + source.description()));
        Map<DetectorType, List<Raw>> byDetector = new LinkedHashMap<>();
        for (Raw r : raws) byDetector.computeIfAbsent(r.type(), k -> new ArrayList<>()).add(r);
        int w = source.width(), h = source.height();
        List<FrameScore> scores = new ArrayList<>();
        List<DetectorSummary> summaries = new ArrayList<>();
        for (var e : byDetector.entrySet()) {
            List<Raw> list = e.getValue();
            List<Detection> refDet = list.stream().filter(r -> r.frame() == ref).findFirst().orElseThrow().detections();
            List<Double> reps = new ArrayList<>();
            List<double[]> dists = new ArrayList<>();
            int nTrue = 0;
            double countSum = 0, hullSum = 0, occSum = 0, msSum = 0;
            for (Raw r : list) {
                FrameInfo f = r.frame();
                Optional<Homography> hm = f == ref ? Optional.empty() : f.truth().fromReference();
                List<ProjectedFeature> findable = Localisation.findableBy(r.type(), f.truth().features());
                FrameScoring.Scored sc = FrameScoring.score(refDet, r.detections(), hm, w, h, findable, w, h, epsilon);
                if (f != ref && hm.isEmpty() && undistortedH.containsKey(f.name()))
                    sc = sc.withRepeatability(Repeatability.score(undistorted(refDet), undistorted(r.detections()), undistortedH.get(f.name()),
                            w, h, w, h, epsilon));
                sc.repeatability().ifPresent(rr -> rr.repeatability().ifPresent(reps::add));
                if (sc.localisation().isPresent()) {
                    dists.add(sc.locDistances());
                    nTrue += findable.size();
                }
                var spread = sc.spread();
                scores.add(new FrameScore(r.type(), f.index(), f.name(), r.detections(), sc.repeatability(), sc.localisation(), sc.locDistances(), spread));
                countSum += r.detections().size();
                hullSum += spread.hullAreaFraction();
                occSum += spread.cellOccupancy();
                msSum += r.millis();
            }
            double[] pooled = dists.stream().flatMapToDouble(java.util.Arrays::stream).toArray();
            int n = list.size();
            summaries.add(new DetectorSummary(e.getKey(),
                    reps.isEmpty() ? OptionalDouble.empty() : reps.stream().mapToDouble(Double::doubleValue).average(),
                    reps.isEmpty() ? OptionalDouble.empty() : reps.stream().mapToDouble(Double::doubleValue).min(),
                    reps.size(), countSum / n, Localisation.summarise(pooled, nTrue), hullSum / n, occSum / n, msSum / n));
        }
        summaries.sort(RANKING);
        samples.sort(Comparator.comparing((SourceFrame f) -> !f.name().equals(refName)).thenComparingInt(SourceFrame::index));
        int withH = (int) frames.stream().filter(f -> f != ref && (f.truth().fromReference().isPresent() || undistortedH.containsKey(f.name()))).count();
        int withPts = (int) frames.stream().filter(f -> !f.truth().features().isEmpty()).count();
        return new CompareResult(source.description(), w, h, refName, epsilon, frames.size(), withH, withPts,
                configs, summaries, scores, samples);
    }
}
