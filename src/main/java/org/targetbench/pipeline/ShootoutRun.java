package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Feasibility;
import org.targetbench.camera.FeasibilityConfig;
import org.targetbench.camera.FeasibilityReport;
import org.targetbench.camera.Pose;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.PointDetector;
import org.targetbench.perturb.Perturbation;
import org.targetbench.perturb.Perturbed;
import org.targetbench.perturb.Perturber;
import org.targetbench.score.Repeatability;
import org.targetbench.select.Candidate;
import org.targetbench.select.CandidateConfig;
import org.targetbench.select.Candidates;
import org.targetbench.select.SelectConfig;
import org.targetbench.select.Selection;
import org.targetbench.select.ServoPointSelector;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * Target shoot-out: the same questions asked of several candidate designs under the same camera, stand-off and
 * conditions, so the one for the fixture can be chosen on what matters to a servo cell.
 *
 * <p>Per design: (1) the feasibility check; (2) a stress sweep at the stand-off, whose envelope ranking names the best
 * detector for the design; (3) for that detector, how many points of the square-on view stay robust across the
 * envelope: a point counts when it is found again (the rule of {@link Repeatability}, with the sweep's ε) in at least {@value #ROBUST_SHARE} of the envelope's
 * conditions (every swept parameter at each of its levels inside the envelope); (4) the best 4-point servo set the
 * servo-aware selection finds, trying every detector on views at the stand-off, and its cond(L*); (5) image
 * coverage of the best detector's points (share of 4 x 4 cells).
 *
 * <p>Design-matched detectors: each design is also scored, side by side, with the detector built for its features
 * ({@link DesignMatch}: x-corner saddles for checkerboards, x-corner fields and markers, dot centres for dot grids)
 * and with the best generic detector by envelope score ({@link Side}: envelope score, points, robust points and the
 * localisation RMS against the projected features, pooled over the views). For dot designs the worst perspective bias
 * of the imaged dot centres over the views ({@code camera.DotBias}) is reported, and the dot detector's RMS with the
 * bias corrected from the known pose beside the uncorrected one.
 *
 * <p>Ranking: designs that fail the feasibility check go last; then designs with at least 4 robust points before
 * those without; then the lower best cond(L*); then more robust points; then more coverage. The figures are shown
 * side by side, so a reader can weigh them differently.
 */
public final class ShootoutRun {
    /** Share of the envelope's conditions in which a point must be found again to count as robust. */
    public static final double ROBUST_SHARE = 0.8;
    /** Tilts and rolls of the views the servo choice compares, degrees {tiltX, tiltY, roll}. */
    static final double[][] VIEWS = {{0, 0, 0}, {10, 0, 0}, {0, 15, 0}, {-10, 10, 0}, {0, 0, 20}, {0, 0, -30}, {20, 0, 5}, {0, -20, 0}};
    /** Seed of the perturbations behind the robust-point count. */
    static final long SEED = 7;

    /**
     * One design's figures. {@code bestCondition} is NaN when no acceptable 4-point set exists. {@code sides}: the
     * design-matched detector's figures (when the design has one, see {@link DesignMatch}), then the best generic
     * detector's. {@code dotBiasPx}: the worst perspective bias of the imaged dot centres over the views, pixels; NaN for
     * a design without dots.
     */
    public record Entry(TargetDesign design, FeasibilityReport feasibility, SweepResult sweep, DetectorType bestDetector,
                        double envelopeScore, int points, int robustPoints, double bestCondition, double bestSigmaMin,
                        String servoNote, double coverage, int rank, List<Side> sides, double dotBiasPx) {
        /** This entry at another rank. */
        public Entry withRank(int r) {
            return new Entry(design, feasibility, sweep, bestDetector, envelopeScore, points, robustPoints, bestCondition, bestSigmaMin,
                    servoNote, coverage, r, sides, dotBiasPx);
        }
    }

    /**
     * One detector's figures for one design: {@code matched} says whether it is the design-matched detector (else it is
     * the best generic one). {@code localisationRmsPx} is against the projected features, pooled over the views at
     * the stand-off (NaN when none is found within {@code score.Localisation.DEFAULT_RADIUS}); {@code correctedRmsPx} the same after
     * the dot-bias correction from the known pose, for the dot detector only (NaN otherwise).
     */
    public record Side(DetectorType detector, boolean matched, double envelopeScore, int points, int robustPoints,
                       double localisationRmsPx, double correctedRmsPx) {}

    private final CameraModel camera;
    private final double standoffM;
    private final double tiltDeg;
    private final SweepConfig sweep;
    private final Map<Perturbation, Double> envelope;

    public ShootoutRun(CameraModel camera, double standoffM, double tiltDeg, SweepConfig sweep, Map<Perturbation, Double> envelope) {
        if (!(standoffM > 0)) throw new IllegalArgumentException("stand-off must be > 0 m, got " + standoffM);
        sweep.checkValidity();
        this.camera = camera;
        this.standoffM = standoffM;
        this.tiltDeg = tiltDeg;
        this.sweep = sweep.copy();
        this.envelope = Map.copyOf(envelope);
    }

    public List<Entry> run(List<TargetDesign> designs, RenderConfig lighting, Progress progress, BooleanSupplier cancelled) throws InterruptedException {
        List<Entry> out = new ArrayList<>();
        int i = 0;
        for (TargetDesign d : designs) {
            if (cancelled.getAsBoolean()) break;
            progress.update(i++, designs.size(), d.id());
            out.add(one(d, lighting, cancelled));
        }
        progress.update(designs.size(), designs.size(), "done");
        return rank(out);
    }

    private Entry one(TargetDesign d, RenderConfig lighting, BooleanSupplier cancelled) throws InterruptedException {
        FeasibilityReport f = Feasibility.check(d, camera, standoffM, tiltDeg, new FeasibilityConfig());
        SweepBase base = SweepBase.render(d, camera, lighting, standoffM, sweep.syntheticFrames, sweep.seed);
        SweepResult s = new SweepRun(sweep).run(base, Progress.NONE, cancelled);
        var top = SweepSummary.rankEnvelope(s, envelope).get(0);
        DetectorConfig dc = sweep.detectors.stream().filter(c -> c.type() == top.detector()).findFirst().orElseThrow();
        PointDetector det = Detectors.create(dc);
        SyntheticRenderer renderer = new SyntheticRenderer(camera, lighting);
        List<Pose> poses = new ArrayList<>();
        for (double[] v : VIEWS) poses.add(Pose.facing(d.widthMm(), d.heightMm(), standoffM, v[0], v[1], v[2], 0, 0));
        List<SyntheticRenderer.Rendered> views = new ArrayList<>();
        for (int k = 0; k < poses.size(); k++) views.add(renderer.render(d, poses.get(k), SEED + k));
        List<Detection> ref = det.detect(views.get(0).image());
        int robust = robustPoints(det, views.get(0).image(), ref);
        double coverage = org.targetbench.score.Spread.score(ref, camera.width(), camera.height()).cellOccupancy();
        // the servo choice, as 'pick' makes it, on views at the stand-off with their exact homographies; every detector
        // is tried and the best-conditioned acceptable set kept
        Selection best = null;
        DetectorType bestServo = null;
        String why = "";
        for (DetectorConfig c : sweep.detectors) {
            PointDetector sd = Detectors.create(c);
            List<Detection> sref = c.type() == dc.type() ? ref : sd.detect(views.get(0).image());
            List<Candidates.Frame> others = new ArrayList<>();
            for (int k = 1; k < views.size(); k++)
                others.add(new Candidates.Frame("view_" + k, sd.detect(views.get(k).image()),
                        camera.isDistorted() ? Optional.empty() : Optional.of(org.targetbench.camera.Projection.referenceToFrame(camera, poses.get(0), poses.get(k))),
                        views.get(k).features()));
            CandidateConfig cc = new CandidateConfig();
            cc.epsilonPx = sweep.epsilon;
            List<Candidate> cands = Candidates.build(new Candidates.Frame("view_0", sref, Optional.empty(), views.get(0).features()), others,
                    camera, d, poses.get(0), cc);
            SelectConfig sc = new SelectConfig();
            sc.count = 4;
            Selection sel = ServoPointSelector.select(cands, camera.width(), camera.height(), sc);
            if (sel.outcome() == Selection.Outcome.SELECTED && (best == null || sel.condition() < best.condition())) {
                best = sel;
                bestServo = c.type();
            } else if (sel.outcome() != Selection.Outcome.SELECTED && why.isEmpty()) {
                why = c.type().label() + ": " + Reasons.selection(sel);
            }
        }
        boolean ok = best != null;
        List<Side> sides = MatchedSides.of(d, camera, poses, views, SweepSummary.rankEnvelope(s, envelope), sweep.detectors,
                (detector, points) -> robustPoints(detector, views.get(0).image(), points));
        double bias = 0;
        for (Pose p : poses) bias = Math.max(bias, org.targetbench.camera.DotBias.worst(d, camera, p));
        return new Entry(d, f, s, top.detector(), top.score(), ref.size(), robust, ok ? best.condition() : Double.NaN,
                ok ? best.sigmaMin() : Double.NaN, ok ? "4 points from " + bestServo.label() : "no acceptable set (" + why + ")", coverage, 0,
                sides, org.targetbench.camera.DotBias.hasDots(d) ? bias : Double.NaN);
    }

    /** Points of the square-on view found again within ε in at least {@link #ROBUST_SHARE} of the envelope's conditions. */
    int robustPoints(PointDetector det, boofcv.struct.image.GrayF32 image, List<Detection> ref) {
        Perturber perturber = new Perturber(sweep.perturb);
        int[] found = new int[ref.size()];
        int conditions = 0;
        for (Perturbation p : sweep.parameters) {
            for (double v : sweep.valuesOf(p)) {
                Double limit = envelope.get(p);
                if (limit != null && !SweepSummary.inEnvelope(p, v, limit)) continue;
                if (p.geometric() && v == p.neutral()) continue;
                conditions++;
                Perturbed q = perturber.apply(p, v, image, SEED);
                List<Detection> got = det.detect(q.image());
                int[] again = Repeatability.foundAgain(ref, got, q.warp(), image.width, image.height, q.image().width, q.image().height,
                        sweep.epsilon);
                for (int i = 0; i < ref.size(); i++) if (again[i] > 0) found[i]++;
            }
        }
        int robust = 0;
        for (int c : found) if (conditions > 0 && c >= ROBUST_SHARE * conditions) robust++;
        return robust;
    }

    static List<Entry> rank(List<Entry> entries) {
        List<Entry> sorted = new ArrayList<>(entries);
        sorted.sort(Comparator.comparing((Entry e) -> e.feasibility().overall() == FeasibilityReport.Status.FAIL)
                .thenComparing(e -> e.robustPoints() < 4)
                .thenComparingDouble(e -> Double.isNaN(e.bestCondition()) ? Double.POSITIVE_INFINITY : e.bestCondition())
                .thenComparing(Comparator.comparingInt(Entry::robustPoints).reversed())
                .thenComparing(Comparator.comparingDouble(Entry::coverage).reversed()));
        List<Entry> out = new ArrayList<>();
        for (int i = 0; i < sorted.size(); i++) {
            Entry e = sorted.get(i);
            out.add(e.withRank(i + 1));
        }
        return out;
    }
}
