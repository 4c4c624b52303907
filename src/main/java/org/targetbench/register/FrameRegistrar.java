package org.targetbench.register;

import boofcv.abst.geo.Estimate1ofEpipolar;
import boofcv.abst.geo.RefineEpipolar;
import boofcv.factory.geo.EpipolarError;
import boofcv.factory.geo.FactoryMultiView;
import boofcv.struct.distort.Point2Transform2_F64;
import boofcv.struct.geo.AssociatedPair;
import boofcv.struct.image.GrayF32;
import georegression.struct.point.Point2D_F64;
import org.ejml.data.DMatrixRMaj;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Pose;
import org.targetbench.camera.PoseEstimation;
import org.targetbench.camera.Projection;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetFeature;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * Registers frames to a known planar design: which designed feature is where in the frame, with the plane's pose
 * (given intrinsics) or the design-to-image homography (without), so scores on real footage have truth.
 *
 * <p>Method, per frame:
 * <ol>
 *   <li><b>Correspondences.</b> Only x-corners, dot centres or the grid finder's anchors are matched; every designed
 *   feature, the outer L-corners of a checkerboard included, is predicted from the fitted model. Designs with a grid finder (checkerboard, dot grid, square grid) use it
 *   ({@link GridFinder}, BoofCV [1]). Designs of x-corners without one (random x-corner fields, marker grids, and
 *   checkerboards whose grid finder failed, e.g. partly out of view) match BoofCV's x-corner candidates [2] to the
 *   designed features: first around the previous frame's prediction; failing that (or on the first frame) by a
 *   global search of similarity hypotheses from every pair of designed features onto every pair of candidates,
 *   scored by the designed features that land on a candidate (a RANSAC-style consensus, Fischler &amp; Bolles 1981
 *   [3], made exhaustive because the candidate set is small). The best hypotheses are refined by alternating
 *   homography fits (normalised DLT, Hartley &amp; Zisserman 2004 [4] alg. 4.2) and nearest-candidate matching with
 *   a shrinking radius, in undistorted pixels when intrinsics are given.</li>
 *   <li><b>Model.</b> With intrinsics: the planar pose by IPPE and Levenberg-Marquardt on the reprojection error
 *   ({@link PoseEstimation}), reported as the frame's pose. The predictions then go through the general planar
 *   projective mapping (8 parameters) from the design to undistorted pixels, fitted to the same matches after the
 *   pose ([4] alg. 4.2 and sec. 4.5; [4] sec. 2.3 for the mapping of a plane) and passed through the lens model,
 *   eqs. (1)-(3) of {@link CameraModel}. A rigid pose predicts exactly only when the intrinsics are exact; the two
 *   extra parameters absorb a first-order error of focal length and principal point (Zhang 2000 [5] sec. 2.3: the
 *   plane's homography is K [r1 r2 t] for any K), which a reference calibration carries. Measured on the
 *   chessboard photos of Debian's opencv-doc with their reference intrinsics: median distance to OpenCV's refined
 *   corners 0.155 px with the pose, 0.144 px with the mapping. With fewer than {@link #MIN_FOR_PROJECTIVE}
 *   matches the pose predicts. Without:
 *   the homography by normalised DLT and Levenberg-Marquardt on the transfer error [4] (exact only for a
 *   distortion-free camera). A fit that shows the back of the page is refused.</li>
 *   <li><b>Orientation.</b> A symmetric layout (an odd-by-odd or even-by-even checkerboard, a grid of dots, squares
 *   or markers) fits in several turns. The image decides when the design's reflectance, sampled over the page through
 *   each candidate, correlates clearly better in one turn ({@link RegisterConfig#orientationMargin}); otherwise the
 *   turn closest to the previous registered frame is kept, and on a first frame the upright turn is assumed and the
 *   note says so.</li>
 *   <li><b>Acceptance.</b> At least {@link RegisterConfig#minFeatures} features, a share
 *   {@link RegisterConfig#minInViewFraction} of those predicted in view (for matched designs), and an RMS residual
 *   at most {@link RegisterConfig#maxRmsPx}. Anything else is a typed failure and is never scored.</li>
 * </ol>
 *
 * <p>Keeps the previous registration between calls: one registrar per sequence and thread.
 *
 * <p>[1] P. Abeles, BoofCV 1.2.2, FactoryFiducialCalibration. [2] BoofCV 1.2.2, DetectChessboardCornersXPyramid
 * (x-corner intensity after Abeles 2021, "Pyramidal blur aware x-corner chessboard detector", arXiv:2110.13793).
 * [3] M. A. Fischler, R. C. Bolles, "Random sample consensus", CACM 24(6), 1981. [4] R. Hartley, A. Zisserman,
 * Multiple View Geometry in Computer Vision, 2nd ed., 2004, ch. 2 and 4. [5] Z. Zhang, "A flexible new technique for
 * camera calibration", IEEE TPAMI 22(11), 2000.
 */
public final class FrameRegistrar {
    /** Sample grid over the page for the photometric orientation check (columns, rows). */
    private static final int PHOTO_COLS = 48, PHOTO_ROWS = 36;
    /** Photometric samples keep this far from any edge of the design, millimetres. */
    private static final double PHOTO_CLEAR_MM = 1.5;
    /** Two fits whose predictions differ by less than this are the same, pixels. */
    private static final double SAME_FIT_PX = 0.5;

    private final TargetDesign design;
    private final Optional<CameraModel> camera;
    private final RegisterConfig config;
    private final Optional<GridFinder> grid;
    private final boolean xcornerDesign;
    private final List<int[]> symmetries;
    /** Tolerance when testing a turn of the design onto itself, millimetres. */
    private static final double SYMMETRY_TOL_MM = 1e-3;
    private final XCornerMatcher matcher;
    private Fit previous;

    /**
     * @param design the printed design
     * @param camera the intrinsics with distortion, or empty to register with homographies
     */
    public FrameRegistrar(TargetDesign design, Optional<CameraModel> camera, RegisterConfig config) {
        config.checkValidity();
        this.design = design;
        this.camera = camera;
        this.config = config.copy();
        this.grid = GridFinder.forDesign(design);
        this.xcornerDesign = design.features().stream().anyMatch(f -> f.kind() == FeatureKind.X_CORNER);
        this.matcher = new XCornerMatcher(design, camera, this.config);
        this.symmetries = symmetries(design);
    }

    public TargetDesign design() { return design; }

    public Optional<CameraModel> camera() { return camera; }

    /** Forgets the previous frame (a cut in the footage). */
    public void reset() { previous = null; }

    /** A fitted model and its correspondences. */
    private record Fit(List<Match> matches, Optional<Pose> pose, Homography working, double rmsPx, boolean predictByWorking) {}

    /**
     * Fewest matched features for the general planar mapping (8 parameters) to replace the rigid pose (6) in the
     * predictions: four observations per parameter (common practice, no source); with fewer the pose predicts.
     */
    static final int MIN_FOR_PROJECTIVE = 16;

    /**
     * The general planar projective mapping from design millimetres to undistorted pixels, fitted to the matches
     * after the pose (normalised DLT and Levenberg-Marquardt on the transfer error, Hartley &amp; Zisserman 2004 [4]
     * alg. 4.2 and sec. 4.5, seeded by nothing but the matches), with its residual measured in raw pixels through
     * the lens model. Empty when it does not fit or shows the back of the page.
     */
    private Optional<Fit> projective(Fit rigid) {
        CameraModel k = camera.get();
        Point2Transform2_F64 toNorm = k.pixelToNormalised();
        Point2D_F64 n = new Point2D_F64();
        List<double[]> from = new ArrayList<>(), to = new ArrayList<>();
        for (Match m : rigid.matches) {
            toNorm.compute(m.u(), m.v(), n);
            from.add(new double[]{m.xMm(), m.yMm()});
            to.add(new double[]{k.fx() * n.x + k.cx(), k.fy() * n.y + k.cy()});
        }
        Optional<Homography> h = homography(from, to, true);
        if (h.isEmpty() || !facing(h.get())) return Optional.empty();
        Fit f = new Fit(rigid.matches, rigid.pose, h.get(), 0, true);
        double sum = 0;
        for (Match m : rigid.matches) {
            double[] p = project(f, m.xMm(), m.yMm());
            sum += sq(p[0] - m.u()) + sq(p[1] - m.v());
        }
        double rms = Math.sqrt(sum / rigid.matches.size());
        if (!Double.isFinite(rms)) return Optional.empty();
        return Optional.of(new Fit(rigid.matches, rigid.pose, h.get(), rms, true));
    }

    /** Registers one frame. */
    public Registration register(GrayF32 image) {
        if (camera.isPresent() && (camera.get().width() != image.width || camera.get().height() != image.height))
            throw new IllegalArgumentException("intrinsics are for " + camera.get().width() + " x " + camera.get().height()
                    + " but the frame is " + image.width + " x " + image.height);
        imageW = image.width;
        imageH = image.height;
        List<List<Match>> hyps = new ArrayList<>();
        if (grid.isPresent()) hyps.addAll(grid.get().find(image, design));
        if (hyps.isEmpty() && xcornerDesign) hyps.addAll(matcher.match(image, Optional.ofNullable(previous).map(Fit::working)));
        if (hyps.isEmpty()) return Registration.failed(RegistrationNote.NOT_FOUND, 0, Double.NaN);

        hyps = withSymmetricAlternatives(hyps);
        List<Fit> accepted = new ArrayList<>();
        RegistrationNote worst = RegistrationNote.NO_MODEL;
        int bestUsed = 0;
        double bestRms = Double.NaN;
        for (List<Match> h : hyps) {
            Optional<Fit> f = fit(h);
            if (f.isEmpty()) continue;
            Fit fit = f.get();
            if (Double.isNaN(bestRms) || fit.rmsPx < bestRms) { bestRms = fit.rmsPx; bestUsed = fit.matches.size(); }
            if (fit.matches.size() < config.minFeatures || !enoughInView(fit)) { worst = RegistrationNote.TOO_FEW_FEATURES; continue; }
            if (fit.rmsPx > config.maxRmsPx) {
                if (worst != RegistrationNote.TOO_FEW_FEATURES) worst = RegistrationNote.RESIDUAL_ABOVE_LIMIT;
                continue;
            }
            boolean dup = false;
            for (Fit a : accepted) dup |= sameFit(a, fit);
            if (!dup) accepted.add(fit);
        }
        if (accepted.isEmpty()) return Registration.failed(worst, bestUsed, bestRms);

        Fit chosen;
        RegistrationNote note = RegistrationNote.OK;
        if (accepted.size() == 1) {
            chosen = accepted.get(0);
        } else {
            List<double[]> scored = new ArrayList<>();
            for (int i = 0; i < accepted.size(); i++) scored.add(new double[]{i, photometric(image, accepted.get(i))});
            scored.sort(Comparator.comparingDouble((double[] s) -> -s[1]));
            if (scored.get(0)[1] - scored.get(1)[1] >= config.orientationMargin) {
                chosen = accepted.get((int) scored.get(0)[0]);
            } else {
                List<Fit> tied = new ArrayList<>();
                for (double[] s : scored) if (scored.get(0)[1] - s[1] < config.orientationMargin) tied.add(accepted.get((int) s[0]));
                if (previous != null) {
                    chosen = tied.stream().min(Comparator.comparingDouble(this::distanceToPrevious)).orElseThrow();
                    note = RegistrationNote.ORIENTATION_BY_CONTINUITY;
                } else {
                    chosen = tied.stream().min(Comparator.comparingDouble(this::turnFromUpright)).orElseThrow();
                    note = RegistrationNote.ORIENTATION_ASSUMED;
                }
            }
        }
        if (photometric(image, chosen) < config.minPhotometric)
            return Registration.failed(RegistrationNote.NOT_FOUND, chosen.matches.size(), chosen.rmsPx);
        previous = chosen;
        Optional<Homography> h = Optional.of(chosen.working);
        return new Registration(note, chosen.pose, h, chosen.matches.size(), chosen.rmsPx, predict(chosen));
    }

    /**
     * Adds, for each hypothesis made of designed features, the same pixels read as the design turned by each of its
     * symmetries, so the orientation step sees every way the layout fits.
     */
    private List<List<Match>> withSymmetricAlternatives(List<List<Match>> hyps) {
        if (symmetries.isEmpty()) return hyps;
        List<List<Match>> out = new ArrayList<>(hyps);
        for (List<Match> h : hyps) {
            if (!h.stream().allMatch(m -> m.featureId() >= 0)) continue;
            for (int[] perm : symmetries) {
                List<Match> alt = new ArrayList<>();
                for (Match m : h) {
                    TargetFeature t = design.features().get(perm[m.featureId()]);
                    alt.add(new Match(t.xMm(), t.yMm(), m.u(), m.v(), t.id()));
                }
                out.add(alt);
            }
        }
        return out;
    }

    /**
     * The turns (90, 180, 270 degrees about the features' centroid) that lay the designed features onto designed
     * features of the same kind, as permutations of feature ids.
     */
    static List<int[]> symmetries(TargetDesign design) {
        List<TargetFeature> fs = design.features();
        List<int[]> out = new ArrayList<>();
        if (fs.isEmpty()) return out;
        double cx = 0, cy = 0;
        for (TargetFeature f : fs) { cx += f.xMm(); cy += f.yMm(); }
        cx /= fs.size(); cy /= fs.size();
        int[][] turns = {{0, -1, 1, 0}, {-1, 0, 0, -1}, {0, 1, -1, 0}};
        for (int[] a : turns) {
            int[] perm = new int[fs.size()];
            boolean ok = true;
            for (int i = 0; i < fs.size() && ok; i++) {
                double dx = fs.get(i).xMm() - cx, dy = fs.get(i).yMm() - cy;
                double x = cx + a[0] * dx + a[1] * dy, y = cy + a[2] * dx + a[3] * dy;
                perm[i] = -1;
                for (TargetFeature g : fs)
                    if (g.kind() == fs.get(i).kind() && Math.abs(g.xMm() - x) < SYMMETRY_TOL_MM && Math.abs(g.yMm() - y) < SYMMETRY_TOL_MM) {
                        perm[i] = g.id();
                        break;
                    }
                ok = perm[i] >= 0;
            }
            if (ok) out.add(perm);
        }
        return out;
    }

    // ---- models -------------------------------------------------------------------------------------------------

    private Optional<Fit> fit(List<Match> ms) {
        if (ms.size() < 4) return Optional.empty();
        if (camera.isPresent()) {
            List<double[]> px = new ArrayList<>(), mm = new ArrayList<>();
            for (Match m : ms) { px.add(new double[]{m.u(), m.v()}); mm.add(new double[]{m.xMm(), m.yMm()}); }
            Optional<PoseEstimation.Estimate> e = PoseEstimation.planar(camera.get(), px, mm);
            if (e.isEmpty()) return Optional.empty();
            Pose pose = e.get().pose();
            if (!(pose.r(2, 2) > 0)) return Optional.empty(); // the back of the page
            Fit rigid = new Fit(ms, Optional.of(pose), Projection.targetToImage(camera.get(), pose), e.get().reprojectionRmsPx(), false);
            if (ms.size() < MIN_FOR_PROJECTIVE) return Optional.of(rigid);
            return Optional.of(projective(rigid).orElse(rigid));
        }
        List<double[]> from = new ArrayList<>(), to = new ArrayList<>();
        for (Match m : ms) { from.add(new double[]{m.xMm(), m.yMm()}); to.add(new double[]{m.u(), m.v()}); }
        Optional<Homography> h = homography(from, to, true);
        if (h.isEmpty() || !facing(h.get())) return Optional.empty();
        double sum = 0;
        for (Match m : ms) {
            double[] p = h.get().apply(m.xMm(), m.yMm());
            sum += sq(p[0] - m.u()) + sq(p[1] - m.v());
        }
        return Optional.of(new Fit(ms, Optional.empty(), h.get(), Math.sqrt(sum / ms.size()), true));
    }

    /** Whether the homography keeps the page's handedness at the design centre (the front of the page is seen). */
    private boolean facing(Homography h) {
        double cx = design.widthMm() / 2, cy = design.heightMm() / 2;
        double w = h.get(2, 0) * cx + h.get(2, 1) * cy + h.get(2, 2);
        double[] p = h.apply(cx, cy), px = h.apply(cx + 1, cy), py = h.apply(cx, cy + 1);
        double det = (px[0] - p[0]) * (py[1] - p[1]) - (px[1] - p[1]) * (py[0] - p[0]);
        return det > 0 && w != 0;
    }

    /** Normalised DLT, optionally refined by Levenberg-Marquardt on the transfer error. */
    static Optional<Homography> homography(List<double[]> from, List<double[]> to, boolean refine) {
        List<AssociatedPair> pairs = new ArrayList<>();
        for (int i = 0; i < from.size(); i++) pairs.add(new AssociatedPair(from.get(i)[0], from.get(i)[1], to.get(i)[0], to.get(i)[1]));
        Estimate1ofEpipolar dlt = FactoryMultiView.homographyDLT(true);
        DMatrixRMaj h = new DMatrixRMaj(3, 3);
        if (!dlt.process(pairs, h)) return Optional.empty();
        if (refine) {
            RefineEpipolar lm = FactoryMultiView.homographyRefine(1e-12, 50, EpipolarError.SIMPLE);
            DMatrixRMaj r = new DMatrixRMaj(3, 3);
            if (lm.fitModel(pairs, h, r)) h = r;
        }
        try {
            return Optional.of(new Homography(h.data.clone()).normalised());
        } catch (IllegalArgumentException e) {
            return Optional.empty();
        }
    }

    /** Pixel of a design point under a fit, lens distortion applied; NaNs behind the camera. */
    private double[] project(Fit f, double xMm, double yMm) {
        if (camera.isEmpty()) return f.working.apply(xMm, yMm);
        if (!f.predictByWorking) return Projection.projectTargetPoint(camera.get(), f.pose.orElseThrow(), xMm, yMm);
        Homography h = f.working;
        if (!(h.get(2, 0) * xMm + h.get(2, 1) * yMm + h.get(2, 2) > 0)) return new double[]{Double.NaN, Double.NaN};
        double[] u = h.apply(xMm, yMm);
        CameraModel k = camera.get();
        if (distort == null) distort = k.normalisedToPixel();
        Point2D_F64 px = new Point2D_F64();
        distort.compute((u[0] - k.cx()) / k.fx(), (u[1] - k.cy()) / k.fy(), px);
        return new double[]{px.x, px.y};
    }

    /** Normalised undistorted coordinates to distorted pixels (one per registrar: not thread safe). */
    private Point2Transform2_F64 distort;

    private List<Registration.PredictedFeature> predict(Fit f) {
        List<Registration.PredictedFeature> out = new ArrayList<>();
        for (TargetFeature t : design.features()) {
            double[] p = project(f, t.xMm(), t.yMm());
            if (!Double.isFinite(p[0]) || !Double.isFinite(p[1])) continue;
            if (p[0] < -0.5 || p[1] < -0.5 || p[0] > imageW - 0.5 || p[1] > imageH - 0.5) continue;
            double z = f.pose.map(pose -> pose.targetToCamera(t.xMm(), t.yMm())[2]).orElse(Double.NaN);
            out.add(new Registration.PredictedFeature(t.id(), t.xMm(), t.yMm(), p[0], p[1], z, t.kind()));
        }
        return out;
    }

    /** Size of the frame being registered. */
    private int imageW, imageH;

    private boolean enoughInView(Fit f) {
        boolean designed = f.matches.stream().allMatch(m -> m.featureId() >= 0);
        if (!designed) return true; // a grid finder found its whole grid
        // only the kinds that were matched count (a checkerboard's outer L-corners are predicted, never matched)
        java.util.EnumSet<FeatureKind> matched = java.util.EnumSet.noneOf(FeatureKind.class);
        for (Match m : f.matches) matched.add(design.features().get(m.featureId()).kind());
        int inView = 0;
        for (TargetFeature t : design.features()) {
            if (!matched.contains(t.kind())) continue;
            double[] p = project(f, t.xMm(), t.yMm());
            if (p[0] >= -0.5 && p[1] >= -0.5 && p[0] <= imageW - 0.5 && p[1] <= imageH - 0.5) inView++;
        }
        return f.matches.size() >= Math.ceil(config.minInViewFraction * inView);
    }

    private boolean sameFit(Fit a, Fit b) {
        for (TargetFeature t : design.features()) {
            double[] p = project(a, t.xMm(), t.yMm()), q = project(b, t.xMm(), t.yMm());
            if (!(Math.hypot(p[0] - q[0], p[1] - q[1]) < SAME_FIT_PX)) return false;
        }
        return true;
    }

    // ---- orientation --------------------------------------------------------------------------------------------

    /** Correlation of the design's reflectance with the image, sampled over the page through the fit. */
    private double photometric(GrayF32 image, Fit f) {
        double sr = 0, si = 0, srr = 0, sii = 0, sri = 0;
        int n = 0;
        for (int j = 0; j < PHOTO_ROWS; j++)
            for (int i = 0; i < PHOTO_COLS; i++) {
                double x = (i + 0.5) / PHOTO_COLS * design.widthMm(), y = (j + 0.5) / PHOTO_ROWS * design.heightMm();
                double[] p = project(f, x, y);
                if (!(p[0] >= 0 && p[1] >= 0 && p[0] <= image.width - 1 && p[1] <= image.height - 1)) continue;
                double r = design.reflectance(x, y);
                if (design.reflectance(x - PHOTO_CLEAR_MM, y - PHOTO_CLEAR_MM) != r || design.reflectance(x + PHOTO_CLEAR_MM, y - PHOTO_CLEAR_MM) != r
                        || design.reflectance(x - PHOTO_CLEAR_MM, y + PHOTO_CLEAR_MM) != r || design.reflectance(x + PHOTO_CLEAR_MM, y + PHOTO_CLEAR_MM) != r)
                    continue; // near an edge: blur and print spread, not registration, decide the grey level there
                double g = bilinear(image, p[0], p[1]);
                sr += r; si += g; srr += r * r; sii += g * g; sri += r * g;
                n++;
            }
        if (n < 10) return 0;
        double cov = sri - sr * si / n, vr = srr - sr * sr / n, vi = sii - si * si / n;
        return vr > 0 && vi > 0 ? cov / Math.sqrt(vr * vi) : 0;
    }

    private static double bilinear(GrayF32 img, double x, double y) {
        int x0 = Math.min((int) Math.floor(x), img.width - 2), y0 = Math.min((int) Math.floor(y), img.height - 2);
        x0 = Math.max(x0, 0); y0 = Math.max(y0, 0);
        double ax = x - x0, ay = y - y0;
        return (1 - ay) * ((1 - ax) * img.get(x0, y0) + ax * img.get(x0 + 1, y0))
                + ay * ((1 - ax) * img.get(x0, y0 + 1) + ax * img.get(x0 + 1, y0 + 1));
    }

    private double distanceToPrevious(Fit f) {
        double sum = 0;
        int n = 0;
        for (TargetFeature t : design.features()) {
            double[] p = project(f, t.xMm(), t.yMm()), q = project(previous, t.xMm(), t.yMm());
            double d = Math.hypot(p[0] - q[0], p[1] - q[1]);
            if (Double.isFinite(d)) { sum += d; n++; }
        }
        return n == 0 ? Double.MAX_VALUE : sum / n;
    }

    /** Angle between the design's x axis, as imaged at the page centre, and the image's x axis, radians. */
    private double turnFromUpright(Fit f) {
        double cx = design.widthMm() / 2, cy = design.heightMm() / 2;
        double[] p = project(f, cx, cy), q = project(f, cx + 1, cy);
        return Math.abs(Math.atan2(q[1] - p[1], q[0] - p[0]));
    }

    private static double sq(double x) { return x * x; }
}
