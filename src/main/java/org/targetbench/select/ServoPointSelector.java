package org.targetbench.select;

import org.targetbench.detect.Detection;
import org.targetbench.score.Spread;
import org.targetbench.camera.InteractionMatrix;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Chooses k servo points from candidates so that the servo is well conditioned and sees widely over the image.
 *
 * <p>Steps: (1) hard filters on what was measured (repeatability, track survival, localisation error, jitter; plus a
 * border margin, a known depth and, when truth is known, being a designed feature), in that order, the first failure
 * being the reason; (2) among the survivors, sets whose points are all at least the minimum separation apart; (3) the
 * set minimising J = log10 cond(L*) - w · coverage, with cond(L*) scaled as in {@link InteractionMatrix} and coverage
 * the convex-hull area fraction. The search is exhaustive when the pool gives at most
 * {@link SelectConfig#exhaustiveLimit} sets, otherwise greedy (farthest pair, widest triangle, then the best next
 * point) followed by best-improvement swaps, from two seeds (the greedy one and the points nearest the image corners).
 *
 * <p>Using the condition number of the image Jacobian to choose features follows Feddema, Lee &amp; Mitchell, IEEE
 * Trans. Robotics and Automation 7(1), 1991; adding coverage of the image and robustness criteria follows the spirit of
 * Janabi-Sharifi &amp; Wilson, "Automatic selection of image features for visual servoing", IEEE Trans. Robotics and
 * Automation 13(6), 1997 (both from memory). The weighting is ours.
 */
public final class ServoPointSelector {
    private static final int MAX_SWAP_ROUNDS = 200;

    private ServoPointSelector() {}

    public static Selection select(List<Candidate> candidates, int width, int height, SelectConfig config) {
        config.checkValidity();
        SelectConfig c = config.copy();
        int k = c.count;
        List<Selection.Rejected> rejected = new ArrayList<>();
        List<Candidate> pool = new ArrayList<>();
        Map<Selection.Why, Integer> why = new LinkedHashMap<>();
        for (Candidate cand : candidates) {
            Selection.Rejected r = filter(cand, width, height, c);
            if (r == null) pool.add(cand);
            else {
                rejected.add(r);
                why.merge(r.why(), 1, Integer::sum);
            }
        }
        int n = candidates.size();
        if (pool.size() < k)
            return refuse(new Selection.Refusal(Selection.RefusalKind.TOO_FEW_PASS, n, pool.size(), k, why, c.minSeparationPx, Double.NaN, c.maxCondition), n, rejected, pool);
        Objective obj = new Objective(pool, width, height, c);
        int[] best;
        Selection.SearchKind searchKind;
        long combos = binomial(pool.size(), k);
        if (combos <= c.exhaustiveLimit) {
            best = exhaustive(obj, k);
            searchKind = Selection.SearchKind.EXHAUSTIVE;
        } else {
            int[] a = swapImprove(obj, greedy(obj, k, null));
            int[] b = swapImprove(obj, greedy(obj, k, corners(pool, width, height)));
            best = a == null ? b : (b == null || obj.value(a) <= obj.value(b) ? a : b);
            searchKind = Selection.SearchKind.GREEDY_SWAP;
        }
        Selection.Search method = new Selection.Search(searchKind, searchKind == Selection.SearchKind.EXHAUSTIVE ? combos : 0, obj.evaluations);
        if (best == null)
            return refuse(new Selection.Refusal(Selection.RefusalKind.NOT_SEPARATED, n, pool.size(), k, why, c.minSeparationPx, Double.NaN, c.maxCondition), n, rejected, pool);
        InteractionMatrix.Conditioning cond = obj.conditioning(best);
        double cov = obj.coverage(best);
        if (!(cond.condition() <= c.maxCondition))
            return refuse(new Selection.Refusal(Selection.RefusalKind.ILL_CONDITIONED, n, pool.size(), k, why, c.minSeparationPx, cond.condition(), c.maxCondition),
                    n, rejected, pool);
        List<Selection.Chosen> chosen = new ArrayList<>();
        boolean[] in = new boolean[pool.size()];
        for (int i : best) in[i] = true;
        for (int slot = 0; slot < k; slot++) {
            int i = best[slot];
            int[] rest = new int[k - 1];
            for (int j = 0, m = 0; j < k; j++) if (j != slot) rest[m++] = best[j];
            double without = obj.conditioning(rest).condition();
            double nearest = Double.POSITIVE_INFINITY;
            for (int j : best) if (j != i) nearest = Math.min(nearest, obj.dist(i, j));
            chosen.add(new Selection.Chosen(pool.get(i), new Selection.ChosenWhy(c.minRepeatability, c.maxLocalisationErrorPx, k - 1, without,
                    cond.condition(), nearest)));
        }
        for (int j = 0; j < pool.size(); j++) {
            if (in[j]) continue;
            Candidate cand = pool.get(j);
            int close = -1;
            for (int i : best) if (obj.dist(i, j) < c.minSeparationPx) close = i;
            if (close >= 0) {
                rejected.add(new Selection.Rejected(cand, Selection.Why.TOO_CLOSE, obj.dist(close, j), c.minSeparationPx, pool.get(close).id(),
                        Double.NaN, Optional.empty()));
                continue;
            }
            double bestSwap = Double.POSITIVE_INFINITY, swapCond = Double.NaN;
            int swapFor = -1;
            for (int slot = 0; slot < k; slot++) {
                int[] trial = best.clone();
                trial[slot] = j;
                if (!obj.feasible(trial)) continue;
                double v = obj.value(trial);
                if (v < bestSwap) {
                    bestSwap = v;
                    swapFor = pool.get(best[slot]).id();
                    swapCond = obj.conditioning(trial).condition();
                }
            }
            rejected.add(swapFor < 0 ? Selection.Rejected.of(cand, Selection.Why.NO_SEPARATED_SWAP, Double.NaN, Double.NaN)
                    : new Selection.Rejected(cand, Selection.Why.WORSE_SWAP, swapCond, obj.value(best), swapFor, bestSwap, Optional.empty()));
        }
        rejected.sort((a, b) -> Integer.compare(a.candidate().id(), b.candidate().id()));
        return new Selection(Selection.Outcome.SELECTED, n, pool.size(), Optional.empty(), chosen, rejected, cond.condition(), cond.sigmaMin(), cov, obj.value(best), method);
    }

    /** The first failed filter, or null. */
    static Selection.Rejected filter(Candidate cand, int width, int height, SelectConfig c) {
        var r = cand.robustness();
        if (!(cand.zM() > 0)) return Selection.Rejected.of(cand, Selection.Why.DEPTH_UNKNOWN, Double.NaN, Double.NaN);
        if (c.requireDesignedFeature && !cand.designed()) return Selection.Rejected.of(cand, Selection.Why.NOT_DESIGNED, Double.NaN, Double.NaN);
        double border = Math.min(Math.min(cand.u(), cand.v()), Math.min(width - 1 - cand.u(), height - 1 - cand.v()));
        if (border < c.borderMarginPx) return Selection.Rejected.of(cand, Selection.Why.NEAR_BORDER, border, c.borderMarginPx);
        if (r.repeatability().isPresent() && r.repeatability().getAsDouble() < c.minRepeatability)
            return Selection.Rejected.of(cand, Selection.Why.LOW_REPEATABILITY, r.repeatability().getAsDouble(), c.minRepeatability);
        if (r.trackSurvival().isPresent() && r.trackSurvival().getAsDouble() < c.minTrackSurvival)
            return Selection.Rejected.of(cand, Selection.Why.LOW_SURVIVAL, r.trackSurvival().getAsDouble(), c.minTrackSurvival);
        if (r.localisationErrorPx().isPresent() && r.localisationErrorPx().getAsDouble() > c.maxLocalisationErrorPx)
            return Selection.Rejected.of(cand, Selection.Why.HIGH_LOCALISATION, r.localisationErrorPx().getAsDouble(), c.maxLocalisationErrorPx);
        if (r.jitterPx().isPresent() && r.jitterPx().getAsDouble() > c.maxJitterPx)
            return Selection.Rejected.of(cand, Selection.Why.HIGH_JITTER, r.jitterPx().getAsDouble(), c.maxJitterPx);
        return null;
    }

    private static Selection refuse(Selection.Refusal refusal, int candidates, List<Selection.Rejected> rejected, List<Candidate> pool) {
        List<Selection.Rejected> all = new ArrayList<>(rejected);
        for (Candidate c : pool)
            all.add(new Selection.Rejected(c, Selection.Why.SET_REFUSED, Double.NaN, Double.NaN, -1, Double.NaN, Optional.of(refusal)));
        all.sort((a, b) -> Integer.compare(a.candidate().id(), b.candidate().id()));
        return new Selection(Selection.Outcome.NO_ACCEPTABLE_SET, candidates, pool.size(), Optional.of(refusal), List.of(), all,
                Double.NaN, Double.NaN, Double.NaN, Double.NaN, Selection.Search.NONE);
    }

    static long binomial(int n, int k) {
        if (k > n) return 0;
        long r = 1;
        for (int i = 1; i <= k; i++) {
            r = r * (n - k + i) / i;
            if (r > Long.MAX_VALUE / 64) return Long.MAX_VALUE;
        }
        return r;
    }

    private static int[] exhaustive(Objective obj, int k) {
        int n = obj.size();
        int[] cur = new int[k];
        int[][] best = {null};
        double[] bestV = {Double.POSITIVE_INFINITY};
        enumerate(obj, cur, 0, 0, n, best, bestV);
        return best[0];
    }

    private static void enumerate(Objective obj, int[] cur, int depth, int from, int n, int[][] best, double[] bestV) {
        if (depth == cur.length) {
            double v = obj.value(cur);
            if (v < bestV[0] || best[0] == null) { // keep a feasible set even when every one is rank deficient
                bestV[0] = v;
                best[0] = cur.clone();
            }
            return;
        }
        for (int i = from; i <= n - (cur.length - depth); i++) {
            boolean ok = true;
            for (int d = 0; d < depth && ok; d++) ok = obj.separated(cur[d], i);
            if (!ok) continue;
            cur[depth] = i;
            enumerate(obj, cur, depth + 1, i + 1, n, best, bestV);
        }
    }

    /** Greedy build from the seed (or the farthest pair), keeping the separation; null when it gets stuck. */
    private static int[] greedy(Objective obj, int k, int[] seed) {
        List<Integer> set = new ArrayList<>();
        if (seed != null) for (int s : seed) if (set.stream().allMatch(j -> obj.separated(j, s)) && set.size() < k) set.add(s);
        if (set.isEmpty()) {
            double bd = -1;
            int bi = -1, bj = -1;
            for (int i = 0; i < obj.size(); i++)
                for (int j = i + 1; j < obj.size(); j++)
                    if (obj.dist(i, j) > bd && obj.separated(i, j)) {
                        bd = obj.dist(i, j);
                        bi = i;
                        bj = j;
                    }
            if (bi < 0) return null;
            set.add(bi);
            set.add(bj);
        }
        while (set.size() < k) {
            int bestJ = -1;
            double bestV = Double.POSITIVE_INFINITY;
            int fallback = -1;
            for (int j = 0; j < obj.size(); j++) {
                final int jj = j;
                if (set.contains(j) || !set.stream().allMatch(i -> obj.separated(i, jj))) continue;
                int[] trial = new int[set.size() + 1];
                for (int m = 0; m < set.size(); m++) trial[m] = set.get(m);
                trial[set.size()] = j;
                // below three points L has no full rank: widen the hull instead
                double v = trial.length <= 3 ? -obj.coverage(trial) : obj.value(trial);
                if (fallback < 0) fallback = j;
                if (v < bestV) {
                    bestV = v;
                    bestJ = j;
                }
            }
            if (bestJ < 0) bestJ = fallback; // every addition rank deficient: keep a feasible set for the refusal
            if (bestJ < 0) return null;
            set.add(bestJ);
        }
        return set.stream().mapToInt(Integer::intValue).toArray();
    }

    private static int[] swapImprove(Objective obj, int[] start) {
        if (start == null) return null;
        int[] cur = start.clone();
        double curV = obj.value(cur);
        for (int round = 0; round < MAX_SWAP_ROUNDS; round++) {
            int[] bestT = null;
            double bestV = curV - 1e-12;
            for (int slot = 0; slot < cur.length; slot++)
                for (int j = 0; j < obj.size(); j++) {
                    final int jj = j;
                    if (Arrays.stream(cur).anyMatch(i -> i == jj)) continue;
                    int[] t = cur.clone();
                    t[slot] = j;
                    if (!obj.feasible(t)) continue;
                    double v = obj.value(t);
                    if (v < bestV) {
                        bestV = v;
                        bestT = t;
                    }
                }
            if (bestT == null) break;
            cur = bestT;
            curV = bestV;
        }
        return cur;
    }

    /** Pool indices of the candidates nearest each image corner. */
    private static int[] corners(List<Candidate> pool, int w, int h) {
        double[][] cs = {{0, 0}, {w - 1, 0}, {w - 1, h - 1}, {0, h - 1}};
        int[] out = new int[4];
        for (int c = 0; c < 4; c++) {
            double bd = Double.POSITIVE_INFINITY;
            for (int i = 0; i < pool.size(); i++) {
                double d = Math.hypot(pool.get(i).u() - cs[c][0], pool.get(i).v() - cs[c][1]);
                if (d < bd) {
                    bd = d;
                    out[c] = i;
                }
            }
        }
        return out;
    }

    /** The objective over sets of pool indices. */
    private static final class Objective {
        final List<Candidate> pool;
        final double imageArea;
        final SelectConfig c;
        long evaluations;

        Objective(List<Candidate> pool, int w, int h, SelectConfig c) {
            this.pool = pool;
            this.imageArea = (double) w * h;
            this.c = c;
        }

        int size() { return pool.size(); }

        double dist(int i, int j) { return Math.hypot(pool.get(i).u() - pool.get(j).u(), pool.get(i).v() - pool.get(j).v()); }

        boolean separated(int i, int j) { return dist(i, j) >= c.minSeparationPx; }

        boolean feasible(int[] set) {
            for (int a = 0; a < set.length; a++)
                for (int b = a + 1; b < set.length; b++) if (set[a] == set[b] || !separated(set[a], set[b])) return false;
            return true;
        }

        /** Reused across the (up to {@link SelectConfig#exhaustiveLimit}) sets evaluated, as the servo controller reuses its own. */
        private final InteractionMatrix.Workspace workspace = new InteractionMatrix.Workspace();
        private double[] x = new double[0], y = new double[0], z = new double[0];

        InteractionMatrix.Conditioning conditioning(int[] set) {
            if (x.length < set.length) {
                x = new double[set.length];
                y = new double[set.length];
                z = new double[set.length];
            }
            double zs = 0;
            for (int i = 0; i < set.length; i++) {
                Candidate cd = pool.get(set[i]);
                x[i] = cd.x();
                y[i] = cd.y();
                z[i] = cd.zM();
                zs += z[i];
            }
            return workspace.conditioning(x, y, z, set.length, zs / set.length);
        }

        double coverage(int[] set) {
            List<Detection> pts = new ArrayList<>();
            for (int i : set) pts.add(new Detection(pool.get(i).u(), pool.get(i).v(), 0, 0));
            return Spread.hullArea(pts) / imageArea;
        }

        /** J = log10 cond(L*) - w · coverage; infinite for rank-deficient sets. */
        double value(int[] set) {
            evaluations++;
            double cond = conditioning(set).condition();
            if (!Double.isFinite(cond)) return Double.POSITIVE_INFINITY;
            return Math.log10(cond) - c.coverageWeight * coverage(set);
        }
    }
}
