package org.targetbench.outside;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.opencv.core.CvType;
import org.opencv.core.Mat;
import org.opencv.core.MatOfKeyPoint;
import org.opencv.features2d.SimpleBlobDetector;
import org.opencv.core.KeyPoint;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DotConfig;
import org.targetbench.detect.Detectors;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Dot centres against OpenCV 4.9's {@code SimpleBlobDetector} (org.openpnp:opencv 4.9.0-0, the reference library;
 * default parameters: dark blobs, thresholds 50..220 in steps of 10, keypoint = mean of the contour-moment centres
 * over the thresholds) on the committed dot design {@code target-designs/fixture-dots20}, rendered fronto-parallel at
 * its intended stand-off of 260 mm by the demo's flange camera (f = 532 px), 8-bit, no noise.
 *
 * <p>Every one of the 48 dots must be found by both, and each of our centres must lie within 0.1 px of OpenCV's.
 * Measured: the largest disagreement is 0.020 px (ellipse fit) and 0.012 px (grey centroid).
 */
class DotsVsOpenCvTest {
    /** Largest allowed disagreement with OpenCV's keypoint, pixels. */
    static final double TOL_PX = 0.1;
    static final CameraModel FLANGE = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);

    @BeforeAll
    static void load() {
        nu.pattern.OpenCV.loadLocally();
    }

    @ParameterizedTest
    @EnumSource(DotConfig.CentreMethod.class)
    void centresAgreeWithSimpleBlobDetector(DotConfig.CentreMethod method) throws Exception {
        TargetDesign d = TargetFile.read(Path.of("target-designs/fixture-dots20/target.json"));
        // a small offset puts the dot centres off the pixel grid
        Pose pose = Pose.facing(d.widthMm(), d.heightMm(), 0.26, 0, 0, 0, 0.00031, -0.00017);
        GrayF32 img = new SyntheticRenderer(FLANGE, new RenderConfig()).render(d, pose).image();

        DotConfig c = new DotConfig();
        c.centre = method;
        List<Detection> ours = Detectors.create(c).detect(img);
        assertEquals(48, ours.size(), "our dots");

        Mat m = new Mat(img.height, img.width, CvType.CV_8UC1);
        byte[] b = new byte[img.width * img.height];
        for (int i = 0; i < b.length; i++) b[i] = (byte) Math.round(img.data[i]);
        m.put(0, 0, b);
        MatOfKeyPoint kp = new MatOfKeyPoint();
        SimpleBlobDetector.create().detect(m, kp);
        List<KeyPoint> theirs = new ArrayList<>(Arrays.asList(kp.toArray()));
        assertEquals(48, theirs.size(), "OpenCV's blobs");

        double worst = 0;
        for (KeyPoint k : theirs) {
            double best = Double.POSITIVE_INFINITY;
            for (Detection o : ours) best = Math.min(best, Math.hypot(o.x() - k.pt.x, o.y() - k.pt.y));
            worst = Math.max(worst, best);
        }
        assertTrue(worst <= TOL_PX, method + ": largest disagreement " + worst + " px");
    }
}
