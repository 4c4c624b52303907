package org.targetbench.servo;

import boofcv.struct.distort.Point2Transform2_F64;
import georegression.struct.point.Point2D_F64;
import org.targetbench.camera.CameraModel;

import java.util.SplittableRandom;

/**
 * The true image of the target points for a camera pose, with the real intrinsics and distortion, for the closed loops
 * of both rehearsals: P_c = Rᵀ (P - t), x = X/Z, y = Y/Z, then to pixels (pinhole directly, else through the lens
 * model); and the noisy measurement of those pixels with the controller's depth estimates. Not thread safe (one per
 * loop).
 */
public final class PointProjection {
    private final CameraModel cam;
    private final boolean pinhole;
    private final Point2Transform2_F64 toPixel, toNorm;
    private final Point2D_F64 p2 = new Point2D_F64();

    public PointProjection(CameraModel cam) {
        this.cam = cam;
        this.pinhole = !cam.isDistorted();
        this.toPixel = cam.normalisedToPixel();
        this.toNorm = cam.pixelToNormalised();
    }

    /**
     * Projects {@code pw} (target or world frame) into the camera whose rotation R has its column j at
     * {@code rot[j], rot[j + stride], rot[j + 2 stride]} (stride 3 for a 3 x 3, 4 for a 4 x 4 row-major matrix) and
     * whose centre is (tx, ty, tz); fills the normalised x, y, the depth z and the pixels u, v.
     *
     * @return the first point behind the camera or out of the image, or -1 when all are in view
     */
    public int project(double[][] pw, double[] rot, int stride, double tx, double ty, double tz,
                       double[] x, double[] y, double[] z, double[] u, double[] v) {
        int s1 = stride, s2 = 2 * stride;
        for (int i = 0; i < x.length; i++) {
            double dx = pw[i][0] - tx, dy = pw[i][1] - ty, dz = pw[i][2] - tz;
            double X = rot[0] * dx + rot[s1] * dy + rot[s2] * dz, Y = rot[1] * dx + rot[1 + s1] * dy + rot[1 + s2] * dz,
                    Z = rot[2] * dx + rot[2 + s1] * dy + rot[2 + s2] * dz;
            if (!(Z > 0)) return i;
            x[i] = X / Z;
            y[i] = Y / Z;
            z[i] = Z;
            if (pinhole) {
                u[i] = cam.fx() * x[i] + cam.cx();
                v[i] = cam.fy() * y[i] + cam.cy();
            } else {
                toPixel.compute(x[i], y[i], p2);
                u[i] = p2.x;
                v[i] = p2.y;
            }
            if (!cam.inImage(u[i], v[i])) return i;
        }
        return -1;
    }

    /** RMS over the points of the pixel distance between (u, v) and (uStar, vStar). */
    public static double errorRms(double[] u, double[] v, double[] uStar, double[] vStar) {
        int k = u.length;
        double sum = 0;
        for (int i = 0; i < k; i++) {
            double du = u[i] - uStar[i], dv = v[i] - vStar[i];
            sum += du * du + dv * dv;
        }
        return Math.sqrt(sum / k);
    }

    /**
     * The controller's measurement: pixel noise of {@code noisePx[i]} (standard deviation, px; Box-Muller) on (u, v),
     * back to normalised coordinates, and the depth per {@code mode} (true z, the reference depth zStar, or zStar times
     * {@code depthErrorFactor}).
     */
    public void measure(SplittableRandom rng, double[] noisePx, double[] x, double[] y, double[] z, double[] u, double[] v, double[] zStar,
                        DepthMode mode, double depthErrorFactor, double[] xm, double[] ym, double[] zEst) {
        for (int i = 0; i < x.length; i++) {
            double sigma = noisePx[i];
            if (sigma > 0) {
                double um = u[i] + sigma * gaussian(rng), vm = v[i] + sigma * gaussian(rng);
                if (pinhole) {
                    xm[i] = (um - cam.cx()) / cam.fx();
                    ym[i] = (vm - cam.cy()) / cam.fy();
                } else {
                    toNorm.compute(um, vm, p2);
                    xm[i] = p2.x;
                    ym[i] = p2.y;
                }
            } else {
                xm[i] = x[i];
                ym[i] = y[i];
            }
            zEst[i] = switch (mode) {
                case TRUE -> z[i];
                case CONSTANT -> zStar[i];
                case SCALED -> zStar[i] * depthErrorFactor;
            };
        }
    }

    /** A standard normal draw (Box-Muller, cosine branch). */
    public static double gaussian(SplittableRandom rng) {
        double a = rng.nextDouble();
        double b = rng.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - a)) * Math.cos(2 * Math.PI * b);
    }
}
