package org.targetbench.arm;

import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;
import org.targetbench.source.ArmFiles;
import org.targetbench.source.SourceException;
import org.targetbench.pipeline.ArmInputs;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/** Forward kinematics, Jacobian and manipulability against outside references. */
class ArmKinematicsTest {
    /** KDL writes 12 decimals; our FK must agree to this (metres and rotation entries). */
    static final double KDL_TOL = 1e-9;
    /** The recalled PUMA value has 4 decimals. */
    static final double MEMORY_TOL = 1e-4;
    /** Derived: central differences with step h err by O(h²) plus rounding about 1e-16 / h, far below 1e-6. */
    static final double FD_TOL = 1e-6;
    /** Derived: the URDF chain and the DH table describe one arm, so they agree up to double rounding. */
    static final double URDF_TOL = 1e-9;
    static final double[] INF = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY,
            Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
    static final double[] NINF = {Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY,
            Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};

    /** PUMA 560, standard DH, as published by Corke (IEEE RAM 1996) after Armstrong, Khatib &amp; Burdick (ICRA 1986). */
    static ArmModel puma() {
        double h = Math.PI / 2;
        return ArmModel.fromDh("PUMA 560", "Corke 1996", false, DhConvention.STANDARD, List.of(
                new DhRow(0, h, 0, 0), new DhRow(0.4318, 0, 0, 0), new DhRow(0.0203, -h, 0.15005, 0),
                new DhRow(0, h, 0.4318, 0), new DhRow(0, -h, 0, 0), new DhRow(0, 0, 0, 0)), null, NINF, INF, INF);
    }

    /** The same table in Craig's modified form (see the reference's PROVENANCE.md). */
    static ArmModel pumaLikeModified() {
        double h = Math.PI / 2;
        return ArmModel.fromDh("PUMA-like, modified DH", "test", false, DhConvention.MODIFIED, List.of(
                new DhRow(0, 0, 0, 0), new DhRow(0, -h, 0, 0), new DhRow(0.4318, 0, 0.15005, 0),
                new DhRow(0.0203, -h, 0.4318, 0), new DhRow(0, h, 0, 0), new DhRow(0, -h, 0, 0)), null, NINF, INF, INF);
    }

    record Ref(String arm, double[] q, double[] p, double[] r) {}

    static List<Ref> kdl() throws IOException {
        try (InputStream in = ArmKinematicsTest.class.getResourceAsStream("/reference/kinematics/kdl-poses.csv")) {
            String[] lines = new String(in.readAllBytes(), StandardCharsets.UTF_8).split("\n");
            List<Ref> out = new ArrayList<>();
            for (int i = 1; i < lines.length; i++) {
                String[] c = lines[i].trim().split(",");
                double[] v = Arrays.stream(c, 1, c.length).mapToDouble(Double::parseDouble).toArray();
                out.add(new Ref(c[0], Arrays.copyOfRange(v, 0, 6), Arrays.copyOfRange(v, 6, 9), Arrays.copyOfRange(v, 9, 18)));
            }
            return out;
        }
    }

    @Test
    void pumaAtZeroMatchesTheRecalledPose() {
        // (0.4521, -0.1500, 0.4318) m with identity orientation: Corke 1996 PUMA 560 at zero joints, from memory
        double[] t = puma().forward(new double[6]);
        assertArrayEquals(new double[]{0.4521, -0.1500, 0.4318}, Rigid.translation(t), MEMORY_TOL);
        assertArrayEquals(new double[]{1, 0, 0, 0, 1, 0, 0, 0, 1}, Rigid.rotation(t), 1e-12);
    }

    @Test
    void forwardKinematicsAgreesWithOrocosKdl() throws IOException {
        // reference: Debian python3-pykdl 1.5.1 (Orocos KDL), see src/test/resources/reference/kinematics/PROVENANCE.md
        List<Ref> refs = kdl();
        int checked = 0;
        for (Ref ref : refs) {
            ArmModel arm = switch (ref.arm()) {
                case "puma560" -> puma();
                case "demo" -> DemoArm.model().unlimited();
                case "puma-like-modified" -> pumaLikeModified();
                default -> throw new AssertionError(ref.arm());
            };
            double[] t = arm.forward(ref.q());
            assertArrayEquals(ref.p(), Rigid.translation(t), KDL_TOL, ref.arm() + " " + Arrays.toString(ref.q()));
            assertArrayEquals(ref.r(), Rigid.rotation(t), KDL_TOL, ref.arm() + " " + Arrays.toString(ref.q()));
            checked++;
        }
        assertEquals(21, checked, "7 joint vectors for each of 3 arms");
    }

    @Test
    void jacobianMatchesCentralDifferences() {
        // derived: column i of the geometric Jacobian is d(position)/dqi and the rotation rate dR/dqi Rᵀ = [ωi]x
        SplittableRandom rng = new SplittableRandom(12);
        double h = 1e-6;
        for (ArmModel arm : List.of(puma(), DemoArm.model(), pumaLikeModified())) {
            for (int n = 0; n < 5; n++) {
                double[] q = new double[6];
                for (int i = 0; i < 6; i++) q[i] = (2 * rng.nextDouble() - 1) * 2.5;
                DMatrixRMaj j = arm.jacobian(q);
                double[] t0 = arm.forward(q);
                for (int i = 0; i < 6; i++) {
                    double[] qp = q.clone(), qm = q.clone();
                    qp[i] += h;
                    qm[i] -= h;
                    double[] tp = arm.forward(qp), tm = arm.forward(qm);
                    for (int a = 0; a < 3; a++) assertEquals((tp[a * 4 + 3] - tm[a * 4 + 3]) / (2 * h), j.get(a, i), FD_TOL);
                    // [ω]x = dR/dq Rᵀ
                    double[] dr = new double[9];
                    for (int a = 0; a < 3; a++)
                        for (int b = 0; b < 3; b++) dr[a * 3 + b] = (tp[a * 4 + b] - tm[a * 4 + b]) / (2 * h);
                    double[] w = new double[9];
                    for (int a = 0; a < 3; a++)
                        for (int b = 0; b < 3; b++)
                            for (int c = 0; c < 3; c++) w[a * 3 + b] += dr[a * 3 + c] * t0[b * 4 + c];
                    assertEquals(w[7], j.get(3, i), FD_TOL);
                    assertEquals(w[2], j.get(4, i), FD_TOL);
                    assertEquals(w[3], j.get(5, i), FD_TOL);
                }
            }
        }
    }

    @Test
    void manipulabilityVanishesAtTheWristSingularity() {
        // derived: with joint 5 at zero, joints 4 and 6 share an axis, J loses rank and det(J Jᵀ) = 0 (Yoshikawa 1985)
        ArmModel arm = DemoArm.model();
        double[] q = DemoArm.rad(new double[]{10, 20, 30, 40, 0, 50});
        assertEquals(0, arm.manipulability(q), 1e-12);
        double[] away = DemoArm.rad(DemoArm.REFERENCE_DEG);
        assertTrue(arm.manipulability(away) > 1e-3, "the demo reference is far from singular: " + arm.manipulability(away));
    }

    @Test
    void urdfOfTheDemoArmAgreesWithItsDhTable() throws SourceException {
        ArmModel dh = DemoArm.model();
        ArmModel urdf = ArmInputs.arm(ArmFiles.urdf(DemoArm.urdf(), "demo.urdf", "flange")).model();
        SplittableRandom rng = new SplittableRandom(3);
        for (int n = 0; n < 20; n++) {
            double[] q = new double[6];
            for (int i = 0; i < 6; i++) q[i] = (2 * rng.nextDouble() - 1) * 2;
            double[] a = dh.forward(q), b = urdf.forward(q);
            for (int i = 0; i < 12; i++) assertEquals(a[i], b[i], URDF_TOL);
        }
        assertArrayEquals(dh.lowerRad(), urdf.lowerRad(), 1e-12);
        assertArrayEquals(dh.maxSpeedRadS(), urdf.maxSpeedRadS(), 1e-12);
    }

    @Test
    void urdfRefusesWhatItCannotModel() {
        String ok = DemoArm.urdf();
        String prismatic = ok.replaceFirst("type=\"revolute\"", "type=\"prismatic\"");
        String continuous = ok.replaceFirst("type=\"revolute\"", "type=\"continuous\"");
        assertTrue(assertThrows(SourceException.class, () -> ArmFiles.urdf(prismatic, "p.urdf", "flange")).getMessage().contains("prismatic"));
        assertTrue(assertThrows(SourceException.class, () -> ArmFiles.urdf(continuous, "c.urdf", "flange")).getMessage().contains("continuous"));
        assertTrue(assertThrows(SourceException.class, () -> ArmFiles.urdf(ok, "t.urdf", "nowhere")).getMessage().contains("no link named"));
        assertTrue(assertThrows(SourceException.class, () -> ArmFiles.urdf(ok, "five.urdf", "link5")).getMessage().contains("5 revolute"));
        for (String bad : List.of(prismatic, continuous)) {
            String msg = assertThrows(SourceException.class, () -> ArmFiles.urdf(bad, "x.urdf", "flange")).getMessage();
            assertFalse(msg.contains("\n"), "one line: " + msg);
        }
    }

    @Test
    void inverseKinematicsReturnsToAPose() {
        ArmModel arm = DemoArm.model();
        double[] q = DemoArm.rad(new double[]{15, 25, 10, -20, 50, 30});
        double[] target = arm.forward(q);
        double[] found = ArmRehearsal.inverse(arm, target, DemoArm.rad(DemoArm.REFERENCE_DEG)).orElseThrow();
        double[] back = arm.forward(found);
        assertTrue(Rigid.distance(target, back) < 1e-9);
        assertTrue(Rigid.angleBetween(target, back) < 1e-9);
    }
}
