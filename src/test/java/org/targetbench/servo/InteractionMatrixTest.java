package org.targetbench.servo;

import org.targetbench.camera.InteractionMatrix;
import georegression.struct.se.Se3_F64;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/** Checks of the interaction matrix against a worked value, finite differences and known degenerate sets. */
class InteractionMatrixTest {
    /** Exact arithmetic on a few terms. */
    private static final double EXACT = 1e-12;
    /** Central differences with a step of 1e-6 agree with the analytic derivative to about 1e-9 relative. */
    private static final double FD_STEP = 1e-6;
    /** Derived: truncation O(h²) = 1e-12 and rounding about 1e-16 / h = 1e-10 relative, so 1e-6 leaves wide margin. */
    private static final double FD_TOL = 1e-6;

    @Test
    void knownValue() {
        // Worked from eq. (11) of Chaumette & Hutchinson 2006, IEEE RAM 13(4): x = 0.1, y = -0.2, Z = 0.5.
        double[][] expected = {{-2, 0, 0.2, -0.02, -1.01, -0.2}, {0, -2, -0.4, 1.04, 0.02, -0.1}};
        DMatrixRMaj l = InteractionMatrix.point(0.1, -0.2, 0.5);
        for (int r = 0; r < 2; r++)
            for (int c = 0; c < 6; c++) assertEquals(expected[r][c], l.get(r, c), EXACT, "L[" + r + "][" + c + "]");
    }

    /**
     * Moves the camera by ±h ξ with the simulator's own exponential-map integrator and projects the world points in
     * the moved camera; the central difference must equal L ξ (the definition ṡ = L v of Chaumette & Hutchinson 2006).
     */
    @Test
    void matchesFiniteDifferencesOfTheProjection() {
        SplittableRandom rng = new SplittableRandom(11);
        CameraModel cam = CameraModel.pinhole(800, 600, 610, 590, 401.2, 297.7);
        RigidMotion motion = new RigidMotion();
        for (int trial = 0; trial < 20; trial++) {
            Se3_F64 g = randomCameraPose(rng);
            int k = 4 + rng.nextInt(5);
            double[][] world = new double[k][];
            double[] x = new double[k], y = new double[k], z = new double[k];
            for (int i = 0; i < k; i++) {
                // a point in front of the camera, then expressed in the world frame
                double[] pc = {rng.nextDouble() * 0.4 - 0.2, rng.nextDouble() * 0.4 - 0.2, 0.3 + rng.nextDouble() * 0.7};
                world[i] = toWorld(g, pc);
                x[i] = pc[0] / pc[2];
                y[i] = pc[1] / pc[2];
                z[i] = pc[2];
            }
            double[] xi = new double[6];
            for (int j = 0; j < 6; j++) xi[j] = rng.nextDouble() * 2 - 1;
            double[] minus = xi.clone();
            for (int j = 0; j < 6; j++) minus[j] = -xi[j];
            Se3_F64 gp = g.copy(), gm = g.copy();
            motion.integrate(gp, xi, FD_STEP);
            motion.integrate(gm, minus, FD_STEP);
            double[] sp = project(gp, world), sm = project(gm, world);
            DMatrixRMaj l = InteractionMatrix.stacked(x, y, z);
            DMatrixRMaj lp = InteractionMatrix.pixel(cam, x, y, z);
            for (int r = 0; r < 2 * k; r++) {
                double fd = (sp[r] - sm[r]) / (2 * FD_STEP), an = 0, anPx = 0;
                for (int j = 0; j < 6; j++) {
                    an += l.get(r, j) * xi[j];
                    anPx += lp.get(r, j) * xi[j];
                }
                assertEquals(fd, an, FD_TOL * (1 + Math.abs(an)), "trial " + trial + " row " + r);
                // pixel form: u = fx x + cx, v = fy y + cy for this distortion-free camera
                double f = r % 2 == 0 ? cam.fx() : cam.fy();
                assertEquals(f * fd, anPx, FD_TOL * f * (1 + Math.abs(an)), "pixel L, trial " + trial + " row " + r);
            }
        }
    }

    @Test
    void fourCollinearPointsGiveRankFive() {
        // Degenerate configuration (Michel & Rives 1993; Chaumette 1998, from memory): points on one image line.
        double[] x = {-0.2, -0.05, 0.1, 0.25}, y = new double[4], z = {0.5, 0.5, 0.5, 0.5};
        for (int i = 0; i < 4; i++) y[i] = 0.3 * x[i] + 0.05;
        var c = InteractionMatrix.conditioning(InteractionMatrix.stacked(x, y, z), 0.5);
        assertEquals(5, c.rank());
        assertEquals(Double.POSITIVE_INFINITY, c.condition());
    }

    @Test
    void conditionOfACentredSquareFallsAsItGrows() {
        // A wider spread of points gives a better conditioned L (Feddema et al. 1991; Chaumette 1998, from memory).
        double previous = Double.POSITIVE_INFINITY;
        for (double a : new double[]{0.02, 0.05, 0.1, 0.2, 0.3}) {
            double[] x = {-a, a, a, -a}, y = {-a, -a, a, a}, z = {0.5, 0.5, 0.5, 0.5};
            var c = InteractionMatrix.conditioning(InteractionMatrix.stacked(x, y, z), 0.5);
            assertEquals(6, c.rank());
            assertTrue(c.condition() < previous, "cond " + c.condition() + " at half-width " + a + " after " + previous);
            previous = c.condition();
        }
    }

    @Test
    void scalingMakesTheConditionUnitFree() {
        // The same geometry in millimetres instead of metres (depth x 1000) gives the same scaled figures.
        double[] x = {-0.1, 0.12, 0.09, -0.11}, y = {-0.1, -0.08, 0.1, 0.12};
        var m = InteractionMatrix.conditioning(InteractionMatrix.stacked(x, y, new double[]{0.5, 0.5, 0.5, 0.5}), 0.5);
        var mm = InteractionMatrix.conditioning(InteractionMatrix.stacked(x, y, new double[]{500, 500, 500, 500}), 500);
        assertEquals(m.condition(), mm.condition(), 1e-9 * m.condition());
        assertEquals(m.sigmaMin(), mm.sigmaMin(), 1e-12);
    }

    @Test
    void misuseNamesTheNumbers() {
        var e = assertThrows(IllegalArgumentException.class, () -> InteractionMatrix.point(0, 0, -1));
        assertTrue(e.getMessage().contains("Z=-1"), e.getMessage());
    }

    static Se3_F64 randomCameraPose(SplittableRandom rng) {
        Pose p = Pose.fromEulerXYZ(rng.nextDouble() * 2 - 1, rng.nextDouble() * 2 - 1, rng.nextDouble() * 6 - 3,
                rng.nextDouble() - 0.5, rng.nextDouble() - 0.5, rng.nextDouble() - 0.5);
        return p.toSe3();
    }

    static double[] toWorld(Se3_F64 cameraToWorld, double[] pc) {
        double[] r = cameraToWorld.R.data;
        return new double[]{r[0] * pc[0] + r[1] * pc[1] + r[2] * pc[2] + cameraToWorld.T.x,
                r[3] * pc[0] + r[4] * pc[1] + r[5] * pc[2] + cameraToWorld.T.y,
                r[6] * pc[0] + r[7] * pc[1] + r[8] * pc[2] + cameraToWorld.T.z};
    }

    /** Normalised coordinates (x0, y0, x1, y1, ...) of world points seen from a camera pose. */
    static double[] project(Se3_F64 cameraToWorld, double[][] world) {
        double[] r = cameraToWorld.R.data, s = new double[2 * world.length];
        for (int i = 0; i < world.length; i++) {
            double dx = world[i][0] - cameraToWorld.T.x, dy = world[i][1] - cameraToWorld.T.y, dz = world[i][2] - cameraToWorld.T.z;
            double X = r[0] * dx + r[3] * dy + r[6] * dz, Y = r[1] * dx + r[4] * dy + r[7] * dz, Z = r[2] * dx + r[5] * dy + r[8] * dz;
            s[2 * i] = X / Z;
            s[2 * i + 1] = Y / Z;
        }
        return s;
    }
}
