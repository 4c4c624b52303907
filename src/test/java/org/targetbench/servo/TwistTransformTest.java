package org.targetbench.servo;

import org.targetbench.camera.InteractionMatrix;
import georegression.struct.se.Se3_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;
import org.targetbench.camera.Pose;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

class TwistTransformTest {
    private static final double EXACT = 1e-12;
    private static final double FD_STEP = 1e-6;
    /** Derived: central differences with step h err by O(h²) plus rounding about 1e-16 / h, far below 1e-6. */
    private static final double FD_TOL = 1e-6;

    @Test
    void matchesAHandComputation() {
        // R turns x into y, y into z, z into x (120 deg about (1,1,1)); t = (0.1, 0.2, 0.3) m.
        double[] r = {0, 0, 1, 1, 0, 0, 0, 1, 0};
        double[] t = {0.1, 0.2, 0.3};
        // [t]x = [[0,-0.3,0.2],[0.3,0,-0.1],[-0.2,0.1,0]]; [t]x R worked by hand column by column:
        // column j of [t]x R is t x (column j of R): t x (0,1,0) = (-0.3,0,0.1), t x (0,0,1) = (0.2,-0.1,0), t x (1,0,0) = (0,0.3,-0.2)
        double[][] expected = {
                {0, 0, 1, -0.3, 0.2, 0},
                {1, 0, 0, 0, -0.1, 0.3},
                {0, 1, 0, 0.1, 0, -0.2},
                {0, 0, 0, 0, 0, 1},
                {0, 0, 0, 1, 0, 0},
                {0, 0, 0, 0, 1, 0}};
        DMatrixRMaj v = TwistTransform.of(r, t);
        for (int i = 0; i < 6; i++)
            for (int j = 0; j < 6; j++) assertEquals(expected[i][j], v.get(i, j), EXACT, "V[" + i + "][" + j + "]");
    }

    @Test
    void composedWithItsInverseGivesTheIdentity() {
        SplittableRandom rng = new SplittableRandom(3);
        for (int k = 0; k < 10; k++) {
            Pose p = Pose.fromEulerXYZ(rng.nextDouble() * 6 - 3, rng.nextDouble() * 2 - 1, rng.nextDouble() * 6 - 3,
                    rng.nextDouble() - 0.5, rng.nextDouble() - 0.5, rng.nextDouble() - 0.5);
            DMatrixRMaj prod = new DMatrixRMaj(6, 6);
            CommonOps_DDRM.mult(TwistTransform.of(p.rotation(), p.translation()), TwistTransform.inverse(p.rotation(), p.translation()), prod);
            for (int i = 0; i < 6; i++)
                for (int j = 0; j < 6; j++) assertEquals(i == j ? 1 : 0, prod.get(i, j), 1e-12);
        }
    }

    /**
     * A camera rigidly mounted on an end effector: move the camera by a small body twist with the simulator's
     * integrator, read off the end effector's body twist with the SE(3) logarithm, and compare with V ξ_c.
     */
    @Test
    void matchesFiniteDifferencesOfARigidMount() {
        SplittableRandom rng = new SplittableRandom(8);
        RigidMotion motion = new RigidMotion();
        for (int trial = 0; trial < 10; trial++) {
            Pose eToC = Pose.fromEulerXYZ(rng.nextDouble() * 2 - 1, rng.nextDouble() * 2 - 1, rng.nextDouble() * 2 - 1,
                    rng.nextDouble() * 0.2 - 0.1, rng.nextDouble() * 0.2 - 0.1, rng.nextDouble() * 0.2);
            Se3_F64 camInEe = eToC.toSe3();                      // P_e = R P_c + t: the hand-eye transform
            Se3_F64 camToWorld = InteractionMatrixTest.randomCameraPose(rng);
            double[] xi = new double[6];
            for (int j = 0; j < 6; j++) xi[j] = rng.nextDouble() * 2 - 1;
            Se3_F64 eeToWorld = camInEe.invert(null).concat(camToWorld, null);
            double[] minus = new double[6];
            for (int j = 0; j < 6; j++) minus[j] = -xi[j];
            Se3_F64 relPlus = eeBodyMotion(motion, camToWorld, camInEe, eeToWorld, xi);
            Se3_F64 relMinus = eeBodyMotion(motion, camToWorld, camInEe, eeToWorld, minus);
            // central difference of exp(h ξ̂_e) ≈ I + h ξ̂_e: v from the translations, ω from the skew part of R
            double[] fd = new double[6];
            fd[0] = (relPlus.T.x - relMinus.T.x) / (2 * FD_STEP);
            fd[1] = (relPlus.T.y - relMinus.T.y) / (2 * FD_STEP);
            fd[2] = (relPlus.T.z - relMinus.T.z) / (2 * FD_STEP);
            DMatrixRMaj d = new DMatrixRMaj(3, 3);
            CommonOps_DDRM.subtract(relPlus.R, relMinus.R, d);
            fd[3] = (d.get(2, 1) - d.get(1, 2)) / (4 * FD_STEP);
            fd[4] = (d.get(0, 2) - d.get(2, 0)) / (4 * FD_STEP);
            fd[5] = (d.get(1, 0) - d.get(0, 1)) / (4 * FD_STEP);
            DMatrixRMaj v = TwistTransform.of(eToC.rotation(), eToC.translation());
            for (int i = 0; i < 6; i++) {
                double an = 0;
                for (int j = 0; j < 6; j++) an += v.get(i, j) * xi[j];
                assertEquals(an, fd[i], FD_TOL * (1 + Math.abs(an)), "trial " + trial + " component " + i);
            }
        }
    }

    /** Pose of the end-effector frame after the camera moved by h ξ_c, in the end-effector frame before the move. */
    private static Se3_F64 eeBodyMotion(RigidMotion motion, Se3_F64 camToWorld, Se3_F64 camInEe, Se3_F64 eeToWorld, double[] xi) {
        Se3_F64 moved = camToWorld.copy();
        motion.integrate(moved, xi, FD_STEP);
        Se3_F64 eeMoved = camInEe.invert(null).concat(moved, null);
        return eeMoved.concat(eeToWorld.invert(null), null);
    }
}
