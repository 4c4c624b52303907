package org.targetbench.outside;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.opencv.core.CvType;
import org.opencv.core.Mat;
import org.opencv.core.MatOfByte;
import org.opencv.core.MatOfFloat;
import org.opencv.core.MatOfPoint2f;
import org.opencv.core.Point;
import org.opencv.core.Size;
import org.opencv.core.TermCriteria;
import org.opencv.video.Video;
import org.targetbench.detect.Detection;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.ShiTomasiConfig;
import org.targetbench.track.KltConfig;
import org.targetbench.track.KltTracker;
import org.targetbench.track.TrackFrame;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;
import org.targetbench.track.TrackScenes;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Our pyramidal KLT against OpenCV 4.9's {@code calcOpticalFlowPyrLK} (org.openpnp:opencv 4.9.0-0, the reference
 * library; Bouguet's pyramidal Lucas-Kanade) on the same points of the same frames: a clean textured render, 8-bit,
 * moved by a translation. Comparable settings: window 2r+1 = 15, pyramid levels 4 (OpenCV maxLevel 3), at most 20
 * iterations or a 0.01 px step. Points that either tracker loses are left out.
 */
class KltVsOpenCvTest {
    /**
     * Largest allowed median disagreement of the Lucas-Kanade step itself (drift correction off, as OpenCV has none),
     * pixels: a hundredth of a pixel, far below what a servo notices (common practice, no source); measured 0.0002 px.
     */
    static final double MEDIAN_TOL_PX = 0.01;
    /**
     * The same with drift correction on (our default), pixels: the correction is a different estimator (affine warp,
     * gain and bias, whole-pixel template), so it agrees less closely; measured 0.010-0.012 px (common practice, no
     * source, for the bound).
     */
    static final double CORRECTED_MEDIAN_TOL_PX = 0.02;
    static final int W = 640, H = 480;
    static final long SEED = 7;

    @BeforeAll
    static void load() {
        nu.pattern.OpenCV.loadLocally();
    }

    static Mat mat(GrayF32 g) {
        Mat m = new Mat(g.height, g.width, CvType.CV_8UC1);
        byte[] b = new byte[g.width * g.height];
        for (int i = 0; i < b.length; i++) b[i] = (byte) Math.round(Math.max(0, Math.min(255, g.data[i])));
        m.put(0, 0, b);
        return m;
    }

    @ParameterizedTest(name = "shift ({0}, {1}) px, drift correction {2}")
    @CsvSource({"0.3, 0.7, false", "2.25, -1.6, false", "7.3, 4.1, false", "15.6, -9.2, false", "0.3, 0.7, true", "15.6, -9.2, true"})
    void medianDisagreementWithOpenCvIsTiny(double dx, double dy, boolean driftCorrection) {
        GrayF32 a = TrackScenes.quantised(TrackScenes.texture(W, H, SEED, 0, 0));
        GrayF32 b = TrackScenes.quantised(TrackScenes.texture(W, H, SEED, dx, dy));
        ShiTomasiConfig st = new ShiTomasiConfig();
        st.maxFeatures = 300;
        List<double[]> seeds = new ArrayList<>();
        for (Detection d : Detectors.create(st).detect(a)) seeds.add(new double[]{d.x(), d.y()});

        KltConfig k = new KltConfig();
        k.maxTracks = 1000;
        k.forwardBackward = false;
        k.driftCorrection = driftCorrection;
        KltTracker ours = new KltTracker(k, null);
        TrackFrame f0 = ours.start(a, 0, seeds);
        TrackFrame f1 = ours.process(b, 1);

        Point[] p0 = new Point[f0.points().size()];
        for (int i = 0; i < p0.length; i++) p0[i] = new Point(f0.points().get(i).x(), f0.points().get(i).y());
        MatOfPoint2f next = new MatOfPoint2f();
        MatOfByte status = new MatOfByte();
        Video.calcOpticalFlowPyrLK(mat(a), mat(b), new MatOfPoint2f(p0), next, status, new MatOfFloat(),
                new Size(2 * k.windowRadius + 1, 2 * k.windowRadius + 1), k.pyramidLevels - 1,
                new TermCriteria(TermCriteria.COUNT + TermCriteria.EPS, k.maxIterations, k.epsilon), 0, 1e-4);
        Point[] q = next.toArray();
        byte[] ok = status.toArray();
        double[] d = new double[p0.length];
        int n = 0;
        for (int i = 0; i < p0.length; i++) {
            TrackPoint r = f1.points().get(i); // rows come in the order the tracks started
            if (r.outcome() != TrackOutcome.TRACKED || ok[i] == 0) continue;
            d[n++] = Math.hypot(r.x() - q[i].x, r.y() - q[i].y);
        }
        assertTrue(n > 250, "points tracked by both: " + n);
        double[] used = Arrays.copyOf(d, n);
        Arrays.sort(used);
        double median = used[n / 2];
        assertTrue(median < (driftCorrection ? CORRECTED_MEDIAN_TOL_PX : MEDIAN_TOL_PX), "median disagreement " + median + " px");
    }
}
