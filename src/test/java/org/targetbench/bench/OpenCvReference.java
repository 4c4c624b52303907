package org.targetbench.bench;

import org.opencv.core.Mat;
import org.opencv.core.MatOfKeyPoint;
import org.opencv.core.MatOfPoint;
import org.opencv.features2d.FastFeatureDetector;
import org.opencv.features2d.SIFT;
import org.opencv.imgproc.Imgproc;
import org.targetbench.detect.DetectorType;

import java.util.List;
import java.util.Optional;

/**
 * OpenCV counterparts of our detectors, with settings chosen to do comparable work on the same 8-bit frames.
 *
 * <ul>
 *   <li>Shi-Tomasi: {@code goodFeaturesToTrack}, maxCorners 500, qualityLevel 0.01, minDistance 3, blockSize 3 (the box
 *       window of the same spread as our Gaussian window of sigma 1 px, derived: a box of width w has variance
 *       (w^2 - 1) / 12 over integer pixels, so sigma 1 px lies between w = 3 and w = 5; 3 is the cheaper one for
 *       OpenCV, so the comparison errs against us).</li>
 *   <li>Harris: the same with {@code useHarrisDetector = true}, k = 0.04.</li>
 *   <li>FAST: {@code FastFeatureDetector}, threshold 20, non-maximum suppression, TYPE_9_16.</li>
 *   <li>SIFT: {@code SIFT.create(500).detect} (keypoints only, no descriptors).</li>
 *   <li>SURF: not available; it lives in OpenCV's contrib modules, which this build does not include.</li>
 * </ul>
 *
 * <p>Caveats: the work is comparable, not identical. Our Harris and Shi-Tomasi use a
 * Gaussian window and a three-point peak fit (OpenCV's goodFeaturesToTrack returns integer pixels with a box window); OpenCV's FAST keeps every
 * corner while ours ranks both polarities and keeps the strongest 500; OpenCV's SIFT ranks by contrast and keeps 500.
 * The point counts are printed next to the times for that reason.
 */
final class OpenCvReference {
    static final String SURF_NOTE = "n/a (not in OpenCV main modules)";
    static final String XCORNER_NOTE = "n/a (OpenCV finds x-corners only as a whole chessboard of known size)";

    private OpenCvReference() {}

    /** Why there is no OpenCV counterpart, or empty when there is one. */
    static Optional<String> unavailable(DetectorType type) {
        return type == DetectorType.SURF ? Optional.of(SURF_NOTE) : type == DetectorType.XCORNER ? Optional.of(XCORNER_NOTE) : Optional.empty();
    }

    /** The OpenCV call and settings used for {@code type}, for the report. */
    static String describe(DetectorType type) {
        return switch (type) {
            case SHI_TOMASI -> "goodFeaturesToTrack(maxCorners 500, quality 0.01, minDistance 3, blockSize 3, useHarris false)";
            case HARRIS -> "goodFeaturesToTrack(maxCorners 500, quality 0.01, minDistance 3, blockSize 3, useHarris true, k 0.04)";
            case FAST -> "FastFeatureDetector(threshold 20, nonmaxSuppression true, TYPE_9_16).detect";
            case SIFT -> "SIFT.create(500).detect";
            case SURF -> SURF_NOTE;
            case DOTS -> "SimpleBlobDetector.create().detect (default parameters)";
            case XCORNER -> XCORNER_NOTE;
        };
    }

    /** A fresh task running the OpenCV counterpart of {@code type} on {@code frames} (CV_8UC1). */
    static FrameTask task(DetectorType type, List<Mat> frames) {
        return switch (type) {
            case SHI_TOMASI -> goodFeatures(frames, false);
            case HARRIS -> goodFeatures(frames, true);
            case FAST -> keypoints(frames, FastFeatureDetector.create(20, true, FastFeatureDetector.TYPE_9_16)::detect);
            case SIFT -> keypoints(frames, SIFT.create(500)::detect);
            case SURF -> throw new IllegalArgumentException(SURF_NOTE);
            case DOTS -> keypoints(frames, org.opencv.features2d.SimpleBlobDetector.create()::detect);
            case XCORNER -> throw new IllegalArgumentException(XCORNER_NOTE);
        };
    }

    private static FrameTask goodFeatures(List<Mat> frames, boolean harris) {
        MatOfPoint corners = new MatOfPoint();
        Mat noMask = new Mat();
        return f -> {
            Imgproc.goodFeaturesToTrack(frames.get(f), corners, 500, 0.01, 3, noMask, 3, harris, 0.04);
            return corners.rows();
        };
    }

    private interface KeypointDetector { void detect(Mat image, MatOfKeyPoint out); }

    private static FrameTask keypoints(List<Mat> frames, KeypointDetector detector) {
        MatOfKeyPoint found = new MatOfKeyPoint();
        return f -> {
            detector.detect(frames.get(f), found);
            return found.rows();
        };
    }
}
