package org.targetbench.pipeline;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.camera.Calibration;
import org.targetbench.camera.CalibrationConfig;
import org.targetbench.camera.CalibrationResult;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.ImageFolderSource;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The calibration run shared by the command line and the workbench, on the chessboard photos from Debian's opencv-doc
 * (src/test/resources/reference/calibration/PROVENANCE.md), and its jackknife spread.
 */
class CalibrateRunTest {
    static final Path PHOTOS = Path.of("src/test/resources/reference/calibration");
    static final Calibration.Board BOARD = new Calibration.Board(9, 6, 25);
    /** Agreement of two evaluations of the same closed form, relative (floating-point rounding only). */
    static final double ROUNDING = 1e-12;

    private static Path folder(Path tmp, String... names) throws Exception {
        Path d = tmp.resolve("f" + names.length);
        Files.createDirectories(d);
        for (String n : names) Files.copy(PHOTOS.resolve(n), d.resolve(n));
        return d;
    }

    @Test
    void givesWhatDetectingAndSolvingFrameByFrameGives(@TempDir Path tmp) throws Exception {
        Path d = folder(tmp, "left01.jpg", "left02.jpg", "left03.jpg", "left04.jpg", "left05.jpg");
        ImageFiles.writePng(new boofcv.struct.image.GrayF32(640, 480), d.resolve("left06-blank.png"));
        CalibrateRun.Result r;
        try (ImageFolderSource src = ImageFolderSource.open(d, null)) {
            r = new CalibrateRun(BOARD, new CalibrationConfig()).run(src, Progress.NONE, () -> false);
        }
        assertFalse(r.cancelled());
        assertEquals(5, r.found());
        assertEquals(List.of("left06-blank.png"), r.notFoundIn());
        Calibration cal = new Calibration(BOARD, new CalibrationConfig());
        List<String> names = new ArrayList<>();
        List<Optional<double[]>> found = new ArrayList<>();
        try (ImageFolderSource src = ImageFolderSource.open(d, null)) {
            for (var f = src.next(); f.isPresent(); f = src.next()) {
                names.add(f.get().name());
                found.add(cal.detect(f.get().image()));
            }
        }
        CalibrationResult direct = assertInstanceOf(CalibrationResult.class, cal.solve(640, 480, names, found));
        CalibrationResult viaRun = assertInstanceOf(CalibrationResult.class, r.outcome().orElseThrow());
        assertEquals(direct.camera(), viaRun.camera());
        assertEquals(direct.rmsPx(), viaRun.rmsPx());

        double[] se = new CalibrateRun(BOARD, new CalibrationConfig()).spread(r, () -> false).orElseThrow();
        assertEquals(CalibrateRun.PARAMETERS.size(), se.length);
        for (double s : se) assertTrue(s > 0 && Double.isFinite(s), java.util.Arrays.toString(se));
        // the spread of fx over five views is a few pixels, not zero and not the focal length itself
        assertTrue(se[0] < 0.05 * viaRun.camera().fx(), "se(fx) " + se[0]);
    }

    @Test
    void noBoardAnywhereAndCancelAreData(@TempDir Path tmp) throws Exception {
        Path d = tmp.resolve("blank");
        Files.createDirectories(d);
        for (int i = 0; i < 3; i++) ImageFiles.writePng(new boofcv.struct.image.GrayF32(64, 48), d.resolve("b" + i + ".png"));
        try (ImageFolderSource src = ImageFolderSource.open(d, null)) {
            CalibrateRun.Result r = new CalibrateRun(BOARD, new CalibrationConfig()).run(src, Progress.NONE, () -> false);
            assertEquals(0, r.found());
            assertTrue(r.outcome().isEmpty());
            assertEquals(3, r.notFoundIn().size());
        }
        try (ImageFolderSource src = ImageFolderSource.open(folder(tmp, "left01.jpg", "left02.jpg", "left03.jpg"), null)) {
            CalibrateRun.Result r = new CalibrateRun(BOARD, new CalibrationConfig()).run(src, Progress.NONE, () -> true);
            assertTrue(r.cancelled());
            assertTrue(r.outcome().isEmpty());
        }
    }

    @Test
    void threeViewsAreTooFewForASpread(@TempDir Path tmp) throws Exception {
        try (ImageFolderSource src = ImageFolderSource.open(folder(tmp, "left01.jpg", "left02.jpg", "left03.jpg"), null)) {
            CalibrateRun run = new CalibrateRun(BOARD, new CalibrationConfig());
            CalibrateRun.Result r = run.run(src, Progress.NONE, () -> false);
            assertTrue(run.spread(r, () -> false).isEmpty(), "leaving one of three out leaves fewer than Zhang's three views");
        }
    }

    @Test
    void jackknifeOfTheMeanIsTheClassicStandardError() {
        // For the sample mean, the jackknife standard error equals s / sqrt(n) exactly (Efron and Tibshirani 1993,
        // section 11.2, the remark after eq. 11.5; from memory): a published identity the formula must reproduce.
        SplittableRandom rng = new SplittableRandom(3);
        int n = 9;
        double[] x = new double[n];
        for (int i = 0; i < n; i++) x[i] = 10 + rng.nextGaussian();
        double[][] leaveOneOut = new double[n][1];
        double sum = 0;
        for (double v : x) sum += v;
        for (int i = 0; i < n; i++) leaveOneOut[i][0] = (sum - x[i]) / (n - 1);
        double mean = sum / n, ss = 0;
        for (double v : x) ss += (v - mean) * (v - mean);
        double classic = Math.sqrt(ss / (n - 1)) / Math.sqrt(n);
        assertEquals(classic, CalibrateRun.jackknifeSe(leaveOneOut)[0], ROUNDING * classic);
    }
}
