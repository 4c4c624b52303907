package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.camera.PoseEstimation;
import org.targetbench.camera.Projection;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.select.Candidate;
import org.targetbench.select.CandidateConfig;
import org.targetbench.select.Candidates;
import org.targetbench.select.Selection;
import org.targetbench.select.SelectConfig;
import org.targetbench.select.ServoPointSelector;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.FrameTruth;
import org.targetbench.source.ResultsFolder;
import org.targetbench.source.SourceException;
import org.targetbench.source.TrackRunFiles;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Choosing a servo set from a comparison's results, shared by {@code pick} and {@code demo}: the candidates are the
 * reference-frame detections of one detector (by default the top-ranked), their robustness comes from the other frames
 * ({@link Candidates}), their depth from the reference pose, and the choice from {@link ServoPointSelector}.
 *
 * <p>Reference pose: pose 0 of poses.json when present (checked against the reference frame's true feature pixels
 * when those are known); otherwise estimated with PnP ({@link PoseEstimation}) from the detections that lie within the
 * match radius of the reference frame's true feature pixels, matched to their designed features. The method used is
 * recorded in the set.
 */
public final class PickRun {
    /** Largest median distance between truth pixels and designed features projected with the given pose, pixels. */
    public static final double POSE_CHECK_PX = 2.0;

    private PickRun() {}

    /**
     * Everything a pick produced. {@code set} is empty when the selection found no acceptable set (see its message).
     */
    public record Result(String detector, List<Candidate> candidates, Selection selection, Optional<ServoSet> set,
                         String poseMethod) {}

    public static Result run(ResultsFolder.Data data, String detectorName, CandidateConfig cc, SelectConfig sc,
                             String toolVersion, String created) throws SourceException {
        return run(data, detectorName, cc, sc, toolVersion, created, Optional.empty());
    }

    /**
     * As above; with {@code tracks} (a {@code track --target} run on the same design) the candidates' track survival
     * and jitter are the measured ones ({@link MeasuredTracks}) and the set's tracker settings name that run and its
     * footage.
     */
    public static Result run(ResultsFolder.Data data, String detectorName, CandidateConfig cc, SelectConfig sc,
                             String toolVersion, String created, Optional<TrackRunFiles.Data> tracks) throws SourceException {
        String folder = data.folderName();
        String detector = detectorName != null ? detectorName : data.ranking().isEmpty() ? null : data.ranking().get(0);
        if (detector == null) throw new SourceException(folder + "/summary.json: the ranking is empty; name a detector with --detector");
        Map<String, List<Detection>> byFrame = data.detections().get(detector);
        if (byFrame == null && !data.ranking().contains(detector))
            throw new SourceException("detector \"" + detector + "\" is not in the results in " + folder + "; choose from " + String.join(", ", data.ranking()));
        if (byFrame == null) byFrame = Map.of();
        CameraModel camera = data.camera().orElseThrow(() -> new SourceException("camera.json not found in " + folder
                + ": the camera intrinsics are needed to undistort the points and place them in depth (give --camera FILE)"));
        Optional<TargetDesign> design = data.target();
        Map<String, FrameTruth> truth = data.truth().map(t -> t.frames()).orElse(Map.of());
        String ref = data.referenceFrame();
        List<Detection> refDet = byFrame.getOrDefault(ref, List.of());
        List<ProjectedFeature> refTruth = data.truth().map(t -> t.forFrame(ref).features()).orElse(List.of());

        Pose pose;
        String poseMethod;
        if (data.poses().isPresent()) {
            pose = data.poses().get().get(0);
            poseMethod = "known: pose 0 of " + data.posesFile().map(data::shortName).orElse("poses.json");
            if (!refTruth.isEmpty() && design.isPresent()) checkPose(camera, design.get(), pose, refTruth, data);
        } else if (!refTruth.isEmpty() && design.isPresent()) {
            List<double[]> px = new ArrayList<>(), mm = new ArrayList<>();
            for (ProjectedFeature f : refTruth) {
                Detection best = null;
                double bd = cc.featureMatchPx;
                for (Detection d : refDet) {
                    double dist = Math.hypot(d.x() - f.u(), d.y() - f.v());
                    if (dist <= bd) {
                        bd = dist;
                        best = d;
                    }
                }
                if (best != null && f.featureId() >= 0 && f.featureId() < design.get().features().size()) {
                    px.add(new double[]{best.x(), best.y()});
                    mm.add(new double[]{design.get().features().get(f.featureId()).xMm(), design.get().features().get(f.featureId()).yMm()});
                }
            }
            Optional<PoseEstimation.Estimate> est = PoseEstimation.planar(camera, px, mm);
            if (est.isEmpty()) throw new SourceException("cannot estimate the reference pose: only " + px.size() + " " + detector
                    + " detections of the reference frame match designed features (4 non-collinear are needed); give poses.json with --poses");
            pose = est.get().pose();
            poseMethod = String.format(Locale.ROOT, "%s, from %d %s detections matched to designed features, reprojection RMS %.3f px",
                    PoseEstimation.METHOD, est.get().points(), detector, est.get().reprojectionRmsPx());
        } else {
            throw new SourceException("cannot place the points in depth: no poses.json in " + folder + " (the reference pose)"
                    + (design.isEmpty() ? " and no target.json (the design, for a PnP estimate)" : "")
                    + (refTruth.isEmpty() ? " and no true feature pixels for the reference frame in " + data.shortName(data.truthFile()) + " (to match detections to designed features)" : "")
                    + "; give --poses, or --target and --truth");
        }

        List<Candidates.Frame> others = new ArrayList<>();
        for (String name : allFrames(data, byFrame)) {
            if (name.equals(ref)) continue;
            FrameTruth ft = truth.getOrDefault(name, FrameTruth.none());
            others.add(new Candidates.Frame(name, byFrame.getOrDefault(name, List.of()), ft.fromReference(), ft.features()));
        }
        CandidateConfig c2 = cc.copy();
        c2.epsilonPx = data.epsilonPx();
        List<Candidate> cands = Candidates.build(new Candidates.Frame(ref, refDet, Optional.empty(), refTruth), others, camera,
                design.orElse(null), pose, c2);
        String trackerNote = "{}";
        if (tracks.isPresent()) {
            Map<Integer, MeasuredTracks.Figures> figs = MeasuredTracks.figures(tracks.get());
            cands = MeasuredTracks.apply(cands, figs);
            trackerNote = "{\"track_survival_and_jitter_from\": " + jsonString(tracks.get().folder().toString())
                    + ", \"footage\": " + jsonString(tracks.get().source())
                    + ", \"designed_features_measured\": " + figs.size()
                    + ", \"method\": \"per designed feature: share of the run its first-frame track survived; SD of tracked minus registered pixel\"}";
        }
        Selection sel = ServoPointSelector.select(cands, camera.width(), camera.height(), sc);
        if (sel.outcome() != Selection.Outcome.SELECTED) return new Result(detector, cands, sel, Optional.empty(), poseMethod);
        List<ServoPoint> pts = new ArrayList<>();
        for (Selection.Chosen ch : sel.chosen()) {
            Candidate c = ch.candidate();
            pts.add(new ServoPoint(c.id(), c.u(), c.v(), c.x(), c.y(), c.zM(), c.targetXMm(), c.targetYMm(), c.featureId(), c.robustness(), ch.reason()));
        }
        String designRef = design.map(d -> d.name() + " (" + data.targetFile().map(data::shortName).orElse("target.json") + ")").orElse("unknown");
        ServoSet set = new ServoSet(toolVersion, created, camera, design.map(TargetDesign::id).orElse("unknown"), designRef,
                Optional.of(pose), poseMethod, detector, data.detectorSettings().getOrDefault(detector, "{}"), trackerNote, pts,
                sel.condition(), sel.sigmaMin());
        return new Result(detector, cands, sel, Optional.of(set), poseMethod);
    }

    private static String jsonString(String s) {
        StringBuilder b = new StringBuilder("\"");
        for (char ch : s.toCharArray()) {
            if (ch == '"' || ch == '\\') b.append('\\').append(ch);
            else if (ch < 0x20) b.append(String.format(Locale.ROOT, "\\u%04x", (int) ch));
            else b.append(ch);
        }
        return b.append('"').toString();
    }

    private static List<String> allFrames(ResultsFolder.Data data, Map<String, List<Detection>> byFrame) {
        java.util.LinkedHashSet<String> names = new java.util.LinkedHashSet<>(byFrame.keySet());
        data.truth().ifPresent(t -> names.addAll(t.frames().keySet()));
        return new ArrayList<>(names);
    }

    private static void checkPose(CameraModel camera, TargetDesign design, Pose pose, List<ProjectedFeature> truth,
                                  ResultsFolder.Data data) throws SourceException {
        double[] d = new double[truth.size()];
        int n = 0;
        for (ProjectedFeature f : truth) {
            if (f.featureId() < 0 || f.featureId() >= design.features().size()) continue;
            double[] p = Projection.projectTargetPoint(camera, pose, design.features().get(f.featureId()).xMm(), design.features().get(f.featureId()).yMm());
            d[n++] = Math.hypot(p[0] - f.u(), p[1] - f.v());
        }
        if (n == 0) return;
        double[] s = Arrays.copyOf(d, n);
        Arrays.sort(s);
        double median = s[n / 2];
        if (!(median <= POSE_CHECK_PX))
            throw new SourceException(String.format(Locale.ROOT, "%s: pose 0 does not match the reference frame %s: designed features land a median %.1f px "
                    + "from their true pixels in %s of %s (is the first pose the reference view?)", data.posesFile().map(data::shortName).orElse("poses.json"),
                    data.referenceFrame(), median, data.shortName(data.truthFile()), data.folderName()));
    }
}
