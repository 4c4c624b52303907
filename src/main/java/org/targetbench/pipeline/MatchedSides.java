package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.DotBias;
import org.targetbench.camera.Pose;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.DotBiasCorrection;
import org.targetbench.detect.PointDetector;
import org.targetbench.score.Localisation;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The shoot-out's side-by-side figures of a design's matched detector and its best generic detector
 * ({@link ShootoutRun.Side}).
 */
final class MatchedSides {
    /** Counts the points of the square-on view that stay robust across the envelope. */
    interface RobustCount { int of(PointDetector detector, List<Detection> points); }

    private MatchedSides() {}

    /**
     * @param poses  the views at the stand-off, the square-on view first
     * @param views  their renders with truth
     * @param ranks  the sweep's envelope ranking
     * @param configs the detectors swept; a detector not among them is not scored
     */
    static List<ShootoutRun.Side> of(TargetDesign design, CameraModel camera, List<Pose> poses, List<SyntheticRenderer.Rendered> views,
                                     List<SweepSummary.Rank> ranks, List<DetectorConfig> configs, RobustCount robust) {
        List<ShootoutRun.Side> out = new ArrayList<>();
        Optional<DetectorType> matched = DesignMatch.matched(design);
        matched.flatMap(t -> config(configs, t)).ifPresent(c -> out.add(side(design, camera, poses, views, ranks, c, true, robust)));
        for (SweepSummary.Rank r : ranks)
            if (!r.detector().designMatched()) {
                config(configs, r.detector()).ifPresent(c -> out.add(side(design, camera, poses, views, ranks, c, false, robust)));
                break;
            }
        return List.copyOf(out);
    }

    private static Optional<DetectorConfig> config(List<DetectorConfig> configs, DetectorType t) {
        return configs.stream().filter(c -> c.type() == t).findFirst();
    }

    private static ShootoutRun.Side side(TargetDesign design, CameraModel camera, List<Pose> poses, List<SyntheticRenderer.Rendered> views,
                                         List<SweepSummary.Rank> ranks, DetectorConfig config, boolean matched, RobustCount robust) {
        PointDetector det = Detectors.create(config);
        boolean dots = config.type() == DetectorType.DOTS && DotBias.hasDots(design);
        List<Double> raw = new ArrayList<>(), corrected = new ArrayList<>();
        List<Detection> square = List.of();
        for (int k = 0; k < views.size(); k++) {
            List<Detection> found = det.detect(views.get(k).image());
            if (k == 0) square = found;
            var truth = Localisation.findableBy(config.type(), views.get(k).features());
            for (double v : Localisation.distances(truth, found, Localisation.DEFAULT_RADIUS)) if (!Double.isNaN(v)) raw.add(v);
            if (dots)
                for (double v : Localisation.distances(truth, DotBiasCorrection.correct(found, design, camera, poses.get(k)),
                        Localisation.DEFAULT_RADIUS)) if (!Double.isNaN(v)) corrected.add(v);
        }
        double score = Double.NaN;
        for (SweepSummary.Rank r : ranks) if (r.detector() == config.type()) score = r.score();
        return new ShootoutRun.Side(config.type(), matched, score, square.size(), robust.of(det, square), rms(raw),
                dots ? rms(corrected) : Double.NaN);
    }

    private static double rms(List<Double> d) {
        if (d.isEmpty()) return Double.NaN;
        double s = 0;
        for (double v : d) s += v * v;
        return Math.sqrt(s / d.size());
    }
}
