package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Pose;
import org.targetbench.camera.PoseEstimation;
import org.targetbench.camera.Projection;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.select.Candidate;
import org.targetbench.select.CandidateConfig;
import org.targetbench.select.Candidates;
import org.targetbench.select.DesignedOptimum;
import org.targetbench.select.Selection;
import org.targetbench.select.SelectConfig;
import org.targetbench.select.ServoPointSelector;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.FrameTruth;
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
     * Everything a pick produced. {@code set} is empty when the selection found no acceptable set (see its outcome).
     * {@code betterDesigned} names a set of the design's own features that conditions better than the chosen one and
     * why it was not taken ({@link DesignedOptimum}); empty when the choice is as good or the design is unknown.
     */
    public record Result(String detector, List<Candidate> candidates, Selection selection, Optional<ServoSet> set,
                         String poseMethod, Optional<DesignedOptimum.Better> betterDesigned) {
        public Result(String detector, List<Candidate> candidates, Selection selection, Optional<ServoSet> set, String poseMethod) {
            this(detector, candidates, selection, set, poseMethod, Optional.empty());
        }
    }

    /**
     * What a pick starts from: one comparison's detections and what is known of its scene.
     *
     * @param referenceFrame   name of the reference frame
     * @param epsilonPx        the comparison's match radius, pixels (the candidates' repeatability uses the same)
     * @param ranking          detector names, best first
     * @param detectorSettings per detector name, its settings as JSON text
     * @param detections       per detector name, per frame name (in frame order), the detections
     * @param truth            per frame name, its truth, when known; the reference frame's homography is the identity
     * @param camera           intrinsics (needed)
     * @param design           the target design, when known
     * @param referencePose    the reference view's pose, when known (else estimated from the design and the truth)
     * @param posesLabel       how the set names where a known pose came from (e.g. a file name)
     * @param designLabel      how the set names where the design came from
     * @param undistortedFromReference registered truth under lens distortion: per frame name, the homography from the
     *                         reference frame between undistorted images, G_f G_ref^-1 with G = K [r1 r2 t] of the
     *                         registered poses (as {@link CompareRun#withRegisteredTruth}); empty otherwise
     */
    public record Input(String referenceFrame, double epsilonPx, List<String> ranking, Map<String, String> detectorSettings,
                        Map<String, Map<String, List<Detection>>> detections, Optional<Map<String, FrameTruth>> truth,
                        Optional<CameraModel> camera, Optional<TargetDesign> design, Optional<Pose> referencePose,
                        String posesLabel, String designLabel, Map<String, Homography> undistortedFromReference) {
        public Input {
            undistortedFromReference = Map.copyOf(undistortedFromReference);
        }

        /** Without registered truth under lens distortion. */
        public Input(String referenceFrame, double epsilonPx, List<String> ranking, Map<String, String> detectorSettings,
                     Map<String, Map<String, List<Detection>>> detections, Optional<Map<String, FrameTruth>> truth,
                     Optional<CameraModel> camera, Optional<TargetDesign> design, Optional<Pose> referencePose,
                     String posesLabel, String designLabel) {
            this(referenceFrame, epsilonPx, ranking, detectorSettings, detections, truth, camera, design, referencePose,
                    posesLabel, designLabel, Map.of());
        }

        /**
         * The homographies between undistorted images induced by the target plane in registered poses, from the
         * reference frame's pose to each frame's: G_f G_ref^-1, G = K [r1 r2 t] (Hartley &amp; Zisserman 2004, eq. 13.1).
         * Empty when the reference frame has no pose.
         */
        public static Map<String, Homography> planeInduced(CameraModel camera, String referenceFrame, Map<String, Pose> poses) {
            Pose ref = poses.get(referenceFrame);
            Map<String, Homography> out = new java.util.LinkedHashMap<>();
            if (ref == null) return out;
            Homography gRefInv = Projection.targetToImage(camera, ref).inverse();
            for (var e : poses.entrySet()) out.put(e.getKey(), Projection.targetToImage(camera, e.getValue()).after(gRefInv).normalised());
            return out;
        }
        FrameTruth truthOf(String frame) {
            FrameTruth t = truth.map(m -> m.get(frame)).orElse(null);
            if (t != null) return t;
            return truth.isPresent() && frame.equals(referenceFrame) ? FrameTruth.homography(Homography.identity()) : FrameTruth.none();
        }
    }

    /** Why a pick could not start (expected failures, data). */
    public enum Problem {
        /** The comparison ranked no detector and none was named. */
        EMPTY_RANKING,
        /** The named detector is not in the comparison ({@link Refused#detector}, {@link Refused#choices}). */
        UNKNOWN_DETECTOR,
        /** No camera intrinsics. */
        NO_CAMERA,
        /** Too few reference detections match designed features for a pose estimate ({@link Refused#count}). */
        POSE_NOT_ESTIMABLE,
        /** No known pose, and no design or no reference truth to estimate one ({@link Refused#designMissing}, {@link Refused#truthMissing}). */
        NO_DEPTH,
        /** The known pose does not place the designed features on the reference truth ({@link Refused#medianPx}). */
        POSE_MISMATCH
    }

    /** A pick that could not start, with its typed reason and numbers; sentences are rendered by the shells' one renderer. */
    public static final class Refused extends Exception {
        public final Problem problem;
        public final String detector;
        public final List<String> choices;
        public final int count;
        public final double medianPx;
        public final boolean designMissing, truthMissing;

        Refused(Problem problem, String detector, List<String> choices, int count, double medianPx, boolean designMissing, boolean truthMissing) {
            super(problem.name());
            this.problem = problem;
            this.detector = detector;
            this.choices = List.copyOf(choices);
            this.count = count;
            this.medianPx = medianPx;
            this.designMissing = designMissing;
            this.truthMissing = truthMissing;
        }

        static Refused of(Problem p, String detector) { return new Refused(p, detector, List.of(), 0, Double.NaN, false, false); }
    }

    /**
     * Picks a set.
     *
     * @param detectorName the detector whose detections are the candidates, or null for the top-ranked one
     */
    public static Result run(Input data, String detectorName, CandidateConfig cc, SelectConfig sc,
                             String toolVersion, String created) throws Refused {
        return run(data, detectorName, cc, sc, toolVersion, created, Optional.empty());
    }

    /**
     * As above; with {@code tracks} (a {@code track --target} run on the same design) the candidates' track survival
     * and jitter are the measured ones ({@link MeasuredTracks}) and the set's tracker settings name that run and its
     * footage.
     */
    public static Result run(Input data, String detectorName, CandidateConfig cc, SelectConfig sc,
                             String toolVersion, String created, Optional<TrackRunFiles.Data> tracks) throws Refused {
        String detector = detectorName != null ? detectorName : data.ranking().isEmpty() ? null : data.ranking().get(0);
        if (detector == null) throw Refused.of(Problem.EMPTY_RANKING, null);
        Map<String, List<Detection>> byFrame = data.detections().get(detector);
        if (byFrame == null && !data.ranking().contains(detector))
            throw new Refused(Problem.UNKNOWN_DETECTOR, detector, data.ranking(), 0, Double.NaN, false, false);
        if (byFrame == null) byFrame = Map.of();
        CameraModel camera = data.camera().orElseThrow(() -> Refused.of(Problem.NO_CAMERA, detector));
        Optional<TargetDesign> design = data.design();
        String ref = data.referenceFrame();
        List<Detection> refDet = byFrame.getOrDefault(ref, List.of());
        List<ProjectedFeature> refTruth = data.truth().isPresent() ? data.truthOf(ref).features() : List.of();

        Pose pose;
        String poseMethod;
        if (data.referencePose().isPresent()) {
            pose = data.referencePose().get();
            poseMethod = "known: pose 0 of " + data.posesLabel();
            if (!refTruth.isEmpty() && design.isPresent()) checkPose(camera, design.get(), pose, refTruth, detector);
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
            if (est.isEmpty()) throw new Refused(Problem.POSE_NOT_ESTIMABLE, detector, List.of(), px.size(), Double.NaN, false, false);
            pose = est.get().pose();
            poseMethod = String.format(Locale.ROOT, "%s, from %d %s detections matched to designed features, reprojection RMS %.3f px",
                    PoseEstimation.METHOD, est.get().points(), detector, est.get().reprojectionRmsPx());
        } else {
            throw new Refused(Problem.NO_DEPTH, detector, List.of(), 0, Double.NaN, design.isEmpty(), refTruth.isEmpty());
        }

        // under lens distortion, registered poses give repeatability between undistorted images
        boolean undistorted = camera.isDistorted() && !data.undistortedFromReference().isEmpty();
        List<Candidates.Frame> others = new ArrayList<>();
        for (String name : allFrames(data, byFrame)) {
            if (name.equals(ref)) continue;
            FrameTruth ft = data.truthOf(name);
            Optional<Homography> h = undistorted ? Optional.ofNullable(data.undistortedFromReference().get(name)) : ft.fromReference();
            others.add(new Candidates.Frame(name, byFrame.getOrDefault(name, List.of()), h, ft.features()));
        }
        CandidateConfig c2 = cc.copy();
        c2.epsilonPx = data.epsilonPx();
        List<Candidate> cands = Candidates.build(new Candidates.Frame(ref, refDet, Optional.empty(), refTruth), others, camera,
                design.orElse(null), pose, c2, undistorted);
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
        List<Candidate> candsFinal = cands;
        Optional<DesignedOptimum.Better> better = design.flatMap(d -> DesignedOptimum.check(sel, candsFinal, DesignedOptimum.designedPoints(d, camera, pose),
                d, camera.width(), camera.height(), sc));
        List<ServoPoint> pts = new ArrayList<>();
        for (Selection.Chosen ch : sel.chosen()) {
            pts.add(ServoPoint.of(ch.candidate(), Reasons.chosen(ch)));
        }
        String designRef = design.map(d -> d.name() + " (" + data.designLabel() + ")").orElse("unknown");
        ServoSet set = new ServoSet(toolVersion, created, camera, design.map(TargetDesign::id).orElse("unknown"), designRef,
                Optional.of(pose), poseMethod, detector, data.detectorSettings().getOrDefault(detector, "{}"), trackerNote, pts,
                sel.condition(), sel.sigmaMin());
        return new Result(detector, cands, sel, Optional.of(set), poseMethod, better);
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

    private static List<String> allFrames(Input data, Map<String, List<Detection>> byFrame) {
        java.util.LinkedHashSet<String> names = new java.util.LinkedHashSet<>(byFrame.keySet());
        data.truth().ifPresent(t -> names.addAll(t.keySet()));
        return new ArrayList<>(names);
    }

    private static void checkPose(CameraModel camera, TargetDesign design, Pose pose, List<ProjectedFeature> truth,
                                  String detector) throws Refused {
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
        if (!(median <= POSE_CHECK_PX)) throw new Refused(Problem.POSE_MISMATCH, detector, List.of(), n, median, false, false);
    }
}
