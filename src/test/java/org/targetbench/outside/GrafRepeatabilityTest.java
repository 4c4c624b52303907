package org.targetbench.outside;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.opencv.core.CvType;
import org.opencv.core.Mat;
import org.opencv.core.MatOfPoint;
import org.opencv.core.Point;
import org.opencv.imgcodecs.Imgcodecs;
import org.opencv.imgproc.Imgproc;
import org.targetbench.camera.Homography;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorType;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.PointDetector;
import org.targetbench.detect.ShiTomasiConfig;
import org.targetbench.detect.ThresholdMode;
import org.targetbench.score.Repeatability;
import org.targetbench.score.RepeatabilityResult;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Repeatability of every detector on a real image pair with a published ground-truth homography, and an
 * independent Shi-Tomasi reference from a second library.
 *
 * <p>Measure: repeatability of Schmid, Mohr &amp; Bauckhage, "Evaluation of interest point detectors", IJCV 37(2),
 * 2000, as implemented by {@link Repeatability} (ε = 1.5 px). Data: views 1 and 3 of the graffiti sequence and its
 * homography H1to3p, Mikolajczyk et al., "A comparison of affine region detectors", IJCV 65, 2005 (see
 * {@code src/test/resources/reference/PROVENANCE.md}). Reference library: OpenCV 4.9
 * {@code Imgproc.goodFeaturesToTrack} (org.openpnp:opencv 4.9.0-0).
 */
class GrafRepeatabilityTest {
    /** Match radius ε, pixels (Schmid et al. 2000 use 1.5 px, from memory; also Repeatability.DEFAULT_EPSILON). */
    static final double EPS = 1.5;
    /**
     * Plausible band of repeatability for graf 1 -> 3 (a viewpoint change of about 30 degrees, from memory of
     * Mikolajczyk et al. 2005) for detectors that are not affine-invariant. Measured on this pair at default settings,
     * 500 points per image (remeasured 2026-12-02, after the refinement stage's keep rule): Harris 0.599, Shi-Tomasi
     * 0.596 (0.461 and 0.460 when every refinement was kept), FAST 0.432, SURF-style 0.207, SIFT-style 0.304 (0.378 with the image doubled first). SURF-style
     * is low because it keeps at most 100 points per scale (see SurfConfig: that doubles its repeatability under a 2x
     * scale change) and a fixed ε of 1.5 px is strict for coarse blobs, whose position error grows with their scale;
     * without the per-scale limit it measured 0.326. The lower bound keeps a margin of 0.05 below the weakest; a value
     * near 1 would mean the pair or H is not what it claims (a 30 degree foreshortening cannot leave non-affine
     * detectors unaffected).
     */
    static final double MIN_PLAUSIBLE = 0.15, MAX_PLAUSIBLE = 0.75;
    /** Size of the deliberate error added after H, pixels. */
    static final double SHIFT_PX = 5;
    /**
     * With H off by 5 px (> 3 ε) only chance coincidences remain, so the mean over the four axis shifts must fall
     * below this fraction of the true-H repeatability. Measured mean ratios (2026-12-02): Harris 0.118, Shi-Tomasi
     * 0.115, FAST 0.133, SURF-style 0.166, SIFT-style 0.117.
     */
    static final double MAX_SHIFTED_MEAN_RATIO = 0.3;
    /**
     * Bound on any single shift direction. The +x shift is the worst (measured ratios, 2026-12-02: Harris 0.24,
     * Shi-Tomasi 0.22, FAST 0.20, SURF-style 0.29, SIFT-style 0.20; the other three directions 0.07..0.17): the offset histogram
     * q - H·p of this pair has, besides its peak at (0, 0), a secondary cluster near (+5, +1.5) px from repeated
     * texture in the painting, which a +5 px error partly lands on.
     */
    static final double MAX_SHIFTED_SINGLE_RATIO = 0.35;
    /** Largest allowed |ours with refinement - OpenCV unrefined| Shi-Tomasi repeatability (common practice, no source). */
    static final double MAX_OPENCV_GAP = 0.10;
    /**
     * Largest |ours - OpenCV goodFeaturesToTrack| repeatability with the same window, count, minimum distance and
     * quality, both unrefined (common practice, no source); with OpenCV's blockSize read as 2r + 1 instead of our
     * window's width, the largest shortfall.
     */
    static final double MAX_OPENCV_GAP_UNREFINED = 0.05;
    /** Largest repeatability the default refinement may cost on natural texture (common practice, no source). */
    static final double REFINE_LOSS_TOL = 0.015;
    /** Largest allowed difference between our BT.601 luma and OpenCV's float BGR2GRAY of the same file, grey levels. */
    static final double LUMA_TOL = 1e-3;

    static GrayF32 g1, g3;
    static Homography h13;
    static final Map<DetectorType, List<Detection>> REF = new EnumMap<>(DetectorType.class);
    static final Map<DetectorType, List<Detection>> FRAME = new EnumMap<>(DetectorType.class);

    /** The generic detectors; the design-matched ones are left out of this natural scene (see below). */
    static final List<DetectorType> GENERIC = java.util.Arrays.stream(DetectorType.values()).filter(t -> !t.designMatched()).toList();

    @BeforeAll
    static void load() throws Exception {
        nu.pattern.OpenCV.loadLocally();
        g1 = ReferenceData.image("graf1.png");
        g3 = ReferenceData.image("graf3.png");
        h13 = ReferenceData.readOpenCvMatrix("H1to3p.xml", "H13");
        for (DetectorType t : GENERIC) {
            PointDetector d = Detectors.create(t);
            REF.put(t, d.detect(g1));
            FRAME.put(t, d.detect(g3));
        }
    }

    static RepeatabilityResult score(List<Detection> ref, List<Detection> frame, Homography h) {
        return Repeatability.score(ref, frame, h, g1.width, g1.height, g3.width, g3.height, EPS);
    }

    @Test
    void homographyFileParsesToThePublishedMatrix() {
        // Values from H1to3p.xml of the graffiti sequence (Mikolajczyk et al. 2005, IJCV 65), as shipped in Debian's
        // opencv-doc 4.6.0+dfsg-12.
        assertEquals(7.6285898e-01, h13.get(0, 0), 0);
        assertEquals(2.2567123e+02, h13.get(0, 2), 0);
        assertEquals(-7.6999973e+01, h13.get(1, 2), 0);
        assertEquals(-1.4364524e-05, h13.get(2, 1), 0);
        assertEquals(800, g1.width);
        assertEquals(640, g1.height);
        assertEquals(800, g3.width);
        assertEquals(640, g3.height);
    }

    @Test
    void everyDetectorIsRepeatableUnderTheTrueHomography() {
        // Schmid, Mohr & Bauckhage 2000, IJCV 37(2): repeatability with ε = 1.5 px; data of Mikolajczyk et al. 2005,
        // IJCV 65. Measured (eps 1.5, default configs, 2026-12-02): Harris 0.5994 (199/332), Shi-Tomasi 0.5963 (195/327),
        // FAST 0.4324 (160/370), SURF-style 0.2069 (48/232), SIFT-style 0.3040 (107/352). The design-matched detectors
        // (dots, x-corners) find designed features, which this natural scene does not hold; they are checked on
        // designs and on the opencv-doc chessboard photos instead (DotsVsOpenCvTest, XCornerVsOpenCvTest).
        for (DetectorType t : GENERIC) {
            RepeatabilityResult r = score(REF.get(t), FRAME.get(t), h13);
            assertTrue(r.repeatability().isPresent(), t + ": repeatability undefined: " + r);
            double v = r.repeatability().getAsDouble();
            assertTrue(v > MIN_PLAUSIBLE && v < MAX_PLAUSIBLE, t + ": repeatability " + v + " outside the plausible band " + r);
            assertTrue(r.nReference() >= 100 && r.nFrame() >= 100, t + ": too few points in the common area " + r);
        }
    }

    @Test
    void aFivePixelErrorInTheHomographyCollapsesRepeatability() {
        // Schmid, Mohr & Bauckhage 2000, IJCV 37(2): a point counts as repeated only within ε of its predicted
        // position; with H composed with a 5 px translation (more than 3 ε) the true correspondences fall outside ε
        // and only chance coincidences with neighbouring points remain. Data: Mikolajczyk et al. 2005, IJCV 65.
        double[][] shifts = {{SHIFT_PX, 0}, {-SHIFT_PX, 0}, {0, SHIFT_PX}, {0, -SHIFT_PX}};
        for (DetectorType t : GENERIC) {
            double trueRep = score(REF.get(t), FRAME.get(t), h13).repeatability().getAsDouble();
            double sum = 0;
            for (double[] s : shifts) {
                Homography wrong = Homography.translation(s[0], s[1]).after(h13);
                RepeatabilityResult r = score(REF.get(t), FRAME.get(t), wrong);
                assertTrue(r.repeatability().isPresent(), t + ": undefined with shift " + s[0] + "," + s[1]);
                double v = r.repeatability().getAsDouble();
                assertTrue(v < MAX_SHIFTED_SINGLE_RATIO * trueRep,
                        t + ": shift (" + s[0] + ", " + s[1] + ") px left " + v + " of true " + trueRep);
                sum += v;
            }
            double mean = sum / shifts.length;
            assertTrue(mean < MAX_SHIFTED_MEAN_RATIO * trueRep, t + ": mean shifted repeatability " + mean + " vs true " + trueRep);
        }
    }

    @Test
    void ourLumaEqualsOpenCvGreyConversionOfTheSameFile() {
        // OpenCV 4.9 Imgcodecs.imread + Imgproc.cvtColor(COLOR_BGR2GRAY) on float data applies the BT.601 weights
        // 0.299, 0.587, 0.114 without rounding; ImageFiles.read must give the same grey levels.
        for (String name : new String[]{"graf1.png", "graf3.png"}) {
            Mat bgr = Imgcodecs.imread(ReferenceData.resource(name).toString(), Imgcodecs.IMREAD_COLOR);
            Mat bgrF = new Mat();
            bgr.convertTo(bgrF, CvType.CV_32FC3);
            Mat grey = new Mat();
            Imgproc.cvtColor(bgrF, grey, Imgproc.COLOR_BGR2GRAY);
            GrayF32 ours = name.equals("graf1.png") ? g1 : g3;
            assertEquals(ours.height, grey.rows());
            assertEquals(ours.width, grey.cols());
            float[] row = new float[ours.width];
            double worst = 0;
            for (int y = 0; y < ours.height; y++) {
                grey.get(y, 0, row);
                for (int x = 0; x < ours.width; x++) worst = Math.max(worst, Math.abs(row[x] - ours.unsafe_get(x, y)));
            }
            assertTrue(worst <= LUMA_TOL, name + ": luma differs from OpenCV by " + worst);
        }
    }

    @Test
    void shiTomasiRepeatabilityAgreesWithOpenCvGoodFeaturesToTrackLikeForLike() {
        // Reference library: OpenCV 4.9 Imgproc.goodFeaturesToTrack (minimum-eigenvalue corners, useHarrisDetector
        // false), fed the very same float grey pixels as our detector, scored by the same Repeatability rules
        // (Schmid, Mohr & Bauckhage 2000, IJCV 37(2)) on graf 1 -> 3 (Mikolajczyk et al. 2005, IJCV 65). Like for
        // like: 500 points on both sides, minDistance = nmsRadius (3 px), qualityLevel = the relative threshold (0.01),
        // both without refinement, and the same window (openCvBlockSize: OpenCV's box of the same width as our
        // window). Measured (2026-12-02):
        //   ours at defaults (Gaussian window, sigma 1 px)  0.6086 (199/327)  vs OpenCV blockSize 3  0.6055 (198/327)
        //   ours with the box window (weighted false, r 2)  0.5701 (179/314)  vs OpenCV blockSize 5  0.5238 (165/315)
        // With the box window the remaining 0.046 is our three-point parabola peak fit: our points moved back to their
        // peak pixels score 0.5255, and 400 of the 500 graf1 pixels are OpenCV's. The selection rules (our 7 x 7
        // non-strict suppression and 3 px border against OpenCV's 3 x 3 maximum, 1 px border and greedy minimum
        // distance 3) give the same 0.5238 on OpenCV's own response; the threshold does not bind (the 500-point count
        // is reached first: 0.001, 0.01 and 0.05 give the same figures).
        ShiTomasiConfig defaults = new ShiTomasiConfig();
        assertEquals(ThresholdMode.RELATIVE, defaults.thresholdMode, "qualityLevel maps only onto a relative threshold");
        assertEquals(500, defaults.maxFeatures);
        defaults.refine.enabled = false;
        ShiTomasiConfig box = defaults.copy();
        box.weighted = false;
        assertEquals(3, openCvBlockSize(defaults), "the box as wide as the default Gaussian window");
        for (ShiTomasiConfig c : new ShiTomasiConfig[]{defaults, box}) {
            double cvRep = score(openCvCorners(g1, c), openCvCorners(g3, c), h13).repeatability().getAsDouble();
            PointDetector ours = Detectors.create(c);
            double ourRep = score(ours.detect(g1), ours.detect(g3), h13).repeatability().getAsDouble();
            assertEquals(cvRep, ourRep, MAX_OPENCV_GAP_UNREFINED, "Shi-Tomasi (weighted=" + c.weighted
                    + ", unrefined) vs OpenCV goodFeaturesToTrack blockSize " + openCvBlockSize(c));
        }
    }

    @Test
    void theDefaultWindowDiffersFromOpenCvsMappingOnPurpose() {
        // Our default window is a Gaussian of radius 2 (sigma 1 px): on an ideal x-corner a box window gives a flat
        // plateau of equal response that neither suppression nor the peak fit can place (CornerConfig.weighted). Read
        // as blockSize = 2 r + 1 = 5, OpenCV's box has about twice the second moment of our window and scores lower on
        // this pair. Measured (2026-12-02, graf 1 -> 3, 500 points, unrefined; Mikolajczyk et al. 2005, IJCV 65):
        // ours 0.6086, OpenCV blockSize 5 0.5238 (+0.085), blockSize 3 0.6055, blockSize 7 0.3808; ours with the
        // default refinement 0.5963 (the refinement fairness check below). Our default may score above OpenCV, never
        // more than MAX_OPENCV_GAP_UNREFINED below it.
        ShiTomasiConfig plain = new ShiTomasiConfig();
        plain.refine.enabled = false;
        double cvRep = score(openCvCorners(g1, plain, 2 * plain.windowRadius + 1), openCvCorners(g3, plain, 2 * plain.windowRadius + 1), h13)
                .repeatability().getAsDouble();
        PointDetector ours = Detectors.create(plain);
        double ourRep = score(ours.detect(g1), ours.detect(g3), h13).repeatability().getAsDouble();
        assertTrue(ourRep >= cvRep - MAX_OPENCV_GAP_UNREFINED, "ours " + ourRep + " vs OpenCV blockSize 5 " + cvRep);
        PointDetector refined = Detectors.create(new ShiTomasiConfig());
        double ourRefined = score(refined.detect(g1), refined.detect(g3), h13).repeatability().getAsDouble();
        assertEquals(cvRep, ourRefined, MAX_OPENCV_GAP, "ours with the default refinement vs OpenCV blockSize 5 (unrefined)");
    }

    @Test
    void refinementIsFairOnNaturalTexture() {
        // Graf 1 -> 3 (Mikolajczyk et al. 2005, IJCV 65), 500 points, scored by Repeatability (Schmid, Mohr &
        // Bauckhage 2000). Our default refinement stage (RefineConfig's keep rule) must not lower our own
        // repeatability by more than REFINE_LOSS_TOL on this natural texture. Measured (2026-12-02): ours unrefined
        // 0.6086; with the default refinement 0.5963; with every refinement kept (the old behaviour) 0.4548. The
        // comparison with OpenCV, both unrefined, is in the like-for-like test above.
        ShiTomasiConfig plain = new ShiTomasiConfig();
        plain.refine.enabled = false;
        assertEquals(500, plain.maxFeatures);
        PointDetector unrefined = Detectors.create(plain), refined = Detectors.create(new ShiTomasiConfig());
        double ourPlain = score(unrefined.detect(g1), unrefined.detect(g3), h13).repeatability().getAsDouble();
        double ourRefined = score(refined.detect(g1), refined.detect(g3), h13).repeatability().getAsDouble();
        ShiTomasiConfig always = new ShiTomasiConfig();
        always.refine.maxShiftPx = always.refine.windowRadius;
        always.refine.minEigenRatio = 0;
        always.refine.maxFitRmsPx = Double.MAX_VALUE;
        PointDetector all = Detectors.create(always);
        double ourAll = score(all.detect(g1), all.detect(g3), h13).repeatability().getAsDouble();
        String table = "ours unrefined " + ourPlain + ", default refinement " + ourRefined + ", every refinement kept " + ourAll;
        assertTrue(ourRefined >= ourPlain - REFINE_LOSS_TOL, table);
        // the keep rule is what makes it fair: keeping every refinement costs more than the tolerance (derived from
        // the figures above; if this fails the check above no longer tests the rule)
        assertTrue(ourAll < ourPlain - REFINE_LOSS_TOL, table);
    }

    /**
     * OpenCV's blockSize for the same window as ours (derived): a box of b pixels has the variance (b² - 1) / 12 per
     * axis; our normalised Gaussian weights w_j at offsets j have Σ w_j j²; equal second moments give b, and the
     * nearest odd size is taken. Default radius 2 (BoofCV's σ = 1 px, weights 0.054, 0.244, 0.403, 0.244, 0.054):
     * variance 0.924 px², b = 3.48, so blockSize 3. A box window (weighted false) is OpenCV's own: 2r + 1.
     */
    static int openCvBlockSize(ShiTomasiConfig c) {
        if (!c.weighted) return 2 * c.windowRadius + 1;
        var k = boofcv.factory.filter.kernel.FactoryKernelGaussian.gaussian(boofcv.struct.convolve.Kernel1D_F32.class, -1, c.windowRadius);
        double sum = 0, m2 = 0;
        for (int j = 0; j < k.getWidth(); j++) {
            double off = j - k.getOffset();
            sum += k.data[j];
            m2 += k.data[j] * off * off;
        }
        double b = Math.sqrt(12 * m2 / sum + 1);
        return Math.max(3, 2 * (int) Math.round((b - 1) / 2) + 1);
    }

    static List<Detection> openCvCorners(GrayF32 img, ShiTomasiConfig c) {
        return openCvCorners(img, c, openCvBlockSize(c));
    }

    /**
     * OpenCV goodFeaturesToTrack with settings mapped from ours: maxCorners = maxFeatures, qualityLevel = relative
     * threshold, minDistance = nmsRadius, the given blockSize, no Harris, no refinement. The input is a CV_32F Mat
     * holding exactly our float grey levels (checked after the copy).
     */
    static List<Detection> openCvCorners(GrayF32 img, ShiTomasiConfig c, int blockSize) {
        Mat m = new Mat(img.height, img.width, CvType.CV_32F);
        float[] row = new float[img.width], back = new float[img.width];
        for (int y = 0; y < img.height; y++) {
            System.arraycopy(img.data, img.startIndex + y * img.stride, row, 0, img.width);
            m.put(y, 0, row);
            m.get(y, 0, back);
            for (int x = 0; x < img.width; x++)
                if (Float.floatToIntBits(back[x]) != Float.floatToIntBits(row[x]))
                    throw new AssertionError("pixel copy to OpenCV changed (" + x + ", " + y + ")");
        }
        MatOfPoint corners = new MatOfPoint();
        Imgproc.goodFeaturesToTrack(m, corners, c.maxFeatures, c.threshold, c.nmsRadius, new Mat(),
                blockSize, false, 0.04);
        List<Detection> out = new ArrayList<>();
        // OpenCV corner coordinates are pixel-centre based too: corner (x, y) is the centre of pixel column x, row y.
        for (Point p : corners.toArray()) out.add(new Detection(p.x, p.y, 1, c.windowRadius));
        return out;
    }
}
