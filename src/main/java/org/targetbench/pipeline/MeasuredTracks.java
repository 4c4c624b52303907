package org.targetbench.pipeline;

import org.targetbench.select.Candidate;
import org.targetbench.score.Robustness;
import org.targetbench.source.TrackRunFiles;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * Track survival and jitter of each designed feature, measured on a tracking run of real footage registered to the
 * same design, and laid onto the pick's candidates (by designed feature) so its filters act on measured values.
 *
 * <ul>
 *   <li>Survival of a feature: the track started on the run's first frame within {@link #START_PX} of the feature's
 *   registered pixel; the share of the run's remaining frames it was still tracked (1 = to the end).</li>
 *   <li>Jitter of a feature: the standard deviation sqrt(Σ|r - r̄|²/(n - 1)) of the residual r = tracked pixel -
 *   registered pixel over the frames where both exist (at least {@link #MIN_JITTER_FRAMES}); the registration takes
 *   out the camera's motion, so what is left is the track's own wander against the target.</li>
 * </ul>
 */
public final class MeasuredTracks {
    /** A track stands for a designed feature when it starts this close to its registered pixel. */
    public static final double START_PX = 1.0;
    /** Fewest frames for a jitter figure. */
    public static final int MIN_JITTER_FRAMES = 5;

    private MeasuredTracks() {}

    /** Survival and jitter of one designed feature (either may be NaN when not measured). */
    public record Figures(double survival, double jitterPx) {}

    public static Map<Integer, Figures> figures(TrackRunFiles.Data data) {
        Map<Integer, List<TrackRunFiles.Row>> byTrack = new HashMap<>();
        int first = Integer.MAX_VALUE, last = Integer.MIN_VALUE;
        for (TrackRunFiles.Row r : data.rows()) {
            byTrack.computeIfAbsent(r.track(), k -> new ArrayList<>()).add(r);
            first = Math.min(first, r.frame());
            last = Math.max(last, r.frame());
        }
        Map<Integer, Figures> out = new HashMap<>();
        Map<Integer, double[]> firstTruth = data.truePx().getOrDefault(first, Map.of());
        for (List<TrackRunFiles.Row> rows : byTrack.values()) {
            TrackRunFiles.Row start = rows.get(0);
            if (start.frame() != first) continue;
            int feature = -1;
            double best = START_PX;
            for (var e : firstTruth.entrySet()) {
                double d = Math.hypot(e.getValue()[0] - start.x(), e.getValue()[1] - start.y());
                if (d <= best) { best = d; feature = e.getKey(); }
            }
            if (feature < 0 || out.containsKey(feature)) continue;
            int lastTracked = start.frame();
            List<double[]> residuals = new ArrayList<>();
            for (TrackRunFiles.Row r : rows) {
                if (!r.outcome().equals("started") && !r.outcome().equals("tracked")) continue;
                lastTracked = r.frame();
                double[] t = data.truePx().getOrDefault(r.frame(), Map.of()).get(feature);
                if (t != null) residuals.add(new double[]{r.x() - t[0], r.y() - t[1]});
            }
            double survival = last == first ? 1.0 : (lastTracked - first) / (double) (last - first);
            out.put(feature, new Figures(survival, jitter(residuals)));
        }
        return out;
    }

    private static double jitter(List<double[]> r) {
        if (r.size() < MIN_JITTER_FRAMES) return Double.NaN;
        double mx = 0, my = 0;
        for (double[] p : r) { mx += p[0]; my += p[1]; }
        mx /= r.size(); my /= r.size();
        double s = 0;
        for (double[] p : r) s += (p[0] - mx) * (p[0] - mx) + (p[1] - my) * (p[1] - my);
        return Math.sqrt(s / (r.size() - 1));
    }

    /** The candidates with survival and jitter of their designed feature filled in (others unchanged). */
    public static List<Candidate> apply(List<Candidate> candidates, Map<Integer, Figures> figures) {
        List<Candidate> out = new ArrayList<>();
        for (Candidate c : candidates) {
            Figures f = c.featureId() >= 0 ? figures.get(c.featureId()) : null;
            if (f == null) { out.add(c); continue; }
            Robustness r = c.robustness();
            Robustness m = new Robustness(r.repeatability(), opt(f.survival()), r.localisationErrorPx(), opt(f.jitterPx()));
            out.add(c.withRobustness(m));
        }
        return out;
    }

    private static OptionalDouble opt(double v) {
        return Double.isFinite(v) ? OptionalDouble.of(v) : OptionalDouble.empty();
    }
}
