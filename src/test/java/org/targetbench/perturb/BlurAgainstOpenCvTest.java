package org.targetbench.perturb;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.opencv.core.CvType;
import org.opencv.core.Mat;
import org.opencv.core.Size;
import org.opencv.imgproc.Imgproc;
import org.targetbench.TestScenes;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Defocus blur against an independent reference library: OpenCV 4.9 Imgproc.GaussianBlur with the same σ and the
 * kernel size OpenCV chooses for 8-bit images (radius 3σ, as ours), compared away from the border where the two
 * libraries' border rules differ. OpenCV filters the same grey levels as 32-bit floats: its 8-bit path is a
 * fixed-point approximation that by itself strays up to 2 grey levels from the exact blur at σ = 5.
 */
class BlurAgainstOpenCvTest {
    /** Allowed difference, grey levels (derived: both sides round to whole levels, so they may differ by one level). */
    static final double MAX_DIFF_GREY = 1.0;

    @BeforeAll
    static void loadOpenCv() {
        nu.pattern.OpenCV.loadLocally();
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.8, 1.5, 2.5, 5.0})
    void gaussianBlurMatchesOpenCv(double sigma) {
        GrayF32 img = TestScenes.checkerboardFrame();
        GrayF32 ours = new Perturber().apply(Perturbation.DEFOCUS, sigma, img, 1).image();
        Mat src = new Mat(img.height, img.width, CvType.CV_32F);
        src.put(0, 0, img.data);
        Mat dst = new Mat();
        int ksize = 2 * (int) Math.ceil(3 * sigma) + 1; // OpenCV's 8-bit rule cvRound(6σ + 1) | 1
        Imgproc.GaussianBlur(src, dst, new Size(ksize, ksize), sigma, sigma);
        float[] ref = new float[img.width * img.height];
        dst.get(0, 0, ref);
        int margin = (int) Math.ceil(3 * sigma) + 2;
        double worst = 0;
        for (int y = margin; y < img.height - margin; y++)
            for (int x = margin; x < img.width - margin; x++)
                worst = Math.max(worst, Math.abs(ours.unsafe_get(x, y) - Math.rint(ref[y * img.width + x])));
        assertTrue(worst <= MAX_DIFF_GREY, "sigma " + sigma + ": largest difference " + worst + " grey levels");
    }
}
