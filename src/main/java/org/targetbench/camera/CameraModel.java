package org.targetbench.camera;

import boofcv.alg.distort.brown.LensDistortionBrown;
import boofcv.struct.calib.CameraPinholeBrown;
import boofcv.struct.distort.Point2Transform2_F64;
import georegression.struct.point.Point2D_F64;

/**
 * Pinhole camera with Brown-Conrady lens distortion and a fixed image size.
 *
 * <p>Model (Brown 1966; Conrady 1919; the same as OpenCV's five-coefficient model and BoofCV's
 * {@link CameraPinholeBrown}): a point (X, Y, Z) in the camera frame has normalised coordinates x = X/Z, y = Y/Z;
 * with r² = x² + y²,
 * <pre>
 *   x_d = x (1 + k1 r² + k2 r⁴ + k3 r⁶) + 2 p1 x y + p2 (r² + 2 x²)          (1)
 *   y_d = y (1 + k1 r² + k2 r⁴ + k3 r⁶) + p1 (r² + 2 y²) + 2 p2 x y          (2)
 *   u = fx x_d + cx,   v = fy y_d + cy                                        (3)
 * </pre>
 * Skew is zero. Pixel convention: integer pixel coordinates are pixel centres; (0, 0) is the centre of the top-left
 * pixel. The camera frame has x right, y down, z along the optical axis.
 *
 * @param width  image width, pixels
 * @param height image height, pixels
 * @param fx     focal length along x, pixels
 * @param fy     focal length along y, pixels
 * @param cx     principal point x, pixels
 * @param cy     principal point y, pixels
 * @param k1     radial coefficient of r²
 * @param k2     radial coefficient of r⁴
 * @param k3     radial coefficient of r⁶
 * @param p1     tangential coefficient (OpenCV's p1, BoofCV's t1)
 * @param p2     tangential coefficient (OpenCV's p2, BoofCV's t2)
 */
public record CameraModel(int width, int height, double fx, double fy, double cx, double cy,
                          double k1, double k2, double k3, double p1, double p2) {

    /**
     * Largest image side this tool accepts, pixels (16,384: a 16k x 16k grey image already needs 1 GiB as floats).
     * Larger cameras and images are refused before any pixels are allocated.
     */
    public static final int MAX_SIDE = 16_384;

    public CameraModel {
        if (width < 1 || height < 1) throw new IllegalArgumentException("image size must be positive, got " + width + " x " + height);
        if (width > MAX_SIDE || height > MAX_SIDE)
            throw new IllegalArgumentException("image size " + width + " x " + height + " exceeds the cap of " + MAX_SIDE + " x " + MAX_SIDE + " px");
        if (!(fx > 0) || !(fy > 0) || !Double.isFinite(fx) || !Double.isFinite(fy))
            throw new IllegalArgumentException("focal lengths must be positive and finite, got fx=" + fx + " fy=" + fy);
        for (double v : new double[]{cx, cy, k1, k2, k3, p1, p2})
            if (!Double.isFinite(v)) throw new IllegalArgumentException("camera parameters must be finite, got cx=" + cx + " cy=" + cy
                    + " k1=" + k1 + " k2=" + k2 + " k3=" + k3 + " p1=" + p1 + " p2=" + p2);
    }

    /** Distortion-free camera. */
    public static CameraModel pinhole(int width, int height, double fx, double fy, double cx, double cy) {
        return new CameraModel(width, height, fx, fy, cx, cy, 0, 0, 0, 0, 0);
    }

    /**
     * Distortion-free camera with the principal point at the image centre and a horizontal field of view.
     *
     * @param hfovDeg horizontal field of view, degrees
     */
    public static CameraModel fromFieldOfView(int width, int height, double hfovDeg) {
        double f = (width / 2.0) / Math.tan(Math.toRadians(hfovDeg) / 2);
        return pinhole(width, height, f, f, (width - 1) / 2.0, (height - 1) / 2.0);
    }

    public boolean isDistorted() {
        return k1 != 0 || k2 != 0 || k3 != 0 || p1 != 0 || p2 != 0;
    }

    /** This camera as a BoofCV model (three radial, two tangential terms). */
    public CameraPinholeBrown toBoofcv() {
        CameraPinholeBrown c = new CameraPinholeBrown(3);
        c.fsetK(fx, fy, 0, cx, cy, width, height);
        c.fsetRadial(k1, k2, k3);
        c.fsetTangential(p1, p2);
        return c;
    }

    public static CameraModel fromBoofcv(CameraPinholeBrown c) {
        double[] r = c.radial == null ? new double[0] : c.radial;
        if (Math.abs(c.skew) > 1e-9) throw new IllegalArgumentException("skew must be 0, got " + c.skew);
        return new CameraModel(c.width, c.height, c.fx, c.fy, c.cx, c.cy,
                r.length > 0 ? r[0] : 0, r.length > 1 ? r[1] : 0, r.length > 2 ? r[2] : 0, c.t1, c.t2);
    }

    /**
     * Transform from undistorted normalised coordinates to distorted pixels, eqs. (1)-(3). Not thread safe: create one
     * per thread.
     */
    public Point2Transform2_F64 normalisedToPixel() {
        return new LensDistortionBrown(toBoofcv()).distort_F64(false, true);
    }

    /** Transform from distorted pixels to undistorted normalised coordinates (iterative inverse). Not thread safe. */
    public Point2Transform2_F64 pixelToNormalised() {
        return new LensDistortionBrown(toBoofcv()).undistort_F64(true, false);
    }

    /** Pixel of a camera-frame point, eqs. (1)-(3); the point must be in front of the camera (Z > 0). */
    public Point2D_F64 project(double X, double Y, double Z) {
        if (!(Z > 0)) throw new IllegalArgumentException("point must lie in front of the camera, got Z=" + Z);
        Point2D_F64 out = new Point2D_F64();
        normalisedToPixel().compute(X / Z, Y / Z, out);
        return out;
    }

    /** True when pixel (u, v) lies in the image, [0, w-1] x [0, h-1] in the pixel-centre convention. */
    public boolean inImage(double u, double v) {
        return u >= 0 && v >= 0 && u <= width - 1 && v <= height - 1;
    }
}
