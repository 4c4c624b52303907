package org.targetbench.arm;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.PoseEstimation;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Synthetic hand-eye views with a known mount (invented data): flange poses around a fixed target, the target's
 * corners projected, pixel noise added and the target pose recovered by PnP on the noisy corners.
 */
public final class HandEyeFixtures {
    public static final CameraModel VGA = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);
    /** 10 x 8 inner corners at 25 mm, starting 30 mm from the sheet corner: the inner corners of an 11 x 9 board (an A3-size plate). */
    public static final int COLS = 10, ROWS = 8;
    public static final double SQUARE_MM = 25, ORIGIN_MM = 30;
    /** Centre of the corner grid, metres. */
    public static final double CX = (ORIGIN_MM + (COLS - 1) * SQUARE_MM / 2) / 1000, CY = (ORIGIN_MM + (ROWS - 1) * SQUARE_MM / 2) / 1000;

    /** The true mount: camera 30 mm across, 60 mm off and 45 mm along the flange axis, turned by 90° about it. */
    public static double[] trueX() {
        double[] x = Rigid.fromRotationVector(Math.toRadians(2), Math.toRadians(-3), Math.toRadians(90));
        x[3] = 0.030; x[7] = 0.060; x[11] = 0.045;
        return x;
    }

    public record Views(List<double[]> flange, List<double[]> targetInCamera, List<double[]> trueTargetInCamera, List<String> names,
                        List<double[][]> pixels) {}

    public static List<double[]> corners() {
        List<double[]> mm = new ArrayList<>();
        for (int r = 0; r < ROWS; r++)
            for (int c = 0; c < COLS; c++) mm.add(new double[]{ORIGIN_MM + c * SQUARE_MM, ORIGIN_MM + r * SQUARE_MM});
        return mm;
    }

    /** {@code n} views with the given pixel noise; the target is the corner grid. */
    public static Views views(int n, double noisePx, long seed) {
        return views(n, noisePx, seed, CX, CY, corners());
    }

    /** Views of a target whose corners (mm) are {@code mm} and whose centre is (cx, cy) metres. */
    public static Views views(int n, double noisePx, long seed, double cx, double cy, List<double[]> mm) {
        SplittableRandom rng = new SplittableRandom(seed);
        double[] x = trueX();
        double[] baseToTarget = Rigid.trans(0.55, 0.05, 0.0);
        double[] centre = {cx, cy, 0};
        List<double[]> fl = new ArrayList<>(), tc = new ArrayList<>(), truth = new ArrayList<>();
        List<String> names = new ArrayList<>();
        List<double[][]> pixels = new ArrayList<>();
        while (fl.size() < n) {
            double[] tilt = Rigid.fromRotationVector(Math.toRadians(25 * (2 * rng.nextDouble() - 1)), Math.toRadians(25 * (2 * rng.nextDouble() - 1)),
                    Math.toRadians(60 * (2 * rng.nextDouble() - 1)));
            double[] rot = Rigid.mul(Rigid.rotX(Math.PI), tilt);
            double d = 0.30 + 0.1 * rng.nextDouble();
            double[] cam = rot.clone();
            double[] aim = {centre[0] + 0.01 * (2 * rng.nextDouble() - 1), centre[1] + 0.01 * (2 * rng.nextDouble() - 1), 0};
            cam[3] = 0.55 + aim[0] - rot[2] * d;
            cam[7] = 0.05 + aim[1] - rot[6] * d;
            cam[11] = aim[2] - rot[10] * d;
            double[] c = Rigid.mul(Rigid.inverse(cam), baseToTarget); // target in camera
            double[][] px = new double[mm.size()][];
            List<double[]> pl = new ArrayList<>();
            boolean ok = true;
            for (int i = 0; i < mm.size(); i++) {
                double X = mm.get(i)[0] / 1000, Y = mm.get(i)[1] / 1000;
                double xc = c[0] * X + c[1] * Y + c[3], yc = c[4] * X + c[5] * Y + c[7], zc = c[8] * X + c[9] * Y + c[11];
                double u = VGA.fx() * xc / zc + VGA.cx() + noisePx * gaussian(rng), v = VGA.fy() * yc / zc + VGA.cy() + noisePx * gaussian(rng);
                if (!(zc > 0) || !VGA.inImage(u, v)) ok = false;
                px[i] = new double[]{u, v};
                pl.add(px[i]);
            }
            if (!ok) continue;
            var est = PoseEstimation.planar(VGA, pl, mm).orElseThrow();
            fl.add(Rigid.mul(cam, Rigid.inverse(x)));
            tc.add(Rigid.of(est.pose().rotation(), est.pose().translation()));
            truth.add(c);
            names.add("view" + fl.size());
            pixels.add(px);
        }
        return new Views(fl, tc, truth, names, pixels);
    }

    static double gaussian(SplittableRandom rng) {
        double a = rng.nextDouble(), b = rng.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - a)) * Math.cos(2 * Math.PI * b);
    }
}
