package org.targetbench.score;

import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorType;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * How close detections come to the true positions of designed features: for each true feature, the distance to the
 * nearest detection within {@value #DEFAULT_RADIUS} px counts as found; RMS, median and 95th percentile over the found
 * ones, and the fraction found. A detection may serve more than one true feature (features closer than the radius are
 * a design fault the feasibility check reports, not a scoring matter). Callers pass the true features the detector is
 * built to find ({@link #findableBy}).
 */
public final class Localisation {
    /** Search radius around each true feature, pixels. */
    public static final double DEFAULT_RADIUS = 3.0;

    private Localisation() {}

    public static LocalisationResult score(List<ProjectedFeature> truth, List<Detection> detections, double radius) {
        return summarise(distances(truth, detections, radius), truth.size());
    }

    /**
     * The true features a detector of type {@code t} is built to find ({@link DetectorType#finds}): an x-corner
     * detector is not held to a checkerboard's outer L-corners, nor a dot detector to corners. Features of unknown
     * kind count for every detector. Localisation and the fraction found are counted over these.
     */
    public static List<ProjectedFeature> findableBy(DetectorType t, List<ProjectedFeature> truth) {
        List<ProjectedFeature> out = new ArrayList<>(truth.size());
        for (ProjectedFeature f : truth) if (f.kind().isEmpty() || t.finds(f.kind().get())) out.add(f);
        return out.size() == truth.size() ? truth : out;
    }

    /** Distance from each true feature to its nearest detection, for the features found within {@code radius}. */
    public static double[] distances(List<ProjectedFeature> truth, List<Detection> detections, double radius) {
        if (!(radius > 0)) throw new IllegalArgumentException("search radius must be > 0 px, got " + radius);
        List<double[]> pts = new ArrayList<>();
        for (Detection d : detections) pts.add(new double[]{d.x(), d.y()});
        GridIndex grid = new GridIndex(pts, radius);
        double[] dist = new double[truth.size()];
        int found = 0;
        for (ProjectedFeature f : truth) {
            double best = Double.POSITIVE_INFINITY;
            for (int j : grid.near(f.u(), f.v())) {
                double dx = pts.get(j)[0] - f.u(), dy = pts.get(j)[1] - f.v();
                best = Math.min(best, Math.sqrt(dx * dx + dy * dy));
            }
            if (best <= radius) dist[found++] = best;
        }
        return Arrays.copyOf(dist, found);
    }

    /** Summary of found-feature distances (possibly pooled over frames) out of {@code nTrue} true features. */
    public static LocalisationResult summarise(double[] foundDistances, int nTrue) {
        double[] d = foundDistances.clone();
        Arrays.sort(d);
        int found = d.length;
        double sumSq = 0;
        for (double v : d) sumSq += v * v;
        return new LocalisationResult(nTrue, found, nTrue == 0 ? Double.NaN : found / (double) nTrue,
                found == 0 ? Double.NaN : Math.sqrt(sumSq / found), Stats.percentile(d, 50), Stats.percentile(d, 95));
    }
}
