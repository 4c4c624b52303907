package org.targetbench.register;

import boofcv.alg.feature.detect.chess.ChessboardCorner;
import boofcv.alg.feature.detect.chess.DetectChessboardCornersXPyramid;
import boofcv.struct.distort.Point2Transform2_F64;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.ImageType;
import georegression.struct.point.Point2D_F64;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Homography;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetFeature;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Matches the x-corners found in a frame (BoofCV's pyramidal x-corner detector [2] of {@link FrameRegistrar}) to the
 * designed x-corners of a design that has no grid finder: followed from the previous frame's mapping, else by the
 * global similarity search with RANSAC-style scoring [3]; each hypothesis is refined by alternating homography fits
 * and one-to-one matching with shrinking radii. Part of {@link FrameRegistrar}, whose class comment describes the
 * method and holds the references; one matcher per registrar (it keeps its detector between frames).
 */
final class XCornerMatcher {
    /** Above this many similarity hypotheses the global search pairs only near neighbours (design and image). */
    private static final double EXHAUSTIVE_LIMIT = 5e7;
    /** Near neighbours paired in the restricted global search: in the design, and among the candidates. */
    private static final int DESIGN_NEIGHBOURS = 4, CANDIDATE_NEIGHBOURS = 6;
    /**
     * In the restricted search a hypothesis is scored in full only when at least PRESCORE_MATCHES of the anchor and
     * its nearest designed features (PRESCORE_FEATURES in all) land on candidates.
     */
    private static final int PRESCORE_FEATURES = 9, PRESCORE_MATCHES = 8;
    /** In the restricted search only the strongest candidates anchor hypotheses. */
    private static final int RESTRICTED_ANCHORS = 24;
    /** Matching radii of the refinement after a global hypothesis, pixels (the last is the config's match radius). */
    private static final double[] GLOBAL_RADII_PX = {12, 6};
    /** Tolerance of a similarity hypothesis grows with the distance from its anchor (perspective, tilt). */
    /**
     * Global hypotheses kept for refinement: a regular layout (a marker grid) matches itself in many wrong ways with
     * every feature landing on a candidate, so the count alone cannot rank them; the photometric check does.
     */
    private static final int GLOBAL_KEEP = 40;
    private static final double HYPOTHESIS_SLOPE = 0.25, HYPOTHESIS_BASE_PX = 3;

    /** The designed x-corners, the only features matched (L-corners and dot centres are predicted, never matched). */
    private final List<TargetFeature> xFeatures;
    private final Optional<CameraModel> camera;
    private final RegisterConfig config;
    private DetectChessboardCornersXPyramid<GrayF32> xcorners;

    XCornerMatcher(TargetDesign design, Optional<CameraModel> camera, RegisterConfig config) {
        this.xFeatures = design.features().stream().filter(f -> f.kind() == FeatureKind.X_CORNER).toList();
        this.camera = camera;
        this.config = config;
    }

    /**
     * Hypotheses of feature-to-candidate matches on one frame: around the previous frame's mapping when there is
     * one (working pixels), else from the global search.
     */
    List<List<Match>> match(GrayF32 image, Optional<Homography> previousWorking) {
        if (xcorners == null) xcorners = new DetectChessboardCornersXPyramid<>(ImageType.single(GrayF32.class));
        xcorners.process(image);
        List<ChessboardCorner> found = new ArrayList<>(xcorners.getCorners().toList());
        found.sort(Comparator.comparingDouble((ChessboardCorner c) -> -c.intensity));
        int keepCandidates = Math.max(config.maxCandidates, xFeatures.size() + xFeatures.size() / 2);
        if (found.size() > keepCandidates) found = new ArrayList<>(found.subList(0, keepCandidates));
        // raw pixels (pixel-centre convention) and working pixels (undistorted when intrinsics are given)
        int n = found.size();
        double[][] raw = new double[n][], work = new double[n][];
        Point2Transform2_F64 toNorm = camera.map(CameraModel::pixelToNormalised).orElse(null);
        Point2D_F64 tmp = new Point2D_F64();
        for (int i = 0; i < n; i++) {
            ChessboardCorner c = found.get(i);
            raw[i] = new double[]{c.x - GridFinder.CHESS_OFFSET_PX, c.y - GridFinder.CHESS_OFFSET_PX};
            if (toNorm != null) {
                toNorm.compute(raw[i][0], raw[i][1], tmp);
                CameraModel k = camera.get();
                work[i] = new double[]{k.fx() * tmp.x + k.cx(), k.fy() * tmp.y + k.cy()};
            } else work[i] = raw[i];
        }
        List<List<Match>> out = new ArrayList<>();
        if (n < 4) return out;
        if (previousWorking.isPresent()) {
            List<int[]> m = assign(previousWorking.get(), work, config.followRadiusPx);
            if (m.size() >= 4) {
                m = refineMatches(m, work, new double[]{config.followRadiusPx / 2});
                if (m.size() >= config.minFeatures) {
                    out.add(toMatches(m, raw));
                    return out;
                }
            }
        }
        for (List<int[]> m : globalHypotheses(work, n)) {
            m = refineMatches(m, work, GLOBAL_RADII_PX);
            if (m.size() >= 4) out.add(toMatches(m, raw));
        }
        return out;
    }

    private List<Match> toMatches(List<int[]> m, double[][] raw) {
        List<Match> ms = new ArrayList<>();
        for (int[] fm : m) {
            TargetFeature t = xFeatures.get(fm[0]);
            ms.add(new Match(t.xMm(), t.yMm(), raw[fm[1]][0], raw[fm[1]][1], t.id()));
        }
        return ms;
    }

    /** Alternates homography fits and matching with the given radii, then the final match radius. */
    private List<int[]> refineMatches(List<int[]> m, double[][] work, double[] radii) {
        double[] all = new double[radii.length + 1];
        System.arraycopy(radii, 0, all, 0, radii.length);
        all[radii.length] = config.matchRadiusPx;
        for (double r : all) {
            if (m.size() < 4) return m;
            List<double[]> from = new ArrayList<>(), to = new ArrayList<>();
            for (int[] fm : m) {
                TargetFeature t = xFeatures.get(fm[0]);
                from.add(new double[]{t.xMm(), t.yMm()});
                to.add(work[fm[1]]);
            }
            Optional<Homography> h = FrameRegistrar.homography(from, to, false);
            if (h.isEmpty()) return List.of();
            m = assign(h.get(), work, r);
        }
        return m;
    }

    /** One-to-one matches (feature index, candidate index) within the radius, closest pairs first. */
    private List<int[]> assign(Homography h, double[][] work, double radius) {
        List<double[]> pairs = new ArrayList<>();
        List<TargetFeature> fs = xFeatures;
        for (int f = 0; f < fs.size(); f++) {
            double[] p = h.apply(fs.get(f).xMm(), fs.get(f).yMm());
            for (int c = 0; c < work.length; c++) {
                double d = Math.hypot(work[c][0] - p[0], work[c][1] - p[1]);
                if (d <= radius) pairs.add(new double[]{d, f, c});
            }
        }
        pairs.sort(Comparator.comparingDouble(a -> a[0]));
        boolean[] usedF = new boolean[fs.size()], usedC = new boolean[work.length];
        List<int[]> out = new ArrayList<>();
        for (double[] p : pairs) {
            int f = (int) p[1], c = (int) p[2];
            if (usedF[f] || usedC[c]) continue;
            usedF[f] = true; usedC[c] = true;
            out.add(new int[]{f, c});
        }
        return out;
    }

    /**
     * Exhaustive similarity hypotheses: designed features a, b onto candidates p, q; each scored by the designed
     * features predicted within a tolerance (growing with the distance from p) of a candidate. Returns the matches
     * of the best few hypotheses.
     */
    private List<List<int[]>> globalHypotheses(double[][] work, int n) {
        List<TargetFeature> fs = xFeatures;
        int m = fs.size();
        final int keep = GLOBAL_KEEP;
        List<Object[]> best = new ArrayList<>(); // {score, matches}
        Map<String, Boolean> seen = new HashMap<>();
        boolean restricted = (double) m * m * n * n * m > EXHAUSTIVE_LIMIT;
        int[][] designNb = neighbours(m, i -> fs.get(i).xMm(), i -> fs.get(i).yMm(), restricted ? DESIGN_NEIGHBOURS : m - 1);
        double[] wx = new double[n], wy = new double[n];
        for (int i = 0; i < n; i++) { wx[i] = work[i][0]; wy[i] = work[i][1]; }
        int[][] byDistance = new int[m][];
        int[][] allNb = neighbours(m, i -> fs.get(i).xMm(), i -> fs.get(i).yMm(), m - 1);
        for (int i = 0; i < m; i++) {
            byDistance[i] = new int[m];
            byDistance[i][0] = i;
            System.arraycopy(allNb[i], 0, byDistance[i], 1, m - 1);
        }
        int[][] candNb = neighbours(n, i -> work[i][0], i -> work[i][1], restricted ? CANDIDATE_NEIGHBOURS : n - 1);
        for (int a = 0; a < m; a++)
            for (int b : designNb[a]) {
                if (!restricted && b < a) continue;
                double fax = fs.get(a).xMm(), fay = fs.get(a).yMm();
                double dfx = fs.get(b).xMm() - fax, dfy = fs.get(b).yMm() - fay, df2 = dfx * dfx + dfy * dfy;
                for (int p = 0; p < (restricted ? Math.min(n, RESTRICTED_ANCHORS) : n); p++)
                    for (int q : candNb[p]) {
                        double dpx = work[q][0] - work[p][0], dpy = work[q][1] - work[p][1];
                        // z = (dp) / (df) as complex numbers
                        double zr = (dpx * dfx + dpy * dfy) / df2, zi = (dpy * dfx - dpx * dfy) / df2;
                        List<int[]> matches = new ArrayList<>();
                        boolean[] usedC = new boolean[n];
                        boolean pruned = false;
                        for (int ci = 0; ci < m; ci++) {
                            if (restricted && ci == PRESCORE_FEATURES && matches.size() < PRESCORE_MATCHES) { pruned = true; break; }
                            int c = byDistance[a][ci];
                            double ex = fs.get(c).xMm() - fax, ey = fs.get(c).yMm() - fay;
                            double px = work[p][0] + zr * ex - zi * ey, py = work[p][1] + zi * ex + zr * ey;
                            double tol = HYPOTHESIS_BASE_PX + HYPOTHESIS_SLOPE * Math.sqrt(sq(px - work[p][0]) + sq(py - work[p][1]));
                            int bestC = -1;
                            double bestD2 = tol * tol;
                            for (int k = 0; k < n; k++) {
                                if (usedC[k]) continue;
                                double ddx = wx[k] - px, ddy = wy[k] - py, d2 = ddx * ddx + ddy * ddy;
                                if (d2 < bestD2) { bestD2 = d2; bestC = k; }
                            }
                            if (bestC >= 0) { usedC[bestC] = true; matches.add(new int[]{c, bestC}); }
                        }
                        if (pruned || matches.size() < 4) continue;
                        if (best.size() == keep && matches.size() <= (int) best.get(keep - 1)[0]) continue;
                        StringBuilder key = new StringBuilder();
                        matches.sort(Comparator.comparingInt((int[] mm) -> mm[0]));
                        for (int[] mm : matches) key.append(mm[0]).append(':').append(mm[1]).append(',');
                        if (seen.put(key.toString(), Boolean.TRUE) != null) continue;
                        best.add(new Object[]{matches.size(), matches});
                        best.sort(Comparator.comparingInt((Object[] o) -> -(int) o[0]));
                        if (best.size() > keep) best.remove(best.size() - 1);
                    }
            }
        List<List<int[]>> out = new ArrayList<>();
        for (Object[] o : best) {
            @SuppressWarnings("unchecked") List<int[]> l = (List<int[]>) o[1];
            out.add(l);
        }
        return out;
    }

    /** For each of n points, the indices of its k nearest others, nearest first. */
    private static int[][] neighbours(int n, java.util.function.IntToDoubleFunction x, java.util.function.IntToDoubleFunction y, int k) {
        int[][] out = new int[n][];
        for (int i = 0; i < n; i++) {
            final int ii = i;
            out[i] = java.util.stream.IntStream.range(0, n).filter(j -> j != ii)
                    .boxed().sorted(Comparator.comparingDouble(j -> Math.hypot(x.applyAsDouble(j) - x.applyAsDouble(ii), y.applyAsDouble(j) - y.applyAsDouble(ii))))
                    .limit(Math.max(0, k)).mapToInt(Integer::intValue).toArray();
        }
        return out;
    }

    private static double sq(double x) { return x * x; }
}
