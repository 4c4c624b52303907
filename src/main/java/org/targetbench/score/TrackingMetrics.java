package org.targetbench.score;

import org.targetbench.camera.Homography;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.track.TrackFrame;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;

/**
 * Survival, forward-backward error, drift and jitter of a tracking run, fed one frame at a time in constant memory
 * (per-frame figures are handed back to the caller, not kept).
 *
 * <ul>
 *   <li><b>Survival</b> S(f): the fraction of the first frame's tracks still alive after frame f (the empirical
 *       survival function of their lifetimes; every track of the initial set starts together, so no censoring
 *       correction is needed [1]). The median lifetime is the first f - f₀ with S(f) ≤ 1/2.</li>
 *   <li><b>Forward-backward error</b>: every measured value, tracked or lost (Kalal et al. 2010 [2]).</li>
 *   <li><b>Drift</b>: endpoint error of each tracked point against truth. With homographies, a track started at p_b on
 *       frame b follows the plane point q = H_b⁻¹ p_b, whose true pixel on frame f is H_f q (x' ~ H x, Hartley &amp;
 *       Zisserman 2004 [3] eq. 2.1); drift is |p_f - H_f q|. With true feature pixels only, a track started within
 *       {@value #FEATURE_MATCH_PX} px of a feature keeps its offset from it: drift is |p_f - (t_f + p_b - t_b)|.</li>
 *   <li><b>Jitter</b>: over each run of at least {@value #JITTER_MIN_FRAMES} consecutive frames in which nothing moved
 *       (truth unchanged to {@value #STATIC_TOL_PX} px, or the whole run when the user says it is static), the
 *       standard deviation of a track's position, σ = sqrt(Σ |p - p̄|² / (n - 1)), one value per track and run.</li>
 * </ul>
 *
 * <p>References: [1] E. L. Kaplan, P. Meier, "Nonparametric estimation from incomplete observations", JASA 53, 1958.
 * [2] Z. Kalal, K. Mikolajczyk, J. Matas, "Forward-backward error: automatic detection of tracking failures", ICPR 2010.
 * [3] R. Hartley, A. Zisserman, Multiple View Geometry, 2nd ed. 2004.
 */
public final class TrackingMetrics {
    /** Fewest frames of a static run that give a jitter value (common practice, no source). */
    public static final int JITTER_MIN_FRAMES = 5;
    /** Truth that moves less than this between frames, pixels, counts as not moved. */
    public static final double STATIC_TOL_PX = 1e-3;
    /** A track started this close to a true feature follows it when there is no homography, pixels. */
    public static final double FEATURE_MATCH_PX = 1.0;
    /** Resolution and range of the pooled distributions, pixels. */
    private static final double BIN_PX = 0.001, CEILING_PX = 100;

    private final int width, height;
    private final int survivalAtFrame;
    private final boolean wholeRunStatic;
    private final Map<Integer, State> states = new HashMap<>();
    private final Map<TrackOutcome, Integer> ended = new EnumMap<>(TrackOutcome.class);
    private final ValueHistogram fb = new ValueHistogram(BIN_PX, CEILING_PX);
    private final ValueHistogram drift = new ValueHistogram(BIN_PX, CEILING_PX);
    private final ValueHistogram jitter = new ValueHistogram(BIN_PX, CEILING_PX);
    private Optional<Homography> previousH = Optional.empty();
    private Map<Integer, double[]> previousFeatures = Map.of();
    private int frames, firstFrame, lastFrame, initialTracks, started, framesWithTruth, staticFrames;
    private double lastSurvival = Double.NaN, survivalAtN = Double.NaN;
    private int medianLifetime = -1;
    private boolean finished;

    /** What is known about one live track. */
    private static final class State {
        double[] plane;          // q = H_b⁻¹ p_b, when started on a frame with a homography
        int featureId = -1;      // the true feature it follows, when started near one without a homography
        double offX, offY;       // p_b - t_b for feature truth
        double lastX, lastY;
        int n;                   // jitter run: count and sums about its first point (kept small for precision)
        double refX, refY, sx, sy, sxx, syy;
    }

    /**
     * @param width           frame width, pixels (to compare homographies over the frame)
     * @param height          frame height, pixels
     * @param survivalAtFrame frame index at which survival is reported on its own
     * @param wholeRunStatic  the user says the camera and target never moved: the whole run is one static segment
     */
    public TrackingMetrics(int width, int height, int survivalAtFrame, boolean wholeRunStatic) {
        if (width < 1 || height < 1) throw new IllegalArgumentException("frame size must be positive, got " + width + "x" + height);
        if (survivalAtFrame < 0) throw new IllegalArgumentException("survival-at frame must be >= 0, got " + survivalAtFrame);
        this.width = width;
        this.height = height;
        this.survivalAtFrame = survivalAtFrame;
        this.wholeRunStatic = wholeRunStatic;
        for (TrackOutcome o : TrackOutcome.values()) if (o.isLoss()) ended.put(o, 0);
    }

    /**
     * Adds one frame's tracker output with the frame's truth.
     *
     * @param h        homography from the reference view to this frame, when known
     * @param features true pixels of target features on this frame (may be empty)
     */
    public FrameTracking add(TrackFrame tf, Optional<Homography> h, List<ProjectedFeature> features) {
        if (finished) throw new IllegalStateException("the run has been summarised already");
        boolean first = frames == 0;
        if (!first && tf.frame() <= lastFrame)
            throw new IllegalArgumentException("frames must come in increasing order: " + tf.frame() + " after " + lastFrame);
        frames++;
        if (first) firstFrame = tf.frame();
        lastFrame = tf.frame();
        Map<Integer, double[]> truePx = new HashMap<>();
        for (ProjectedFeature f : features) truePx.put(f.featureId(), new double[]{f.u(), f.v()});
        boolean isStatic = !first && (wholeRunStatic || sameView(h, truePx));
        if (isStatic) staticFrames++;
        Optional<Homography> hInv = h.map(Homography::inverse);
        List<Double> drifts = new ArrayList<>();
        for (TrackPoint p : tf.points()) {
            switch (p.outcome()) {
                case STARTED -> {
                    started++;
                    if (first) initialTracks++;
                    states.put(p.trackId(), anchor(p, hInv, features));
                }
                case TRACKED -> {
                    fb.add(p.fbError());
                    State s = states.get(p.trackId());
                    if (s == null) throw new IllegalArgumentException("track " + p.trackId() + " tracked on frame " + tf.frame() + " but never started");
                    double d = driftOf(s, p, h, truePx);
                    if (!Double.isNaN(d)) drifts.add(d);
                    if (isStatic) {
                        if (s.n == 0) accumulate(s, s.lastX, s.lastY);
                        accumulate(s, p.x(), p.y());
                    } else {
                        closeRun(s);
                    }
                    s.lastX = p.x();
                    s.lastY = p.y();
                }
                default -> {
                    ended.merge(p.outcome(), 1, Integer::sum);
                    fb.add(p.fbError());
                    State s = states.remove(p.trackId());
                    if (s != null) closeRun(s);
                }
            }
        }
        double[] dv = drifts.stream().mapToDouble(Double::doubleValue).toArray();
        for (double v : dv) drift.add(v);
        if (dv.length > 0) framesWithTruth++;
        double fraction = initialTracks == 0 ? Double.NaN : first ? 1.0 : tf.initialAlive() / (double) initialTracks;
        lastSurvival = fraction;
        if (tf.frame() <= survivalAtFrame) survivalAtN = fraction;
        if (medianLifetime < 0 && fraction <= 0.5) medianLifetime = tf.frame() - firstFrame;
        previousH = h;
        previousFeatures = truePx;
        return new FrameTracking(tf.frame(), fraction, tf.alive(), Distribution.of(dv), isStatic);
    }

    /** Summary of the run so far; closes every open jitter run, so call it once, at the end. */
    public TrackingScore result() {
        finished = true;
        for (State s : states.values()) closeRun(s);
        return new TrackingScore(frames, firstFrame, lastFrame, initialTracks, started, states.size(), lastSurvival,
                survivalAtFrame, frames > 0 && lastFrame >= survivalAtFrame ? survivalAtN : Double.NaN,
                medianLifetime >= 0 ? OptionalInt.of(medianLifetime) : OptionalInt.empty(), ended, fb.summary(),
                drift.summary(), framesWithTruth, jitter.summary(), staticFrames);
    }

    private State anchor(TrackPoint p, Optional<Homography> hInv, List<ProjectedFeature> features) {
        State s = new State();
        s.lastX = p.x();
        s.lastY = p.y();
        if (hInv.isPresent()) s.plane = hInv.get().apply(p.x(), p.y());
        // also anchored to a true feature: the reference frame has the identity homography even when the other
        // frames only have points (registered truth under lens distortion)
        {
            double best = FEATURE_MATCH_PX;
            for (ProjectedFeature f : features) {
                double d = Math.hypot(f.u() - p.x(), f.v() - p.y());
                if (d <= best) {
                    best = d;
                    s.featureId = f.featureId();
                    s.offX = p.x() - f.u();
                    s.offY = p.y() - f.v();
                }
            }
        }
        return s;
    }

    private static double driftOf(State s, TrackPoint p, Optional<Homography> h, Map<Integer, double[]> truePx) {
        if (s.plane != null && h.isPresent()) {
            double[] t = h.get().apply(s.plane[0], s.plane[1]);
            return Math.hypot(p.x() - t[0], p.y() - t[1]);
        }
        if (s.featureId >= 0 && truePx.containsKey(s.featureId)) {
            double[] t = truePx.get(s.featureId);
            return Math.hypot(p.x() - (t[0] + s.offX), p.y() - (t[1] + s.offY));
        }
        return Double.NaN;
    }

    /** True when this frame's truth equals the previous frame's to {@link #STATIC_TOL_PX}. */
    private boolean sameView(Optional<Homography> h, Map<Integer, double[]> truePx) {
        if (h.isPresent() && previousH.isPresent()) {
            double[][] corners = {{0, 0}, {width - 1, 0}, {0, height - 1}, {width - 1, height - 1}};
            for (double[] c : corners) {
                double[] a = h.get().apply(c[0], c[1]), b = previousH.get().apply(c[0], c[1]);
                if (!(Math.hypot(a[0] - b[0], a[1] - b[1]) < STATIC_TOL_PX)) return false;
            }
            return true;
        }
        int common = 0;
        for (var e : truePx.entrySet()) {
            double[] b = previousFeatures.get(e.getKey());
            if (b == null) continue;
            common++;
            if (!(Math.hypot(e.getValue()[0] - b[0], e.getValue()[1] - b[1]) < STATIC_TOL_PX)) return false;
        }
        return common > 0;
    }

    private static void accumulate(State s, double x, double y) {
        if (s.n == 0) {
            s.refX = x;
            s.refY = y;
        }
        x -= s.refX;
        y -= s.refY;
        s.n++;
        s.sx += x;
        s.sy += y;
        s.sxx += x * x;
        s.syy += y * y;
    }

    private void closeRun(State s) {
        if (s.n >= JITTER_MIN_FRAMES) {
            double var = (s.sxx - s.sx * s.sx / s.n + s.syy - s.sy * s.sy / s.n) / (s.n - 1);
            jitter.add(Math.sqrt(Math.max(0, var)));
        }
        s.n = 0;
        s.sx = s.sy = s.sxx = s.syy = 0;
    }
}
