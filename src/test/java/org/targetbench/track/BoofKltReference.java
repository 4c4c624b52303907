package org.targetbench.track;

import boofcv.alg.tracker.klt.ConfigKlt;
import boofcv.alg.tracker.klt.KltFeature;
import boofcv.alg.tracker.klt.KltTrackFault;
import boofcv.alg.tracker.klt.PyramidKltFeature;
import boofcv.alg.tracker.klt.PyramidKltTracker;
import boofcv.factory.interpolate.FactoryInterpolation;
import boofcv.factory.transform.pyramid.FactoryPyramid;
import boofcv.struct.image.GrayF32;
import boofcv.struct.image.ImageType;
import boofcv.struct.pyramid.ConfigDiscreteLevels;
import boofcv.struct.pyramid.PyramidDiscrete;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.PointDetector;

import java.util.ArrayList;
import java.util.List;

/**
 * The tracker as it was before {@link KltTracker} got its own Lucas-Kanade step: the same flow on BoofCV 1.2.2's float
 * KLT ({@code PyramidKltTracker}). Kept in test scope as the reference the faster tracker is checked against
 * ({@code KltEqualityTest}); not used by the tool.
 *
 * <p>Pyramidal Kanade-Lucas-Tomasi point tracker with a forward-backward check, on BoofCV's float KLT.
 *
 * <p>Each frame: a Gaussian pyramid (5-tap kernel, factor 2 per level) and the normalised Scharr gradient of every level
 * ({@link ScharrGradient}); every live track is located in the new frame from the coarsest level down, each level
 * solving the Lucas-Kanade normal equations G d = e with G = Σ ∇T ∇Tᵀ and e = Σ (T - I) ∇T over the window
 * ([1] eq. 3-5; [2] sec. 2.2-2.4, the coarse result doubled as the next level's guess), T being the track's template
 * from the previous frame; the template is then re-taken at the new position, its smaller eigenvalue checked against
 * {@link KltConfig#minEigenvalue} ([3] eq. 7), and the point tracked back into the previous frame: the distance from
 * where it lands to where it started is the forward-backward error ([4] sec. 2, eq. 1).
 *
 * <p>Drift correction ({@link KltConfig#driftCorrection}, on by default): the frame-to-frame step above random-walks
 * away from the feature over many frames, because every re-taken template carries the last frame's error. So each
 * track also keeps the template of the frame it was born in, and after the frame-to-frame step that template is
 * aligned with the full-resolution frame under an affine warp with gain and bias, inverse compositional
 * ({@link AffineAnchorReference}; [6] sec. 3.2), starting from the frame-to-frame position and the warp of the previous frame;
 * when it converges within {@link KltConfig#maxCorrection} of the frame-to-frame position its answer replaces it
 * ([5] sec. 2.4, strategy 3). The affine warp follows the roll, zoom and local lens distortion of an approach that a
 * translation-only window cannot. The residual check is made against that first template, warped (a window whose
 * aligned residual exceeds {@link KltConfig#maxResidual} ends as {@link TrackOutcome#RESIDUAL_TOO_LARGE}), and the
 * forward-backward check starts from the corrected position with the re-taken template.
 *
 * <p>Caveats: an alignment that does not converge leaves the frame-to-frame position uncorrected for that frame;
 * the tracker is single threaded and not thread safe; every frame of a run must have the same size.
 *
 * <p>References: [1] B. D. Lucas, T. Kanade, "An iterative image registration technique with an application to stereo
 * vision", IJCAI 1981. [2] J.-Y. Bouguet, "Pyramidal implementation of the Lucas Kanade feature tracker", Intel
 * Corporation, 2000. [3] J. Shi, C. Tomasi, "Good features to track", CVPR 1994. [4] Z. Kalal, K. Mikolajczyk,
 * J. Matas, "Forward-backward error: automatic detection of tracking failures", ICPR 2010. [5] I. Matthews,
 * T. Ishikawa, S. Baker, "The template update problem", IEEE PAMI 26(6), 2004. [6] S. Baker, I. Matthews,
 * "Lucas-Kanade 20 years on: a unifying framework", IJCV 56(3), 2004.
 */
public final class BoofKltReference {
    /** Gaussian kernel radius of the pyramid (5 taps, as in [2]); the sigma is derived from it by BoofCV. */
    private static final int PYRAMID_KERNEL_RADIUS = 2;
    /** BoofCV's own singularity guard on det G per pixel; texture is judged by {@link KltConfig#minEigenvalue}. */
    private static final float MIN_DETERMINANT = 1e-6f;
    /**
     * Most iterations of the drift correction: it starts from the frame-to-frame answer, a few hundredths of a pixel
     * from its optimum, and converges in two or three; one that has not converged after this many is not applied
     * (common practice, no source; bounds its cost).
     */
    private static final int ANCHOR_ITERATIONS = 6;

    private final KltConfig config;
    private final PointDetector seeder;
    private final PyramidKltTracker<GrayF32, GrayF32> klt;
    private PyramidDiscrete<GrayF32> current, previous;
    private GrayF32[] currentDx, currentDy, previousDx, previousDy;
    private final List<Live> live = new ArrayList<>();
    private final List<PyramidKltFeature> spare = new ArrayList<>();
    private int width = -1, height = -1;
    private int nextId;
    private boolean started;

    /** A live track. */
    private static final class Live {
        final int id;
        final PyramidKltFeature feature;
        final boolean initial;
        /** Drift correction against the first template; null when off or the first window was incomplete. */
        final AffineAnchorReference anchor;
        float x, y;

        Live(int id, PyramidKltFeature feature, AffineAnchorReference anchor, boolean initial, float x, float y) {
            this.id = id;
            this.anchor = anchor;
            this.feature = feature;
            this.initial = initial;
            this.x = x;
            this.y = y;
        }
    }

    /**
     * @param config  tracker settings (validated and copied)
     * @param seeding detector that picks the points to track, or null when points are always given to
     *                {@link #start(GrayF32, int, List)}
     */
    public BoofKltReference(KltConfig config, DetectorConfig seeding) {
        config.checkValidity();
        this.config = config.copy();
        if (seeding != null) {
            DetectorConfig d = seeding.copy();
            // ask for more than needed: candidates too close to each other or to live tracks are skipped
            d.maxFeatures = Math.max(d.maxFeatures, 4 * this.config.maxTracks);
            this.seeder = Detectors.create(d);
        } else {
            this.seeder = null;
        }
        ConfigKlt k = new ConfigKlt();
        k.maxIterations = this.config.maxIterations;
        k.minPositionDelta = (float) this.config.epsilon;
        k.maxPerPixelError = (float) this.config.maxResidual;
        k.minDeterminant = MIN_DETERMINANT;
        k.driftFracTol = 1.0f;
        klt = new PyramidKltTracker<>(new CornerCheckedKlt(FactoryInterpolation.bilinearRectangle(GrayF32.class),
                FactoryInterpolation.bilinearRectangle(GrayF32.class), k));
        current = pyramid();
        previous = pyramid();
    }

    private PyramidDiscrete<GrayF32> pyramid() {
        return FactoryPyramid.discreteGaussian(ConfigDiscreteLevels.levels(config.pyramidLevels), -1, PYRAMID_KERNEL_RADIUS,
                true, ImageType.single(GrayF32.class));
    }

    public KltConfig config() { return config.copy(); }

    /** Tracks alive now. */
    public int alive() { return live.size(); }

    /**
     * Processes the next frame: on the first call starts tracks at the seeding detector's strongest points, afterwards
     * tracks the live ones (and tops up when the respawn policy says so).
     *
     * @param frame the frame's index, reported back in the rows
     */
    public TrackFrame process(GrayF32 image, int frame) {
        if (!started) {
            if (seeder == null) throw new IllegalStateException("no seeding detector: start the tracker with explicit points");
            setFrame(image);
            started = true;
            List<TrackPoint> rows = new ArrayList<>();
            seed(frame, candidates(image), true, rows);
            return new TrackFrame(frame, rows, live.size(), live.size());
        }
        return track(image, frame);
    }

    /**
     * Starts tracking the given points (x, y pairs, pixel-centre convention) on the first frame. Points that cannot be
     * tracked (off the image, too little texture, closer than the minimum spacing to an earlier point) are not
     * started; the rows list the ones that were, in the order given.
     */
    public TrackFrame start(GrayF32 image, int frame, List<double[]> points) {
        if (started) throw new IllegalStateException("the tracker has already started");
        setFrame(image);
        started = true;
        List<TrackPoint> rows = new ArrayList<>();
        seed(frame, points, true, rows);
        return new TrackFrame(frame, rows, live.size(), live.size());
    }

    private List<double[]> candidates(GrayF32 image) {
        List<double[]> out = new ArrayList<>();
        for (Detection d : seeder.detect(image)) out.add(new double[]{d.x(), d.y()});
        return out;
    }

    private void checkSize(GrayF32 image) {
        if (width < 0) {
            int need = config.minImageSide();
            if (Math.min(image.width, image.height) < need)
                throw new IllegalArgumentException("frames of " + image.width + "x" + image.height + " are too small for " + config.pyramidLevels
                        + " pyramid levels with window radius " + config.windowRadius + ": each side needs at least " + need + " px");
            width = image.width;
            height = image.height;
        } else if (image.width != width || image.height != height) {
            throw new IllegalArgumentException("frame is " + image.width + "x" + image.height + " but the run started at " + width + "x" + height);
        }
    }

    /** Makes {@code image} the current frame; the current one becomes the previous. */
    private void setFrame(GrayF32 image) {
        checkSize(image);
        PyramidDiscrete<GrayF32> p = previous;
        previous = current;
        current = p;
        GrayF32[] dx = previousDx, dy = previousDy;
        previousDx = currentDx;
        previousDy = currentDy;
        current.process(image);
        int n = current.getNumLayers();
        if (dx == null || dx.length != n) {
            dx = new GrayF32[n];
            dy = new GrayF32[n];
            for (int i = 0; i < n; i++) {
                dx[i] = new GrayF32(1, 1);
                dy[i] = new GrayF32(1, 1);
            }
        }
        for (int i = 0; i < n; i++) ScharrGradient.compute(current.getLayer(i), dx[i], dy[i]);
        currentDx = dx;
        currentDy = dy;
    }

    private TrackFrame track(GrayF32 image, int frame) {
        setFrame(image);
        int n = live.size();
        TrackOutcome[] outcome = new TrackOutcome[n];
        float[] fx = new float[n], fy = new float[n];
        double[] fb = new double[n];
        // forward: previous frame's templates into the current frame, then new templates at the new positions
        klt.setImage(current, currentDx, currentDy);
        for (int i = 0; i < n; i++) {
            Live t = live.get(i);
            fb[i] = Double.NaN;
            t.feature.setPosition(t.x, t.y);
            KltTrackFault fault = klt.track(t.feature);
            if (fault != KltTrackFault.SUCCESS) {
                outcome[i] = outcome(fault);
                fx[i] = t.x;
                fy[i] = t.y;
                continue;
            }
            fx[i] = t.feature.x;
            fy[i] = t.feature.y;
            if (!inImage(fx[i], fy[i])) {
                outcome[i] = TrackOutcome.LEFT_IMAGE;
                continue;
            }
            if (t.anchor != null && t.anchor.align(current.getLayer(0), fx[i], fy[i], Math.min(config.maxIterations, ANCHOR_ITERATIONS), config.epsilon) == AffineAnchorReference.Status.CONVERGED) {
                // [5] strategy 3: keep the first template's answer when it lies close to the frame-to-frame one
                if (t.anchor.residual > config.maxResidual) {
                    outcome[i] = TrackOutcome.RESIDUAL_TOO_LARGE;
                    continue;
                }
                if (Math.hypot(t.anchor.rx - fx[i], t.anchor.ry - fy[i]) <= config.maxCorrection) {
                    t.anchor.commit();
                    fx[i] = (float) t.anchor.rx;
                    fy[i] = (float) t.anchor.ry;
                    t.feature.setPosition(fx[i], fy[i]);
                }
            }
            if (!klt.setDescription(t.feature) || minEigenvalue(t.feature.desc[0]) < config.minEigenvalue) outcome[i] = TrackOutcome.TOO_FLAT;
            else outcome[i] = TrackOutcome.TRACKED;
        }
        // backward: the new templates into the previous frame must land where the track came from
        if (config.forwardBackward) {
            klt.setImage(previous, previousDx, previousDy);
            for (int i = 0; i < n; i++) {
                if (outcome[i] != TrackOutcome.TRACKED) continue;
                Live t = live.get(i);
                t.feature.setPosition(fx[i], fy[i]);
                KltTrackFault fault = klt.track(t.feature);
                if (fault == KltTrackFault.SUCCESS) {
                    fb[i] = Math.hypot(t.feature.x - t.x, t.feature.y - t.y);
                    if (!(fb[i] <= config.fbThreshold)) outcome[i] = TrackOutcome.LOST_FORWARD_BACKWARD;
                } else {
                    outcome[i] = TrackOutcome.LOST_FORWARD_BACKWARD;
                }
                t.feature.setPosition(fx[i], fy[i]);
            }
        }
        List<TrackPoint> rows = new ArrayList<>(n + 8);
        List<Live> kept = new ArrayList<>(n);
        int initial = 0;
        for (int i = 0; i < n; i++) {
            Live t = live.get(i);
            rows.add(new TrackPoint(t.id, frame, fx[i], fy[i], outcome[i], fb[i]));
            if (outcome[i] == TrackOutcome.TRACKED) {
                t.x = fx[i];
                t.y = fy[i];
                kept.add(t);
                if (t.initial) initial++;
            } else {
                spare.add(t.feature);
            }
        }
        live.clear();
        live.addAll(kept);
        if (config.respawn == RespawnPolicy.TOP_UP && live.size() < config.maxTracks && seeder != null) {
            klt.setImage(current, currentDx, currentDy);
            seed(frame, candidates(image), false, rows);
        }
        return new TrackFrame(frame, rows, live.size(), initial);
    }

    /** Starts tracks at candidate points on the current frame, strongest first, until there are maxTracks. */
    private void seed(int frame, List<double[]> points, boolean initial, List<TrackPoint> rows) {
        klt.setImage(current, currentDx, currentDy);
        SpacingGrid grid = new SpacingGrid(config.minSpacing);
        for (Live t : live) grid.add(t.x, t.y);
        for (double[] p : points) {
            if (live.size() >= config.maxTracks) break;
            float x = (float) p[0], y = (float) p[1];
            if (!inImage(x, y) || grid.near(x, y)) continue;
            PyramidKltFeature f = spare.isEmpty() ? new PyramidKltFeature(config.pyramidLevels, config.windowRadius) : spare.remove(spare.size() - 1);
            f.setPosition(x, y);
            if (!klt.setDescription(f) || minEigenvalue(f.desc[0]) < config.minEigenvalue) {
                spare.add(f);
                continue;
            }
            AffineAnchorReference anchor = null;
            if (config.driftCorrection) {
                anchor = new AffineAnchorReference(config.windowRadius);
                if (!anchor.init(current.getLayer(0), currentDx[0], currentDy[0], x, y)) anchor = null;
            }
            Live t = new Live(nextId++, f, anchor, initial, x, y);
            live.add(t);
            grid.add(x, y);
            rows.add(new TrackPoint(t.id, frame, x, y, TrackOutcome.STARTED, Double.NaN));
        }
    }

    private boolean inImage(float x, float y) {
        return x >= 0 && y >= 0 && x <= width - 1 && y <= height - 1;
    }

    /** Smaller eigenvalue of the template's gradient matrix per window pixel, (grey levels / px)² ([3] eq. 7). */
    private double minEigenvalue(KltFeature f) {
        double gxx = f.Gxx, gyy = f.Gyy, gxy = f.Gxy;
        double half = (gxx + gyy) / 2, root = Math.sqrt((gxx - gyy) * (gxx - gyy) / 4 + gxy * gxy);
        int side = 2 * f.radius + 1;
        return (half - root) / (side * side);
    }

    private static TrackOutcome outcome(KltTrackFault fault) {
        return switch (fault) {
            case OUT_OF_BOUNDS -> TrackOutcome.LEFT_IMAGE;
            case DRIFTED -> TrackOutcome.DIVERGED;
            case LARGE_ERROR -> TrackOutcome.RESIDUAL_TOO_LARGE;
            case FAILED -> TrackOutcome.TOO_FLAT;
            case SUCCESS -> TrackOutcome.TRACKED;
        };
    }
}
