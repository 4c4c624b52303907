package org.targetbench.outside;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.opencv.calib3d.Calib3d;
import org.opencv.core.CvType;
import org.opencv.core.Mat;
import org.opencv.core.MatOfDouble;
import org.opencv.core.MatOfPoint2f;
import org.opencv.core.MatOfPoint3f;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Our pinhole + Brown-Conrady projection against OpenCV 4.9 {@code Calib3d.projectPoints} (org.openpnp:opencv
 * 4.9.0-0), the reference library, for a camera with all five distortion coefficients non-zero.
 *
 * <p>Mapping: rvec = Rodrigues(R) of our pose, tvec = our t (metres), object points (x, y, 0) in metres = mm / 1000,
 * distCoeffs in OpenCV's order (k1, k2, p1, p2, k3).
 *
 * <p>Precision: the Java binding of projectPoints takes and returns float32 points (MatOfPoint3f, MatOfPoint2f), so
 * its pixels carry up to half a float ulp of rounding (1.5e-5 px near u = 500). OpenCV computes in double, though,
 * and its optional jacobian output is a double matrix whose focal-length columns are exactly the distorted normalised
 * coordinates: u = fx·x_d + cx, so ∂u/∂fx = x_d and ∂v/∂fy = y_d. The double-precision OpenCV pixel is therefore
 * fx·(∂u/∂fx) + cx, and that is compared with ours to {@link #TOL_PX}; the float output is checked as well, to
 * within its rounding. Object points are drawn as float32 values, so both libraries project exactly the same points
 * (a float times 1000 and divided by 1000 again is exact in double).
 */
class ProjectionVsOpenCvTest {
    /** Largest allowed difference between our pixel and OpenCV's, pixels. */
    static final double TOL_PX = 1e-6;
    /** Fixed seed: the poses and target points are the same on every run. */
    static final long SEED = 20240917L;
    static final int POSES = 12, POINTS_PER_POSE = 60;
    /** Half-size of the square target area the points are drawn from, millimetres. */
    static final double TARGET_HALF_MM = 120;
    /** The poses must put points where the distortion moves them by at least this much somewhere, pixels. */
    static final double MIN_DISTORTION_PX = 10;
    /** Jacobian columns of ∂/∂fx and ∂/∂fy (after rvec 0..2 and tvec 3..5). */
    static final int COL_FX = 6, COL_FY = 7;

    static final CameraModel CAMERA = new CameraModel(640, 480, 800, 790, 330, 245, -0.28, 0.07, -0.01, 0.001, -0.0008);

    @BeforeAll
    static void loadOpenCv() {
        nu.pattern.OpenCV.loadLocally();
    }

    static Mat cameraMatrix(CameraModel c) {
        Mat k = Mat.zeros(3, 3, CvType.CV_64F);
        k.put(0, 0, c.fx(), 0, c.cx(), 0, c.fy(), c.cy(), 0, 0, 1);
        return k;
    }

    static MatOfDouble distCoeffs(CameraModel c) {
        return new MatOfDouble(c.k1(), c.k2(), c.p1(), c.p2(), c.k3());
    }

    /**
     * OpenCV projection of n object points {X, Y, Z, X, Y, Z, ...} (metres, float32) under rvec, tvec. Returns
     * {u, v, ...} in double precision from the jacobian's focal-length columns, after checking that the float32
     * output agrees with it to within float rounding.
     */
    static double[] openCvProject(float[] xyz, Mat rvec, Mat tvec, CameraModel c) {
        int n = xyz.length / 3;
        MatOfPoint3f object = new MatOfPoint3f();
        object.alloc(n);
        object.put(0, 0, xyz);
        MatOfPoint2f image = new MatOfPoint2f();
        Mat jacobian = new Mat();
        Calib3d.projectPoints(object, rvec, tvec, cameraMatrix(c), distCoeffs(c), image, jacobian);
        assertEquals(CvType.CV_64FC1, jacobian.type());
        assertEquals(2 * n, jacobian.rows());
        assertEquals(10 + 5, jacobian.cols(), "jacobian columns: rvec 3, tvec 3, f 2, c 2, distortion 5");
        float[] uvFloat = new float[2 * n];
        image.get(0, 0, uvFloat);
        double[] uv = new double[2 * n];
        for (int i = 0; i < n; i++) {
            uv[2 * i] = c.fx() * jacobian.get(2 * i, COL_FX)[0] + c.cx();
            uv[2 * i + 1] = c.fy() * jacobian.get(2 * i + 1, COL_FY)[0] + c.cy();
            for (int j = 0; j < 2; j++)
                assertEquals(uvFloat[2 * i + j], uv[2 * i + j], Math.ulp(uvFloat[2 * i + j]) / 2 + TOL_PX,
                        "float output vs double jacobian of point " + i);
        }
        return uv;
    }

    @Test
    void targetPointProjectionMatchesOpenCvProjectPoints() {
        // Reference library: OpenCV 4.9 Calib3d.projectPoints with the five-coefficient Brown-Conrady model.
        // Measured: worst |ours - OpenCV| 2.3e-13 px over 720 points; 705 of them in the 640x480 frame; distortion
        // moves points by up to 22.3 px.
        Random rnd = new Random(SEED);
        CameraModel pinhole = CameraModel.pinhole(CAMERA.width(), CAMERA.height(), CAMERA.fx(), CAMERA.fy(), CAMERA.cx(), CAMERA.cy());
        int compared = 0, inImage = 0;
        double largestDistortion = 0;
        for (int k = 0; k < POSES; k++) {
            Pose pose = Pose.fromEulerXYZ(
                    (rnd.nextDouble() - 0.5) * 1.2, (rnd.nextDouble() - 0.5) * 1.2, (rnd.nextDouble() - 0.5) * 2 * Math.PI,
                    (rnd.nextDouble() - 0.5) * 0.1, (rnd.nextDouble() - 0.5) * 0.1, 0.35 + rnd.nextDouble() * 0.5);
            Mat r = new Mat(3, 3, CvType.CV_64F);
            r.put(0, 0, pose.rotation());
            Mat rvec = new Mat();
            Calib3d.Rodrigues(r, rvec);
            Mat tvec = new Mat(3, 1, CvType.CV_64F);
            tvec.put(0, 0, pose.translation());

            double[] mm = new double[2 * POINTS_PER_POSE];
            float[] xyz = new float[3 * POINTS_PER_POSE];
            for (int i = 0; i < POINTS_PER_POSE; i++) {
                for (int j = 0; j < 2; j++) {
                    xyz[3 * i + j] = (float) ((rnd.nextDouble() * 2 - 1) * TARGET_HALF_MM / 1000.0);
                    mm[2 * i + j] = xyz[3 * i + j] * 1000.0;
                    assertEquals(xyz[3 * i + j], mm[2 * i + j] / 1000.0, 0, "mm -> m must be exact");
                }
                xyz[3 * i + 2] = 0;
            }
            double[] uv = openCvProject(xyz, rvec, tvec, CAMERA);
            for (int i = 0; i < POINTS_PER_POSE; i++) {
                double[] ours = Projection.projectTargetPoint(CAMERA, pose, mm[2 * i], mm[2 * i + 1]);
                assertTrue(Double.isFinite(ours[0]) && Double.isFinite(ours[1]), "point behind the camera: " + pose);
                assertEquals(uv[2 * i], ours[0], TOL_PX, "u of pose " + k + " point " + i);
                assertEquals(uv[2 * i + 1], ours[1], TOL_PX, "v of pose " + k + " point " + i);
                double[] undistorted = Projection.projectTargetPoint(pinhole, pose, mm[2 * i], mm[2 * i + 1]);
                largestDistortion = Math.max(largestDistortion, Math.hypot(ours[0] - undistorted[0], ours[1] - undistorted[1]));
                if (CAMERA.inImage(ours[0], ours[1])) inImage++;
                compared++;
            }
        }
        assertEquals(POSES * POINTS_PER_POSE, compared);
        // The comparison must exercise the distortion terms on points a real frame would show.
        assertTrue(inImage >= compared / 2, "only " + inImage + " of " + compared + " points fall in the image");
        assertTrue(largestDistortion > MIN_DISTORTION_PX, "distortion moved points by at most " + largestDistortion + " px");
    }

    @Test
    void cameraFramePointProjectionMatchesOpenCvWithIdentityPose() {
        // Reference library: OpenCV 4.9 Calib3d.projectPoints with rvec = tvec = 0, i.e. points already in the camera
        // frame, against CameraModel.project(X, Y, Z).
        Random rnd = new Random(SEED + 1);
        int n = 200;
        float[] xyz = new float[3 * n];
        for (int i = 0; i < n; i++) {
            double z = 0.2 + rnd.nextDouble();
            xyz[3 * i] = (float) ((rnd.nextDouble() - 0.5) * 0.9 * z);
            xyz[3 * i + 1] = (float) ((rnd.nextDouble() - 0.5) * 0.7 * z);
            xyz[3 * i + 2] = (float) z;
        }
        Mat zero = Mat.zeros(3, 1, CvType.CV_64F);
        double[] uv = openCvProject(xyz, zero, zero, CAMERA);
        for (int i = 0; i < n; i++) {
            var p = CAMERA.project(xyz[3 * i], xyz[3 * i + 1], xyz[3 * i + 2]);
            assertEquals(uv[2 * i], p.x, TOL_PX, "u of point " + i);
            assertEquals(uv[2 * i + 1], p.y, TOL_PX, "v of point " + i);
        }
    }
}
