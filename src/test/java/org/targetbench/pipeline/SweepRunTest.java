package org.targetbench.pipeline;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.Perturbation;

import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;

import static org.junit.jupiter.api.Assertions.*;

/** The sweep engine on the demo target: outside-world orderings and its own guarantees. */
class SweepRunTest {
    static SweepBase base;

    @BeforeAll
    static void render() {
        base = SweepBase.render(DemoScenario.target(), DemoScenario.camera(), DemoScenario.lighting(), DemoScenario.STANDOFF_M, 3, 11);
    }

    static SweepConfig config(List<DetectorType> dets, List<Perturbation> params, Map<Perturbation, double[]> values) {
        SweepConfig c = new SweepConfig();
        for (DetectorType d : dets) c.detectors.add(DetectorConfig.defaults(d));
        c.parameters = params;
        c.values.putAll(values);
        c.seed = 5;
        return c;
    }

    static double mean(SweepResult r, DetectorType d, Perturbation p, double value) {
        return SweepRun.meanRepeatability(r.rows().stream().filter(x -> x.detector() == d && x.parameter() == p && x.value() == value).toList())
                .orElseThrow();
    }

    @Test
    void fastFallsFasterUnderNoiseThanShiTomasi() throws Exception {
        // Rosten, Porter & Drummond 2010, IEEE TPAMI 32(1), from memory: FAST does no smoothing, so Gaussian noise
        // hurts it more than gradient-based corners, which average over a window. Measured at sigma 15 on the demo
        // target: FAST well below Shi-Tomasi.
        var r = new SweepRun(config(List.of(DetectorType.FAST, DetectorType.SHI_TOMASI), List.of(Perturbation.GAUSSIAN_NOISE),
                Map.of(Perturbation.GAUSSIAN_NOISE, new double[]{15}))).run(base, Progress.NONE, () -> false);
        double fast = mean(r, DetectorType.FAST, Perturbation.GAUSSIAN_NOISE, 15);
        double st = mean(r, DetectorType.SHI_TOMASI, Perturbation.GAUSSIAN_NOISE, 15);
        assertTrue(fast < st, "FAST " + fast + " vs Shi-Tomasi " + st + " at sigma 15");
    }

    @Test
    void cornersAreFlatUnderRotation() throws Exception {
        // Schmid, Mohr & Bauckhage 2000, IJCV 37(2): Harris is rotation invariant, its repeatability nearly constant
        // over the rotation angle. On the demo target.
        double[] angles = {0, 30, 60, 90, 120, 150, 180};
        var r = new SweepRun(config(List.of(DetectorType.HARRIS, DetectorType.SHI_TOMASI), List.of(Perturbation.ROTATION),
                Map.of(Perturbation.ROTATION, angles))).run(base, Progress.NONE, () -> false);
        for (DetectorType d : List.of(DetectorType.HARRIS, DetectorType.SHI_TOMASI)) {
            double sum = 0;
            double[] v = new double[angles.length];
            for (int i = 0; i < angles.length; i++) sum += v[i] = mean(r, d, Perturbation.ROTATION, angles[i]);
            double m = sum / angles.length;
            for (int i = 0; i < angles.length; i++)
                assertEquals(m, v[i], 0.1, d + " at " + angles[i] + " deg: " + v[i] + " against mean " + m);
        }
    }

    @Test
    void cornersFallUnderScaleOnNaturalTexture() throws Exception {
        // Schmid, Mohr & Bauckhage 2000, IJCV 37(2): Harris is not scale invariant. A checkerboard's x-corners are
        // self-similar and survive zoom, so this uses natural texture: a 640 x 480 crop of the Oxford Graffiti image
        // graf1 (Mikolajczyk et al. 2005, IJCV 65; Debian opencv-doc, see reference/PROVENANCE.md).
        var img = org.targetbench.source.ImageFiles.read(java.nio.file.Path.of("src/test/resources/reference/graf1.png"));
        var crop = img.subimage(80, 60, 720, 540).clone();
        SweepBase graf = new SweepBase("graf1 crop", List.of(new SweepBase.BaseFrame("graf1", crop, List.of(), java.util.Optional.empty())),
                java.util.Optional.empty());
        var r = new SweepRun(config(List.of(DetectorType.HARRIS, DetectorType.SHI_TOMASI), List.of(Perturbation.SCALE),
                Map.of(Perturbation.SCALE, new double[]{1.0, 2.0}))).run(graf, Progress.NONE, () -> false);
        // Since refinement has a keep rule (RefineConfig) Harris keeps 0.785 and Shi-Tomasi 0.762 at 2x (measured
        // 2026-12-02; the old loss of more than 0.3 was largely the fixed-size refinement window's), so only a clear
        // loss is asserted
        for (DetectorType d : List.of(DetectorType.HARRIS, DetectorType.SHI_TOMASI))
            assertTrue(mean(r, d, Perturbation.SCALE, 2.0) < mean(r, d, Perturbation.SCALE, 1.0) - 0.1,
                    d + " must lose much of its repeatability at 2x: " + mean(r, d, Perturbation.SCALE, 2.0));
    }

    @Test
    void relativeThresholdMakesShiTomasiBlindToGain() throws Exception {
        // Affine intensity change scales the structure tensor by a constant, so a threshold relative to the frame's
        // strongest response selects the same points (common practice). Gains that saturate the white paper are left
        // out: clipping is not a gain.
        double[] gains = {0.3, 0.6, 1.1};
        var r = new SweepRun(config(List.of(DetectorType.SHI_TOMASI), List.of(Perturbation.GAIN), Map.of(Perturbation.GAIN, gains)))
                .run(base, Progress.NONE, () -> false);
        for (double g : gains) assertTrue(mean(r, DetectorType.SHI_TOMASI, Perturbation.GAIN, g) > 0.95, "gain " + g);
    }

    @Test
    void resultsDoNotDependOnThreads() throws Exception {
        SweepConfig one = config(List.of(DetectorType.FAST, DetectorType.HARRIS), List.of(Perturbation.GAUSSIAN_NOISE, Perturbation.TILT), Map.of());
        one.levels = 3;
        one.threads = 1;
        SweepConfig two = config(List.of(DetectorType.FAST, DetectorType.HARRIS), List.of(Perturbation.GAUSSIAN_NOISE, Perturbation.TILT), Map.of());
        two.levels = 3;
        two.threads = 2;
        assertEquals(new SweepRun(one).run(base, Progress.NONE, () -> false).rows(), new SweepRun(two).run(base, Progress.NONE, () -> false).rows());
    }

    @Test
    void cancellingKeepsTheFinishedCellsAndSaysSo() throws Exception {
        SweepConfig c = config(List.of(DetectorType.FAST), List.of(Perturbation.GAIN, Perturbation.GAUSSIAN_NOISE), Map.of());
        c.threads = 1;
        AtomicInteger progressCalls = new AtomicInteger();
        var r = new SweepRun(c).run(base, (d, t, w) -> progressCalls.incrementAndGet(), () -> progressCalls.get() >= 5);
        assertTrue(r.cancelled());
        assertEquals(5, r.cellsDone());
        assertEquals(5, r.rows().size());
        assertEquals(2 * 8 * 3, r.cellsTotal());
    }

    @Test
    void reRenderedTiltCarriesExactTruth() throws Exception {
        var r = new SweepRun(config(List.of(DetectorType.SHI_TOMASI), List.of(Perturbation.TILT), Map.of(Perturbation.TILT, new double[]{0, 40})))
                .run(base, Progress.NONE, () -> false);
        for (SweepRow row : r.rows()) {
            assertTrue(row.localisationPx() < 0.3, "x-corners of a re-rendered tilt are found near their true pixels: " + row);
            assertTrue(row.repeatability().orElseThrow() > 0.8, row.toString());
        }
    }

    @Test
    void envelopeRankingUsesTheWeakestCondition() throws Exception {
        var r = new SweepRun(config(List.of(DetectorType.FAST, DetectorType.SHI_TOMASI), List.of(Perturbation.GAUSSIAN_NOISE, Perturbation.DEFOCUS),
                Map.of())).run(base, Progress.NONE, () -> false);
        var ranks = SweepSummary.rankEnvelope(r, Map.of(Perturbation.GAUSSIAN_NOISE, 10.0, Perturbation.DEFOCUS, 1.0));
        for (var x : ranks) {
            double noise = SweepRun.meanRepeatability(r.rows().stream().filter(y -> y.detector() == x.detector()
                    && y.parameter() == Perturbation.GAUSSIAN_NOISE && y.value() <= 10.0 + 1e-9).toList()).orElseThrow();
            double blur = SweepRun.meanRepeatability(r.rows().stream().filter(y -> y.detector() == x.detector()
                    && y.parameter() == Perturbation.DEFOCUS && y.value() <= 1.0 + 1e-9).toList()).orElseThrow();
            assertEquals(Math.min(noise, blur), x.score(), 1e-12, x.toString());
        }
        assertTrue(SweepSummary.inEnvelope(Perturbation.JPEG_QUALITY, 80, 60));
        assertFalse(SweepSummary.inEnvelope(Perturbation.JPEG_QUALITY, 40, 60));
    }
}
