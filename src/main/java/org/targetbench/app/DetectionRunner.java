package org.targetbench.app;

import org.targetbench.pipeline.SweepBase;
import org.targetbench.pipeline.FrameScoring;
import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.PointDetector;
import org.targetbench.perturb.Perturbation;
import org.targetbench.perturb.Perturbed;
import org.targetbench.perturb.Perturber;
import org.targetbench.pipeline.SweepRun;
import org.targetbench.score.Localisation;
import org.targetbench.score.Repeatability;
import org.targetbench.score.Spread;
import org.targetbench.source.SourceFrame;

import javax.swing.SwingUtilities;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Runs every detector on the current frame, off the event-dispatch thread, whenever the frame, the detectors or
 * the previewed degradation change; the newest request wins and stale results are dropped. Scores use the same
 * functions as the command line: repeatability against the reference frame through the frame's homography (composed
 * with a geometric degradation's warp), localisation against the moved true features, coverage.
 */
final class DetectionRunner implements Session.Listener {
    /** Seed of the previewed degradation, so the same setting always shows the same noise. */
    static final long PREVIEW_SEED = 1;

    private final Session session;
    private final ExecutorService worker = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "targetbench-live-detect");
        t.setDaemon(true);
        return t;
    });
    private final AtomicLong generation = new AtomicLong();
    /** Confined to the worker thread. */
    private final Scorer scorer = new Scorer();
    /** Bumped on the event-dispatch thread when the source changes; read by the worker. */
    private volatile int sourceVersion;
    /** Worker-thread copy of the source version its reference cache belongs to. */
    private int seenSourceVersion;

    DetectionRunner(Session session) {
        this.session = session;
        session.addListener(this);
    }

    @Override
    public void changed(Session.Change c) {
        if (c == Session.Change.DETECTIONS || c == Session.Change.SHOWN || !session.hasFrames()) return;
        if (session.playing() && c != Session.Change.SOURCE) return; // playback prepares its own frames (PlaybackRun)
        if (c == Session.Change.SOURCE) sourceVersion++;
        int srcVersion = sourceVersion;
        long gen = generation.incrementAndGet();
        SourceFrame frame = session.frame(), ref = session.reference();
        int index = session.frameIndex(), version = session.configVersion();
        List<DetectorConfig> configs = session.configs();
        Perturbation p = session.degrade();
        double value = session.degradeValue();
        worker.submit(() -> {
            if (generation.get() != gen) return;
            if (srcVersion != seenSourceVersion) {
                scorer.forgetReference();
                seenSourceVersion = srcVersion;
            }
            Session.FrameDetections out = scorer.detect(frame, ref, index, configs, version, p, value);
            SwingUtilities.invokeLater(() -> {
                if (generation.get() == gen) session.setDetections(out);
            });
        });
    }

    /**
     * Detects and scores one frame with cached detectors and reference-frame points; one instance per thread (the
     * runner's worker, a playback's worker).
     */
    static final class Scorer {
        private final Map<DetectorType, PointDetector> detectors = new EnumMap<>(DetectorType.class);
        private final Map<String, List<Detection>> referenceCache = new LinkedHashMap<>();
        private int detectorsVersion = -1;

        void forgetReference() { referenceCache.clear(); }

    Session.FrameDetections detect(SourceFrame frame, SourceFrame ref, int index, List<DetectorConfig> configs, int version,
                                           Perturbation p, double value) {
        if (version != detectorsVersion) {
            detectors.clear();
            referenceCache.clear();
            detectorsVersion = version;
        }
        GrayF32 shown = frame.image();
        Homography warp = Homography.identity();
        List<ProjectedFeature> truth = SweepRun.moveTruth(frame.truth().features(), warp, shown.width, shown.height);
        if (value != p.neutral()) {
            // the previewed degradation is one sweep cell's view of this frame
            SweepRun.View v = SweepRun.degrade(new SweepBase.BaseFrame(frame.name(), frame.image(), frame.truth().features(), Optional.empty()),
                    Optional.empty(), new Perturber(), p, value, PREVIEW_SEED);
            shown = v.image();
            warp = v.warp();
            truth = v.truth();
        }
        Optional<Homography> h = frame.truth().fromReference();
        Map<DetectorType, List<Detection>> points = new LinkedHashMap<>();
        Map<DetectorType, Session.FrameFigures> figures = new LinkedHashMap<>();
        for (DetectorConfig c : configs) {
            PointDetector det = detectors.computeIfAbsent(c.type(), t -> Detectors.create(c));
            List<Detection> found = det.detect(shown);
            points.put(c.type(), found);
            List<Detection> refPts = h.isPresent() ? referenceCache.computeIfAbsent(ref.name() + "/" + c.type(), k -> det.detect(ref.image())) : List.of();
            FrameScoring.Scored sc = FrameScoring.score(refPts, found, h.map(warp::after), ref.image().width, ref.image().height,
                    Localisation.findableBy(c.type(), truth),
                    shown.width, shown.height, Repeatability.DEFAULT_EPSILON);
            figures.put(c.type(), new Session.FrameFigures(found.size(), sc.repeatabilityOrNaN(), sc.spread().cellOccupancy(), sc.localisationRmsPx()));
        }
        return new Session.FrameDetections(index, shown, points, figures);
    }
    }

    void shutdown() { worker.shutdownNow(); }
}
